import { QuoteMessagesResponse, type QuoteMessageView } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { conversationKeys, HOMEOWNER_POLL_MS, quotePath } from './conversation-keys';

/** GET /api/quotes/:id/messages: the homeowner's questions and the firm's replies, oldest first. */
export async function fetchMessages(quoteId: string, signal?: AbortSignal): Promise<QuoteMessageView[]> {
  const { messages } = await apiRequest(`${quotePath(quoteId)}/messages`, { schema: QuoteMessagesResponse, signal });
  return messages;
}

export const messagesQueryOptions = (quoteId: string) =>
  queryOptions({
    queryKey: conversationKeys.messages(quoteId),
    queryFn: ({ signal }) => fetchMessages(quoteId, signal),
    refetchInterval: HOMEOWNER_POLL_MS,
  });

export const useMessages = (quoteId: string) => useQuery(messagesQueryOptions(quoteId));
