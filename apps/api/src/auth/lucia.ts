import { Lucia, TimeSpan } from 'lucia';
import type { Role } from '@gloaming/contracts';
import type { Database } from '@gloaming/db';
import { MikroOrmSessionAdapter } from './adapter';

export const SESSION_COOKIE = 'gloaming_session';

/** How long a session lives: `idle` since it was last used, `absolute` since sign-in at most. */
export interface SessionLifetimes {
  idleMinutes: number;
  absoluteMinutes: number;
}

/**
 * Lucia's expiry slides: each use of a session more than half-way to its expiry extends it by
 * the idle window. The adapter adds the absolute limit, counted from sign-in, which no amount
 * of use extends.
 */
export function createLucia(orm: Database, secureCookies: boolean, lifetimes: SessionLifetimes) {
  return new Lucia(new MikroOrmSessionAdapter(orm, lifetimes.absoluteMinutes * 60_000), {
    sessionExpiresIn: new TimeSpan(lifetimes.idleMinutes, 'm'),
    sessionCookie: {
      name: SESSION_COOKIE,
      attributes: { secure: secureCookies, sameSite: 'lax', path: '/' },
    },
    getSessionAttributes: (a) => ({ organizationId: a.organizationId }),
    getUserAttributes: (a) => ({
      email: a.email,
      name: a.name,
      role: a.role,
      organizationId: a.organizationId,
      organizationName: a.organizationName,
    }),
  });
}

export type Auth = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: Auth;
    DatabaseSessionAttributes: { organizationId: string };
    DatabaseUserAttributes: {
      email: string;
      name: string;
      role: Role;
      organizationId: string;
      organizationName: string;
    };
  }
}
