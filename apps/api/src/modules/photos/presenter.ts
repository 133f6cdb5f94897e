import type { QuotePhoto } from '@gloaming/contracts';
import type { Photo } from '@gloaming/db';
import { PhotoContentType } from '@gloaming/contracts';

export function presentPhoto(photo: Photo): QuotePhoto {
  const quoteId = photo.quote.id;
  const base = `/api/quotes/${quoteId}/photos/${photo.id}`;
  return {
    id: photo.id,
    quoteId,
    caption: photo.caption,
    position: photo.position,
    onQuote: photo.onQuote,
    contentType: PhotoContentType.parse(photo.contentType),
    width: photo.width,
    height: photo.height,
    bytes: photo.bytes,
    createdAt: photo.createdAt.toISOString(),
    version: photo.version,
    imageUrl: `${base}/image`,
    thumbnailUrl: `${base}/thumbnail`,
  };
}
