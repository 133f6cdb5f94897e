/**
 * Rates are integers of basis points: 1 bp = 0.01 %, so 20 % VAT is 2000 and a 33.33 %
 * margin is 3333. Conversions between markup and margin are exact rational sums done in
 * integers, rounded once at the end.
 */
import { assertNonNegativeInteger, assertSafeInteger, MoneyInputError, mulDiv, type IntegerRounding } from './integer-math';

export const BASIS_POINTS = 10_000;

/** `amount x bp / 10000`, rounded by `mode` (default half-up). */
export function applyBasisPoints(amountMinor: number, bp: number, mode: IntegerRounding = 'half-up'): number {
  return mulDiv(amountMinor, bp, BASIS_POINTS, mode);
}

/** Percent with up to two decimals -> basis points: 20 -> 2000, 12.5 -> 1250. */
export function percentToBasisPoints(percent: number): number {
  const bp = Math.round(percent * 100);
  if (!Number.isFinite(percent) || Math.abs(bp - percent * 100) > 1e-6 * Math.max(1, Math.abs(bp))) {
    throw new MoneyInputError('bad-percent', 'percent', `A percentage takes at most two decimal places; got ${percent}.`);
  }
  return bp + 0;
}

function assertMargin(marginBp: number): void {
  assertSafeInteger(marginBp, 'marginBp');
  if (marginBp >= BASIS_POINTS) {
    throw new MoneyInputError('margin-too-high', 'marginBp', `A margin must be below 100 %; got ${marginBp / 100} %.`);
  }
}

function assertMarkup(markupBp: number): void {
  assertSafeInteger(markupBp, 'markupBp');
  if (markupBp <= -BASIS_POINTS) {
    throw new MoneyInputError('markup-too-low', 'markupBp', `A markup must be above -100 %; got ${markupBp / 100} %.`);
  }
}

/** Sell price from cost and markup on cost: cost x (1 + markup). */
export function priceFromMarkup(costMinor: number, markupBp: number, mode: IntegerRounding = 'half-up'): number {
  assertNonNegativeInteger(costMinor, 'costMinor');
  assertMarkup(markupBp);
  return mulDiv(costMinor, BASIS_POINTS + markupBp, BASIS_POINTS, mode);
}

/** Sell price from cost and margin on price: cost / (1 - margin). */
export function priceFromMargin(costMinor: number, marginBp: number, mode: IntegerRounding = 'half-up'): number {
  assertNonNegativeInteger(costMinor, 'costMinor');
  assertMargin(marginBp);
  return mulDiv(costMinor, BASIS_POINTS, BASIS_POINTS - marginBp, mode);
}

/** Markup -> the margin it gives: m / (1 + m). 50 % markup -> 33.33 % margin (3333 bp). */
export function marginFromMarkup(markupBp: number, mode: IntegerRounding = 'half-up'): number {
  assertMarkup(markupBp);
  return mulDiv(markupBp, BASIS_POINTS, BASIS_POINTS + markupBp, mode);
}

/** Margin -> the markup that gives it: g / (1 - g). 25 % margin -> 33.33 % markup (3333 bp). */
export function markupFromMargin(marginBp: number, mode: IntegerRounding = 'half-up'): number {
  assertMargin(marginBp);
  return mulDiv(marginBp, BASIS_POINTS, BASIS_POINTS - marginBp, mode);
}

/** Margin of a price over its cost, in bp of the price; null when the price is zero. */
export function marginOf(priceMinor: number, costMinor: number, mode: IntegerRounding = 'half-up'): number | null {
  assertSafeInteger(priceMinor, 'priceMinor');
  assertSafeInteger(costMinor, 'costMinor');
  if (priceMinor === 0) return null;
  const sign = priceMinor < 0 ? -1 : 1;
  return mulDiv((priceMinor - costMinor) * sign, BASIS_POINTS, Math.abs(priceMinor), mode);
}

/** Markup of a price over its cost, in bp of the cost; null when the cost is zero. */
export function markupOf(priceMinor: number, costMinor: number, mode: IntegerRounding = 'half-up'): number | null {
  assertSafeInteger(priceMinor, 'priceMinor');
  assertSafeInteger(costMinor, 'costMinor');
  if (costMinor === 0) return null;
  const sign = costMinor < 0 ? -1 : 1;
  return mulDiv((priceMinor - costMinor) * sign, BASIS_POINTS, Math.abs(costMinor), mode);
}
