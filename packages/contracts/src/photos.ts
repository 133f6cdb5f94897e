import { z } from 'zod';

/**
 * Site photos and plan images attached to a quote. The api checks the type from the bytes
 * (never the file name), refuses images with too many pixels before decoding them, and makes
 * a JPEG thumbnail that the workbench lists and the quote PDF prints.
 */
export const PHOTO_CONTENT_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export const PhotoContentType = z.enum(PHOTO_CONTENT_TYPES);
export type PhotoContentType = z.infer<typeof PhotoContentType>;

/** Largest upload, bytes (a phone photo is 2-8 MB). */
export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;
/** Most pixels an image may declare (width x height) before we refuse to decode it. */
export const PHOTO_MAX_PIXELS = 64_000_000;
/** Most photos on one quote. */
export const PHOTO_MAX_PER_QUOTE = 60;
/** The multipart field the file goes in. */
export const PHOTO_UPLOAD_FIELD = 'file';

const Caption = z.string().trim().max(300, 'At most 300 characters.');

export const QuotePhoto = z.object({
  id: z.string(),
  quoteId: z.string(),
  caption: z.string(),
  /** 0-based order on the quote and in the PDF. */
  position: z.number().int(),
  /** Printed on the quote PDF and shown in the portal. */
  onQuote: z.boolean(),
  contentType: PhotoContentType,
  width: z.number().int(),
  height: z.number().int(),
  bytes: z.number().int(),
  createdAt: z.string(),
  version: z.number().int(),
  /** Same-origin api paths, for signed-in staff of the firm. */
  imageUrl: z.string(),
  thumbnailUrl: z.string(),
});
export type QuotePhoto = z.infer<typeof QuotePhoto>;

export const PhotoListResponse = z.object({ photos: z.array(QuotePhoto) });
export type PhotoListResponse = z.infer<typeof PhotoListResponse>;

export const PhotoResponse = z.object({ photo: QuotePhoto });
export type PhotoResponse = z.infer<typeof PhotoResponse>;

/** The optional caption sent beside the file in the multipart upload. */
export const PhotoUploadFields = z.object({ caption: Caption.optional() });
export type PhotoUploadFields = z.infer<typeof PhotoUploadFields>;

export const UpdatePhotoRequest = z
  .object({
    caption: Caption.optional(),
    onQuote: z.boolean().optional(),
    /** The version the client last saw: a stale one answers 409. */
    version: z.number().int().min(1),
  })
  .refine((v) => v.caption !== undefined || v.onQuote !== undefined, { message: 'Change the caption or whether it is on the quote.' });
export type UpdatePhotoRequest = z.infer<typeof UpdatePhotoRequest>;

/** Every photo of the quote, in the new order. */
export const ReorderPhotosRequest = z.object({
  photoIds: z.array(z.uuid('This id is not valid.')).min(1).max(PHOTO_MAX_PER_QUOTE),
});
export type ReorderPhotosRequest = z.infer<typeof ReorderPhotosRequest>;

export const QuotePhotoParams = z.object({
  id: z.uuid('This id is not valid.'),
  photoId: z.uuid('This id is not valid.'),
});
export type QuotePhotoParams = z.infer<typeof QuotePhotoParams>;
