import type { PortalDeclineResponse, PortalDeclineRequest } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { useApiAction } from '../../../lib/use-api-action';
import { useQuoteUpdate } from '../quote-update';
import { portalPath } from './fetch-quote';

export const declineQuote = (token: string, body: PortalDeclineRequest) =>
  apiRequest(`${portalPath(token)}/decline`, { method: 'POST', body, schema: answerWith<PortalDeclineResponse>('declined') });

export function useDeclineQuote(token: string) {
  const update = useQuoteUpdate();
  return useApiAction(
    (body: PortalDeclineRequest) => declineQuote(token, body),
    ({ declined }) => update((q) => ({ ...q, state: 'declined', declined })),
  );
}
