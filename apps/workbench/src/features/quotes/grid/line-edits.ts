/**
 * Edits to the estimate document, all immutable: each returns a new document that shares
 * every untouched section and line with the old one (cheap undo snapshots, cheap memo checks).
 */
import type { EstimateContent, EstimateLine, EstimateSection } from '@gloaming/contracts';
import { cellText, newLine, writeCell, type PricingSettings } from './cell-codec';
import { flattenEstimate, isDerivedLine, type GridRow, type LineRow } from './estimate-rows';
import { GRID_COLUMNS, isReadOnlyColumn, type ColumnId } from './grid-columns';
import type { CellRange } from './selection';

export interface CellEdit {
  row: number;
  col: number;
  text: string;
}

export interface CellProblem {
  row: number;
  col: number;
  error: string;
}

export interface EditResult {
  content: EstimateContent;
  problems: CellProblem[];
}

const DERIVED = 'This line comes from a circuit; change the circuit to change it.';

/** Replace some lines, copying only the sections they are in. */
export function replaceLines(content: EstimateContent, changes: ReadonlyMap<string, EstimateLine>, rows: readonly GridRow[]): EstimateContent {
  if (changes.size === 0) return content;
  const bySection = new Map<number, Map<number, EstimateLine>>();
  for (const row of rows) {
    if (row.kind !== 'line') continue;
    const next = changes.get(row.line.id);
    if (!next) continue;
    let m = bySection.get(row.sectionIndex);
    if (!m) bySection.set(row.sectionIndex, (m = new Map()));
    m.set(row.lineIndex, next);
  }
  const sections = content.sections.map((s, si) => {
    const m = bySection.get(si);
    if (!m) return s;
    return { ...s, lines: s.lines.map((l, li) => m.get(li) ?? l) };
  });
  return { ...content, sections };
}

/** Of each pick-one group, keep one line chosen: when none is, the first one is. */
export function normaliseAlternatives(content: EstimateContent): EstimateContent {
  const chosen = new Set<string>();
  const first = new Map<string, string>();
  for (const s of content.sections)
    for (const l of s.lines) {
      if (!l.alternativeGroup) continue;
      if (!first.has(l.alternativeGroup)) first.set(l.alternativeGroup, l.id);
      if (l.selected) chosen.add(l.alternativeGroup);
    }
  const fix = new Set<string>();
  for (const [group, id] of first) if (!chosen.has(group)) fix.add(id);
  // Lines that left every group go back to counting.
  let changed = false;
  const sections = content.sections.map((s) => {
    let touched = false;
    const lines = s.lines.map((l) => {
      if (fix.has(l.id)) {
        touched = true;
        return { ...l, selected: true };
      }
      if (!l.alternativeGroup && !l.optional && !l.selected) {
        touched = true;
        return { ...l, selected: true };
      }
      return l;
    });
    if (!touched) return s;
    changed = true;
    return { ...s, lines };
  });
  return changed ? { ...content, sections } : content;
}

function renameSection(content: EstimateContent, sectionIndex: number, name: string): EstimateContent {
  const sections = content.sections.map((s, i) => (i === sectionIndex ? { ...s, name } : s));
  return { ...content, sections };
}

/**
 * Apply typed or pasted text to cells. A section row takes text as its name (any column);
 * read-only cells and circuit-derived lines are left alone with a problem reported; text that
 * does not parse leaves the cell as it was and is reported too.
 */
