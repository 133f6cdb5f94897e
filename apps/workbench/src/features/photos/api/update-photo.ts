import { PhotoResponse, type QuotePhoto, type UpdatePhotoRequest } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { photoKeys } from './photo-keys';

/** PATCH /api/quotes/:id/photos/:photoId: caption or on-quote choice, with the version seen. */
export async function updateQuotePhoto(quoteId: string, photoId: string, change: UpdatePhotoRequest): Promise<QuotePhoto> {
  const { photo } = await apiRequest(`/quotes/${encodeURIComponent(quoteId)}/photos/${encodeURIComponent(photoId)}`, {
    method: 'PATCH',
    body: change,
    schema: PhotoResponse,
  });
  return photo;
}

export function useUpdateQuotePhoto(quoteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ photoId, change }: { photoId: string; change: UpdatePhotoRequest }) =>
      updateQuotePhoto(quoteId, photoId, change),
    onSuccess: (photo) =>
      queryClient.setQueryData<QuotePhoto[]>(photoKeys.quote(quoteId), (list) =>
        list?.map((p) => (p.id === photo.id ? photo : p)),
      ),
    onError: () => queryClient.invalidateQueries({ queryKey: photoKeys.quote(quoteId) }),
  });
}
