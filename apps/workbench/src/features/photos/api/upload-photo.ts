import { PHOTO_UPLOAD_FIELD, PhotoResponse, type QuotePhoto } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { photoKeys } from './photo-keys';

/** POST /api/quotes/:id/photos (multipart): the server checks the type from the bytes. */
export async function uploadQuotePhoto(quoteId: string, file: File, caption = ''): Promise<QuotePhoto> {
  const form = new FormData();
  if (caption) form.append('caption', caption);
  form.append(PHOTO_UPLOAD_FIELD, file);
  const { photo } = await apiRequest(`/quotes/${encodeURIComponent(quoteId)}/photos`, {
    method: 'POST',
    body: form,
    schema: PhotoResponse,
  });
  return photo;
}

export function useUploadQuotePhoto(quoteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadQuotePhoto(quoteId, file),
    onSettled: () => queryClient.invalidateQueries({ queryKey: photoKeys.quote(quoteId) }),
  });
}
