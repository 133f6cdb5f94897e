import { act, cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { PortalDepositState } from '@gloaming/contracts';
import { navigation } from '../../src/features/deposit/deposit-api';
import { DepositPanel } from '../../src/features/deposit/deposit-panel';
import { CONFIRMATION_TIMEOUT_MS, DepositReturnPage, POLL_INTERVAL_MS } from '../../src/features/deposit/deposit-return-page';

const TOKEN = 'tok_abcdefghijklmnopqrstuvwxyz0123456789ABCDEF';

function state(extra: Partial<PortalDepositState>): PortalDepositState {
  return {
    depositMinor: 40558,
    currency: 'GBP',
    state: 'open',
    failureCode: null,
    failureMessage: null,
    paidAt: null,
    refundedMinor: 0,
    canPay: true,
    ...extra,
  };
}
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/** Answers GET …/deposit from `states` in turn (the last one repeats) and POST …/checkout with a URL. */
function stubApi(states: PortalDepositState[]) {
  const calls: { url: string; method: string }[] = [];
  let i = 0;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input);
      const method = init?.method ?? 'GET';
      calls.push({ url, method });
      if (method === 'POST') return json(201, { url: 'http://127.0.0.1:9/pay/cs_test_x', paymentId: 'p1', depositMinor: 40558, currency: 'GBP' });
      const s = states[Math.min(i++, states.length - 1)]!;
      return json(200, { deposit: s });
    }),
  );
  return calls;
}

beforeEach(() => {
  vi.useFakeTimers({ shouldAdvanceTime: true });
});
afterEach(() => {
  cleanup();
  vi.useRealTimers();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

describe('DepositReturnPage', () => {
  it('says it is waiting, then paid once the confirmation has arrived', async () => {
    const calls = stubApi([state({}), state({}), state({ state: 'paid', paidAt: '2026-12-01T10:02:00.000Z', canPay: false })]);
    render(<DepositReturnPage token={TOKEN} sessionId="cs_test_1" quoteHref="/portal/q/x" />);
    expect(screen.getByRole('status').textContent).toContain('Confirming your payment');
    await act(() => vi.advanceTimersByTimeAsync(POLL_INTERVAL_MS * 2 + 100));
    expect(screen.getByRole('status').textContent).toContain('Deposit paid. Thank you.');
    expect(screen.getByRole('status').textContent).toContain('£405.58');
    expect(screen.getByRole('status').textContent).toContain('1 December 2026');
    expect(calls[0]!.url).toBe(`/api/portal/${TOKEN}/deposit?session=cs_test_1`);
    const asked = calls.length;
    await act(() => vi.advanceTimersByTimeAsync(POLL_INTERVAL_MS * 3));
    expect(calls.length).toBe(asked); // settled: no more polling
  });

  it('a refused card is said plainly and offers a retry that goes back to the payment page', async () => {
    stubApi([state({ state: 'failed', failureCode: 'generic_decline', failureMessage: 'Your card was declined. No money was taken.' })]);
    const go = vi.spyOn(navigation, 'go').mockImplementation(() => {});
    render(<DepositReturnPage token={TOKEN} sessionId="cs_test_1" quoteHref="/portal/q/x" />);
    await act(() => vi.advanceTimersByTimeAsync(50));
    expect(screen.getByRole('status').textContent).toContain('The payment did not go through.');
    expect(screen.getByRole('status').textContent).toContain('Your card was declined.');
    await userEvent.setup({ advanceTimers: vi.advanceTimersByTime }).click(screen.getByRole('button', { name: 'Try again: pay £405.58' }));
    await act(() => vi.advanceTimersByTimeAsync(50));
    expect(go).toHaveBeenCalledWith('http://127.0.0.1:9/pay/cs_test_x');
  });

  it('after 30 s without a confirmation it says so, and can check again', async () => {
    const calls = stubApi([state({})]);
    render(<DepositReturnPage token={TOKEN} sessionId="cs_test_1" quoteHref="/portal/q/x" />);
    await act(() => vi.advanceTimersByTimeAsync(CONFIRMATION_TIMEOUT_MS - 2000));
    expect(screen.getByRole('status').textContent).toContain('Confirming your payment');
    await act(() => vi.advanceTimersByTimeAsync(POLL_INTERVAL_MS * 2 + 100));
    expect(screen.getByRole('status').textContent).toContain('We have not heard back yet.');
    expect(screen.getByRole('status').textContent).toContain('please do not pay');
    const asked = calls.length;
    await userEvent.setup({ advanceTimers: vi.advanceTimersByTime }).click(screen.getByRole('button', { name: 'Check again' }));
    await act(() => vi.advanceTimersByTimeAsync(50));
    expect(calls.length).toBe(asked + 1);
    expect(screen.getByRole('status').textContent).toContain('Confirming your payment');
  });
});

describe('DepositPanel', () => {
  it('shows the server’s amount and pays through the checkout the api makes', async () => {
    const calls = stubApi([state({ state: 'none' })]);
    const go = vi.spyOn(navigation, 'go').mockImplementation(() => {});
    render(<DepositPanel token={TOKEN} />);
    const button = await screen.findByRole('button', { name: 'Pay deposit £405.58' });
    await userEvent.setup({ advanceTimers: vi.advanceTimersByTime }).click(button);
    await act(() => vi.advanceTimersByTimeAsync(50));
    expect(calls.find((c) => c.method === 'POST')?.url).toBe(`/api/portal/${TOKEN}/deposit/checkout`);
    expect(go).toHaveBeenCalledWith('http://127.0.0.1:9/pay/cs_test_x');
  });

  it('after payment it shows the deposit as paid and offers no payment', async () => {
    stubApi([state({ state: 'paid', paidAt: '2026-12-01T10:02:00.000Z', canPay: false })]);
    render(<DepositPanel token={TOKEN} />);
    expect(await screen.findByText(/Deposit paid on 1 December 2026/)).toBeTruthy();
    expect(screen.queryByRole('button')).toBeNull();
  });
});
