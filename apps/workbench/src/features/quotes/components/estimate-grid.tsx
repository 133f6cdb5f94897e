import type { EstimateContent, EstimateLine, Product, RevisionSettings } from '@gloaming/contracts';
import { formatBasisPoints, formatMoney, formatQuantityMilli, priceFromMarkup } from '@gloaming/engine';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useVirtualizer } from '@tanstack/react-virtual';
import { memo, useCallback, useEffect, useRef, useState, type ClipboardEvent, type KeyboardEvent, type MouseEvent, type ReactNode } from 'react';
import { cellText, newLine, pricingText, writeCell } from '../grid/cell-codec';
import { isDerivedLine, type GridRow } from '../grid/estimate-rows';
import {
  COLUMN_COUNT,
  COLUMN_LEFT,
  GRID_COLUMNS,
  GUTTER_WIDTH,
  columnIndex,
  isNumericColumn,
  isReadOnlyColumn,
  STICKY_COLUMN_COUNT,
  scrollLeftToShow,
  stickyLeft,
  type ColumnId,
} from '../grid/grid-columns';
import {
  applyCellEdits,
  clearRange,
  copyRange,
  deleteRows,
  duplicateLines,
  fillDown,
  insertLine,
  insertSection,
  moveLines,
  pasteBlock,
  replaceLines,
  type CellProblem,
} from '../grid/line-edits';
import { cellSelection, moveSelection, rangeOf, tabSelection, type Selection } from '../grid/selection';
import { parseTsv, serialiseTsv } from '../grid/tsv';
import type { EstimateEditor } from '../hooks/use-estimate-editor';
import { ProductPicker } from './product-picker';

export const ROW_HEIGHT = 34;

export interface CellDraft {
  row: number;
  col: number;
  text: string;
}

/** The line a draft would make, for live totals while typing; null when the text does not parse yet. */
export function previewContent(content: EstimateContent, rows: readonly GridRow[], draft: CellDraft | null): EstimateContent {
  if (!draft) return content;
  const row = rows[draft.row];
  const column = GRID_COLUMNS[draft.col];
  if (row?.kind !== 'line' || !column || column.id === 'product') return content;
  const w = writeCell(row.line, column.id, draft.text);
  return w.ok && w.line !== row.line ? replaceLines(content, new Map([[row.line.id, w.line]]), rows) : content;
}

function productLine(line: EstimateLine, product: Product, settings: RevisionSettings): EstimateLine {
  const base: EstimateLine = {
    ...line,
    productId: product.id,
    productCode: product.supplierCode,
    description: product.name,
    unit: product.unit.slice(0, 16),
    unitCostMinor: product.costMinor,
  };
  if (product.costMinor > 0) return { ...base, pricingMode: 'markup', pricingBp: settings.markupPercentBp, unitPriceMinor: priceFromMarkup(product.costMinor, settings.markupPercentBp) };
  return { ...base, pricingMode: 'fixed', unitPriceMinor: product.listPriceMinor };
}

const columnHelper = createColumnHelper<GridRow>();
const TABLE_COLUMNS = GRID_COLUMNS.map((c) =>
  columnHelper.display({ id: c.id, header: c.label, size: c.width, meta: { numeric: isNumericColumn(c) } }),
);
const GRID_WIDTH = COLUMN_LEFT[COLUMN_COUNT]!;
/** Sticky cells sit above the cells that scroll under them, on the row's own background. */
const STICKY = 'sticky z-[11] bg-inherit';

interface GridProps {
  editor: EstimateEditor;
  settings: RevisionSettings;
  lineTotals: ReadonlyMap<string, number>;
  readOnly: boolean;
  draft: CellDraft | null;
  onDraftChange: (draft: CellDraft | null) => void;
  onNotice: (text: string) => void;
}

/**
 * The estimate grid: sections as header rows, lines below; virtualised so thousands of lines
 * scroll smoothly. The grid element keeps keyboard focus; an editor input appears in the
 * active cell while typing. See the key list in the editor page's help.
 */
