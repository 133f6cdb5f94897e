import { PhotoListResponse, type QuotePhoto } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { photoKeys } from './photo-keys';

/** GET /api/quotes/:id/photos: the quote's site photos and plans, in order. */
export async function fetchQuotePhotos(quoteId: string, signal?: AbortSignal): Promise<QuotePhoto[]> {
  const { photos } = await apiRequest(`/quotes/${encodeURIComponent(quoteId)}/photos`, { schema: PhotoListResponse, signal });
  return photos;
}

export const quotePhotosQueryOptions = (quoteId: string) =>
  queryOptions({ queryKey: photoKeys.quote(quoteId), queryFn: ({ signal }) => fetchQuotePhotos(quoteId, signal) });

export function useQuotePhotos(quoteId: string) {
  return useQuery(quotePhotosQueryOptions(quoteId));
}
