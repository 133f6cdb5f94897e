import { useEffect, useState } from 'react';
import type { PortalDepositState } from '@gloaming/contracts';
import { formatMoney } from '@gloaming/engine';
import { isApiError } from '../../lib/api-error';
import { fetchDepositState } from './deposit-api';
import { formatDepositDate } from './deposit-panel';
import { usePayDeposit } from './use-pay-deposit';

/** How often the page asks, and how long it waits for the card payment service's confirmation. */
export const POLL_INTERVAL_MS = 1500;
export const CONFIRMATION_TIMEOUT_MS = 30_000;

type View =
  | { kind: 'waiting' }
  | { kind: 'settled'; deposit: PortalDepositState }
  | { kind: 'timed-out' }
  | { kind: 'error'; message: string };

/**
 * Where the card payment page sends the homeowner back. Only the provider's signed
 * confirmation to our server marks a deposit paid, so this page waits for it (asking every
 * 1.5 s), then says honestly what happened; after 30 s without an answer it says so.
 */
export function DepositReturnPage({ token, sessionId, quoteHref }: { token: string; sessionId: string | null; quoteHref: string }) {
  const [view, setView] = useState<View>({ kind: 'waiting' });
  const [round, setRound] = useState(0);

  useEffect(() => {
    const controller = new AbortController();
    const started = Date.now();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const ask = async () => {
      try {
        const deposit = await fetchDepositState(token, sessionId ?? undefined, controller.signal);
        if (controller.signal.aborted) return;
        if (deposit.state !== 'open' && deposit.state !== 'none') return setView({ kind: 'settled', deposit });
      } catch (err) {
        if (controller.signal.aborted) return;
        // a passing network fault is retried; the api's refusal (bad link, unknown payment) is final
        if (isApiError(err) && err.status >= 400 && err.status < 500)
          return setView({ kind: 'error', message: err.message });
      }
      if (Date.now() - started >= CONFIRMATION_TIMEOUT_MS) return setView({ kind: 'timed-out' });
      timer = setTimeout(() => void ask(), POLL_INTERVAL_MS);
    };
    void ask();
    return () => {
      controller.abort();
      if (timer) clearTimeout(timer);
    };
  }, [token, sessionId, round]);

  return (
    <div className="min-h-screen bg-canvas text-ink">
      <main id="main" className="mx-auto flex max-w-xl flex-col gap-5 px-5 py-10 sm:px-8">
        <h1 className="text-title font-semibold tracking-tight">Your deposit</h1>
        <div role="status" aria-live="polite" className="rounded-card bg-surface p-5 shadow-card ring-1 ring-line" data-testid="deposit-return">
          <ReturnMessage view={view} token={token} onCheckAgain={() => {
              setView({ kind: 'waiting' });
              setRound((r) => r + 1);
            }} />
        </div>
        <p>
          <a href={quoteHref} className="font-semibold text-dusk-600 underline underline-offset-4">
            Back to your quote
          </a>
        </p>
      </main>
    </div>
  );
}

function ReturnMessage({ view, token, onCheckAgain }: { view: View; token: string; onCheckAgain: () => void }) {
  const { pay, busy, error } = usePayDeposit(token);
  if (view.kind === 'waiting')
    return (
      <p>
        <span className="font-semibold">Confirming your payment…</span> We are waiting for the card payment service to confirm it to
        us. This usually takes a few seconds; please keep this page open.
      </p>
    );
  if (view.kind === 'timed-out')
    return (
      <div className="flex flex-col gap-3">
        <p>
          <span className="font-semibold">We have not heard back yet.</span> The card payment service has not confirmed a payment to us
          in the last 30 seconds. If money was taken it will show here shortly and you will get a receipt by e-mail, so please do not pay
          again yet.
        </p>
        <Action onClick={onCheckAgain}>Check again</Action>
      </div>
    );
  if (view.kind === 'error')
    return (
      <p role="alert" className="text-danger">
        {view.message}
      </p>
    );
  const d = view.deposit;
  const amount = formatMoney(d.depositMinor, d.currency, 'en-GB');
  if (d.state === 'paid' || d.state === 'partly-refunded' || d.state === 'refunded')
    return (
      <p>
        <span className="font-semibold text-leaf-700">Deposit paid. Thank you.</span> We have received {amount}
        {d.paidAt ? ` on ${formatDepositDate(d.paidAt)}` : ''}. A receipt is on its way to your e-mail, and the firm has been told.
      </p>
    );
  return (
    <div className="flex flex-col gap-3">
      <p className="text-ember-700">
        <span className="font-semibold">The payment did not go through.</span>{' '}
        {d.state === 'failed' ? d.failureMessage : 'The payment page expired before a payment was made. No money was taken.'}
      </p>
      {d.canPay ? (
        <Action onClick={() => void pay()} busy={busy}>
          {busy ? 'Opening the secure payment page…' : `Try again: pay ${amount}`}
        </Action>
      ) : null}
      {error ? (
        <p role="alert" className="text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function Action({ onClick, busy = false, children }: { onClick: () => void; busy?: boolean; children: string }) {
  return (
    <button
      type="button"
      onClick={onClick}
      disabled={busy}
      aria-busy={busy || undefined}
      className="inline-flex min-h-11 w-full items-center justify-center rounded-control bg-accent px-5 font-semibold text-accent-ink shadow-control hover:bg-lamp-300 disabled:cursor-wait disabled:opacity-70 sm:w-auto"
    >
      {children}
    </button>
  );
}
