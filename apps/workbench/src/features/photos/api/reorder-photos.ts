import { PhotoListResponse, type QuotePhoto } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { photoKeys } from './photo-keys';

/** PUT /api/quotes/:id/photos/order: every photo of the quote, in the new order. */
export async function reorderQuotePhotos(quoteId: string, photoIds: string[]): Promise<QuotePhoto[]> {
  const { photos } = await apiRequest(`/quotes/${encodeURIComponent(quoteId)}/photos/order`, {
    method: 'PUT',
    body: { photoIds },
    schema: PhotoListResponse,
  });
  return photos;
}

/** Moves optimistically; the server's order wins when it answers. */
export function useReorderQuotePhotos(quoteId: string) {
  const queryClient = useQueryClient();
  const key = photoKeys.quote(quoteId);
  return useMutation({
    mutationFn: (photoIds: string[]) => reorderQuotePhotos(quoteId, photoIds),
    onMutate: async (photoIds) => {
      await queryClient.cancelQueries({ queryKey: key });
      const before = queryClient.getQueryData<QuotePhoto[]>(key);
      if (before) {
        const byId = new Map(before.map((p) => [p.id, p]));
        queryClient.setQueryData<QuotePhoto[]>(
          key,
          photoIds.flatMap((id, position) => {
            const p = byId.get(id);
            return p ? [{ ...p, position }] : [];
          }),
        );
      }
      return { before };
    },
    onError: (_err, _ids, context) => {
      if (context?.before) queryClient.setQueryData(key, context.before);
    },
    onSuccess: (photos) => queryClient.setQueryData(key, photos),
  });
}