export function applyCellEdits(content: EstimateContent, rows: readonly GridRow[], edits: readonly CellEdit[]): EditResult {
  const problems: CellProblem[] = [];
  const changes = new Map<string, EstimateLine>();
  let doc = content;
  let groupsTouched = false;
  for (const e of edits) {
    const row = rows[e.row];
    const column = GRID_COLUMNS[e.col];
    if (!row || !column) continue;
    if (row.kind === 'section') {
      if (e.col === 0 || column.id === 'description') {
        const name = e.text.trim();
        if (name.length > 200) problems.push({ row: e.row, col: e.col, error: 'A section name is at most 200 characters.' });
        else doc = renameSection(doc, row.sectionIndex, name);
      }
      continue;
    }
    if (isReadOnlyColumn(column)) continue;
    const current = changes.get(row.line.id) ?? row.line;
    if (isDerivedLine(current)) {
      problems.push({ row: e.row, col: e.col, error: DERIVED });
      continue;
    }
    if (column.id === 'product' && e.text.trim() !== '' && e.text.trim() === cellText(current, 'product', undefined)) continue;
    if (column.id === 'product' && e.text.trim() !== '') continue; // pasted product codes: the picker chooses products
    const w = writeCell(current, column.id, e.text);
    if (!w.ok) problems.push({ row: e.row, col: e.col, error: w.error });
    else if (w.line !== current) {
      changes.set(row.line.id, w.line);
      if (column.id === 'alternativeGroup' || column.id === 'optional') groupsTouched = true;
    }
  }
  doc = replaceLines(doc, changes, rows);
  return { content: groupsTouched ? normaliseAlternatives(doc) : doc, problems };
}

/** Clear the selected cells (Delete): text cells empty, numbers zero, the product unlinked. */
export function clearRange(content: EstimateContent, rows: readonly GridRow[], range: CellRange): EditResult {
  const edits: CellEdit[] = [];
  for (let r = range.top; r <= range.bottom; r++) {
    if (rows[r]?.kind !== 'line') continue;
    for (let c = range.left; c <= range.right; c++) edits.push({ row: r, col: c, text: '' });
  }
  return applyCellEdits(content, rows, edits);
}

/**
 * Fill down (Ctrl+D): the top row of the range is copied into the rows below it, column by
 * column; with a single row selected, the row above is copied into it. Section rows are skipped.
 */
export function fillDown(content: EstimateContent, rows: readonly GridRow[], range: CellRange, lineTotals: ReadonlyMap<string, number>): EditResult {
  let top = range.top;
  const bottom = range.bottom;
  if (top === bottom) {
    let above = top - 1;
    while (above >= 0 && rows[above]?.kind !== 'line') above--;
    if (above < 0) return { content, problems: [] };
    top = above;
  }
  const source = rows[top];
  if (source?.kind !== 'line') return { content, problems: [] };
  const edits: CellEdit[] = [];
  for (let r = top + 1; r <= bottom; r++) {
    if (rows[r]?.kind !== 'line') continue;
    for (let c = range.left; c <= range.right; c++) {
      const column = GRID_COLUMNS[c]!;
      if (isReadOnlyColumn(column)) continue;
      if (column.id === 'product') continue;
      edits.push({ row: r, col: c, text: cellText(source.line, column.id, lineTotals.get(source.line.id)) });
    }
  }
  // Copying the product link is a field copy, not text: do it directly.
  const productCol = GRID_COLUMNS.findIndex((c) => c.id === 'product');
  let doc = content;
  if (productCol >= range.left && productCol <= range.right) {
    const changes = new Map<string, EstimateLine>();
    for (let r = top + 1; r <= bottom; r++) {
      const row = rows[r];
      if (row?.kind !== 'line' || isDerivedLine(row.line)) continue;
      const { productCode, productId } = source.line;
      const next: EstimateLine = { ...row.line, productId };
      if (productCode === undefined) delete next.productCode;
      else next.productCode = productCode;
      changes.set(row.line.id, next);
    }
    doc = replaceLines(doc, changes, rows);
  }
  return applyCellEdits(doc, flattenEstimate(doc), edits);
}

/**
 * Paste a block of cells with its top-left corner at (row, col). Rows past the end become new
 * lines in the last section; columns past the last are dropped.
 */
