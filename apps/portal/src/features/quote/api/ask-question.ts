import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PortalQuestionResponse, PortalQuoteView } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { portalPath } from './fetch-quote';
import { quoteKeys } from './quote-keys';

export const askQuestion = (token: string, body: string) =>
  apiRequest(`${portalPath(token)}/questions`, {
    method: 'POST',
    body: { body },
    schema: answerWith<PortalQuestionResponse>('message'),
  });

export function useAskQuestion(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: string) => askQuestion(token, body),
    onSuccess: ({ message }) =>
      client.setQueryData<PortalQuoteView>(quoteKeys.view(token), (q) => (q ? { ...q, messages: [...q.messages, message] } : q)),
  });
}
