import { useEffect, useId, useState } from 'react';
import type { PortalDepositState } from '@gloaming/contracts';
import { formatMoney } from '@gloaming/engine';
import { isApiError } from '../../lib/api-error';
import { fetchDepositState } from './deposit-api';
import { usePayDeposit } from './use-pay-deposit';

export const formatDepositDate = (iso: string) =>
  new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' }).format(new Date(iso));

/**
 * The deposit on an approved quote: the amount, "Pay deposit" (to the card payment page), and
 * what became of the payment. The amount shown and charged is the server's.
 */
export function DepositPanel({ token }: { token: string }) {
  const [deposit, setDeposit] = useState<PortalDepositState | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const headingId = useId();
  useEffect(() => {
    const controller = new AbortController();
    fetchDepositState(token, undefined, controller.signal)
      .then(setDeposit)
      .catch((err: unknown) => {
        if (!controller.signal.aborted) setLoadError(isApiError(err) ? err.detail : 'The deposit could not be loaded.');
      });
    return () => controller.abort();
  }, [token]);

  return (
    <section aria-labelledby={headingId} className="rounded-card bg-surface p-5 shadow-card ring-1 ring-line" data-testid="deposit-panel">
      <h2 id={headingId} className="text-heading font-semibold tracking-tight">
        Deposit
      </h2>
      {loadError ? (
        <p role="alert" className="mt-2 text-danger">
          {loadError}
        </p>
      ) : deposit ? (
        <DepositBody token={token} deposit={deposit} />
      ) : (
        <p className="mt-2 text-ink-muted">Loading the deposit…</p>
      )}
    </section>
  );
}

function DepositBody({ token, deposit }: { token: string; deposit: PortalDepositState }) {
  const { pay, busy, error } = usePayDeposit(token);
  const amount = formatMoney(deposit.depositMinor, deposit.currency, 'en-GB');
  if (deposit.depositMinor <= 0) return <p className="mt-2 text-ink-muted">This quote asks for no deposit.</p>;
  const paid = deposit.state === 'paid' || deposit.state === 'partly-refunded' || deposit.state === 'refunded';
  return (
    <div className="mt-2 flex flex-col gap-3">
      <p className="text-lead">
        <span className="text-ink-muted">To book the installation: </span>
        <span className="font-semibold">{amount}</span>
      </p>
      <div role="status" aria-live="polite">
        {paid ? (
          <p className="rounded-control bg-leaf-50 px-3 py-2 text-leaf-700 ring-1 ring-leaf-700/25">
            {deposit.state === 'paid' ? 'Deposit paid' : deposit.state === 'refunded' ? 'Deposit paid and since refunded in full' : 'Deposit paid; part of it has since been refunded'}
            {deposit.paidAt ? ` on ${formatDepositDate(deposit.paidAt)}` : ''}. Thank you.
          </p>
        ) : deposit.state === 'failed' ? (
          <p className="rounded-control bg-ember-50 px-3 py-2 text-ember-700 ring-1 ring-ember-600/40">{deposit.failureMessage}</p>
        ) : deposit.state === 'expired' ? (
          <p className="text-ink-muted">The last payment page expired before a payment was made. No money was taken.</p>
        ) : null}
      </div>
      {deposit.canPay ? (
        <div>
          <button
            type="button"
            onClick={() => void pay()}
            disabled={busy}
            aria-busy={busy || undefined}
            className="inline-flex min-h-11 w-full items-center justify-center rounded-control bg-accent px-5 font-semibold text-accent-ink shadow-control hover:bg-lamp-300 disabled:cursor-wait disabled:opacity-70 sm:w-auto"
          >
            {busy ? 'Opening the secure payment page…' : deposit.state === 'failed' ? `Try again: pay ${amount}` : `Pay deposit ${amount}`}
          </button>
          <p className="mt-2 text-caption text-ink-muted">You pay by card on the card payment service’s secure page, then come back here.</p>
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}
