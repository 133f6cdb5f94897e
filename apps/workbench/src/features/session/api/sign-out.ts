import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, noContent } from '../../../lib/http-client';
import { sessionKeys } from './session-keys';

/** DELETE /api/session. */
export async function signOut(): Promise<void> {
  await apiRequest('/session', { method: 'DELETE', schema: noContent });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.current(), null);
    },
  });
}
