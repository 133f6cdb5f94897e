import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import type { DepositPaymentView, QuoteDepositsResponse } from '@gloaming/contracts';
import { QuoteDepositsPanel } from '../../src/features/deposits/components/quote-deposits-panel';
import { json, problem, stubFetch } from '../fetch-stub';
import { renderWithApp } from '../render';

afterEach(cleanup);

const QUOTE = '7d3f0c6e-52b1-4c1e-9d7a-0a0b0c0d0e0f';
const PAYMENT = '0b1c2d3e-4f50-4617-8a9b-0c1d2e3f4a5b';

function payment(extra: Partial<DepositPaymentView> = {}): DepositPaymentView {
  return {
    id: PAYMENT,
    state: 'paid',
    amountMinor: 40558,
    currency: 'GBP',
    refundedMinor: 0,
    refundableMinor: 40558,
    failureCode: null,
    checkoutSessionId: 'cs_test_1',
    paymentIntentId: 'pi_test_1',
    createdAt: '2026-12-01T10:00:00.000Z',
    paidAt: '2026-12-01T10:02:00.000Z',
    version: 2,
    ...extra,
  };
}
const listing = (p: DepositPaymentView): QuoteDepositsResponse => ({
  approved: { depositMinor: 40558, currency: 'GBP', approvedAt: '2026-12-01T09:58:00.000Z' },
  payments: [p],
  paidMinor: 40558,
  refundedMinor: p.refundedMinor,
});

describe('QuoteDepositsPanel', () => {
  it('shows the approved and paid deposit; an owner refunds part of it after confirming', async () => {
    let current = payment();
    const { sent } = stubFetch((r) => {
      if (r.method === 'POST') {
        current = payment({ state: 'partly-refunded', refundedMinor: 10000, refundableMinor: 30558, version: 3 });
        return json(201, { payment: current, refundedNowMinor: 10000 });
      }
      return json(200, listing(current));
    });
    renderWithApp(<QuoteDepositsPanel quoteId={QUOTE} locale="en-GB" canRefund />);
    const panel = await screen.findByRole('region', { name: 'Deposit' });
    expect(within(panel).getByText('Paid', { selector: 'span' })).toBeTruthy();
    expect(within(panel).getAllByText('£405.58').length).toBeGreaterThan(0);

    const user = userEvent.setup();
    await user.click(within(panel).getByRole('button', { name: 'Refund…' }));
    const amount = within(panel).getByLabelText('Amount to refund') as HTMLInputElement;
    expect(amount.value).toBe('405.58'); // defaults to all that is left
    await user.clear(amount);
    await user.type(amount, '500');
    expect(within(panel).getByText('Enter an amount up to £405.58.')).toBeTruthy();
    expect((within(panel).getByRole('button', { name: /^Refund/ }) as HTMLButtonElement).disabled).toBe(true);
    await user.clear(amount);
    await user.type(amount, '100.00');
    await user.click(within(panel).getByRole('button', { name: 'Refund £100.00' }));

    await waitFor(() => expect(within(panel).getByText('Partly refunded')).toBeTruthy());
    const post = sent.find((r) => r.method === 'POST');
    expect(post?.url).toBe(`/api/quotes/${QUOTE}/deposits/${PAYMENT}/refund`);
    expect(post?.body).toEqual({ amountMinor: 10000 });
    expect(within(panel).getByText('£100.00', { selector: 'dd' })).toBeTruthy();
  });

  it('a full refund sends no amount; a refusal is shown', async () => {
    const { sent } = stubFetch((r) =>
      r.method === 'POST'
        ? problem(409, { title: 'Conflict', detail: 'Another refund of this deposit was made at the same moment. Reload to see it.' })
        : json(200, listing(payment())),
    );
    renderWithApp(<QuoteDepositsPanel quoteId={QUOTE} locale="en-GB" canRefund />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Refund…' }));
    await user.click(screen.getByRole('button', { name: 'Refund £405.58' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Another refund');
    expect(sent.find((r) => r.method === 'POST')?.body).toEqual({});
  });

  it('an estimator sees the payments but no refund action; a quote without approval shows nothing', async () => {
    stubFetch(() => json(200, listing(payment({ state: 'failed', paidAt: null, failureCode: 'generic_decline', refundableMinor: 0 }))));
    const { unmount } = renderWithApp(<QuoteDepositsPanel quoteId={QUOTE} locale="en-GB" canRefund={false} />);
    expect(await screen.findByText('Card refused')).toBeTruthy();
    expect(screen.getByText(/reason: generic decline/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Refund…' })).toBeNull();
    unmount();
    const { fetchMock } = stubFetch(() => json(200, { approved: null, payments: [], paidMinor: 0, refundedMinor: 0 }));
    const { container } = renderWithApp(<QuoteDepositsPanel quoteId={QUOTE} locale="en-GB" canRefund />);
    await waitFor(() => expect(fetchMock).toHaveBeenCalled());
    await new Promise((r) => setTimeout(r, 50)); // the answer has been rendered
    expect(container.innerHTML).toBe('');
  });
});
