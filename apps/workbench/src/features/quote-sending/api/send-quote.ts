import { SendQuoteResponse, type SendQuoteRequest } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from '../../quotes/api/quote-keys';
import { revisionPath, sendingKeys } from './sending-keys';

export type SendKind = 'send' | 'resend';

/** POST …/send (a draft: freezes it) or …/resend (a sent revision: a new link). */
export async function sendQuote(
  quoteId: string,
  revisionId: string,
  kind: SendKind,
  request: SendQuoteRequest,
): Promise<SendQuoteResponse> {
  return apiRequest(`${revisionPath(quoteId, revisionId)}/${kind}`, { method: 'POST', body: request, schema: SendQuoteResponse });
}

export function useSendQuote(quoteId: string, revisionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ kind, request }: { kind: SendKind; request: SendQuoteRequest }) =>
      sendQuote(quoteId, revisionId, kind, request),
    onSuccess: async (result) => {
      queryClient.setQueryData(sendingKeys.state(quoteId, revisionId), result.sending);
      // the revision is frozen and the quote's status moved: the editor reloads it read-only
      await queryClient.invalidateQueries({ queryKey: quoteKeys.detail(quoteId) });
      await queryClient.invalidateQueries({ queryKey: quoteKeys.lists() });
    },
  });
}
