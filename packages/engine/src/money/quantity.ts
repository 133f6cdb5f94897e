/**
 * Quantities are exact: integers of thousandths (`quantityMilli`), so 12.5 m is 12500 and
 * 3 fittings is 3000. Three decimals cover metres to the millimetre and hours to 3.6 s.
 */
import { MoneyInputError, mulDiv, type IntegerRounding } from './integer-math';

export const QUANTITY_SCALE = 1000;

export type DecimalParseResult = { ok: true; value: number } | { ok: false; error: string };

const DECIMAL = /^([+-]?)(\d+)(?:\.(\d*))?$|^([+-]?)\.(\d+)$/;

/**
 * Parse a decimal string exactly into an integer scaled by 10^digits (no floats). Accepts
 * "12", "12.5", ".5", "-3.25"; thousands separators and currency signs are not accepted
 * (the front end strips its own formatting before parsing).
 */
export function parseScaledDecimal(text: string, digits: number, what: string): DecimalParseResult {
  const s = text.trim();
  const m = DECIMAL.exec(s);
  if (!m) return { ok: false, error: `"${text}" is not a number for ${what}.` };
  const sign = m[1] ?? m[4] ?? '';
  const whole = m[2] ?? '0';
  const frac = m[3] ?? m[5] ?? '';
  if (frac.length > digits) {
    return { ok: false, error: `${what} takes at most ${digits} decimal places; got "${text}".` };
  }
  const scaled = BigInt(whole + frac.padEnd(digits, '0')) * (sign === '-' ? -1n : 1n);
  const n = Number(scaled);
  if (!Number.isSafeInteger(n)) return { ok: false, error: `${what} "${text}" is too large.` };
  return { ok: true, value: n + 0 };
}

/** "12.5" -> 12500 thousandths. */
export function parseQuantity(text: string): DecimalParseResult {
  return parseScaledDecimal(text, 3, 'a quantity');
}

/**
 * A JavaScript number with at most three decimals (12.5, 0.125) -> thousandths. Refuses
 * numbers that are not exactly that many decimals once the float noise is removed.
 */
export function quantityMilli(value: number): number {
  if (!Number.isFinite(value)) {
    throw new MoneyInputError('not-a-number', 'quantity', `A quantity must be a finite number; got ${value}.`);
  }
  const scaled = Math.round(value * QUANTITY_SCALE);
  if (Math.abs(scaled - value * QUANTITY_SCALE) > 1e-6 * Math.max(1, Math.abs(scaled)) || !Number.isSafeInteger(scaled)) {
    throw new MoneyInputError(
      'too-many-decimals',
      'quantity',
      `A quantity takes at most three decimal places (thousandths); got ${value}.`,
    );
  }
  return scaled + 0;
}

/** Thousandths -> a plain decimal string without trailing zeros ("12.5", "3"). */
export function formatQuantityMilli(milli: number): string {
  const negative = milli < 0;
  const abs = Math.abs(milli);
  const whole = Math.trunc(abs / QUANTITY_SCALE);
  const frac = (abs % QUANTITY_SCALE).toString().padStart(3, '0').replace(/0+$/, '');
  return `${negative ? '-' : ''}${whole}${frac ? `.${frac}` : ''}`;
}

/** quantity (thousandths) x unit price (minor units), rounded to a whole minor unit. */
export function extendMinor(quantityMilliValue: number, unitPriceMinor: number, mode: IntegerRounding = 'half-up'): number {
  const p = quantityMilliValue * unitPriceMinor;
  if (mode === 'half-up' && p >= 0 && Number.isSafeInteger(p)) {
    // fast path for the common case: non-negative, exact in a double
    const r = p % QUANTITY_SCALE;
    return Math.trunc((p - r) / QUANTITY_SCALE) + (r >= QUANTITY_SCALE / 2 ? 1 : 0); // trunc: see integer-math
  }
  return mulDiv(quantityMilliValue, unitPriceMinor, QUANTITY_SCALE, mode);
}
