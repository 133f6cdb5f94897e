import { useId, useState } from 'react';
import { DEPOSIT_PAYMENT_STATE_LABELS, type DepositPaymentState, type DepositPaymentView } from '@gloaming/contracts';
import { formatMoney, parseMoney } from '@gloaming/engine';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-error';
import { useQuoteDeposits } from '../api/get-quote-deposits';
import { useRefundDeposit } from '../api/refund-deposit';

const TONE: Record<DepositPaymentState, 'neutral' | 'positive' | 'pending' | 'muted'> = {
  open: 'pending',
  paid: 'positive',
  failed: 'muted',
  expired: 'muted',
  refunded: 'neutral',
  'partly-refunded': 'neutral',
};

/**
 * The quote's deposit: what was approved, each payment attempt with its state, and (owners
 * only) a refund through the payment provider after a confirmation. Shown once a quote has an
 * approval or a payment; nothing otherwise. `canRefund`: the signed-in person is an owner.
 */
export function QuoteDepositsPanel({ quoteId, locale, canRefund }: { quoteId: string; locale: string; canRefund: boolean }) {
  const query = useQuoteDeposits(quoteId);
  const headingId = useId();
  if (query.isPending) return null;
  if (query.isError) return <p role="alert" className="text-caption text-danger">{query.error.message}</p>;
  const { approved, payments, paidMinor, refundedMinor } = query.data;
  if (!approved && payments.length === 0) return null;
  const currency = approved?.currency ?? payments[0]?.currency ?? 'GBP';
  const money = (n: number) => formatMoney(n, currency, locale);

  return (
    <section aria-labelledby={headingId} className="w-80 rounded-card bg-surface p-4 shadow-card ring-1 ring-line" data-testid="quote-deposits">
      <h2 id={headingId} className="text-body font-semibold text-ink">
        Deposit
      </h2>
      <dl className="mt-2 grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-caption">
        {approved ? (
          <>
            <dt className="text-ink-muted">Approved</dt>
            <dd className="font-mono text-ink">{money(approved.depositMinor)}</dd>
          </>
        ) : null}
        <dt className="text-ink-muted">Paid</dt>
        <dd className="font-mono text-ink">{money(paidMinor)}</dd>
        {refundedMinor > 0 ? (
          <>
            <dt className="text-ink-muted">Refunded</dt>
            <dd className="font-mono text-ink">{money(refundedMinor)}</dd>
          </>
        ) : null}
      </dl>
      {payments.length > 0 ? (
        <ul className="mt-3 flex flex-col gap-2" aria-label="Card payments">
          {payments.map((p) => (
            <PaymentRow key={p.id} quoteId={quoteId} payment={p} money={money} locale={locale} canRefund={canRefund} />
          ))}
        </ul>
      ) : (
        <p className="mt-3 text-caption text-ink-muted">The homeowner has not started paying yet.</p>
      )}
    </section>
  );
}

function PaymentRow({
  quoteId,
  payment,
  money,
  locale,
  canRefund,
}: {
  quoteId: string;
  payment: DepositPaymentView;
  money: (n: number) => string;
  locale: string;
  canRefund: boolean;
}) {
  const [confirming, setConfirming] = useState(false);
  const when = new Date(payment.paidAt ?? payment.createdAt);
  const date = new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' }).format(when);
  return (
    <li className="rounded-control bg-canvas px-3 py-2 ring-1 ring-line" data-testid="deposit-payment">
      <div className="flex items-center justify-between gap-2">
        <Badge tone={TONE[payment.state]}>{DEPOSIT_PAYMENT_STATE_LABELS[payment.state]}</Badge>
        <span className="font-mono text-caption text-ink">{money(payment.amountMinor)}</span>
      </div>
      <p className="mt-1 text-micro text-ink-muted">
        {payment.paidAt ? 'Paid' : 'Started'} {date}
        {payment.failureCode ? ` · reason: ${payment.failureCode.replaceAll('_', ' ')}` : ''}
        {payment.refundedMinor > 0 ? ` · ${money(payment.refundedMinor)} refunded` : ''}
      </p>
      {canRefund && payment.refundableMinor > 0 ? (
        confirming ? (
          <RefundConfirmation quoteId={quoteId} payment={payment} money={money} onDone={() => setConfirming(false)} />
        ) : (
          <Button variant="secondary" className="mt-2 h-8 px-3 text-caption" onClick={() => setConfirming(true)}>
            Refund…
          </Button>
        )
      ) : null}
    </li>
  );
}

function RefundConfirmation({
  quoteId,
  payment,
  money,
  onDone,
}: {
  quoteId: string;
  payment: DepositPaymentView;
  money: (n: number) => string;
  onDone: () => void;
}) {
  const refund = useRefundDeposit(quoteId);
  const [text, setText] = useState(formatPlain(payment.refundableMinor));
  const titleId = useId();
  const parsed = parseMoney(text.trim(), payment.currency);
  const amount = parsed.ok ? parsed.value : null;
  const fieldError = !parsed.ok
    ? 'Enter an amount such as 100.00.'
    : amount !== null && (amount <= 0 || amount > payment.refundableMinor)
      ? `Enter an amount up to ${money(payment.refundableMinor)}.`
      : undefined;
  const problem = refund.error instanceof ApiError ? refund.error.detail : refund.error?.message;

  return (
    <div role="group" aria-labelledby={titleId} className="mt-2 flex flex-col gap-2 rounded-control bg-surface p-3 ring-1 ring-ember-600/30">
      <p id={titleId} className="text-caption font-semibold text-ink">
        Refund to the homeowner’s card
      </p>
      <TextField label="Amount to refund" inputMode="decimal" value={text} onChange={(e) => setText(e.target.value)} error={fieldError} hint={`Up to ${money(payment.refundableMinor)}. A refund cannot be undone.`} />
      {problem ? (
        <p role="alert" className="text-caption text-danger">
          {problem}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button
          className="h-9 px-3 text-caption"
          busy={refund.isPending}
          disabled={fieldError !== undefined || amount === null}
          onClick={() => {
            if (amount === null) return;
            refund.mutate(
              { paymentId: payment.id, request: amount === payment.refundableMinor ? {} : { amountMinor: amount } },
              { onSuccess: onDone },
            );
          }}
        >
          Refund {amount !== null && fieldError === undefined ? money(amount) : ''}
        </Button>
        <Button variant="quiet" className="h-9 px-3 text-caption" onClick={onDone} disabled={refund.isPending}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

/** 40558 -> "405.58": the figure typed back into the field. */
function formatPlain(minor: number): string {
  return `${Math.trunc(minor / 100)}.${String(minor % 100).padStart(2, '0')}`;
}
