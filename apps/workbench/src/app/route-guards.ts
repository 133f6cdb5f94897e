import type { Role, SessionUser } from '@gloaming/contracts';
import type { QueryClient } from '@tanstack/react-query';
import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { currentUserQueryOptions } from '../features/session/api/get-session';
import { ROLE_HOME } from '../features/session/role-home';

/** Resolves with the signed-in user, or sends the visitor to sign in and back here afterwards. */
export async function requireUser(queryClient: QueryClient, request: Request): Promise<SessionUser> {
  const user = await queryClient.ensureQueryData(currentUserQueryOptions());
  if (!user) {
    const url = new URL(request.url);
    throw redirect(`/sign-in?next=${encodeURIComponent(`${url.pathname}${url.search}`)}`);
  }
  return user;
}

/** Like requireUser, and sends people whose role may not open the screen to their own home. */
export async function requireRole(queryClient: QueryClient, request: Request, roles: ReadonlyArray<Role>): Promise<SessionUser> {
  const user = await requireUser(queryClient, request);
  if (!roles.includes(user.role)) throw redirect(ROLE_HOME[user.role]);
  return user;
}

/** Signed-out pages (sign in) send someone already signed in to their home. */
export function signedOutOnly(queryClient: QueryClient) {
  return async (_args: LoaderFunctionArgs) => {
    // If the session cannot be checked (api unreachable), still offer the form: it reports the problem.
    const user = await queryClient.ensureQueryData(currentUserQueryOptions()).catch(() => null);
    if (user) throw redirect(ROLE_HOME[user.role]);
    return null;
  };
}
