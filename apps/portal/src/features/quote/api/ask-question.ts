import type { PortalQuestionResponse } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { useApiAction } from '../../../lib/use-api-action';
import { useQuoteUpdate } from '../quote-update';
import { portalPath } from './fetch-quote';

export const askQuestion = (token: string, body: string) =>
  apiRequest(`${portalPath(token)}/questions`, {
    method: 'POST',
    body: { body },
    schema: answerWith<PortalQuestionResponse>('message'),
  });

export function useAskQuestion(token: string) {
  const update = useQuoteUpdate();
  return useApiAction(
    (body: string) => askQuestion(token, body),
    ({ message }) => update((q) => ({ ...q, messages: [...q.messages, message] })),
  );
}
