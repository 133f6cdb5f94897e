import { Lucia, TimeSpan } from 'lucia';
import type { Role } from '@gloaming/contracts';
import type { Database } from '@gloaming/db';
import { MikroOrmSessionAdapter } from './adapter';

export const SESSION_COOKIE = 'gloaming_session';

export function createLucia(orm: Database, secureCookies: boolean) {
  return new Lucia(new MikroOrmSessionAdapter(orm), {
    sessionExpiresIn: new TimeSpan(14, 'd'),
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
