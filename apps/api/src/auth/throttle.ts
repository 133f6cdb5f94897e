import type { Request, RequestHandler } from 'express';
import { rateLimit, type Store } from 'express-rate-limit';
import type { RateLimitStores } from './rate-limit-store';
import { tooManyRequests } from '../http/problem';

export interface ThrottleSettings {
  maxPerAccount: number;
  maxPerIp: number;
  windowMs: number;
}

function retryAfterSeconds(req: Request, windowMs: number): number {
  const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
  const ms = reset ? reset.getTime() - Date.now() : windowMs;
  return Math.max(1, Math.ceil(ms / 1000));
}

function waitPhrase(seconds: number): string {
  const minutes = Math.ceil(seconds / 60);
  return minutes <= 1 ? 'a minute' : `${minutes} minutes`;
}

/** express-rate-limit's `store` option: the shared store when there is one, else its memory store. */
export const storeOption = (store: Store | undefined): { store?: Store } => (store ? { store } : {});

/**
 * Sign-in throttles: failed attempts are counted per account (the e-mail typed) and per
 * client IP; successful sign-ins are not counted. Either limit answers 429 problem+json
 * with a clear wait time and a Retry-After header.
 */
export function signInThrottles(s: ThrottleSettings, stores: RateLimitStores): RequestHandler[] {
  const perIp = rateLimit({
    ...storeOption(stores('signin-ip')),
    windowMs: s.windowMs,
    limit: s.maxPerIp,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, _res, next) => {
      const wait = retryAfterSeconds(req, s.windowMs);
      next(tooManyRequests(`Too many sign-in attempts from this network. Try again in ${waitPhrase(wait)}.`, wait));
    },
  });
  const perAccount = rateLimit({
    ...storeOption(stores('signin-account')),
    windowMs: s.windowMs,
    limit: s.maxPerAccount,
    skipSuccessfulRequests: true,
    standardHeaders: false,
    legacyHeaders: false,
    keyGenerator: (req) => {
      const email = (req.body as { email?: unknown } | undefined)?.email;
      return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
    },
    handler: (req, _res, next) => {
      const wait = retryAfterSeconds(req, s.windowMs);
      next(
        tooManyRequests(
          `Too many failed sign-in attempts for this account. Try again in ${waitPhrase(wait)}, or reset your password.`,
          wait,
        ),
      );
    },
  });
  return [perIp, perAccount];
}

/**
 * A general limiter for e-mail-sending public routes (password reset requests). Give it
 * `deps.rateLimits(<limiter name>)` so the count is shared by every api process.
 */
export function emailRequestThrottle(windowMs: number, limit: number, store?: Store): RequestHandler {
  return rateLimit({
    ...storeOption(store),
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, _res, next) => {
      const wait = retryAfterSeconds(req, windowMs);
      next(tooManyRequests(`Too many requests. Try again in ${waitPhrase(wait)}.`, wait));
    },
  });
}
