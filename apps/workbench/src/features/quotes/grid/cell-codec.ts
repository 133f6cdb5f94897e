/**
 * A grid cell as text and back: what a cell shows, what Copy puts on the clipboard, and how
 * typed or pasted text becomes a line's value. Money and quantities stay integers throughout
 * (the engine's parsers); numeric cells take arithmetic ("3*12.5") through expression.ts.
 */
import type { EstimateLine, RevisionSettings } from '@gloaming/contracts';
import { formatBasisPoints, formatQuantityMilli, minorToDecimalString, priceFromMargin, priceFromMarkup } from '@gloaming/engine';
import { evaluateScaled } from './expression';
import type { ColumnId } from './grid-columns';

export type CellWrite = { ok: true; line: EstimateLine } | { ok: false; error: string };

export type PricingSettings = Pick<RevisionSettings, 'currency' | 'locale' | 'defaultVatRateBp' | 'markupPercentBp'>;

const MAX_MINOR = 1_000_000_000_00;
const MAX_QUANTITY_MILLI = 1_000_000_000;

export function newLine(settings: PricingSettings, id: string = crypto.randomUUID()): EstimateLine {
  return {
    id,
    productId: null,
    description: '',
    quantityMilli: 1000,
    unit: 'each',
    unitCostMinor: 0,
    pricingMode: 'markup',
    pricingBp: settings.markupPercentBp,
    unitPriceMinor: 0,
    vatRateBp: settings.defaultVatRateBp,
    discount: null,
    optional: false,
    alternativeGroup: null,
    selected: true,
    note: '',
    circuitId: null,
    overridden: false,
  };
}

export function pricingText(line: EstimateLine): string {
  if (line.pricingMode === 'fixed') return 'fixed';
  return `${formatBasisPoints(line.pricingBp)} ${line.pricingMode}`;
}

/** The cell's text for copying and for starting an edit (no currency sign, no thousands commas). */
export function cellText(line: EstimateLine, col: ColumnId, lineTotalMinor: number | undefined): string {
  switch (col) {
    case 'product':
      return line.productCode ?? (line.productId ? 'catalogue' : '');
    case 'description':
      return line.description;
    case 'quantity':
      return formatQuantityMilli(line.quantityMilli);
    case 'unit':
      return line.unit;
    case 'unitCost':
      return minorToDecimalString(line.unitCostMinor, 2);
    case 'pricing':
      return pricingText(line);
    case 'unitPrice':
      return minorToDecimalString(line.unitPriceMinor, 2);
    case 'lineTotal':
      return lineTotalMinor === undefined ? '' : minorToDecimalString(lineTotalMinor, 2);
    case 'vat':
      return formatBasisPoints(line.vatRateBp);
    case 'optional':
      return line.optional ? 'yes' : '';
    case 'alternativeGroup':
      return line.alternativeGroup ?? '';
    case 'note':
      return line.note;
  }
}

/** The unit price a markup or margin gives from the cost; a fixed price stays as typed. */
export function repriced(line: EstimateLine): CellWrite {
  if (line.pricingMode === 'fixed') return { ok: true, line };
  if (line.pricingMode === 'margin' && line.pricingBp >= 10_000) return { ok: false, error: 'A margin must be under 100 %.' };
  const price = line.pricingMode === 'markup' ? priceFromMarkup(line.unitCostMinor, line.pricingBp) : priceFromMargin(line.unitCostMinor, line.pricingBp);
  if (price > MAX_MINOR) return { ok: false, error: 'That price is too large.' };
  return { ok: true, line: price === line.unitPriceMinor ? line : { ...line, unitPriceMinor: price } };
}

const stripMoney = (text: string) => text.replace(/[£$€,\s]/g, '');

/** Money typed in pounds (sums allowed, like 3*12.5) -> minor units. */
export function parseMinor(text: string): { ok: true; value: number } | { ok: false; error: string } {
  const t = stripMoney(text);
  if (t === '') return { ok: true, value: 0 };
  const r = evaluateScaled(t, 2);
  if (!r.ok) return r;
  if (r.value < 0) return { ok: false, error: 'An amount cannot be negative.' };
  if (r.value > MAX_MINOR) return { ok: false, error: 'That amount is too large.' };
  return r;
}

