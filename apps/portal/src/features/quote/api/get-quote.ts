import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PortalQuoteResponse, PortalQuoteView } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { quoteKeys } from './quote-keys';

export const portalPath = (token: string) => `/portal/${encodeURIComponent(token)}`;

export async function fetchQuote(token: string, signal?: AbortSignal): Promise<PortalQuoteView> {
  const res = await apiRequest(portalPath(token), {
    schema: answerWith<PortalQuoteResponse>('quote'),
    ...(signal ? { signal } : {}),
  });
  return res.quote;
}

export const quoteQueryOptions = (token: string) =>
  queryOptions({ queryKey: quoteKeys.view(token), queryFn: ({ signal }) => fetchQuote(token, signal) });

export const useQuote = (token: string) => useQuery(quoteQueryOptions(token));
