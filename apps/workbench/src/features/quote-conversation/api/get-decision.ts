import { QuoteDecisionResponse, type QuoteDetailResponse } from '@gloaming/contracts';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from '../../quotes/api/quote-keys';
import { conversationKeys, HOMEOWNER_POLL_MS, quotePath } from './conversation-keys';

/** GET /api/quotes/:id/decision: the approval (frozen choice and totals) or the decline, and the status. */
export async function fetchDecision(quoteId: string, signal?: AbortSignal): Promise<QuoteDecisionResponse> {
  return apiRequest(`${quotePath(quoteId)}/decision`, { schema: QuoteDecisionResponse, signal });
}

export const decisionQueryOptions = (quoteId: string) =>
  queryOptions({
    queryKey: conversationKeys.decision(quoteId),
    queryFn: ({ signal }) => fetchDecision(quoteId, signal),
    refetchInterval: HOMEOWNER_POLL_MS,
  });

/**
 * The decision, polled; when the homeowner's steps move the quote's status, the quote page's
 * status badge follows (only the status is patched: the open estimate is left alone).
 */
export function useDecision(quoteId: string) {
  const query = useQuery(decisionQueryOptions(quoteId));
  const queryClient = useQueryClient();
  const status = query.data?.status;
  useEffect(() => {
    if (!status) return;
    queryClient.setQueryData<QuoteDetailResponse>(quoteKeys.detail(quoteId), (detail) =>
      detail && detail.quote.status !== status ? { ...detail, quote: { ...detail.quote, status } } : detail,
    );
  }, [queryClient, quoteId, status]);
  return query;
}
