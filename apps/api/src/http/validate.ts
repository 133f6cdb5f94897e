import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { badRequest } from './problem';

export interface RequestSchemas {
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
}

/** Parsed request parts, attached by `validate` and read with `parsed(req)`. */
export interface Parsed<S extends RequestSchemas> {
  body: S['body'] extends z.ZodType ? z.output<S['body']> : undefined;
  query: S['query'] extends z.ZodType ? z.output<S['query']> : undefined;
  params: S['params'] extends z.ZodType ? z.output<S['params']> : undefined;
}

const PARSED = Symbol('parsed');

/**
 * Validate body, query and params with the contracts' zod schemas. Failures are a 400
 * problem with every field path (`body.email`, `query.page`), never a 500.
 */
export function validate<S extends RequestSchemas>(schemas: S): RequestHandler {
  return (req, _res, next) => {
    const out: Record<string, unknown> = {};
    const errors: { path: string; message: string }[] = [];
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const input = part === 'body' ? (req.body ?? {}) : req[part];
      const result = schema.safeParse(input);
      if (result.success) out[part] = result.data;
      else
        for (const issue of result.error.issues)
          errors.push({ path: [part, ...issue.path.map(String)].join('.'), message: issue.message });
    }
    if (errors.length) {
      next(badRequest(errors.length === 1 ? errors[0]!.message : 'Some fields need attention.', errors));
      return;
    }
    (req as unknown as Record<symbol, unknown>)[PARSED] = out;
    next();
  };
}

export function parsed<S extends RequestSchemas>(req: Express.Request): Parsed<S> {
  return ((req as unknown as Record<symbol, unknown>)[PARSED] ?? {}) as Parsed<S>;
}

/**
 * The body alone, checked inside a handler after the route has found what its path names, so
 * another firm's id is a 404 whatever the body holds. Same 400 problem shape as `schemas.body`.
 */
export function validatedBody<T extends z.ZodType>(req: Express.Request & { body?: unknown }, schema: T): z.output<T> {
  const result = schema.safeParse(req.body ?? {});
  if (result.success) return result.data;
  const errors = result.error.issues.map((issue) => ({
    path: ['body', ...issue.path.map(String)].join('.'),
    message: issue.message,
  }));
  throw badRequest(errors.length === 1 ? errors[0]!.message : 'Some fields need attention.', errors);
}
