import { describe, expect, it } from 'vitest';
import type { EstimateContent, EstimateLine } from '@gloaming/contracts';
import { cellText, newLine, writeCell } from '../../src/features/quotes/grid/cell-codec';
import { flattenEstimate } from '../../src/features/quotes/grid/estimate-rows';
import { columnIndex } from '../../src/features/quotes/grid/grid-columns';
import { applyCellEdits, copyRange, deleteRows, duplicateLines, fillDown, moveLines, pasteBlock } from '../../src/features/quotes/grid/line-edits';
import { moveSelection, rangeOf, tabSelection } from '../../src/features/quotes/grid/selection';
import { createUndoStack, pushState, redo, undo } from '../../src/features/quotes/grid/undo-stack';
import { parseTsv, serialiseTsv } from '../../src/features/quotes/grid/tsv';

const settings = { currency: 'GBP', locale: 'en-GB', defaultVatRateBp: 2000, markupPercentBp: 3500 };
let n = 0;
const line = (over: Partial<EstimateLine> = {}): EstimateLine => ({ ...newLine(settings, `l${++n}`), ...over });
const doc = (lines: EstimateLine[][]): EstimateContent => ({
  sections: lines.map((ls, i) => ({ id: `s${i}`, name: `Area ${i}`, lines: ls })),
  discount: null,
  deposit: null,
  introduction: '',
});

describe('cells', () => {
  it('prices from cost by markup or margin and fixes a typed price', () => {
    const l = line();
    const costed = writeCell(l, 'unitCost', '25');
    expect(costed.ok && costed.line.unitPriceMinor).toBe(3375); // 25.00 x 1.35 = 33.75
    if (!costed.ok) return;
    const margin = writeCell(costed.line, 'pricing', '40 margin');
    expect(margin.ok && margin.line.unitPriceMinor).toBe(4167); // 25.00 / 0.6 = 41.666.. -> 41.67
    const typed = writeCell(costed.line, 'unitPrice', '30');
    expect(typed.ok && typed.line).toMatchObject({ unitPriceMinor: 3000, pricingMode: 'fixed' });
    expect(writeCell(l, 'pricing', '100 margin').ok).toBe(false);
  });

  it('takes arithmetic in quantities and refuses bad numbers with a reason', () => {
    const q = writeCell(line(), 'quantity', '3*12.5');
    expect(q.ok && q.line.quantityMilli).toBe(37_500);
    expect(writeCell(line(), 'quantity', '-2')).toMatchObject({ ok: false });
    expect(writeCell(line(), 'unitCost', 'twelve')).toMatchObject({ ok: false });
    expect(writeCell(line(), 'vat', '120')).toMatchObject({ ok: false });
    expect(writeCell(line(), 'unitCost', '£1,234.50')).toMatchObject({ ok: true, line: { unitCostMinor: 123_450 } });
  });

  it('keeps a line from being optional and in an alternative group at once', () => {
    const grouped = line({ alternativeGroup: 'path' });
    expect(writeCell(grouped, 'optional', 'yes')).toMatchObject({ ok: false });
  });
});