export function pasteBlock(
  content: EstimateContent,
  rows: readonly GridRow[],
  at: { row: number; col: number },
  block: readonly (readonly string[])[],
  settings: PricingSettings,
): EditResult & { rowsPasted: number } {
  let doc = content;
  if (doc.sections.length === 0) doc = { ...doc, sections: [{ id: crypto.randomUUID(), name: 'Whole garden', lines: [] }] };
  let flat = doc === content ? [...rows] : flattenEstimate(doc);
  const startRow = Math.min(at.row, Math.max(0, flat.length - 1));
  // Count the line rows from startRow down; add lines until the block fits.
  let available = 0;
  for (let r = startRow; r < flat.length; r++) if (flat[r]!.kind === 'line') available++;
  const needed = block.length - available;
  if (needed > 0) {
    const last = doc.sections.length - 1;
    const extra = Array.from({ length: needed }, () => newLine(settings));
    doc = { ...doc, sections: doc.sections.map((s, i) => (i === last ? { ...s, lines: [...s.lines, ...extra] } : s)) };
    flat = flattenEstimate(doc);
  }
  const edits: CellEdit[] = [];
  let r = flat[startRow]?.kind === 'section' ? startRow + 1 : startRow;
  for (const cells of block) {
    while (r < flat.length && flat[r]!.kind !== 'line') r++;
    if (r >= flat.length) break;
    cells.forEach((text, i) => {
      const c = at.col + i;
      if (c < GRID_COLUMNS.length) edits.push({ row: r, col: c, text });
    });
    r++;
  }
  const result = applyCellEdits(doc, flat, edits);
  return { ...result, rowsPasted: block.length };
}

/** The selected rectangle as text rows for the clipboard; a section row copies its name. */
export function copyRange(rows: readonly GridRow[], range: CellRange, lineTotals: ReadonlyMap<string, number>): string[][] {
  const out: string[][] = [];
  for (let r = range.top; r <= range.bottom; r++) {
    const row = rows[r];
    if (!row) continue;
    const cells: string[] = [];
    for (let c = range.left; c <= range.right; c++) {
      const id: ColumnId = GRID_COLUMNS[c]!.id;
      cells.push(row.kind === 'section' ? (c === range.left ? row.section.name : '') : cellText(row.line, id, lineTotals.get(row.line.id)));
    }
    out.push(cells);
  }
  return out;
}

/** Where a new line goes for the row at `rowIndex`: below a line, or first in a section. */
function insertionPoint(rows: readonly GridRow[], rowIndex: number): { sectionIndex: number; lineIndex: number } {
  const row = rows[rowIndex];
  if (!row) return { sectionIndex: 0, lineIndex: 0 };
  return row.kind === 'section' ? { sectionIndex: row.sectionIndex, lineIndex: 0 } : { sectionIndex: row.sectionIndex, lineIndex: row.lineIndex + 1 };
}

export function insertLine(content: EstimateContent, rows: readonly GridRow[], rowIndex: number, line: EstimateLine): EstimateContent {
  if (content.sections.length === 0) return { ...content, sections: [{ id: crypto.randomUUID(), name: 'Whole garden', lines: [line] }] };
  const { sectionIndex, lineIndex } = insertionPoint(rows, rowIndex);
  return {
    ...content,
    sections: content.sections.map((s, i) => (i === sectionIndex ? { ...s, lines: [...s.lines.slice(0, lineIndex), line, ...s.lines.slice(lineIndex)] } : s)),
  };
}

/** A new section after the one holding `rowIndex`; the lines below the row stay where they are. */
export function insertSection(content: EstimateContent, rows: readonly GridRow[], rowIndex: number, section: EstimateSection): EstimateContent {
  const at = rows[rowIndex] ? rows[rowIndex]!.sectionIndex + 1 : content.sections.length;
  return { ...content, sections: [...content.sections.slice(0, at), section, ...content.sections.slice(at)] };
}