export function EstimateGrid({ editor, settings, lineTotals, readOnly, draft, onDraftChange, onNotice }: GridProps) {
  const { rows, selection, content, change, select } = editor;
  const gridRef = useRef<HTMLDivElement>(null);
  const [picker, setPicker] = useState<{ row: number; search: string } | null>(null);
  const table = useReactTable({ data: rows as GridRow[], columns: TABLE_COLUMNS, getCoreRowModel: getCoreRowModel(), getRowId: (r) => r.key });
  const tableRows = table.getRowModel().rows;
  const virtualizer = useVirtualizer({ count: tableRows.length, getScrollElement: () => gridRef.current, estimateSize: () => ROW_HEIGHT, overscan: 6 });
  const range = rangeOf(selection);
  const focusRow = selection.focus.row;

  useEffect(() => {
    virtualizer.scrollToIndex(focusRow, { align: 'auto' });
  }, [focusRow, virtualizer]);
  const focusCol = selection.focus.col;
  useEffect(() => {
    const el = gridRef.current;
    if (!el) return;
    const to = scrollLeftToShow(focusCol, el.scrollLeft, el.clientWidth);
    if (to !== null) el.scrollLeft = to;
  }, [focusCol]);

  const focusGrid = useCallback(() => gridRef.current?.focus({ preventScroll: true }), []);
  // Stable, so the memoised rows that are not being edited skip re-rendering on every keystroke.
  const cancelDraft = useCallback(() => {
    onDraftChange(null);
    gridRef.current?.focus({ preventScroll: true });
  }, [onDraftChange]);

  const report = useCallback(
    (problems: CellProblem[], done?: string) => {
      if (problems.length > 0) onNotice(problems.length === 1 ? problems[0]!.error : `${problems.length} cells were left as they were: ${problems[0]!.error}`);
      else if (done) onNotice(done);
    },
    [onNotice],
  );

  const commitDraft = useCallback(
    (d: CellDraft, next: Selection | null) => {
      const r = applyCellEdits(content, rows, [{ row: d.row, col: d.col, text: d.text }]);
      onDraftChange(null);
      if (r.problems.length > 0) {
        report(r.problems);
        onDraftChange(d); // keep the text so nothing typed is lost
        return;
      }
      change(r.content, next ?? undefined);
      focusGrid();
    },
    [content, rows, change, onDraftChange, report, focusGrid],
  );

  const startEdit = useCallback(
    (initial: string | null) => {
      if (readOnly) return onNotice('This revision is frozen. Choose “Revise” to make a new draft.');
      const { row, col } = selection.focus;
      const gridRow = rows[row];
      const column = GRID_COLUMNS[col]!;
      if (!gridRow) return;
      if (gridRow.kind === 'line' && isDerivedLine(gridRow.line)) return onNotice('This line comes from a circuit; change the circuit to change it.');
      if (gridRow.kind === 'line' && isReadOnlyColumn(column)) return onNotice('The line total is worked out from quantity and price.');
      if (gridRow.kind === 'line' && column.id === 'product') return setPicker({ row, search: initial ?? '' });
      const text = gridRow.kind === 'section' ? gridRow.section.name : cellText(gridRow.line, column.id, lineTotals.get(gridRow.line.id));
      onDraftChange({ row, col: gridRow.kind === 'section' ? col : col, text: initial ?? text });
    },
    [readOnly, selection.focus, rows, lineTotals, onDraftChange, onNotice],
  );

  const pickProduct = useCallback(
    (product: Product | null) => {
      const p = picker;
      setPicker(null);
      focusGrid();
      if (!p || !product) return;
      const row = rows[p.row];
      if (row?.kind !== 'line') return;
      editor.change(replaceLines(content, new Map([[row.line.id, productLine(row.line, product, settings)]]), rows), cellSelection({ row: p.row, col: columnIndex('quantity') }));
    },
    [picker, rows, content, editor, settings, focusGrid],
  );

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (draft || picker) return; // the editor input handles its own keys
    const mod = e.ctrlKey || e.metaKey;
    const key = e.key;
    const n = rows.length;
    const handled = () => e.preventDefault();
    if (mod && !e.shiftKey && key.toLowerCase() === 'z') return handled(), editor.undo();
    if (mod && (key.toLowerCase() === 'y' || (e.shiftKey && key.toLowerCase() === 'z'))) return handled(), editor.redo();
    if (key.startsWith('Arrow') && e.altKey && !readOnly) {
      handled();
      const dir = key === 'ArrowUp' ? -1 : key === 'ArrowDown' ? 1 : 0;
      if (dir === 0) return;
      const moved = moveLines(content, rows, range.top, range.bottom, dir);
      if (!moved) return onNotice('Select lines (not a section row) to move them.');
      return editor.change(moved, { anchor: { ...selection.anchor, row: selection.anchor.row + dir }, focus: { ...selection.focus, row: selection.focus.row + dir } });
    }
    switch (key) {
      case 'ArrowUp':
      case 'ArrowDown':
      case 'ArrowLeft':
      case 'ArrowRight': {
        handled();
        const dRow = key === 'ArrowUp' ? -1 : key === 'ArrowDown' ? 1 : 0;
        const dCol = key === 'ArrowLeft' ? -1 : key === 'ArrowRight' ? 1 : 0;
        const far = mod ? (dRow !== 0 ? n : COLUMN_COUNT) : 1;
        return editor.select(moveSelection(selection, dRow * far, dCol * far, n, COLUMN_COUNT, e.shiftKey));
      }
      case 'PageDown':
      case 'PageUp':
        handled();
        return editor.select(moveSelection(selection, key === 'PageDown' ? 20 : -20, 0, n, COLUMN_COUNT, e.shiftKey));
      case 'Home':
      case 'End': {
        handled();
        const target = key === 'Home' ? { row: mod ? 0 : selection.focus.row, col: 0 } : { row: mod ? n - 1 : selection.focus.row, col: COLUMN_COUNT - 1 };
        return editor.select(e.shiftKey ? { anchor: selection.anchor, focus: target } : cellSelection(target));
      }
      case 'Tab':
        handled();
        return editor.select(tabSelection(selection, e.shiftKey, n, COLUMN_COUNT));
      case 'Enter':
        handled();
        if (readOnly) return;
        if (mod && e.shiftKey) {
          const section = { id: crypto.randomUUID(), name: 'New area', lines: [newLine(settings)] };
          const next = insertSection(content, rows, selection.focus.row, section);
          const at = next.sections.slice(0, next.sections.indexOf(section)).reduce((k, s) => k + 1 + s.lines.length, 0);
          editor.change(next, cellSelection({ row: at, col: 1 }));
          return onDraftChange({ row: at, col: 1, text: 'New area' });
        }
        if (mod) return insertBelow();
        return startEdit(null);
      case 'Insert':
        handled();
        return readOnly ? undefined : insertBelow();
      case 'F2':
        handled();
        return startEdit(null);
      case 'Delete':
      case 'Backspace': {
        handled();
        if (readOnly) return;
        if (mod) return removeRows();
        const r = clearRange(content, rows, range);
        editor.change(r.content, undefined, r.problems);
        return report(r.problems);
      }
      case ' ':
        if (GRID_COLUMNS[selection.focus.col]!.id === 'optional' && rows[selection.focus.row]?.kind === 'line' && !readOnly) {
          handled();
          const line = (rows[selection.focus.row] as Extract<GridRow, { kind: 'line' }>).line;
          const r = applyCellEdits(content, rows, [{ row: selection.focus.row, col: selection.focus.col, text: line.optional ? '' : 'yes' }]);
          editor.change(r.content, undefined, r.problems);
          return report(r.problems);
        }
        break;
      default:
        break;
    }
    if (mod && key.toLowerCase() === 'd') {
      handled();
      if (readOnly) return;
      if (e.shiftKey) {
        const next = duplicateLines(content, rows, range.top, range.bottom);
        return editor.change(next, cellSelection({ row: range.bottom + 1 + (rows[range.bottom]?.kind === 'line' ? 0 : 0), col: selection.focus.col }));
      }
      const r = fillDown(content, rows, range, lineTotals);
      editor.change(r.content, undefined, r.problems);
      return report(r.problems, r.content === content ? 'Nothing to fill: select the row to copy and the rows below it.' : undefined);
    }
    if (mod && key === '-') return handled(), readOnly ? undefined : removeRows();
    if (!mod && !e.altKey && key.length === 1) {
      handled();
      startEdit(key);
    }
  };

  function insertBelow() {
    const line = newLine(settings);
    const next = insertLine(content, rows, selection.focus.row, line);
    const focus = rows[selection.focus.row] ? selection.focus.row + 1 : 1;
    editor.change(next, cellSelection({ row: focus, col: columnIndex('description') }));
  }

  function removeRows() {
    const r = deleteRows(content, rows, range.top, range.bottom);
    editor.change(r.content, cellSelection({ row: Math.max(0, range.top - (range.top >= rows.length - (range.bottom - range.top + 1) ? 1 : 0)), col: selection.focus.col }), r.problems);
    report(r.problems, `${range.bottom - range.top + 1} row${range.bottom > range.top ? 's' : ''} deleted. Ctrl+Z brings ${range.bottom > range.top ? 'them' : 'it'} back.`);
  }

  const onCopy = (e: ClipboardEvent<HTMLDivElement>, cut = false) => {
    if (draft || picker) return;
    e.preventDefault();
    const text = serialiseTsv(copyRange(rows, range, lineTotals));
    e.clipboardData.setData('text/plain', text);
    if (cut && !readOnly) {
      const r = clearRange(content, rows, range);
      editor.change(r.content, undefined, r.problems);
    }
    onNotice(`${range.bottom - range.top + 1} × ${range.right - range.left + 1} cells copied.`);
  };

  const onPaste = (e: ClipboardEvent<HTMLDivElement>) => {
    if (draft || picker) return;
    e.preventDefault();
    if (readOnly) return onNotice('This revision is frozen. Choose “Revise” to make a new draft.');
    const block = parseTsv(e.clipboardData.getData('text/plain'));
    if (block.length === 0) return;
    if (block.length > 10_000) return onNotice('That is more than 10,000 rows; paste it in parts.');
    const r = pasteBlock(content, rows, selection.focus, block, settings);
    const bottom = Math.min(selection.focus.row + block.length - 1 + (rows[selection.focus.row]?.kind === 'section' ? 1 : 0), Number.MAX_SAFE_INTEGER);
    const right = Math.min(selection.focus.col + Math.max(...block.map((b) => b.length)) - 1, COLUMN_COUNT - 1);
    editor.change(r.content, { anchor: selection.focus, focus: { row: bottom, col: right } }, r.problems);
    report(r.problems, `${block.length} row${block.length === 1 ? '' : 's'} pasted.`);
  };

  /**
   * One mouse-down handler for every cell of the grid (rather than one per cell): the row and
   * column come from the cell's aria-rowindex / aria-colindex. A section row has one cell
   * across the grid; clicking it keeps the column the row already had, or the description.
   */
  const onMouseDown = (e: MouseEvent<HTMLDivElement>) => {
    const cell = e.target instanceof Element ? e.target.closest('[role="gridcell"]') : null;
    const rowElement = cell?.closest('[role="row"]');
    if (!cell || !rowElement) return;
    const row = Number(rowElement.getAttribute('aria-rowindex')) - 2;
    const gridRow = rows[row];
    if (!gridRow) return;
    const col = gridRow.kind === 'section' ? (selection.focus.row === row ? selection.focus.col : 1) : Number(cell.getAttribute('aria-colindex')) - 1;
    if (draft) commitDraft(draft, null);
    select(e.shiftKey ? { anchor: selection.anchor, focus: { row, col } } : cellSelection({ row, col }));
    focusGrid();
  };

  const virtualItems = virtualizer.getVirtualItems();
  const active = rows[selection.focus.row];
  const activeLabel = active
    ? active.kind === 'section'
      ? `Section ${active.section.name}`
      : `${GRID_COLUMNS[selection.focus.col]!.label}, line “${active.line.description || 'untitled'}”`
    : '';

  return (
    <div className="relative flex min-h-0 min-w-0 flex-1 flex-col">
      <div
        ref={gridRef}
        role="grid"
        aria-label="Estimate lines"
        aria-rowcount={rows.length + 1}
        aria-colcount={COLUMN_COUNT}
        aria-readonly={readOnly || undefined}
        aria-describedby="grid-keys"
        tabIndex={0}
        onKeyDown={onKeyDown}
        onMouseDown={onMouseDown}
        onCopy={(e) => onCopy(e)}
        onCut={(e) => onCopy(e, true)}
        onPaste={onPaste}
        className="estimate-grid relative min-h-0 flex-1 overflow-auto rounded-card bg-surface font-sans text-caption shadow-card ring-1 ring-line outline-none focus-visible:ring-2 focus-visible:ring-focus"
      >
        <div style={{ width: GRID_WIDTH }} className="relative">
          <div role="row" aria-rowindex={1} className="sticky top-0 z-20 flex border-b border-line-strong/40 bg-dusk-900 text-micro font-semibold tracking-wide text-dusk-100 uppercase">
            <div className={`${STICKY} left-0 shrink-0`} style={{ width: GUTTER_WIDTH }} aria-hidden="true" />
            {table.getHeaderGroups()[0]!.headers.map((h, i) => (
              <div
                key={h.id}
                role="columnheader"
                aria-colindex={i + 1}
                style={{ width: h.getSize(), left: stickyLeft(i) ?? undefined }}
                className={`flex h-8 shrink-0 items-center border-r border-dusk-800 px-2 ${stickyLeft(i) !== null ? 'sticky z-[11]' : ''} ${isNumericColumn(GRID_COLUMNS[i]!) ? 'justify-end' : ''} ${range.left <= i && i <= range.right ? 'bg-dusk-800 text-lamp-200' : 'bg-inherit'}`}
              >
                {flexRender(h.column.columnDef.header, h.getContext())}
              </div>
            ))}
          </div>
          <div style={{ height: virtualizer.getTotalSize() }} className="relative">
            {virtualItems.map((vi) => {
              const row = tableRows[vi.index]!.original;
              const inRows = vi.index >= range.top && vi.index <= range.bottom;
              return (
                <GridRowView
                  key={row.key}
                  row={row}
                  index={vi.index}
                  top={vi.start}
                  selLeft={inRows ? range.left : -1}
                  selRight={inRows ? range.right : -1}
                  focusCol={selection.focus.row === vi.index ? selection.focus.col : -1}
                  lineTotal={row.kind === 'line' ? lineTotals.get(row.line.id) : undefined}
                  currency={settings.currency}
                  locale={settings.locale}
                  draft={draft && draft.row === vi.index ? draft : null}
                  onDraftChange={onDraftChange}
                  onCommit={commitDraft}
                  onCancel={cancelDraft}
                  rows={rows.length}
                />
              );
            })}
          </div>
        </div>
        {rows.length <= 1 && !readOnly ? (
          <p className="pointer-events-none absolute inset-x-0 top-24 text-center text-body text-ink-muted">
            No lines yet. Press <kbd className="rounded-sm bg-mist-100 px-1 font-mono text-micro ring-1 ring-mist-300">Ctrl</kbd> + <kbd className="rounded-sm bg-mist-100 px-1 font-mono text-micro ring-1 ring-mist-300">Enter</kbd> to add one, or paste rows from a spreadsheet.
          </p>
        ) : null}
      </div>
      <p className="sr-only" aria-live="polite">
        {activeLabel}
      </p>
      {picker ? (
        <ProductPicker
          initialSearch={picker.search}
          top={(virtualizer.getVirtualItems().find((v) => v.index === picker.row)?.start ?? 0) + ROW_HEIGHT * 2 - (gridRef.current?.scrollTop ?? 0)}
          onPick={pickProduct}
          currency={settings.currency}
          locale={settings.locale}
        />
      ) : null}
    </div>
  );
}

