/**
 * The quote-level discount and deposit as the totals panel edits them: each is none, a
 * percentage (of the included lines for the discount, of the total for the deposit) or a
 * fixed amount. Text is read with the grid's own money and percentage readers, so sums work.
 */
import type { Discount, EstimateContent } from '@gloaming/contracts';
import { minorToDecimalString } from '@gloaming/engine';
import { parseMinor, parsePercentBp } from './cell-codec';

export type AdjustmentKind = 'none' | Discount['kind'];
export type AdjustmentField = 'discount' | 'deposit';
export type AdjustmentRead = { ok: true; value: Discount | null } | { ok: false; error: string };

export const kindOf = (a: Discount | null): AdjustmentKind => a?.kind ?? 'none';

/** The number shown in the input: 12.5 for 12.5 %, 250.00 for £250. */
export function adjustmentText(a: Discount | null): string {
  if (!a) return '';
  return a.kind === 'percent' ? String(a.bp / 100) : minorToDecimalString(a.amountMinor, 2);
}

/** What the estimator typed, read for the chosen kind. */
export function readAdjustment(kind: AdjustmentKind, text: string): AdjustmentRead {
  if (kind === 'none') return { ok: true, value: null };
  if (kind === 'percent') {
    const r = parsePercentBp(text, 10_000);
    return r.ok ? { ok: true, value: { kind: 'percent', bp: r.value } } : r;
  }
  const r = parseMinor(text);
  return r.ok ? { ok: true, value: { kind: 'fixed', amountMinor: r.value } } : r;
}

/**
 * The value a newly chosen kind starts with: a percentage deposit starts at the firm's
 * default deposit; anything else at nothing, ready to type.
 */
export function startingAdjustment(field: AdjustmentField, kind: AdjustmentKind, firmDepositBp: number): Discount | null {
  if (kind === 'none') return null;
  if (kind === 'percent') return { kind, bp: field === 'deposit' ? firmDepositBp : 0 };
  return { kind, amountMinor: 0 };
}

const same = (a: Discount | null, b: Discount | null): boolean =>
  a === b ||
  (a !== null &&
    b !== null &&
    a.kind === b.kind &&
    (a.kind === 'percent' ? a.bp === (b as typeof a).bp : a.amountMinor === (b as typeof a).amountMinor));

/** The document with a new discount or deposit; the same object when nothing changes (no undo step). */
export function withAdjustment(content: EstimateContent, field: AdjustmentField, value: Discount | null): EstimateContent {
  if (same(content[field], value)) return content;
  return { ...content, [field]: value };
}
