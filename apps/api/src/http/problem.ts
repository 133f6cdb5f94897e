import type { ErrorRequestHandler, RequestHandler, Response } from 'express';
import { PROBLEM_CONTENT_TYPE, type FieldError, type Problem } from '@gloaming/contracts';
import { isDatabaseBusy, OptimisticLockError, UniqueConstraintViolationException } from '@gloaming/db';

/**
 * Errors the handlers throw on purpose. Each becomes an RFC 9457 problem+json response
 * with a stable `type` (a relative URI under /problems/) and a plain-English `detail`.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly slug: string,
    readonly title: string,
    readonly detail?: string,
    readonly extra: Partial<Pick<Problem, 'errors' | 'retryAfterSeconds' | 'blockers'>> = {},
  ) {
    super(detail ?? title);
  }
}

export const badRequest = (detail: string, errors?: FieldError[]) =>
  new HttpError(400, 'validation-failed', 'Some fields need attention', detail, errors ? { errors } : {});
export const unauthorized = (detail = 'Sign in to continue.') => new HttpError(401, 'unauthenticated', 'Not signed in', detail);
export const forbidden = (detail = 'Your role does not allow this.') => new HttpError(403, 'forbidden', 'Not allowed', detail);
export const notFound = (what = 'That item') =>
  new HttpError(404, 'not-found', 'Not found', `${what} does not exist or is not yours to see.`);
export const conflict = (detail: string) => new HttpError(409, 'conflict', 'Conflict', detail);
export const gone = (detail: string) => new HttpError(410, 'gone', 'Link no longer valid', detail);
export const tooManyRequests = (detail: string, retryAfterSeconds: number) =>
  new HttpError(429, 'too-many-requests', 'Too many attempts', detail, { retryAfterSeconds });

export function sendProblem(res: Response, problem: Problem): void {
  res.status(problem.status).type(PROBLEM_CONTENT_TYPE).json(problem);
}

function problemFrom(err: HttpError, instance: string): Problem {
  return {
    type: `/problems/${err.slug}`,
    title: err.title,
    status: err.status,
    ...(err.detail ? { detail: err.detail } : {}),
    instance,
    ...err.extra,
  };
}

/** 404 for anything under /api that no route matched. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(
    new HttpError(404, 'no-such-route', 'Not found', `There is no ${req.method} ${req.originalUrl.split('?')[0]} in this api.`),
  );
};

interface BodyParserError {
  type?: string;
  status?: number;
  expose?: boolean;
  message?: string;
}

/**
 * The one error handler. Known errors map to their status; body-parser errors (bad JSON,
 * too large, wrong charset) map to 400/413/415; anything else is logged and answered with a
 * generic 500 problem: never a stack trace to the client.
 */
export function errorHandler(log: (msg: string, err: unknown) => void): ErrorRequestHandler {
  return (err: unknown, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    const instance = req.originalUrl.split('?')[0] ?? req.originalUrl;
    if (err instanceof HttpError) {
      if (err.extra.retryAfterSeconds !== undefined) res.setHeader('Retry-After', String(err.extra.retryAfterSeconds));
      sendProblem(res, problemFrom(err, instance));
      return;
    }
    if (err instanceof OptimisticLockError) {
      sendProblem(res, problemFrom(conflict('Someone else saved this first. Reload to see their changes.'), instance));
      return;
    }
    if (isDatabaseBusy(err)) {
      // SQLite answered "database is locked" after its busy timeout, or PostgreSQL hit its lock
      // timeout or a deadlock: the write did not happen, and trying again in a moment will very
      // likely work.
      res.setHeader('Retry-After', '1');
      sendProblem(res, {
        type: '/problems/busy',
        title: 'Busy',
        status: 503,
        detail: 'The database is busy. Nothing was changed; please try again in a moment.',
        instance,
      });
      return;
    }
    if (err instanceof UniqueConstraintViolationException) {
      sendProblem(res, problemFrom(conflict('That already exists.'), instance));
      return;
    }
    const bp = err as BodyParserError;
    if (bp && typeof bp === 'object' && typeof bp.type === 'string' && typeof bp.status === 'number' && bp.expose) {
      const map: Record<string, [number, string, string]> = {
        'entity.parse.failed': [400, 'malformed-json', 'The request body is not valid JSON.'],
        'entity.too.large': [413, 'payload-too-large', 'The request body is too large.'],
        'encoding.unsupported': [415, 'unsupported-encoding', 'The request body encoding is not supported.'],
        'charset.unsupported': [415, 'unsupported-charset', 'The request body charset is not supported.'],
        'request.aborted': [400, 'request-aborted', 'The request was aborted.'],
      };
      const [status, slug, detail] = map[bp.type] ?? [bp.status, 'bad-request', 'The request could not be read.'];
      sendProblem(res, problemFrom(new HttpError(status, slug, 'Bad request', detail), instance));
      return;
    }
    log(`Unhandled error on ${req.method} ${instance}`, err);
    sendProblem(res, {
      type: '/problems/internal',
      title: 'Something went wrong',
      status: 500,
      detail: 'Something went wrong on our side. Nothing you entered was lost; please try again.',
      instance,
    });
  };
}
