import type { FieldError, PortalFirmContact, PortalLinkState } from '@gloaming/contracts';
import { ApiError } from './api-error';

/**
 * What the client needs from a response schema. A zod schema from @gloaming/contracts fits, but
 * the portal's own calls use `answerWith(key)`: zod would roughly double what a phone downloads,
 * and the api's tests parse every portal answer with the contracts' schemas.
 */
export type ResponseSchema<T> = {
  safeParse(input: unknown): { success: true; data: T } | { success: false };
};

/** Accepts a JSON object that carries `key`; the type comes from the contracts. */
export function answerWith<T extends object>(key: keyof T & string): ResponseSchema<T> {
  return {
    safeParse: (input) =>
      typeof input === 'object' && input !== null && key in input ? { success: true, data: input as T } : { success: false },
  };
}

const PROBLEM_CONTENT_TYPE = 'application/problem+json';

interface ProblemBody {
  type?: unknown;
  title?: unknown;
  status?: unknown;
  detail?: unknown;
  errors?: unknown;
  retryAfterSeconds?: unknown;
  linkState?: unknown;
  firm?: unknown;
  currentLink?: unknown;
}
const LINK_STATES: readonly PortalLinkState[] = ['unknown', 'revoked', 'expired', 'superseded'];
const text = (v: unknown): string | undefined => (typeof v === 'string' ? v : undefined);

export type ApiRequest<T> = {
  method?: 'GET' | 'POST';
  body?: unknown;
  schema: ResponseSchema<T>;
  signal?: AbortSignal;
};

/**
 * Calls the Gloaming api on this origin. Resolves with the body parsed by `schema`; rejects with
 * an ApiError for anything else. The portal has no session: the link's token is in the path.
 */
export async function apiRequest<T>(path: string, request: ApiRequest<T>): Promise<T> {
  const headers: Record<string, string> = { Accept: `application/json, ${PROBLEM_CONTENT_TYPE}` };
  const init: RequestInit = { method: request.method ?? 'GET', headers, credentials: 'same-origin' };
  if (request.body !== undefined) {
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
      detail: 'We could not reach the server. Check your connection and try again.',
    });
  }
  let payload: unknown = undefined;
  const raw = await response.text().catch(() => '');
  if (raw && (response.headers.get('Content-Type') ?? '').includes('json')) {
    try {
      payload = JSON.parse(raw) as unknown;
    } catch {
      payload = undefined;
    }
  }
  if (!response.ok) throw toApiError(response.status, payload);
  const parsed = request.schema.safeParse(payload);
  if (!parsed.success)
    throw new ApiError({
      status: response.status,
      title: 'Unexpected answer',
      detail: 'The server sent an answer this page does not understand. Reload the page and try again.',
    });
  return parsed.data;
}

function toApiError(status: number, payload: unknown): ApiError {
  const p = (typeof payload === 'object' && payload !== null ? payload : {}) as ProblemBody;
  const title = text(p.title);
  if (!title)
    return new ApiError({
      status,
      title: 'Something went wrong',
      detail:
        status >= 500
          ? 'Something went wrong on our side. Please try again in a moment.'
          : 'That did not work. Please try again.',
    });
  const linkState = LINK_STATES.find((s) => s === p.linkState);
  const firm = typeof p.firm === 'object' && p.firm !== null ? (p.firm as PortalFirmContact) : undefined;
  const errors = Array.isArray(p.errors) ? (p.errors as FieldError[]) : undefined;
  const currentLink = text(p.currentLink);
  return new ApiError({
    status: typeof p.status === 'number' ? p.status : status,
    title,
    detail: text(p.detail) ?? title,
    ...(text(p.type) ? { type: text(p.type)! } : {}),
    ...(errors ? { fieldErrors: errors } : {}),
    ...(typeof p.retryAfterSeconds === 'number' ? { retryAfterSeconds: p.retryAfterSeconds } : {}),
    ...(linkState ? { linkState } : {}),
    ...(firm ? { firm } : {}),
    ...(currentLink?.startsWith('/portal/') ? { currentLink } : {}),
  });
}
