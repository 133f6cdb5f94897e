/**
 * Split an amount by weights so the parts add back to the amount exactly: never a penny
 * lost or invented. Largest-remainder method: every part gets its share rounded toward
 * zero, then the pennies left over go one each to the parts with the largest remainders
 * (ties to the earlier part). £1000.01 split 30/70 gives £300.00 / £700.01.
 */
import { assertNonNegativeInteger, assertSafeInteger, MoneyInputError, mulDivRem } from './integer-math';

/**
 * Allocate `amountMinor` (any safe integer) across `weights` (non-negative safe integers,
 * at least one positive; e.g. basis points or line amounts). Returns one part per weight,
 * each with the sign of the amount; a zero weight always gets zero.
 */
export function allocateMinor(amountMinor: number, weights: ArrayLike<number>): number[] {
  assertSafeInteger(amountMinor, 'amountMinor');
  if (weights.length === 0) {
    throw new MoneyInputError('no-weights', 'weights', 'Cannot split an amount across no parts.');
  }
  let total = 0;
  for (let i = 0; i < weights.length; i++) {
    const w = weights[i];
    // the field name is only built when the weight is wrong (no per-weight garbage)
    if (typeof w !== 'number' || !Number.isSafeInteger(w) || w < 0) assertNonNegativeInteger(w, `weights[${i}]`);
    total += w;
  }
  if (!Number.isSafeInteger(total)) {
    throw new MoneyInputError('weights-too-large', 'weights', 'The weights add up to more than can be held exactly.');
  }
  if (total === 0) {
    throw new MoneyInputError('zero-weights', 'weights', 'Cannot split an amount when every weight is zero.');
  }
  const negative = amountMinor < 0;
  const amount = Math.abs(amountMinor);
  const parts = new Array<number>(weights.length);
  const remainders = new Float64Array(weights.length); // exact: remainders are safe integers
  let given = 0;
  for (let i = 0; i < weights.length; i++) {
    const w = weights[i]!;
    const p = amount * w;
    let quotient: number;
    let remainder: number;
    if (Number.isSafeInteger(p)) {
      remainder = p % total;
      quotient = Math.trunc((p - remainder) / total); // exact; trunc keeps it a small integer (see integer-math)
    } else {
      ({ quotient, remainder } = mulDivRem(amount, w, total));
    }
    parts[i] = quotient;
    remainders[i] = remainder;
    given += quotient;
  }
  const left = amount - given; // 0 <= left < number of parts with a remainder
  if (left > 0) giveLeftovers(parts, remainders, left);
  return negative ? parts.map((p) => -p + 0) : parts;
}

/**
 * Give one unit each to the `left` parts with the largest remainders, ties to the earlier
 * part. Finds the threshold (the left-th largest remainder) by selection in linear time,
 * then hands out in one pass in index order.
 */
function giveLeftovers(parts: number[], remainders: Float64Array, left: number): void {
  const n = remainders.length;
  const work = remainders.slice();
  const threshold = kthSmallest(work, n - left);
  let above = 0;
  for (let i = 0; i < n; i++) if (remainders[i]! > threshold) above++;
  let atThreshold = left - above; // ties handed out in index order
  for (let i = 0; i < n; i++) {
    const r = remainders[i]!;
    if (r > threshold) parts[i]! += 1;
    else if (r === threshold && atThreshold > 0) {
      parts[i]! += 1;
      atThreshold--;
    }
  }
}

/**
 * The k-th smallest value (0-based) of `a`, reordering `a`. Quickselect with a
 * median-of-three pivot; after too many rounds it falls back to a full sort, so the worst
 * case stays O(n log n).
 */
function kthSmallest(a: Float64Array, k: number): number {
  let lo = 0;
  let hi = a.length - 1;
  let rounds = 0;
  const limit = 2 * Math.ceil(Math.log2(a.length + 1)) + 4;
  while (hi > lo) {
    if (++rounds > limit) {
      const rest = a.slice(lo, hi + 1).sort((p, q) => p - q);
      return rest[k - lo]!;
    }
    const mid = lo + ((hi - lo) >> 1);
    const x = a[lo]!;
    const y = a[mid]!;
    const z = a[hi]!;
    const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        const t = a[i]!;
        a[i] = a[j]!;
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k]!;
  }
  return a[k]!;
}
