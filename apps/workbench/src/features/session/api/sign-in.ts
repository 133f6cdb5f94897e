import { SessionResponse, type SessionUser, type SignInRequest } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { sessionKeys } from './session-keys';

/** POST /api/session: the api sets the session cookie and answers with the user. */
export async function signIn(credentials: SignInRequest): Promise<SessionUser> {
  const { user } = await apiRequest('/session', { method: 'POST', body: credentials, schema: SessionResponse });
  return user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // Nothing cached for a previous person may survive a change of user.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
      queryClient.setQueryData(sessionKeys.current(), user);
    },
  });
}
