import { QuoteListResponse } from '@gloaming/contracts';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys, type QuoteListFilters } from './quote-keys';

/** GET /api/quotes: the firm's quotes, newest first, filtered and paged. */
export async function fetchQuotes(filters: QuoteListFilters, signal?: AbortSignal): Promise<QuoteListResponse> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) if (value !== undefined && value !== '') params.set(key, String(value));
  const qs = params.toString();
  return apiRequest(`/quotes${qs ? `?${qs}` : ''}`, { schema: QuoteListResponse, signal });
}

export const quotesQueryOptions = (filters: QuoteListFilters) =>
  queryOptions({ queryKey: quoteKeys.list(filters), queryFn: ({ signal }) => fetchQuotes(filters, signal), placeholderData: keepPreviousData });

export function useQuotes(filters: QuoteListFilters) {
  return useQuery(quotesQueryOptions(filters));
}
