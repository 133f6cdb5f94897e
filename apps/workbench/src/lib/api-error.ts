import type { FieldError } from '@gloaming/contracts';

export type ApiErrorInit = {
  status: number;
  title: string;
  detail: string;
  type?: string;
  fieldErrors?: FieldError[];
  retryAfterSeconds?: number;
};

/**
 * Every failed api call becomes one of these: an RFC 9457 problem from the server, a reply that
 * is not a problem (a proxy's HTML 502 page, say), an answer of the wrong shape, or no answer at
 * all (status 0). `detail` is always a sentence a person can read.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly title: string;
  readonly detail: string;
  readonly type: string;
  readonly fieldErrors: readonly FieldError[];
  readonly retryAfterSeconds: number | undefined;

  constructor(init: ApiErrorInit) {
    super(init.detail);
    this.name = 'ApiError';
    this.status = init.status;
    this.title = init.title;
    this.detail = init.detail;
    this.type = init.type ?? 'about:blank';
    this.fieldErrors = init.fieldErrors ?? [];
    this.retryAfterSeconds = init.retryAfterSeconds;
  }

  /** The message for one field, matched by its last path segment: `body.email` answers `email`. */
  messageFor(field: string): string | undefined {
    return this.fieldErrors.find((error) => error.path === field || error.path.endsWith(`.${field}`))?.message;
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}
