import { QuoteDetailResponse, QuoteEventsResponse, RevisionResponse } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from './quote-keys';

/** GET /api/quotes/:id: the quote, its newest revision and the list of revisions. */
export async function fetchQuote(id: string, signal?: AbortSignal): Promise<QuoteDetailResponse> {
  return apiRequest(`/quotes/${encodeURIComponent(id)}`, { schema: QuoteDetailResponse, signal });
}

export const quoteQueryOptions = (id: string) => queryOptions({ queryKey: quoteKeys.detail(id), queryFn: ({ signal }) => fetchQuote(id, signal), staleTime: Infinity });

export function useQuote(id: string) {
  return useQuery(quoteQueryOptions(id));
}

/** GET /api/quotes/:id/revisions/:n: an earlier revision, read-only. */
export async function fetchRevision(id: string, number: number, signal?: AbortSignal): Promise<RevisionResponse> {
  return apiRequest(`/quotes/${encodeURIComponent(id)}/revisions/${number}`, { schema: RevisionResponse, signal });
}

export const revisionQueryOptions = (id: string, number: number) =>
  queryOptions({ queryKey: quoteKeys.revision(id, number), queryFn: ({ signal }) => fetchRevision(id, number, signal) });

export function useRevision(id: string, number: number | null) {
  return useQuery({ ...revisionQueryOptions(id, number ?? 0), enabled: number !== null });
}

/** GET /api/quotes/:id/events: the history, oldest first. */
export async function fetchQuoteEvents(id: string, signal?: AbortSignal): Promise<QuoteEventsResponse> {
  return apiRequest(`/quotes/${encodeURIComponent(id)}/events`, { schema: QuoteEventsResponse, signal });
}

export function useQuoteEvents(id: string) {
  return useQuery({ queryKey: quoteKeys.events(id), queryFn: ({ signal }) => fetchQuoteEvents(id, signal) });
}
