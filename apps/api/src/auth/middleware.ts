import type { RequestHandler } from 'express';
import { verifyRequestOrigin, type Session, type User } from 'lucia';
import type { Role } from '@gloaming/contracts';
import { forbidden, HttpError, unauthorized } from '../http/problem';
import type { Auth } from './lucia';

export interface AuthContext {
  user: User;
  session: Session;
  organizationId: string;
  role: Role;
}

/**
 * Reads the session cookie on every request, validates it with Lucia, refreshes the cookie
 * when Lucia extends the session, and leaves `res.locals.auth` set for signed-in requests.
 */
export function loadSession(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    const sessionId = auth.readSessionCookie(req.headers.cookie ?? '');
    if (!sessionId) return next();
    const { session, user } = await auth.validateSession(sessionId);
    if (!session) {
      res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
      return next();
    }
    if (session.fresh) res.append('Set-Cookie', auth.createSessionCookie(session.id).serialize());
    const ctx: AuthContext = { user, session, organizationId: user.organizationId, role: user.role };
    res.locals.auth = ctx;
    next();
  };
}

/** 401 when signed out, 403 when the role is not in `roles`. */
export function requireAuth(roles: readonly Role[]): RequestHandler {
  return (_req, res, next) => {
    const ctx = res.locals.auth as AuthContext | undefined;
    if (!ctx) return next(unauthorized());
    if (!roles.includes(ctx.role)) return next(forbidden());
    next();
  };
}

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** A route that is exempt from the Origin check: exact method and path, nothing under it. */
export interface OriginExemption {
  method: 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
}

/**
 * CSRF defence for cookie sessions: a state-changing request that carries an Origin header
 * must come from this site (the Host it was sent to, or the configured public origin).
 * Requests without Origin come from non-browser clients, which cannot carry a victim's
 * cookie; JSON bodies also require a CORS preflight cross-site, which we never grant.
 * `exempt` lists server-to-server routes authenticated otherwise (the payment provider's
 * signed webhook): matched on the exact method and path only.
 */
export function checkOrigin(allowedHosts: string[], exempt: readonly OriginExemption[] = []): RequestHandler {
  return (req, _res, next) => {
    if (!STATE_CHANGING.has(req.method)) return next();
    if (exempt.some((e) => e.method === req.method && e.path === req.path)) return next();
    const origin = req.headers.origin;
    if (!origin) return next();
    const host = req.headers.host;
    const hosts = host ? [host, ...allowedHosts] : allowedHosts;
    if (verifyRequestOrigin(origin, hosts)) return next();
    next(new HttpError(403, 'cross-site-request', 'Cross-site request refused', 'This request came from another site and was refused.'));
  };
}
