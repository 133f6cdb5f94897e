import type { Request } from 'express';
import type { z } from 'zod';
import { badRequest } from './problem';

/**
 * Validate the body inside a handler, after the record named in the path has been found in
 * the caller's firm: another firm's id answers 404 whatever the body holds, and a bad body
 * answers the same 400 problem (paths `body.<field>`) as `schemas.body` would.
 */
export function parseBody<S extends z.ZodType>(req: Request, schema: S): z.output<S> {
  const result = schema.safeParse(req.body ?? {});
  if (result.success) return result.data;
  const errors = result.error.issues.map((issue) => ({ path: ['body', ...issue.path.map(String)].join('.'), message: issue.message }));
  throw badRequest(errors.length === 1 ? errors[0]!.message : 'Some fields need attention.', errors);
}