interface RowViewProps {
  row: GridRow;
  index: number;
  top: number;
  selLeft: number;
  selRight: number;
  focusCol: number;
  lineTotal: number | undefined;
  currency: string;
  locale: string;
  draft: CellDraft | null;
  rows: number;
  onDraftChange: (d: CellDraft | null) => void;
  onCommit: (d: CellDraft, next: Selection | null) => void;
  onCancel: () => void;
}

/**
 * Position and stacking of a line's cell. Only the focused cell (above its neighbours) and the
 * one holding the editor input are positioned: every positioned cell is a paint layer of its
 * own, and a screenful of rows has hundreds of cells.
 */
function cellLayer(frozen: boolean, focused: boolean, editing: boolean): string {
  if (focused && !frozen) return 'relative z-10';
  return focused || editing ? 'relative' : '';
}

function display(line: EstimateLine, id: ColumnId, lineTotal: number | undefined, currency: string, locale: string): string {
  switch (id) {
    case 'unitCost':
      return formatMoney(line.unitCostMinor, currency, locale);
    case 'unitPrice':
      return formatMoney(line.unitPriceMinor, currency, locale);
    case 'lineTotal':
      return lineTotal === undefined ? '' : formatMoney(lineTotal, currency, locale);
    case 'quantity':
      return formatQuantityMilli(line.quantityMilli);
    case 'vat':
      return formatBasisPoints(line.vatRateBp, locale);
    case 'pricing':
      return pricingText(line);
    case 'optional':
      return line.optional ? 'Optional' : '';
    default:
      return cellText(line, id, lineTotal);
  }
}

