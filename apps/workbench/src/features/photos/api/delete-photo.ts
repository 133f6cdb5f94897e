import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, noContent } from '../../../lib/http-client';
import { photoKeys } from './photo-keys';

/** DELETE /api/quotes/:id/photos/:photoId. */
export async function deleteQuotePhoto(quoteId: string, photoId: string): Promise<void> {
  await apiRequest(`/quotes/${encodeURIComponent(quoteId)}/photos/${encodeURIComponent(photoId)}`, {
    method: 'DELETE',
    schema: noContent,
  });
}

export function useDeleteQuotePhoto(quoteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (photoId: string) => deleteQuotePhoto(quoteId, photoId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: photoKeys.quote(quoteId) }),
  });
}
