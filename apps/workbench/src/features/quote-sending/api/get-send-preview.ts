import { SendPreviewResponse } from '@gloaming/contracts';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { revisionPath, sendingKeys } from './sending-keys';

/** GET …/send-preview: the e-mail as it would go out, and anything that stops it. */
export async function fetchSendPreview(
  quoteId: string,
  revisionId: string,
  message: string,
  signal?: AbortSignal,
): Promise<SendPreviewResponse> {
  const query = message ? `?${new URLSearchParams({ message }).toString()}` : '';
  return apiRequest(`${revisionPath(quoteId, revisionId)}/send-preview${query}`, { schema: SendPreviewResponse, signal });
}

export const sendPreviewQueryOptions = (quoteId: string, revisionId: string, message: string) =>
  queryOptions({
    queryKey: sendingKeys.preview(quoteId, revisionId, message),
    queryFn: ({ signal }) => fetchSendPreview(quoteId, revisionId, message, signal),
    placeholderData: keepPreviousData,
  });

export function useSendPreview(quoteId: string, revisionId: string, message: string, enabled: boolean) {
  return useQuery({ ...sendPreviewQueryOptions(quoteId, revisionId, message), enabled });
}
