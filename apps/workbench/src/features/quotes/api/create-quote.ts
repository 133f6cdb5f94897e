import { QuoteDetailResponse, type CreateQuoteRequest } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from './quote-keys';

/** POST /api/quotes: a new quote with its first draft revision. */
export async function createQuote(request: CreateQuoteRequest): Promise<QuoteDetailResponse> {
  return apiRequest('/quotes', { method: 'POST', body: request, schema: QuoteDetailResponse });
}

export function useCreateQuote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createQuote,
    onSuccess: (detail) => {
      queryClient.setQueryData(quoteKeys.detail(detail.quote.id), detail);
      return queryClient.invalidateQueries({ queryKey: quoteKeys.lists() });
    },
  });
}
