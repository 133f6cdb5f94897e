import type { PortalTotals } from '@gloaming/contracts';
import type { Formatters } from '../../../components/ui/format';

/** Net, VAT at each rate, the total and the deposit; `status` says whether the server agreed yet. */
export function QuoteTotals({ totals, f, status }: { totals: PortalTotals; f: Formatters; status: string }) {
  return (
    <div>
      <dl className="flex flex-col gap-1.5 tabular-nums">
        <Row label="Subtotal" value={f.money(totals.grossMinor - totals.lineDiscountMinor)} />
        {totals.quoteDiscountMinor > 0 && <Row label="Discount" value={`− ${f.money(totals.quoteDiscountMinor)}`} />}
        {totals.quoteDiscountMinor > 0 && <Row label="Total before VAT" value={f.money(totals.netMinor)} />}
        {totals.vatByRate.map((r) => (
          <Row key={r.rateBp} label={`VAT at ${f.rate(r.rateBp)} on ${f.money(r.netMinor)}`} value={f.money(r.vatMinor)} />
        ))}
        <div className="mt-1 flex items-baseline justify-between gap-3 border-t border-line pt-2 text-lead font-semibold">
          <dt>Total including VAT</dt>
          <dd data-testid="quote-total">{f.money(totals.totalMinor)}</dd>
        </div>
        {totals.deposit && (
          <>
            <Row label="Deposit on approval" value={f.money(totals.deposit.depositMinor)} testId="quote-deposit" />
            <Row label="Balance" value={f.money(totals.deposit.balanceMinor)} />
          </>
        )}
      </dl>
      <p role="status" aria-live="polite" className="mt-2 min-h-5 text-caption text-ink-muted">
        {status}
      </p>
    </div>
  );
}

function Row({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3">
      <dt className="text-ink-muted">{label}</dt>
      <dd className="font-semibold whitespace-nowrap" {...(testId ? { 'data-testid': testId } : {})}>
        {value}
      </dd>
    </div>
  );
}
