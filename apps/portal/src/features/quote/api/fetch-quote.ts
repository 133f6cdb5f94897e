import type { PortalQuoteResponse, PortalQuoteView } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';

export const portalPath = (token: string) => `/portal/${encodeURIComponent(token)}`;

/** GET /api/portal/<token>: the quote as the homeowner may see it (each GET counts as a view). */
export async function fetchQuote(token: string, signal?: AbortSignal): Promise<PortalQuoteView> {
  const res = await apiRequest(portalPath(token), {
    schema: answerWith<PortalQuoteResponse>('quote'),
    ...(signal ? { signal } : {}),
  });
  return res.quote;
}
