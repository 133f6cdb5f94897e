import { createHash } from 'node:crypto';
import { AuthToken, newSecretToken, type AuthTokenPurpose, type EntityManager, type User } from '@gloaming/db';
import { gone } from '../http/problem';

export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex');

/** Issue a single-use e-mail token; returns the raw token (only its hash is stored). */
export function issueToken(em: EntityManager, user: User, purpose: AuthTokenPurpose, ttlMs: number): string {
  const token = newSecretToken();
  em.create(AuthToken, {
    organization: user.organization,
    user,
    purpose,
    tokenHash: hashToken(token),
    expiresAt: new Date(Date.now() + ttlMs),
  });
  return token;
}

/**
 * Use a token once. Unknown, used and expired tokens get one 410 message each, so a caller
 * learns nothing about which it was beyond what the user needs to act.
 */
export async function consumeToken(em: EntityManager, token: string, purpose: AuthTokenPurpose): Promise<User> {
  const record = await em.findOne(AuthToken, { tokenHash: hashToken(token), purpose }, { populate: ['user', 'user.organization'] });
  const what = purpose === 'invite' ? 'invitation' : 'password reset';
  if (!record || record.usedAt) throw gone(`This ${what} link has already been used or is not valid. Ask for a new one.`);
  if (record.expiresAt.getTime() < Date.now()) throw gone(`This ${what} link has expired. Ask for a new one.`);
  record.usedAt = new Date();
  return record.user;
}