/** A percentage typed (10, 12.5 %, 30/2) -> basis points, at most `max`. */
export function parsePercentBp(text: string, max: number): { ok: true; value: number } | { ok: false; error: string } {
  const t = text.replace(/[%\s]/g, '');
  if (t === '') return { ok: true, value: 0 };
  const r = evaluateScaled(t, 2);
  if (!r.ok) return r;
  if (r.value < 0) return { ok: false, error: 'A percentage cannot be negative.' };
  if (r.value > max) return { ok: false, error: `At most ${max / 100} %.` };
  return r;
}

const YES = new Set(['yes', 'y', 'true', '1', 'x', '✓', 'optional']);
const NO = new Set(['', 'no', 'n', 'false', '0', '-']);

/** Text typed or pasted into a cell -> the changed line, or why it cannot be taken. */
export function writeCell(line: EstimateLine, col: ColumnId, text: string): CellWrite {
  const trimmed = text.trim();
  switch (col) {
    case 'product':
      // Products come from the picker; clearing the cell turns the line into free text.
      if (trimmed === '') {
        const { productCode: _code, ...rest } = line;
        return { ok: true, line: { ...rest, productId: null } };
      }
      return trimmed === cellText(line, 'product', undefined) ? { ok: true, line } : { ok: false, error: 'Pick a product from the catalogue with Enter.' };
    case 'description':
      return text.length > 2000 ? { ok: false, error: 'At most 2000 characters.' } : { ok: true, line: { ...line, description: text } };
    case 'unit':
      return trimmed.length > 16 ? { ok: false, error: 'A unit is at most 16 characters.' } : { ok: true, line: { ...line, unit: trimmed } };
    case 'note':
      return text.length > 2000 ? { ok: false, error: 'At most 2000 characters.' } : { ok: true, line: { ...line, note: text } };
    case 'quantity': {
      const t = trimmed.replace(/[,\s]/g, '');
      const r = t === '' ? ({ ok: true, value: 0 } as const) : evaluateScaled(t, 3);
      if (!r.ok) return r;
      if (r.value < 0) return { ok: false, error: 'A quantity cannot be negative.' };
      if (r.value > MAX_QUANTITY_MILLI) return { ok: false, error: 'That quantity is too large.' };
      return { ok: true, line: { ...line, quantityMilli: r.value } };
    }
    case 'unitCost': {
      const r = parseMinor(trimmed);
      return r.ok ? repriced({ ...line, unitCostMinor: r.value }) : r;
    }
    case 'unitPrice': {
      const r = parseMinor(trimmed);
      // Typing a price fixes it: the markup or margin no longer drives it.
      return r.ok ? { ok: true, line: { ...line, unitPriceMinor: r.value, pricingMode: 'fixed' } } : r;
    }
    case 'pricing': {
      const lower = trimmed.toLowerCase();
      if (lower === 'fixed') return { ok: true, line: { ...line, pricingMode: 'fixed' } };
      const margin = /\b(margin|mg)\b/.test(lower);
      const markup = /\b(markup|mk)\b/.test(lower);
      const number = lower.replace(/\b(margin|mg|markup|mk)\b/g, '');
      const r = parsePercentBp(number, margin ? 9_999 : 1_000_000);
      if (!r.ok) return r;
      const mode = margin ? 'margin' : markup ? 'markup' : line.pricingMode === 'fixed' ? 'markup' : line.pricingMode;
      return repriced({ ...line, pricingMode: mode, pricingBp: r.value });
    }
    case 'lineTotal':
      return { ok: false, error: 'The line total is worked out from quantity and price.' };
    case 'vat': {
      const r = parsePercentBp(trimmed, 10_000);
      return r.ok ? { ok: true, line: { ...line, vatRateBp: r.value } } : r;
    }
    case 'optional': {
      const v = trimmed.toLowerCase();
      if (!YES.has(v) && !NO.has(v)) return { ok: false, error: 'Type yes or leave it empty.' };
      const optional = YES.has(v);
      if (optional && line.alternativeGroup) return { ok: false, error: 'A line in an alternative group cannot also be optional.' };
      return { ok: true, line: { ...line, optional, selected: optional ? false : true } };
    }
    case 'alternativeGroup': {
      if (trimmed.length > 64) return { ok: false, error: 'At most 64 characters.' };
      if (trimmed && line.optional) return { ok: false, error: 'An optional line cannot also be in an alternative group.' };
      return { ok: true, line: { ...line, alternativeGroup: trimmed === '' ? null : trimmed } };
    }
  }
}
