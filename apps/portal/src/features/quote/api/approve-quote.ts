import type { PortalApprovalResponse, PortalApprovalRequest } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { useApiAction } from '../../../lib/use-api-action';
import { useQuoteUpdate } from '../quote-update';
import { portalPath } from './fetch-quote';

export const approveQuote = (token: string, body: PortalApprovalRequest) =>
  apiRequest(`${portalPath(token)}/approval`, { method: 'POST', body, schema: answerWith<PortalApprovalResponse>('approval') });

/** Approve; the quote on screen takes the approval from the answer (refetching would count another view). */
export function useApproveQuote(token: string) {
  const update = useQuoteUpdate();
  return useApiAction(
    (body: PortalApprovalRequest) => approveQuote(token, body),
    ({ approval }) => update((q) => ({ ...q, state: 'approved', approval, selection: approval.selection, totals: approval.totals })),
  );
}
