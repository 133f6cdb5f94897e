import { SessionResponse } from '@gloaming/contracts';
import { describe, expect, it } from 'vitest';
import { ApiError } from '../src/lib/api-error';
import { apiRequest, noContent } from '../src/lib/http-client';
import { json, OWNER, problem, stubFetch } from './fetch-stub';

async function failure(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => undefined,
    (reason: unknown) => reason,
  );
  expect(error).toBeInstanceOf(ApiError);
  return error as ApiError;
}

describe('apiRequest', () => {
  it('sends JSON to /api and returns the body parsed by the contract', async () => {
    const { sent } = stubFetch(() => json(200, { user: OWNER }));

    const answer = await apiRequest('/session', {
      method: 'POST',
      body: { email: OWNER.email, password: 'correct horse' },
      schema: SessionResponse,
    });

    expect(answer.user.organization.name).toBe('Alder Row Lighting');
    expect(sent).toHaveLength(1);
    expect(sent[0]).toMatchObject({
      url: '/api/session',
      method: 'POST',
      body: { email: OWNER.email, password: 'correct horse' },
      headers: { 'Content-Type': 'application/json' },
    });
  });

  // RFC 9457 §3.1: type, title, status, detail; our contract adds `errors` (field paths) for 400s.
  it('turns a problem+json 400 into an ApiError carrying status, detail and field errors', async () => {
    stubFetch(() =>
      problem(400, {
        title: 'Invalid request',
        detail: 'Check the highlighted fields.',
        errors: [
          { path: 'body.email', message: 'Enter an e-mail address like name@example.com.' },
          { path: 'body.role', message: 'Choose owner, estimator or installer.' },
        ],
      }),
    );

    const error = await failure(apiRequest('/invites', { method: 'POST', body: {}, schema: SessionResponse }));

    expect(error.status).toBe(400);
    expect(error.title).toBe('Invalid request');
    expect(error.detail).toBe('Check the highlighted fields.');
    expect(error.fieldErrors).toHaveLength(2);
    expect(error.messageFor('email')).toBe('Enter an e-mail address like name@example.com.');
    expect(error.messageFor('role')).toBe('Choose owner, estimator or installer.');
    expect(error.messageFor('name')).toBeUndefined();
  });

  it('keeps the retry delay of a throttled request', async () => {
    stubFetch(() =>
      problem(429, {
        title: 'Too many sign-in attempts',
        detail: 'Too many attempts for this account. Try again in 15 minutes.',
        retryAfterSeconds: 900,
      }),
    );

    const error = await failure(apiRequest('/session', { method: 'POST', body: {}, schema: SessionResponse }));

    expect(error.status).toBe(429);
    expect(error.retryAfterSeconds).toBe(900);
    expect(error.detail).toContain('15 minutes');
  });

  it('uses the title as the detail when a problem has no detail', async () => {
    stubFetch(() => problem(403, { title: 'Only the owner can do this' }));

    const error = await failure(apiRequest('/users', { schema: SessionResponse }));

    expect(error.status).toBe(403);
    expect(error.detail).toBe('Only the owner can do this');
  });

  it('turns a non-JSON 502 from a proxy into a readable ApiError, not a parse failure', async () => {
    stubFetch(
      () =>
        new Response('<html><body><h1>502 Bad Gateway</h1></body></html>', {
          status: 502,
          statusText: 'Bad Gateway',
          headers: { 'Content-Type': 'text/html' },
        }),
    );

    const error = await failure(apiRequest('/session', { schema: SessionResponse }));

    expect(error.status).toBe(502);
    expect(error.detail).toBe('The server is not answering properly (502 Bad Gateway). Try again in a moment.');
    expect(error.detail).not.toContain('<html>');
    expect(error.fieldErrors).toEqual([]);
  });

  it('reads Retry-After when a 503 has no problem body', async () => {
    stubFetch(() => new Response('', { status: 503, headers: { 'Retry-After': '30' } }));

    const error = await failure(apiRequest('/health', { schema: SessionResponse }));

    expect(error.status).toBe(503);
    expect(error.retryAfterSeconds).toBe(30);
    expect(error.detail).toContain('503 Service Unavailable');
  });

  it('rejects a 200 whose body does not match the contract', async () => {
    stubFetch(() => json(200, { user: { id: 'user-1', role: 'janitor' } }));

    const error = await failure(apiRequest('/session', { schema: SessionResponse }));

    expect(error.status).toBe(200);
    expect(error.title).toBe('Unexpected answer');
  });

  it('reports a network failure as status 0 with a sentence to show', async () => {
    stubFetch(() => {
      throw new TypeError('Failed to fetch');
    });

    const error = await failure(apiRequest('/session', { schema: SessionResponse }));

    expect(error.status).toBe(0);
    expect(error.detail).toBe('Gloaming could not be reached. Check your connection and try again.');
  });

  it('resolves a 204 with undefined when no content is expected, and rejects a body there', async () => {
    stubFetch(() => new Response(null, { status: 204 }));
    await expect(apiRequest('/session', { method: 'DELETE', schema: noContent })).resolves.toBeUndefined();

    stubFetch(() => json(200, { surprise: true }));
    const error = await failure(apiRequest('/session', { method: 'DELETE', schema: noContent }));
    expect(error.title).toBe('Unexpected answer');
  });
});
