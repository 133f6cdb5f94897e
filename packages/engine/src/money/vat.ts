/**
 * VAT rounding as HMRC VAT Notice 700 §17.5 allows, chosen per firm:
 * - `line-down-0.1p`: each line's VAT rounded down to 0.1p;
 * - `line-nearest-1p`: each line's VAT rounded to the nearest 1p (halves up);
 * - `line-nearest-0.5p`: each line's VAT rounded to the nearest 0.5p (halves up);
 * - `invoice-down-1p`: VAT worked on the invoice's totals per rate, the total rounded down
 *   to a whole penny.
 * Where line VAT is kept in fractions of a penny (0.1p, 0.5p) the invoice's total VAT is
 * that exact sum rounded down to a whole penny (the engine's choice: the invoice shows
 * whole pennies and rounding the total down is what §17.5 allows).
 *
 * The per-rate breakdown always adds up to the total VAT: each rate gets its own amount
 * rounded down and the pennies the total gained from the fractions go to the rates with
 * the largest fractions (largest remainder).
 */
import { assertNonNegativeInteger, mulDiv, mulDivRem, type IntegerRounding } from './integer-math';

export type VatRounding = 'line-down-0.1p' | 'line-nearest-1p' | 'line-nearest-0.5p' | 'invoice-down-1p';

export const VAT_ROUNDINGS: readonly VatRounding[] = [
  'line-down-0.1p',
  'line-nearest-1p',
  'line-nearest-0.5p',
  'invoice-down-1p',
];

/** UK rates in basis points [gov.uk]: standard 20 %, reduced 5 %, zero 0 %. */
export const UK_VAT_RATES_BP = { standard: 2000, reduced: 500, zero: 0 } as const;

/**
 * One line's VAT in tenths of a minor unit, rounded as the line modes ask; null for
 * `invoice-down-1p`, where lines carry no rounded VAT of their own.
 */
export function lineVatTenths(netMinor: number, rateBp: number, rounding: VatRounding): number | null {
  switch (rounding) {
    case 'line-down-0.1p':
      return mulDiv(netMinor, rateBp, 1000, 'down');
    case 'line-nearest-1p':
      return mulDiv(netMinor, rateBp, 10_000, 'half-up') * 10;
    case 'line-nearest-0.5p':
      return mulDiv(netMinor, rateBp, 5000, 'half-up') * 5;
    case 'invoice-down-1p':
      return null;
  }
}

export interface VatRateTotal {
  rateBp: number;
  /** Net (ex VAT) of the included lines at this rate, minor units. */
  netMinor: number;
  /** VAT at this rate, whole minor units; the rates add up to the invoice's VAT. */
  vatMinor: number;
}

/** A rate's VAT before the total is rounded: whole minor units plus a fraction rem/den. */
interface VatPart {
  rateBp: number;
  netMinor: number;
  whole: number;
  rem: number;
}

/**
 * Per-rate VAT from the per-rate nets (invoice mode) or from the per-rate sums of line VAT
 * in tenths (line modes). Rates are listed highest first.
 */
export function vatByRate(
  rates: ReadonlyMap<number, { netMinor: number; vatTenths: number }>,
  rounding: VatRounding,
): { byRate: VatRateTotal[]; vatMinor: number } {
  const parts: VatPart[] = [];
  const den = rounding === 'invoice-down-1p' ? 10_000 : 10;
  let whole = 0;
  let rems = 0;
  for (const [rateBp, r] of rates) {
    const { quotient, remainder } =
      rounding === 'invoice-down-1p' ? mulDivRem(r.netMinor, rateBp, 10_000) : mulDivRem(r.vatTenths, 1, 10);
    parts.push({ rateBp, netMinor: r.netMinor, whole: quotient, rem: remainder });
    whole += quotient;
    rems += remainder;
  }
  // Total = floor(exact sum). The fractions add up to `extra` whole pennies (< number of rates).
  let extra = Math.floor(rems / den);
  parts.sort((a, b) => b.rateBp - a.rateBp);
  if (extra > 0) {
    const order = parts.map((p, i) => i).sort((x, y) => parts[y]!.rem - parts[x]!.rem || x - y);
    for (let k = 0; k < order.length && extra > 0; k++, extra--) parts[order[k]!]!.whole += 1;
  }
  const byRate = parts.map((p) => ({ rateBp: p.rateBp, netMinor: p.netMinor, vatMinor: p.whole }));
  return { byRate, vatMinor: whole + Math.floor(rems / den) };
}

/**
 * The VAT inside a VAT-inclusive amount: amount x rate / (1 + rate), rounded by `mode`
 * (default half-up). At 20 % that is the VAT fraction 1/6.
 */
export function vatInInclusiveMinor(inclusiveMinor: number, rateBp: number, mode: IntegerRounding = 'half-up'): number {
  assertNonNegativeInteger(rateBp, 'rateBp');
  return mulDiv(inclusiveMinor, rateBp, 10_000 + rateBp, mode);
}
