/**
 * Exact integer arithmetic for money. Amounts are JavaScript numbers holding safe integers
 * (|x| <= Number.MAX_SAFE_INTEGER = 9,007,199,254,740,991), never fractions. Products that
 * would leave the safe range are redone with bigint, so every intermediate is exact; only a
 * final result that does not fit a safe integer is refused (about £90 trillion in pence).
 *
 * Exact quotients are passed through Math.trunc, which changes no value (they are whole
 * already) but gives V8 a small integer rather than a boxed double when one fits: results
 * stored in objects and arrays then stay unboxed, which saves an allocation per amount on
 * every line of a quote.
 */

import { EngineInputError } from '../units/engine-input-error';

/**
 * How to round a quotient to an integer.
 * - `half-up`: to nearest, halves away from zero (HMRC's "nearest", 86.5p -> 87p).
 * - `half-even`: to nearest, halves to the even neighbour (banker's rounding).
 * - `down`: toward zero (truncate; "round down" for the non-negative amounts on a quote).
 * - `up`: away from zero (never short, e.g. cable cut lengths).
 */
export type IntegerRounding = 'half-up' | 'half-even' | 'down' | 'up';

/**
 * Thrown for amounts, rates or quantities that are not what the money API accepts. It is an
 * EngineInputError, so it carries a ready-made error finding (its subject is the field).
 */
export class MoneyInputError extends EngineInputError {
  /** Stable machine code, e.g. `not-safe-integer` (the same as `finding.code`). */
  readonly code: string;
  /** Which input was wrong, e.g. `lines[3].unitPriceMinor`. */
  readonly field: string;
  constructor(code: string, field: string, message: string) {
    super(code, message, { subject: field });
    this.name = 'MoneyInputError';
    this.code = code;
    this.field = field;
  }
}

function shownValue(value: unknown): string {
  if (typeof value === 'object' && value !== null) {
    try {
      return JSON.stringify(value) ?? 'an object';
    } catch {
      return 'an object';
    }
  }
  return String(value);
}

/** Throw a clear MoneyInputError unless `value` is a safe integer. */
export function assertSafeInteger(value: unknown, field: string): asserts value is number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value)) {
    throw new MoneyInputError(
      'not-safe-integer',
      field,
      `${field} must be a whole number of minor units (or thousandths) within ±${Number.MAX_SAFE_INTEGER}; got ${shownValue(value)}.`,
    );
  }
}

/** Throw unless `value` is a safe integer >= 0. */
export function assertNonNegativeInteger(value: unknown, field: string): asserts value is number {
  assertSafeInteger(value, field);
  if (value < 0) {
    throw new MoneyInputError('negative', field, `${field} must not be negative; got ${value}.`);
  }
}

function checkedResult(value: number | bigint, what: string): number {
  const n = typeof value === 'bigint' ? Number(value) : value;
  if (!Number.isSafeInteger(n) || (typeof value === 'bigint' && BigInt(n) !== value)) {
    throw new MoneyInputError(
      'result-out-of-range',
      what,
      `${what} is too large to hold exactly (beyond ±${Number.MAX_SAFE_INTEGER} minor units).`,
    );
  }
  return n + 0; // normalise -0
}

function roundQuotient(q: number, absR: number, rest: number, negative: boolean, mode: IntegerRounding): number {
  if (absR === 0) return q;
  const away = negative ? -1 : 1;
  switch (mode) {
    case 'down':
      return q;
    case 'up':
      return q + away;
    case 'half-up':
      return absR >= rest ? q + away : q;
    case 'half-even':
      return absR > rest || (absR === rest && q % 2 !== 0) ? q + away : q;
  }
}

function roundQuotientBig(q: bigint, absR: bigint, rest: bigint, negative: boolean, mode: IntegerRounding): bigint {
  if (absR === 0n) return q;
  const away = negative ? -1n : 1n;
  switch (mode) {
    case 'down':
      return q;
    case 'up':
      return q + away;
    case 'half-up':
      return absR >= rest ? q + away : q;
    case 'half-even':
      return absR > rest || (absR === rest && q % 2n !== 0n) ? q + away : q;
  }
}

/** n / d rounded by `mode`; n any safe integer, d a positive safe integer. Exact. */
export function divRound(n: number, d: number, mode: IntegerRounding): number {
  assertSafeInteger(n, 'dividend');
  assertSafeInteger(d, 'divisor');
  if (d <= 0) throw new MoneyInputError('bad-divisor', 'divisor', `divisor must be positive; got ${d}.`);
  const r = n % d; // exact for safe integers, takes the sign of n
  const q = Math.trunc((n - r) / d); // exact: n - r is a multiple of d (trunc: see the note at the top)
  const absR = Math.abs(r);
  return roundQuotient(q, absR, d - absR, n < 0, mode) + 0;
}

/**
 * a * b / d rounded by `mode`, exact for any safe integers a, b and positive d. Uses
 * plain numbers while a * b stays safe and bigint otherwise.
 */
export function mulDiv(a: number, b: number, d: number, mode: IntegerRounding): number {
  const p = a * b;
  if (Number.isSafeInteger(p)) return divRound(p, d, mode);
  assertSafeInteger(a, 'factor');
  assertSafeInteger(b, 'factor');
  assertSafeInteger(d, 'divisor');
  if (d <= 0) throw new MoneyInputError('bad-divisor', 'divisor', `divisor must be positive; got ${d}.`);
  const bp = BigInt(a) * BigInt(b);
  const bd = BigInt(d);
  const r = bp % bd;
  const q = bp / bd;
  const absR = r < 0n ? -r : r;
  return checkedResult(roundQuotientBig(q, absR, bd - absR, bp < 0n, mode), 'product');
}

/**
 * a * b / d truncated toward zero, with the remainder (same sign as a * b, |rem| < d).
 * Exact; the remainder is what a largest-remainder allocation ranks on.
 */
export function mulDivRem(a: number, b: number, d: number): { quotient: number; remainder: number } {
  const p = a * b;
  if (Number.isSafeInteger(p) && Number.isSafeInteger(d) && d > 0) {
    const r = p % d;
    return { quotient: Math.trunc((p - r) / d) + 0, remainder: r + 0 };
  }
  assertSafeInteger(a, 'factor');
  assertSafeInteger(b, 'factor');
  assertSafeInteger(d, 'divisor');
  if (d <= 0) throw new MoneyInputError('bad-divisor', 'divisor', `divisor must be positive; got ${d}.`);
  const bp = BigInt(a) * BigInt(b);
  const bd = BigInt(d);
  return { quotient: checkedResult(bp / bd, 'product'), remainder: Number(bp % bd) + 0 };
}

/** a + b, refusing a sum that leaves the safe-integer range. */
export function addMinor(a: number, b: number): number {
  const s = a + b;
  if (!Number.isSafeInteger(s)) return checkedResult(BigInt(a) + BigInt(b), 'sum');
  return s;
}