const GridRowView = memo(function GridRowView({
  row,
  index,
  top,
  selLeft,
  selRight,
  focusCol,
  lineTotal,
  currency,
  locale,
  draft,
  rows,
  onDraftChange,
  onCommit,
  onCancel,
}: RowViewProps) {
  const style = { transform: `translateY(${top}px)`, height: ROW_HEIGHT };
  const editorFor = (col: number) =>
    draft && draft.col === col ? (
      <CellInput
        draft={draft}
        numeric={isNumericColumn(GRID_COLUMNS[col]!)}
        onChange={(text) => onDraftChange({ ...draft, text })}
        onCommit={(move) => {
          const next =
            move === 'down'
              ? cellSelection({ row: Math.min(rows - 1, index + 1), col })
              : move === 'up'
                ? cellSelection({ row: Math.max(0, index - 1), col })
                : move === 'tab' || move === 'back'
                  ? tabSelection(cellSelection({ row: index, col }), move === 'back', rows, COLUMN_COUNT)
                  : null;
          onCommit(draft, next);
        }}
        onCancel={onCancel}
      />
    ) : null;

  if (row.kind === 'section') {
    const selected = selLeft >= 0;
    return (
      <div role="row" aria-rowindex={index + 2} style={style} className="absolute inset-x-0 top-0 flex border-b border-dusk-200 bg-dusk-50">
        <div className={`${STICKY} left-0 flex shrink-0 items-center justify-center text-dusk-400`} style={{ width: GUTTER_WIDTH }} aria-hidden="true">
          <svg viewBox="0 0 12 12" className="size-3">
            <path d="M2 4h8L6 9z" fill="currentColor" />
          </svg>
        </div>
        <div
          role="gridcell"
          aria-colindex={1}
          aria-colspan={COLUMN_COUNT}
          aria-selected={selected}
          className={`relative flex flex-1 items-center px-2 text-body font-semibold text-dusk-800 ${selected ? 'bg-dusk-100' : ''} ${focusCol >= 0 ? 'shadow-[inset_0_0_0_2px_var(--color-dusk-600)]' : ''}`}
        >
          {draft ? (
            editorFor(draft.col)
          ) : (
            // the area's name stays in view when the grid scrolls sideways
            <span className="sticky flex max-w-[26rem] min-w-0 items-center" style={{ left: GUTTER_WIDTH + 8 }} data-section-name>
              <span className="truncate">{row.section.name || 'Untitled area'}</span>
              <span className="ml-3 shrink-0 text-micro font-normal text-dusk-500">{row.section.lines.length} lines</span>
            </span>
          )}
        </div>
      </div>
    );
  }
  const derived = isDerivedLine(row.line);
  const excluded = (row.line.optional || row.line.alternativeGroup) && !row.line.selected;
  const cells = GRID_COLUMNS.map((c, col) => {
    const selected = col >= selLeft && col <= selRight;
    const focused = focusCol === col;
    const numeric = isNumericColumn(c);
    const editing = draft !== null && draft.col === col;
    const frozen = col < STICKY_COLUMN_COUNT;
    const badge = editing ? null : cellBadge(row.line, c.id, derived);
    // Plain text sits in the cell itself, truncated, on a line as tall as the row's content
    // (34 px less its 1 px bottom border); a badge keeps its own box, centred.
    const layout = badge || editing ? 'flex items-center' : `truncate leading-[33px] ${numeric ? 'text-right' : ''}`;
    return (
      <div
        key={c.id}
        role="gridcell"
        aria-colindex={col + 1}
        aria-selected={selected}
        aria-readonly={derived || isReadOnlyColumn(c) || undefined}
        data-col={c.id}
        style={{ width: c.width }}
        className={`shrink-0 border-r border-line/70 px-2 ${layout} ${cellLayer(frozen, focused, editing)} ${numeric ? 'justify-end font-mono tabular-nums' : ''} ${
          selected ? 'bg-lamp-50' : ''
        } ${focused ? 'shadow-[inset_0_0_0_2px_var(--color-dusk-600)]' : ''} ${c.id === 'lineTotal' ? 'font-semibold text-ink' : ''}`}
      >
        {editing ? editorFor(col) : (badge ?? display(row.line, c.id, lineTotal, currency, locale))}
      </div>
    );
  });
  return (
    <div
      role="row"
      aria-rowindex={index + 2}
      style={style}
      className={`absolute inset-x-0 top-0 flex border-b border-line ${derived ? 'bg-mist-50 text-ink-muted' : 'bg-surface'} ${excluded ? 'text-mist-500' : ''}`}
    >
      {/* The gutter, product and description stay in view when the grid scrolls sideways: one sticky box per row. */}
      <div className="sticky left-0 z-[11] flex shrink-0 bg-inherit">
        <div className="flex shrink-0 items-center justify-end pr-1.5 font-mono text-micro text-mist-400" style={{ width: GUTTER_WIDTH }} aria-hidden="true">
          {derived ? (
            <span title="Derived from a circuit: read-only" className="text-lamp-600">
              ⌁
            </span>
          ) : (
            index
          )}
        </div>
        {cells.slice(0, STICKY_COLUMN_COUNT)}
      </div>
      {cells.slice(STICKY_COLUMN_COUNT)}
    </div>
  );
});

