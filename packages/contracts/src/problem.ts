import { z } from 'zod';

/** One invalid field: a dotted path (`body.email`, `query.page`) and what is wrong with it. */
export const FieldError = z.object({
  path: z.string(),
  message: z.string(),
});
export type FieldError = z.infer<typeof FieldError>;

/** RFC 9457 problem details, the body of every error the api sends. */
export const Problem = z.object({
  type: z.string(),
  title: z.string(),
  status: z.number().int(),
  detail: z.string().optional(),
  instance: z.string().optional(),
  errors: z.array(FieldError).optional(),
  /** Seconds until a throttled request may be retried. */
  retryAfterSeconds: z.number().int().optional(),
});
export type Problem = z.infer<typeof Problem>;

export const PROBLEM_CONTENT_TYPE = 'application/problem+json';
