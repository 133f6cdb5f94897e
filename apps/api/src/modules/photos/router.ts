import type { Request, Response } from 'express';
import type { z } from 'zod';
import { IdParams, QuotePhotoParams, ReorderPhotosRequest, UpdatePhotoRequest } from '@gloaming/contracts';
import type { Photo } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { parsed, validate } from '../../http/validate';
import type { FileStorage } from '../../storage/storage';
import { loadQuoteForFirm } from '../quotes/service';
import { presentPhoto } from './presenter';
import {
  addQuotePhoto,
  deleteQuotePhoto,
  findQuotePhoto,
  listQuotePhotos,
  receiveUpload,
  reorderQuotePhotos,
  updateQuotePhoto,
} from './service';

/** Owner and estimators edit and view. Installers will view photos of approved jobs later. */
const quoteStaff = allowRoles('owner', 'estimator');

async function sendImage(res: Response, storage: FileStorage, photo: Photo, which: 'image' | 'thumbnail'): Promise<void> {
  const key = which === 'image' ? photo.storageKey : photo.thumbnailKey;
  const bytes = await storage.get(key);
  res.setHeader('Cache-Control', 'private, max-age=300');
  res.setHeader(
    'Content-Disposition',
    `inline; filename="photo-${photo.position + 1}.${which === 'image' ? key.split('.').pop() : 'jpg'}"`,
  );
  res.type(which === 'image' ? photo.contentType : 'image/jpeg').send(bytes);
}

/**
 * The body, validated by the shared validator after the quote was found: another firm's id is
 * a 404 whatever the body holds.
 */
async function bodyAfterLookup<T extends z.ZodType>(req: Request, res: Response, schema: T): Promise<z.output<T>> {
  await new Promise<void>((resolve, reject) =>
    validate({ body: schema })(req, res, (err?: unknown) => (err ? reject(err) : resolve())),
  );
  return parsed<{ body: T }>(req).body as z.output<T>;
}

export function photosRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  const { storage } = deps;
  return moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/:id/photos',
      summary: "A quote's site photos and plans, in order",
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        res.json({ photos: (await listQuotePhotos(em, quote)).map(presentPhoto) });
      },
    }),
    route({
      method: 'post',
      path: '/:id/photos',
      summary: 'Upload a site photo or plan image (multipart, field "file")',
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        const { bytes, caption } = await receiveUpload(req, res);
        const photo = await addQuotePhoto(em, storage, quote, bytes, caption);
        res.status(201).json({ photo: presentPhoto(photo) });
      },
    }),
    route({
      method: 'put',
      path: '/:id/photos/order',
      summary: "Reorder a quote's photos",
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        const body = await bodyAfterLookup(req, res, ReorderPhotosRequest);
        res.json({ photos: (await reorderQuotePhotos(em, quote, body)).map(presentPhoto) });
      },
    }),
    route({
      method: 'patch',
      path: '/:id/photos/:photoId',
      summary: "Change a photo's caption or whether it is on the quote",
      policy: quoteStaff,
      schemas: { params: QuotePhotoParams },
      handler: async ({ req, res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        const photo = await findQuotePhoto(em, quote, input.params.photoId);
        const body = await bodyAfterLookup(req, res, UpdatePhotoRequest);
        res.json({ photo: presentPhoto(await updateQuotePhoto(em, photo, body)) });
      },
    }),
    route({
      method: 'delete',
      path: '/:id/photos/:photoId',
      summary: 'Remove a photo',
      policy: quoteStaff,
      schemas: { params: QuotePhotoParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        await deleteQuotePhoto(em, storage, quote, await findQuotePhoto(em, quote, input.params.photoId));
        res.status(204).end();
      },
    }),
    route({
      method: 'get',
      path: '/:id/photos/:photoId/image',
      summary: 'The uploaded image',
      policy: quoteStaff,
      schemas: { params: QuotePhotoParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        await sendImage(res, storage, await findQuotePhoto(em, quote, input.params.photoId), 'image');
      },
    }),
    route({
      method: 'get',
      path: '/:id/photos/:photoId/thumbnail',
      summary: "The photo's thumbnail (JPEG)",
      policy: quoteStaff,
      schemas: { params: QuotePhotoParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        await sendImage(res, storage, await findQuotePhoto(em, quote, input.params.photoId), 'thumbnail');
      },
    }),
  ]);
}
