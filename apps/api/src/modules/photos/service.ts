import type { Request, Response } from 'express';
import multer from 'multer';
import {
  PHOTO_MAX_BYTES,
  PHOTO_MAX_PER_QUOTE,
  PHOTO_UPLOAD_FIELD,
  PhotoUploadFields,
  RevisionSettings,
  type ReorderPhotosRequest,
  type UpdatePhotoRequest,
} from '@gloaming/contracts';
import { Photo, QuoteRevision, type EntityManager, type Quote } from '@gloaming/db';
import { badRequest, conflict, HttpError, notFound } from '../../http/problem';
import { newStorageKey, type FileStorage } from '../../storage/storage';
import { checkImage, makeThumbnail } from './image-intake';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 4, fieldSize: 4096, parts: 6 },
}).single(PHOTO_UPLOAD_FIELD);

/** Parse the multipart upload (after the route's auth check) into memory, with the size limit. */
export function receiveUpload(req: Request, res: Response): Promise<{ bytes: Buffer; caption: string }> {
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return reject(
            new HttpError(413, 'file-too-large', 'File too large', `Photos can be at most ${PHOTO_MAX_BYTES / 1024 / 1024} MB.`),
          );
        return reject(
          badRequest(`The upload could not be read (${err.message}). Send one file in the "${PHOTO_UPLOAD_FIELD}" field.`),
        );
      }
      if (err) return reject(badRequest('The upload could not be read. Send it as multipart/form-data.'));
      if (!req.file)
        return reject(
          badRequest(`Attach an image in the "${PHOTO_UPLOAD_FIELD}" field.`, [
            { path: `body.${PHOTO_UPLOAD_FIELD}`, message: 'Choose an image.' },
          ]),
        );
      const fields = PhotoUploadFields.safeParse(req.body ?? {});
      if (!fields.success)
        return reject(
          badRequest(
            'Some fields need attention.',
            fields.error.issues.map((i) => ({ path: ['body', ...i.path.map(String)].join('.'), message: i.message })),
          ),
        );
      resolve({ bytes: req.file.buffer, caption: fields.data.caption ?? '' });
    });
  });
}

export function listQuotePhotos(em: EntityManager, quote: Quote): Promise<Photo[]> {
  return em.find(Photo, { quote, organization: quote.organization }, { orderBy: { position: 'asc', createdAt: 'asc' } });
}

export async function findQuotePhoto(em: EntityManager, quote: Quote, photoId: string): Promise<Photo> {
  const photo = await em.findOne(Photo, { id: photoId, quote, organization: quote.organization });
  if (!photo) throw notFound('That photo');
  return photo;
}

/** Check, thumbnail and store an upload; the new photo goes last. */
export async function addQuotePhoto(
  em: EntityManager,
  storage: FileStorage,
  quote: Quote,
  bytes: Buffer,
  caption: string,
): Promise<Photo> {
  const existing = await em.count(Photo, { quote });
  if (existing >= PHOTO_MAX_PER_QUOTE)
    throw new HttpError(422, 'too-many-photos', 'Too many photos', `A quote can have at most ${PHOTO_MAX_PER_QUOTE} photos.`);
  const image = await checkImage(bytes);
  const thumbnail = await makeThumbnail(bytes);
  const prefix = `org/${quote.organization.id}/quotes/${quote.id}/photos`;
  const storageKey = newStorageKey(prefix, image.extension);
  const thumbnailKey = newStorageKey(prefix, 'jpg');
  await storage.put(storageKey, bytes);
  await storage.put(thumbnailKey, thumbnail);
  const last = await em.findOne(Photo, { quote }, { orderBy: { position: 'desc' } });
  const photo = em.create(Photo, {
    organization: quote.organization,
    quote,
    storageKey,
    thumbnailKey,
    contentType: image.contentType,
    width: image.width,
    height: image.height,
    bytes: bytes.length,
    caption,
    position: last ? last.position + 1 : 0,
    onQuote: true,
  });
  try {
    await em.flush();
  } catch (err) {
    await Promise.all([storage.delete(storageKey), storage.delete(thumbnailKey)]);
    throw err;
  }
  return photo;
}

export async function updateQuotePhoto(em: EntityManager, photo: Photo, change: UpdatePhotoRequest): Promise<Photo> {
  if (change.version !== photo.version) throw conflict('Someone else changed this photo first. Reload to see their changes.');
  if (change.caption !== undefined) photo.caption = change.caption;
  if (change.onQuote !== undefined) photo.onQuote = change.onQuote;
  await em.flush();
  return photo;
}

/** Put the quote's photos in the given order; the list must name each photo once. */
export async function reorderQuotePhotos(em: EntityManager, quote: Quote, order: ReorderPhotosRequest): Promise<Photo[]> {
  const photos = await listQuotePhotos(em, quote);
  const byId = new Map(photos.map((p) => [p.id, p]));
  const unique = new Set(order.photoIds);
  if (unique.size !== order.photoIds.length || unique.size !== photos.length || order.photoIds.some((id) => !byId.has(id)))
    throw badRequest('List every photo of this quote exactly once, in the new order.', [
      { path: 'body.photoIds', message: 'Name each photo of the quote once.' },
    ]);
  order.photoIds.forEach((id, i) => {
    byId.get(id)!.position = i;
  });
  await em.flush();
  return listQuotePhotos(em, quote);
}

/** The numbers of the sent (or superseded) revisions of the quote that show this photo. */
async function sentRevisionsShowing(em: EntityManager, quote: Quote, photo: Photo): Promise<number[]> {
  const frozen = await em.find(
    QuoteRevision,
    { quote: quote.id, organization: quote.organization.id, state: { $ne: 'draft' } },
    { orderBy: { number: 'asc' } },
  );
  return frozen
    .filter((r) => RevisionSettings.safeParse(r.settings).data?.sentPhotos?.some((f) => f.photoId === photo.id))
    .map((r) => r.number);
}

/**
 * Remove a photo and its files. A photo that a sent revision shows is refused (409): that
 * revision's PDF must keep showing what the homeowner was sent. Untick "on quote" instead.
 */
export async function deleteQuotePhoto(em: EntityManager, storage: FileStorage, quote: Quote, photo: Photo): Promise<void> {
  const sent = await sentRevisionsShowing(em, quote, photo);
  if (sent.length > 0)
    throw conflict(
      `This photo is in revision${sent.length > 1 ? 's' : ''} ${sent.join(', ')} as sent to the customer, so it is kept for that quotation. Untick “on quote” to leave it off later revisions.`,
    );
  const keys = [photo.storageKey, photo.thumbnailKey];
  em.remove(photo);
  await em.flush();
  await Promise.all(keys.map((k) => storage.delete(k)));
}
