import { QuoteReplyResponse } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from '../../quotes/api/quote-keys';
import { conversationKeys, quotePath } from './conversation-keys';

/** POST /api/quotes/:id/messages: the reply is e-mailed to the homeowner with a link to their quote. */
export async function sendReply(quoteId: string, body: string): Promise<QuoteReplyResponse> {
  return apiRequest(`${quotePath(quoteId)}/messages`, { method: 'POST', body: { body }, schema: QuoteReplyResponse });
}

export function useSendReply(quoteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: string) => sendReply(quoteId, body),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: conversationKeys.messages(quoteId) }),
        queryClient.invalidateQueries({ queryKey: quoteKeys.events(quoteId) }),
      ]),
  });
}
