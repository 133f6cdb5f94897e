import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { PHOTO_CONTENT_TYPES, PHOTO_MAX_PIXELS, type PhotoContentType } from '@gloaming/contracts';
import { HttpError } from '../../http/problem';

/** The longest side of a thumbnail, pixels: sharp enough for the workbench grid and the PDF. */
export const THUMBNAIL_EDGE = 720;

export interface CheckedImage {
  contentType: PhotoContentType;
  extension: 'jpg' | 'png' | 'webp';
  width: number;
  height: number;
}

const EXTENSIONS: Record<PhotoContentType, CheckedImage['extension']> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
};

export const unsupportedImage = () =>
  new HttpError(
    415,
    'unsupported-image-type',
    'Not a supported image',
    'Upload a JPEG, PNG or WebP image. The file content is checked, not its name.',
  );
const tooManyPixels = (w: number, h: number) =>
  new HttpError(
    422,
    'image-too-many-pixels',
    'Image too large',
    `This image is ${w} x ${h} pixels; the most we accept is ${PHOTO_MAX_PIXELS / 1_000_000} megapixels. Resize it and try again.`,
  );
const unreadable = () =>
  new HttpError(
    422,
    'image-unreadable',
    'Image could not be read',
    'The image is damaged or incomplete. Export it again and retry.',
  );

const isPhotoType = (mime: string): mime is PhotoContentType => (PHOTO_CONTENT_TYPES as readonly string[]).includes(mime);

/**
 * Check an upload from its bytes: the magic number decides the type (never the name or the
 * client's content type), then the header's pixel dimensions are checked before anything is
 * decoded, so a small file that would inflate to gigabytes (a decompression bomb) is refused.
 */
export async function checkImage(bytes: Buffer): Promise<CheckedImage> {
  const detected = await fileTypeFromBuffer(bytes);
  if (!detected || !isPhotoType(detected.mime)) throw unsupportedImage();
  let width: number | undefined;
  let height: number | undefined;
  let format: string | undefined;
  try {
    // metadata() reads the header only; limitInputPixels:false so we can report the real size
    const meta = await sharp(bytes, { limitInputPixels: false }).metadata();
    ({ width, height, format } = meta);
  } catch {
    throw unreadable();
  }
  if (!width || !height) throw unreadable();
  if (width * height > PHOTO_MAX_PIXELS) throw tooManyPixels(width, height);
  const expected = { 'image/jpeg': 'jpeg', 'image/png': 'png', 'image/webp': 'webp' }[detected.mime];
  if (format !== expected) throw unsupportedImage();
  return { contentType: detected.mime, extension: EXTENSIONS[detected.mime], width, height };
}

/**
 * A JPEG thumbnail, upright (EXIF orientation applied) and without the original's metadata
 * (no camera GPS leaves the api in it). Decoding is capped by sharp's limitInputPixels too.
 */
export async function makeThumbnail(bytes: Buffer): Promise<Buffer> {
  try {
    return await sharp(bytes, { limitInputPixels: PHOTO_MAX_PIXELS, failOn: 'error' })
      .rotate()
      .resize(THUMBNAIL_EDGE, THUMBNAIL_EDGE, { fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 78, mozjpeg: true })
      .toBuffer();
  } catch {
    throw unreadable();
  }
}
