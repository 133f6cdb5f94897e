import { QuoteDetailResponse } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from './quote-keys';

/** POST /api/quotes/:id/revisions: a new draft from the sent revision. */
export async function reviseQuote(id: string): Promise<QuoteDetailResponse> {
  return apiRequest(`/quotes/${encodeURIComponent(id)}/revisions`, { method: 'POST', schema: QuoteDetailResponse });
}

export function useReviseQuote(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => reviseQuote(id),
    onSuccess: (detail) => {
      queryClient.setQueryData(quoteKeys.detail(id), detail);
      return queryClient.invalidateQueries({ queryKey: quoteKeys.lists() });
    },
  });
}
