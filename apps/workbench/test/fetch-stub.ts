import { vi } from 'vitest';

/** A recorded request as the api would receive it. */
export type SentRequest = { url: string; method: string; body: unknown; headers: Record<string, string> };

/** Replaces fetch with a function that answers from `reply` and records what was sent. */
export function stubFetch(reply: (request: SentRequest) => Response | Promise<Response>) {
  const sent: SentRequest[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const request: SentRequest = {
      url: String(input),
      method: init?.method ?? 'GET',
      body: typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined,
      headers: { ...(init?.headers as Record<string, string> | undefined) },
    };
    sent.push(request);
    return reply(request);
  });
  vi.stubGlobal('fetch', fetchMock);
  return { sent, fetchMock };
}

export function problem(status: number, body: Record<string, unknown>, headers: Record<string, string> = {}) {
  return new Response(JSON.stringify({ type: 'about:blank', status, ...body }), {
    status,
    headers: { 'Content-Type': 'application/problem+json', ...headers },
  });
}

export function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

export const OWNER = {
  id: 'user-1',
  email: 'maren@alder-row.test',
  name: 'Maren Holloway',
  role: 'owner',
  organization: { id: 'org-1', name: 'Alder Row Lighting' },
} as const;
