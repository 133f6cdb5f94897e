import { SessionResponse, type SessionUser } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-error';
import { apiRequest } from '../../../lib/http-client';
import { sessionKeys } from './session-keys';

/** GET /api/session. Signed out is an answer, not an error: it resolves with null. */
export async function fetchCurrentUser(signal?: AbortSignal): Promise<SessionUser | null> {
  try {
    const { user } = await apiRequest('/session', { schema: SessionResponse, signal });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const currentUserQueryOptions = () =>
  queryOptions({
    queryKey: sessionKeys.current(),
    queryFn: ({ signal }) => fetchCurrentUser(signal),
    staleTime: 5 * 60_000,
  });

export function useCurrentUser() {
  return useQuery(currentUserQueryOptions());
}
