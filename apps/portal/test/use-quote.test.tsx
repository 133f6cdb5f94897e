import { act, cleanup, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { PortalQuoteView } from '@gloaming/contracts';
import { retryDelayMs, useQuote } from '../src/features/quote/api/use-quote';

// Only identity matters here: the page gets back exactly what the api sent.
const QUOTE = { reference: 'Q-1042', state: 'open', messages: [] } as unknown as PortalQuoteView;
const json = (status: number, body: unknown, type = 'application/json') =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': type } });
// RFC 9457 problem details, as the api answers a link that no longer opens a quote
const gone = () => json(410, { type: '/problems/link-expired', title: 'This link has expired', status: 410, linkState: 'expired' }, 'application/problem+json');

beforeEach(() => vi.useFakeTimers());
afterEach(() => {
  cleanup();
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe('useQuote', () => {
  it('shows a quote that has already arrived without asking again (each GET records a view)', () => {
    const fetch = vi.fn();
    vi.stubGlobal('fetch', fetch);
    const { result } = renderHook(() => useQuote('tok', QUOTE));
    expect(result.current.load).toEqual({ status: 'ready', quote: QUOTE });
    expect(fetch).not.toHaveBeenCalled();
  });

  it('tries a server fault again after 1 s, then shows the quote', async () => {
    const fetch = vi.fn().mockResolvedValueOnce(json(503, {})).mockResolvedValueOnce(json(200, { quote: QUOTE }));
    vi.stubGlobal('fetch', fetch);
    const { result } = renderHook(() => useQuote('tok', undefined));
    await act(async () => vi.advanceTimersByTimeAsync(0));
    expect(result.current.load.status).toBe('pending');
    expect(fetch).toHaveBeenCalledTimes(1);
    await act(async () => vi.advanceTimersByTimeAsync(1000));
    expect(fetch).toHaveBeenCalledTimes(2);
    expect(result.current.load).toEqual({ status: 'ready', quote: QUOTE });
  });

  it('gives up after three tries of a dropped connection', async () => {
    const fetch = vi.fn().mockRejectedValue(new TypeError('Failed to fetch'));
    vi.stubGlobal('fetch', fetch);
    const { result } = renderHook(() => useQuote('tok', undefined));
    await act(async () => vi.advanceTimersByTimeAsync(retryDelayMs(1) + retryDelayMs(2)));
    expect(fetch).toHaveBeenCalledTimes(3);
    expect(result.current.load.status).toBe('error');
  });

  it("takes the api's refusal as final: one GET, and the link's problem to show", async () => {
    const fetch = vi.fn().mockResolvedValue(gone());
    vi.stubGlobal('fetch', fetch);
    const { result } = renderHook(() => useQuote('tok', undefined));
    await act(async () => vi.advanceTimersByTimeAsync(5000));
    expect(fetch).toHaveBeenCalledTimes(1);
    const load = result.current.load;
    expect(load.status === 'error' && load.error instanceof Error && load.error.message).toBe('This link has expired');
  });

  it('applies an answer to the quote on screen', () => {
    vi.stubGlobal('fetch', vi.fn());
    const { result } = renderHook(() => useQuote('tok', QUOTE));
    act(() => result.current.update((q) => ({ ...q, state: 'declined' })));
    expect(result.current.load.status === 'ready' && result.current.load.quote.state).toBe('declined');
  });
});
