import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PortalApprovalResponse, PortalApprovalRequest, PortalQuoteView } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { portalPath } from './fetch-quote';
import { quoteKeys } from './quote-keys';

export const approveQuote = (token: string, body: PortalApprovalRequest) =>
  apiRequest(`${portalPath(token)}/approval`, { method: 'POST', body, schema: answerWith<PortalApprovalResponse>('approval') });

/** Approve; the cached view takes the approval from the answer (refetching would count another view). */
export function useApproveQuote(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: PortalApprovalRequest) => approveQuote(token, body),
    onSuccess: ({ approval }) =>
      client.setQueryData<PortalQuoteView>(quoteKeys.view(token), (q) =>
        q ? { ...q, state: 'approved', approval, selection: approval.selection, totals: approval.totals } : q,
      ),
  });
}
