import { SendingStateResponse, type RevisionSendingState } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { revisionPath, sendingKeys } from './sending-keys';

/** GET …/revisions/:revisionId/sending: sent or not, and the portal links. */
export async function fetchSendingState(
  quoteId: string,
  revisionId: string,
  signal?: AbortSignal,
): Promise<RevisionSendingState> {
  const { sending } = await apiRequest(`${revisionPath(quoteId, revisionId)}/sending`, { schema: SendingStateResponse, signal });
  return sending;
}

/** While an e-mail waits for the mail server, ask again this often, so "queued" turns to "sent". */
export const QUEUED_POLL_MS = 5_000;

export const sendingStateQueryOptions = (quoteId: string, revisionId: string) =>
  queryOptions({
    queryKey: sendingKeys.state(quoteId, revisionId),
    queryFn: ({ signal }) => fetchSendingState(quoteId, revisionId, signal),
    refetchInterval: (query) => (query.state.data?.links.some((l) => l.delivery === 'queued') ? QUEUED_POLL_MS : false),
  });

export function useSendingState(quoteId: string, revisionId: string) {
  return useQuery(sendingStateQueryOptions(quoteId, revisionId));
}
