import { Problem, PROBLEM_CONTENT_TYPE } from '@gloaming/contracts';
import { ApiError } from './api-error';

/** What the client needs from a response schema; every zod schema in @gloaming/contracts fits. */
export type ResponseSchema<T> = {
  safeParse(input: unknown): { success: true; data: T } | { success: false };
};

/** For endpoints that answer 204 No Content. */
export const noContent: ResponseSchema<undefined> = {
  safeParse: (input) => (input === undefined ? { success: true, data: undefined } : { success: false }),
};

export type ApiRequest<T> = {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** Sent as JSON; a FormData body is sent as multipart (the browser sets its boundary). */
  body?: unknown;
  schema: ResponseSchema<T>;
  signal?: AbortSignal;
};

const STATUS_TEXT: Record<number, string> = {
  500: 'Internal Server Error',
  502: 'Bad Gateway',
  503: 'Service Unavailable',
  504: 'Gateway Timeout',
};

/**
 * Calls the Gloaming api on this origin. Resolves with the body parsed by `schema`; rejects with
 * an ApiError for anything else. The session cookie travels because the api is same-origin.
 */
export async function apiRequest<T>(path: string, request: ApiRequest<T>): Promise<T> {
  const headers: Record<string, string> = { Accept: `application/json, ${PROBLEM_CONTENT_TYPE}` };
  const init: RequestInit = { method: request.method ?? 'GET', headers, credentials: 'same-origin' };
  if (request.body instanceof FormData) {
    init.body = request.body;
  } else if (request.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    init.body = JSON.stringify(request.body);
  }
  if (request.signal) init.signal = request.signal;

  let response: Response;
  try {
    response = await fetch(`/api${path}`, init);
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({
      status: 0,
      title: 'No connection',
      detail: 'Gloaming could not be reached. Check your connection and try again.',
    });
  }

  const payload = await readBody(response);

  if (!response.ok) throw toApiError(response, payload);

  const parsed = request.schema.safeParse(payload.kind === 'json' ? payload.value : undefined);
  if (!parsed.success) {
    throw new ApiError({
      status: response.status,
      title: 'Unexpected answer',
      detail: 'The server sent an answer this page does not understand. Reload the page and try again.',
    });
  }
  return parsed.data;
}

type Body = { kind: 'empty' } | { kind: 'json'; value: unknown } | { kind: 'text'; value: string };

async function readBody(response: Response): Promise<Body> {
  if (response.status === 204) return { kind: 'empty' };
  const text = await response.text().catch(() => '');
  if (text.length === 0) return { kind: 'empty' };
  const type = response.headers.get('Content-Type') ?? '';
  if (type.includes('json')) {
    try {
      return { kind: 'json', value: JSON.parse(text) as unknown };
    } catch {
      return { kind: 'text', value: text };
    }
  }
  return { kind: 'text', value: text };
}

function toApiError(response: Response, body: Body): ApiError {
  if (body.kind === 'json') {
    const problem = Problem.safeParse(body.value);
    if (problem.success) {
      const { status, title, detail, type, errors, retryAfterSeconds } = problem.data;
      return new ApiError({
        status,
        title,
        detail: detail ?? title,
        type,
        fieldErrors: errors ?? [],
        retryAfterSeconds: retryAfterSeconds ?? retryAfterHeader(response),
      });
    }
  }
  const statusText = response.statusText || STATUS_TEXT[response.status] || 'Error';
  const detail =
    response.status >= 500
      ? `The server is not answering properly (${response.status} ${statusText}). Try again in a moment.`
      : `The request failed (${response.status} ${statusText}).`;
  return new ApiError({
    status: response.status,
    title: statusText,
    detail,
    retryAfterSeconds: retryAfterHeader(response),
  });
}

function retryAfterHeader(response: Response): number | undefined {
  const value = response.headers.get('Retry-After');
  if (value === null) return undefined;
  const seconds = Number(value);
  return Number.isFinite(seconds) && seconds >= 0 ? Math.ceil(seconds) : undefined;
}
