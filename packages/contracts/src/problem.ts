import { z } from 'zod';

/** One invalid field: a dotted path (`body.email`, `query.page`) and what is wrong with it. */
export const FieldError = z.object({
  path: z.string(),
  message: z.string(),
});
export type FieldError = z.infer<typeof FieldError>;

/**
 * Something that stops an action (a send), with where to fix it. A circuit's unaccepted error
 * names the circuit, the finding's code and subject, and `pointer`: the api path of the circuit
 * that holds it.
 */
export const Blocker = z.object({
  code: z.string(),
  message: z.string(),
  pointer: z.string().optional(),
  circuit: z
    .object({
      id: z.string(),
      name: z.string(),
      area: z.string(),
      findingCode: z.string(),
      subject: z.string().nullable(),
    })
    .optional(),
});
export type Blocker = z.infer<typeof Blocker>;

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
  /** What stops the action, each with where to fix it (e.g. sending with circuit errors). */
  blockers: z.array(Blocker).optional(),
});
export type Problem = z.infer<typeof Problem>;

export const PROBLEM_CONTENT_TYPE = 'application/problem+json';
