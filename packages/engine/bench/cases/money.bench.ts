/**
 * Money: totals for a 5,000-line estimate (target < 5 ms, one keystroke inside a frame),
 * and the doubling checks 2,500 -> 5,000 and 5,000 -> 10,000 lines (target ratio <= 2.3).
 * The work is linear (one pass per line; the discount share uses a linear selection), but
 * past a few thousand lines the input and output no longer fit in the CPU cache and the
 * ratio creeps up, more so when the machine is busy.
 */
import { computeQuoteTotals, VAT_ROUNDINGS, type QuoteInput, type QuoteLineInput } from '../../src/money';
import { pairedCases, runCase, type BenchResult } from '../harness';

/** A deterministic invented estimate: mixed rates, discounts, options and alternatives. */
export function estimate(lines: number, vatRounding: QuoteInput['vatRounding'] = 'line-nearest-1p'): QuoteInput {
  let seed = 12345;
  const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648);
  const out: QuoteLineInput[] = [];
  for (let i = 0; i < lines; i++) {
    const r = next();
    const l: QuoteLineInput = {
      id: `line-${i}`,
      quantityMilli: (r % 40_000) + 250,
      unitPriceMinor: (next() % 50_000) + 99,
      unitCostMinor: (next() % 30_000) + 50,
      vatRateBp: r % 10 === 0 ? 500 : 2000,
    };
    if (r % 7 === 0) l.discount = { kind: 'percent', bp: 1000 };
    if (r % 11 === 0) l.discount = { kind: 'fixed', amountMinor: 500 };
    if (r % 13 === 0) {
      l.optional = true;
      l.selected = r % 2 === 0;
    } else if (r % 17 === 0) {
      l.alternativeGroup = `g${Math.floor(i / 17)}`;
      l.selected = true;
    }
    out.push(l);
  }
  return { lines: out, vatRounding, discount: { kind: 'percent', bp: 250 }, deposit: { kind: 'percent', bp: 3000 } };
}

export default function moneyBench(): BenchResult[] {
  const results: BenchResult[] = [];
  // Let the optimising compiler settle on every rounding path before the first timed case
  // (otherwise whichever case runs first is timed partly on unoptimised code).
  const warm = VAT_ROUNDINGS.map((r) => estimate(5000, r));
  for (let i = 0; i < 100; i++) for (const q of warm) computeQuoteTotals(q);
  for (const vatRounding of VAT_ROUNDINGS) {
    const q = estimate(5000, vatRounding);
    results.push(
      runCase({ name: `money: totals, 5,000-line estimate (${vatRounding})`, run: () => computeQuoteTotals(q), targetMs: 5 }),
    );
  }
  for (const n of [2500, 5000]) {
    const a = estimate(n);
    const b = estimate(2 * n);
    results.push(
      pairedCases(
        `money: totals doubling ${n.toLocaleString('en-GB')} -> ${(2 * n).toLocaleString('en-GB')} lines`,
        () => computeQuoteTotals(a),
        () => computeQuoteTotals(b),
        {
          maxRatio: 2.3,
        },
      ),
    );
  }
  return results;
}
