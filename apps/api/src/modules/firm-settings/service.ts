/**
 * The owner's firm settings: read, save whole (optimistic lock on the firm's version) and the
 * logo. A save changes what new quotes snapshot (revisionSettingsOf); revisions already made,
 * and sent ones above all, keep the settings they were priced with.
 */
import type { Request, Response } from 'express';
import multer from 'multer';
import sharp from 'sharp';
import { LOGO_MAX_BYTES, LOGO_UPLOAD_FIELD, type FirmSettings, type FirmSettingsResponse } from '@gloaming/contracts';
import { Organization, designSettingsOf, type EntityManager } from '@gloaming/db';
import { HttpError, badRequest, conflict, notFound } from '../../http/problem';
import { newStorageKey, type FileStorage } from '../../storage/storage';
import { recordFirmEvent } from '../activity/service';
import { checkImage } from '../photos/image-intake';

/** The longest side a stored logo keeps, pixels (plenty for a PDF header and the portal). */
export const LOGO_EDGE = 800;

export function firmSettingsOf(firm: Organization): FirmSettings {
  return {
    name: firm.name,
    addressLines: firm.addressLines,
    vatNumber: firm.vatNumber ?? null,
    currency: firm.currency as FirmSettings['currency'],
    locale: firm.locale as FirmSettings['locale'],
    vatRateBp: firm.vatRateBp,
    vatRatesBp: firm.vatRatesBp ?? [firm.vatRateBp],
    vatRounding: firm.vatRounding as FirmSettings['vatRounding'],
    depositPercentBp: firm.depositPercentBp,
    markupPercentBp: firm.markupPercentBp,
    labourRateMinorPerHour: firm.labourRateMinorPerHour,
    design: designSettingsOf(firm),
    quoteValidityDays: firm.quoteValidityDays,
    termsText: firm.termsText,
    emailSenderName: firm.emailSenderName,
  };
}

export function presentFirmSettings(firm: Organization): FirmSettingsResponse {
  return {
    settings: firmSettingsOf(firm),
    version: firm.version,
    logo: firm.logoPath ? { updatedAt: firm.updatedAt.toISOString() } : null,
  };
}

export async function loadFirm(em: EntityManager, organizationId: string): Promise<Organization> {
  return em.findOneOrFail(Organization, organizationId);
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** Save every setting; `version` must be the firm's current one (else 409, nothing written). */
export async function saveFirmSettings(
  em: EntityManager,
  organizationId: string,
  actorId: string,
  version: number,
  next: FirmSettings,
): Promise<Organization> {
  const firm = await loadFirm(em, organizationId);
  if (firm.version !== version) throw conflict('Someone else saved the settings first. Reload to see their changes.');
  const before = firmSettingsOf(firm);
  const changed = (Object.keys(next) as (keyof FirmSettings)[]).filter((k) => !same(before[k], next[k]));
  if (changed.length === 0) return firm;
  firm.name = next.name;
  firm.addressLines = next.addressLines;
  firm.vatNumber = next.vatNumber;
  firm.currency = next.currency;
  firm.locale = next.locale;
  firm.vatRateBp = next.vatRateBp;
  firm.vatRatesBp = [...next.vatRatesBp];
  firm.vatRounding = next.vatRounding;
  firm.depositPercentBp = next.depositPercentBp;
  firm.markupPercentBp = next.markupPercentBp;
  firm.labourRateMinorPerHour = next.labourRateMinorPerHour;
  firm.designSettings = next.design as unknown as Record<string, unknown>;
  firm.quoteValidityDays = next.quoteValidityDays;
  firm.termsText = next.termsText;
  firm.emailSenderName = next.emailSenderName;
  recordFirmEvent(em, organizationId, 'settings-changed', actorId, null, { fields: changed });
  await em.flush();
  return firm;
}

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: LOGO_MAX_BYTES, files: 1, fields: 0, parts: 2 },
}).single(LOGO_UPLOAD_FIELD);

function receiveLogo(req: Request, res: Response): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return reject(new HttpError(413, 'file-too-large', 'File too large', `A logo can be at most ${LOGO_MAX_BYTES / 1024 / 1024} MB.`));
        return reject(badRequest(`The upload could not be read (${err.message}). Send one file in the "${LOGO_UPLOAD_FIELD}" field.`));
      }
      if (err) return reject(badRequest('The upload could not be read. Send it as multipart/form-data.'));
      if (!req.file)
        return reject(badRequest(`Attach an image in the "${LOGO_UPLOAD_FIELD}" field.`, [{ path: `body.${LOGO_UPLOAD_FIELD}`, message: 'Choose an image.' }]));
      resolve(req.file.buffer);
    });
  });
}

/**
 * Store a new logo: the type is read from the bytes (PNG, JPEG or WebP), then it is redrawn as
 * a PNG at most LOGO_EDGE pixels on its longest side without the original's metadata (the
 * PDF renderer reads PNG). The old file is deleted after the firm points at the new one.
 */
export async function replaceLogo(
  em: EntityManager,
  storage: FileStorage,
  organizationId: string,
  actorId: string,
  req: Request,
  res: Response,
): Promise<Organization> {
  const bytes = await receiveLogo(req, res);
  await checkImage(bytes);
  const png = await sharp(bytes, { failOn: 'error' })
    .rotate()
    .resize(LOGO_EDGE, LOGO_EDGE, { fit: 'inside', withoutEnlargement: true })
    .png()
    .toBuffer()
    .catch(() => {
      throw new HttpError(422, 'image-unreadable', 'Image could not be read', 'The image is damaged or incomplete. Export it again and retry.');
    });
  const firm = await loadFirm(em, organizationId);
  const key = newStorageKey(`org/${firm.id}/logo`, 'png');
  await storage.put(key, png);
  const old = firm.logoPath;
  firm.logoPath = key;
  firm.logoContentType = 'image/png';
  recordFirmEvent(em, organizationId, 'logo-changed', actorId);
  await em.flush();
  if (old) await storage.delete(old);
  return firm;
}

export async function removeLogo(em: EntityManager, storage: FileStorage, organizationId: string, actorId: string): Promise<Organization> {
  const firm = await loadFirm(em, organizationId);
  if (!firm.logoPath) throw notFound('A logo');
  const old = firm.logoPath;
  firm.logoPath = null;
  firm.logoContentType = null;
  recordFirmEvent(em, organizationId, 'logo-removed', actorId);
  await em.flush();
  await storage.delete(old);
  return firm;
}