describe('document edits', () => {
  it('fills down the top row of the range, and a single row from the row above', () => {
    const a = line({ description: 'Spike light', unitCostMinor: 2500, unitPriceMinor: 3375 });
    const content = doc([[a, line(), line()]]);
    const rows = flattenEstimate(content);
    const cols = { left: columnIndex('description'), right: columnIndex('unitPrice') };
    const r = fillDown(content, rows, { top: 1, bottom: 3, ...cols }, new Map());
    expect(r.problems).toEqual([]);
    expect(r.content.sections[0]!.lines.map((l) => [l.description, l.unitPriceMinor])).toEqual([
      ['Spike light', 3375],
      ['Spike light', 3375],
      ['Spike light', 3375],
    ]);
    const single = fillDown(content, rows, { top: 2, bottom: 2, left: 1, right: 1 }, new Map());
    expect(single.content.sections[0]!.lines[1]!.description).toBe('Spike light');
    expect(single.content.sections[0]!.lines[2]!.description).toBe('');
  });

  it('pastes a block, adding lines past the end, and reports cells it cannot read', () => {
    const content = doc([[line()]]);
    const rows = flattenEstimate(content);
    const block = parseTsv('Wall light\t2\teach\t18.40\nPath light\tabc\teach\t21\nTransformer box\t1\teach\t64\n');
    const r = pasteBlock(content, rows, { row: 1, col: columnIndex('description') }, block, settings);
    const lines = r.content.sections[0]!.lines;
    expect(lines.map((l) => l.description)).toEqual(['Wall light', 'Path light', 'Transformer box']);
    expect(lines.map((l) => l.unitCostMinor)).toEqual([1840, 2100, 6400]);
    expect(lines[0]!.quantityMilli).toBe(2000);
    expect(r.problems).toEqual([{ row: 2, col: columnIndex('quantity'), error: expect.stringContaining('Use numbers') }]);
    // Copy the block back out: the same text round trip.
    const out = copyRange(flattenEstimate(r.content), { top: 1, bottom: 1, left: columnIndex('description'), right: columnIndex('unitCost') }, new Map());
    expect(serialiseTsv(out)).toBe('Wall light\t2\teach\t18.40');
  });

  it('never edits circuit-derived lines', () => {
    const derived = line({ circuitId: 'c1', description: 'Cable run A' });
    const content = doc([[derived]]);
    const r = applyCellEdits(content, flattenEstimate(content), [{ row: 1, col: columnIndex('description'), text: 'changed' }]);
    expect(r.content).toBe(content);
    expect(r.problems[0]!.error).toMatch(/circuit/);
    expect(deleteRows(content, flattenEstimate(content), 1, 1).content.sections[0]!.lines).toEqual([derived]);
  });

  it('moves lines across a section header and duplicates with new ids', () => {
    const [a, b, c] = [line(), line(), line()];
    const content = doc([[a, b], [c]]);
    const rows = flattenEstimate(content); // s0 a b s1 c
    const down = moveLines(content, rows, 2, 2, 1)!; // b below the header of s1
    expect(down.sections.map((s) => s.lines.map((l) => l.id))).toEqual([[a.id], [b.id, c.id]]);
    expect(moveLines(content, rows, 1, 1, -1)).toBeNull();
    const dup = duplicateLines(content, rows, 1, 2);
    expect(dup.sections[0]!.lines).toHaveLength(4);
    expect(new Set(dup.sections[0]!.lines.map((l) => l.id)).size).toBe(4);
    expect(dup.sections[1]).toBe(content.sections[1]); // untouched sections are shared
  });
});

describe('undo stack and selection', () => {
  it('undoes and redoes many steps, and a new edit drops the redo list', () => {
    let s = createUndoStack(0);
    for (let i = 1; i <= 30; i++) s = pushState(s, i);
    for (let i = 0; i < 25; i++) s = undo(s);
    expect(s.present).toBe(5);
    s = redo(redo(s));
    expect(s.present).toBe(7);
    s = pushState(s, 100);
    expect(redo(s).present).toBe(100);
    expect(undo(s).present).toBe(7);
    let capped = createUndoStack(0);
    for (let i = 1; i <= 10; i++) capped = pushState(capped, i, 3);
    expect(capped.past).toEqual([7, 8, 9]);
  });

  it('moves, extends and tabs within the grid', () => {
    const start = { anchor: { row: 2, col: 2 }, focus: { row: 2, col: 2 } };
    expect(rangeOf(moveSelection(start, 2, 1, 10, 12, true))).toEqual({ top: 2, bottom: 4, left: 2, right: 3 });
    expect(moveSelection(start, -9, -9, 10, 12).focus).toEqual({ row: 0, col: 0 });
    expect(tabSelection({ anchor: { row: 1, col: 11 }, focus: { row: 1, col: 11 } }, false, 10, 12).focus).toEqual({ row: 2, col: 0 });
    expect(tabSelection({ anchor: { row: 1, col: 0 }, focus: { row: 1, col: 0 } }, true, 10, 12).focus).toEqual({ row: 0, col: 11 });
  });
});

it('shows what it stores', () => {
  expect(cellText(line({ quantityMilli: 12_500 }), 'quantity', undefined)).toBe('12.5');
  expect(cellText(line({ vatRateBp: 500 }), 'vat', undefined)).toBe('5%');
});