/**
 * Delete the rows in [top, bottom]: lines go; a section row takes its section and lines with it
 * (the last section stays, emptied). Derived lines are kept (their circuit owns them).
 */
export function deleteRows(content: EstimateContent, rows: readonly GridRow[], top: number, bottom: number): EditResult {
  const dropLines = new Set<string>();
  const dropSections = new Set<number>();
  const problems: CellProblem[] = [];
  for (let r = top; r <= bottom; r++) {
    const row = rows[r];
    if (!row) continue;
    if (row.kind === 'section') dropSections.add(row.sectionIndex);
    else if (isDerivedLine(row.line)) problems.push({ row: r, col: 0, error: DERIVED });
    else dropLines.add(row.line.id);
  }
  let sections = content.sections
    .map((s, i) => (dropSections.has(i) ? null : s.lines.some((l) => dropLines.has(l.id)) ? { ...s, lines: s.lines.filter((l) => !dropLines.has(l.id)) } : s))
    .filter((s): s is EstimateSection => s !== null);
  if (sections.length === 0) sections = [{ ...content.sections[0]!, lines: content.sections[0]!.lines.filter((l) => isDerivedLine(l)) }];
  return { content: { ...content, sections }, problems };
}

/** Copies of the selected lines (new ids, not derived), each placed right after the last selected line of its section. */
export function duplicateLines(content: EstimateContent, rows: readonly GridRow[], top: number, bottom: number): EstimateContent {
  const picked = new Map<number, EstimateLine[]>();
  const lastIndex = new Map<number, number>();
  for (let r = top; r <= bottom; r++) {
    const row = rows[r];
    if (row?.kind !== 'line') continue;
    const copy: EstimateLine = { ...row.line, id: crypto.randomUUID(), circuitId: null, overridden: false };
    picked.set(row.sectionIndex, [...(picked.get(row.sectionIndex) ?? []), copy]);
    lastIndex.set(row.sectionIndex, row.lineIndex);
  }
  if (picked.size === 0) return content;
  return normaliseAlternatives({
    ...content,
    sections: content.sections.map((s, i) => {
      const copies = picked.get(i);
      if (!copies) return s;
      const at = lastIndex.get(i)! + 1;
      return { ...s, lines: [...s.lines.slice(0, at), ...copies, ...s.lines.slice(at)] };
    }),
  });
}

/**
 * Move the line rows in [top, bottom] up or down by one place. Crossing a section header
 * moves them into the neighbouring section. Returns null when they cannot move.
 */
export function moveLines(content: EstimateContent, rows: readonly GridRow[], top: number, bottom: number, direction: -1 | 1): EstimateContent | null {
  const block: LineRow[] = [];
  for (let r = top; r <= bottom; r++) {
    const row = rows[r];
    if (row?.kind !== 'line') return null;
    block.push(row);
  }
  if (block.length === 0) return null;
  // Work on a flat sequence of (section marker | line) and rebuild.
  const seq: (GridRow | undefined)[] = [...rows];
  if (direction === -1) {
    if (top <= 1) return null; // above it is the first section header
    const moved = seq.splice(top, block.length);
    seq.splice(top - 1, 0, ...moved);
  } else {
    if (bottom >= rows.length - 1) return null;
    const moved = seq.splice(top, block.length);
    seq.splice(top + 1, 0, ...moved);
  }
  const sections: EstimateSection[] = [];
  for (const row of seq) {
    if (!row) continue;
    if (row.kind === 'section') sections.push({ ...row.section, lines: [] });
    else if (sections.length === 0) return null;
    else sections[sections.length - 1]!.lines.push(row.line);
  }
  // Keep identity for sections whose lines did not change.
  const out = sections.map((s, i) => {
    const old = content.sections[i];
    return old && old.id === s.id && old.lines.length === s.lines.length && old.lines.every((l, k) => l === s.lines[k]) ? old : s;
  });
  return { ...content, sections: out };
}