/** The cells shown as a small badge rather than plain text; null for plain text. */
function cellBadge(line: EstimateLine, id: ColumnId, derived: boolean): ReactNode {
  if (id === 'product' && line.productId)
    return <span className="truncate rounded-sm bg-dusk-50 px-1 font-mono text-micro text-dusk-700 ring-1 ring-dusk-200">{cellText(line, 'product', undefined)}</span>;
  if (id === 'product' && derived) return <span className="truncate text-micro text-lamp-700">circuit</span>;
  if (id === 'optional' && line.optional) return <span className="rounded-pill bg-lamp-100 px-1.5 text-micro font-semibold text-lamp-800">optional</span>;
  if (id === 'alternativeGroup' && line.alternativeGroup)
    return (
      <span className={`truncate text-micro ${line.selected ? 'font-semibold text-leaf-700' : ''}`}>
        {line.selected ? '● ' : '○ '}
        {line.alternativeGroup}
      </span>
    );
  return null;
}

function CellInput({
  draft,
  numeric,
  onChange,
  onCommit,
  onCancel,
}: {
  draft: CellDraft;
  numeric: boolean;
  onChange: (text: string) => void;
  onCommit: (move: 'down' | 'up' | 'tab' | 'back' | null) => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLInputElement>(null);
  /** Set once Enter, Tab or Escape has settled the edit, so the blur that follows does nothing. */
  const settled = useRef(false);
  const finish = (move: 'down' | 'up' | 'tab' | 'back' | null) => {
    if (settled.current) return;
    settled.current = true;
    onCommit(move);
  };
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    el.focus();
    el.setSelectionRange(el.value.length, el.value.length);
  }, []);
  return (
    <input
      ref={ref}
      aria-label="Cell value"
      value={draft.text}
      spellCheck={!numeric}
      onChange={(e) => onChange(e.target.value)}
      onBlur={() => finish(null)}
      onKeyDown={(e) => {
        e.stopPropagation();
        if (e.key === 'Enter') {
          e.preventDefault();
          finish(e.shiftKey ? 'up' : 'down');
        } else if (e.key === 'Tab') {
          e.preventDefault();
          finish(e.shiftKey ? 'back' : 'tab');
        } else if (e.key === 'Escape') {
          e.preventDefault();
          settled.current = true;
          onCancel();
        }
      }}
      className={`absolute inset-0 z-20 w-full bg-white px-2 text-caption text-ink shadow-[inset_0_0_0_2px_var(--color-lamp-400)] outline-none ${numeric ? 'text-right font-mono' : ''}`}
    />
  );
}
