import type { SessionUser } from '@gloaming/contracts';
import { useCurrentUser } from '../api/get-session';

/**
 * The signed-in person, for screens inside the shell. The shell only renders its screens once
 * the session is known, so a missing user here is a wiring mistake, reported as such.
 */
export function useSignedInUser(): SessionUser {
  const { data } = useCurrentUser();
  if (!data) throw new Error('useSignedInUser was called outside the signed-in shell.');
  return data;
}
