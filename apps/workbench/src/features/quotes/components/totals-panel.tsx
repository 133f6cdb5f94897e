import type { EstimateContent } from '@gloaming/contracts';
import type { QuoteTotals } from '@gloaming/engine';
import { formatBasisPoints, formatMoney } from '@gloaming/engine';
import { DiscountDepositControls } from './discount-deposit-controls';

export interface QuoteAdjustments {
  content: EstimateContent;
  onChange: (content: EstimateContent) => void;
  firmDepositBp: number;
  readOnly: boolean;
}

/**
 * The engine's totals for the estimate as it stands (including the cell being typed), with the
 * quote's discount and deposit to edit. Staff only: cost and margin.
 */
export function TotalsPanel({
  totals,
  currency,
  locale,
  adjustments,
}: {
  totals: QuoteTotals | null;
  currency: string;
  locale: string;
  adjustments?: QuoteAdjustments;
}) {
  const money = (n: number) => formatMoney(n, currency, locale);
  if (!totals) return null;
  const discount = totals.lineDiscountMinor + totals.quoteDiscountMinor;
  return (
    <aside aria-label="Totals" className="flex w-72 shrink-0 flex-col gap-4 rounded-card bg-dusk-900 p-5 text-dusk-100 shadow-card">
      <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-1.5 text-caption">
        <dt>Subtotal</dt>
        <dd className="text-right font-mono tabular-nums" data-total="gross">
          {money(totals.grossMinor)}
        </dd>
        {discount > 0 ? (
          <>
            <dt>Discount</dt>
            <dd className="text-right font-mono tabular-nums" data-total="discount">
              −{money(discount)}
            </dd>
          </>
        ) : null}
        <dt>Net, ex VAT</dt>
        <dd className="text-right font-mono tabular-nums" data-total="net">
          {money(totals.netMinor)}
        </dd>
        {totals.vatByRate.map((r) => (
          <div key={r.rateBp} className="contents">
            <dt className="text-dusk-300">VAT at {formatBasisPoints(r.rateBp, locale)}</dt>
            <dd className="text-right font-mono text-dusk-300 tabular-nums" data-total={`vat-${r.rateBp}`}>
              {money(r.vatMinor)}
            </dd>
          </div>
        ))}
      </dl>
      <div className="border-t border-dusk-700 pt-3">
        <p className="text-micro font-semibold tracking-wide text-dusk-300 uppercase">Total incl. VAT</p>
        <p className="font-mono text-heading font-semibold text-lamp-300 tabular-nums" data-total="total">
          {money(totals.totalMinor)}
        </p>
        {totals.deposit ? (
          <p className="mt-1 text-caption text-dusk-200">
            Deposit <span className="font-mono tabular-nums" data-total="deposit">{money(totals.deposit.depositMinor)}</span>, balance{' '}
            <span className="font-mono tabular-nums">{money(totals.deposit.balanceMinor)}</span>
          </p>
        ) : null}
      </div>
      {adjustments ? <DiscountDepositControls {...adjustments} currency={currency} /> : null}
      <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-1.5 rounded-control bg-dusk-950/60 p-3 text-caption">
        <dt className="col-span-2 text-micro font-semibold tracking-wide text-dusk-300 uppercase">For the firm only</dt>
        <dt>Cost</dt>
        <dd className="text-right font-mono tabular-nums" data-total="cost">
          {money(totals.costMinor)}
        </dd>
        <dt>Gross margin</dt>
        <dd className="text-right font-mono tabular-nums" data-total="margin">
          {money(totals.grossMarginMinor)}
          {totals.grossMarginBp !== null ? <span className="ml-1 text-dusk-300">({formatBasisPoints(totals.grossMarginBp, locale)})</span> : null}
        </dd>
      </dl>
      {totals.findings.length > 0 ? (
        <ul className="flex flex-col gap-2 text-caption" aria-label="Points to check">
          {totals.findings.map((f, i) => (
            <li key={`${f.code}-${i}`} className={`rounded-control px-3 py-2 ${f.severity === 'error' ? 'bg-ember-50 text-ember-700' : 'bg-lamp-50 text-lamp-800'}`}>
              {f.message}
            </li>
          ))}
        </ul>
      ) : null}
    </aside>
  );
}
