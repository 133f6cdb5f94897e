import { SessionResponse, type AcceptInviteRequest, type SessionUser } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { sessionKeys } from '../../session/api/session-keys';

/** POST /api/invites/accept: sets the invited person's password and signs them in. */
export async function acceptInvite(request: AcceptInviteRequest): Promise<SessionUser> {
  const { user } = await apiRequest('/invites/accept', { method: 'POST', body: request, schema: SessionResponse });
  return user;
}

export function useAcceptInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvite,
    onSuccess: (user) => {
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
      queryClient.setQueryData(sessionKeys.current(), user);
    },
  });
}
