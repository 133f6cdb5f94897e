import type { Response } from 'express';
import { hashPassword, verifyPassword, type EntityManager, User } from '@gloaming/db';
import type { Auth } from '../../auth/lucia';
import { unauthorized } from '../../http/problem';

// A real argon2id hash of a random string: verifying against it costs the same time as a
// real account, so an unknown e-mail cannot be told apart by timing.
let dummyHash: Promise<string> | undefined;
const getDummyHash = () => (dummyHash ??= hashPassword(`no-such-account-${Math.random()}`));

export const WRONG_CREDENTIALS = 'That e-mail and password do not match an active account. Check both and try again.';

/** Check an e-mail and password; returns the active user or throws 401 with one message. */
export async function authenticate(em: EntityManager, email: string, password: string): Promise<User> {
  const user = await em.findOne(User, { email }, { populate: ['organization'] });
  if (!user || !user.passwordHash || !user.active) {
    await verifyPassword(await getDummyHash(), password);
    throw unauthorized(WRONG_CREDENTIALS);
  }
  if (!(await verifyPassword(user.passwordHash, password))) throw unauthorized(WRONG_CREDENTIALS);
  return user;
}

/**
 * Start a fresh session for `user` (a new id every sign-in: no fixation), ending the one the
 * browser had, and set the cookie.
 */
export async function startSession(auth: Auth, res: Response, user: User, previousSessionId?: string): Promise<void> {
  if (previousSessionId) await auth.invalidateSession(previousSessionId);
  const session = await auth.createSession(user.id, { organizationId: user.organization.id });
  res.append('Set-Cookie', auth.createSessionCookie(session.id).serialize());
}
