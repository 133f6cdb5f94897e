import { QuoteDepositsResponse } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { depositKeys, quoteDepositsPath } from './deposit-keys';

/** GET /quotes/:id/deposits: the approved deposit and every payment attempt, newest first. */
export async function fetchQuoteDeposits(quoteId: string, signal?: AbortSignal): Promise<QuoteDepositsResponse> {
  return apiRequest(quoteDepositsPath(quoteId), { schema: QuoteDepositsResponse, signal });
}

export const quoteDepositsQueryOptions = (quoteId: string) =>
  queryOptions({
    queryKey: depositKeys.quote(quoteId),
    queryFn: ({ signal }) => fetchQuoteDeposits(quoteId, signal),
  });

export function useQuoteDeposits(quoteId: string) {
  return useQuery(quoteDepositsQueryOptions(quoteId));
}
