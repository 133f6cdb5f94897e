import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PortalDeclineResponse, PortalDeclineRequest, PortalQuoteView } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { portalPath } from './fetch-quote';
import { quoteKeys } from './quote-keys';

export const declineQuote = (token: string, body: PortalDeclineRequest) =>
  apiRequest(`${portalPath(token)}/decline`, { method: 'POST', body, schema: answerWith<PortalDeclineResponse>('declined') });

export function useDeclineQuote(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: PortalDeclineRequest) => declineQuote(token, body),
    onSuccess: ({ declined }) =>
      client.setQueryData<PortalQuoteView>(quoteKeys.view(token), (q) => (q ? { ...q, state: 'declined', declined } : q)),
  });
}
