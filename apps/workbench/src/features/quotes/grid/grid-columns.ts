/**
 * The estimate grid's columns, in order. `kind` decides how a cell is shown, parsed and
 * edited; `readOnly` cells (line total) are computed. Widths are pixels.
 */
export const GRID_COLUMNS = [
  { id: 'product', label: 'Product', kind: 'product', width: 120 },
  { id: 'description', label: 'Description', kind: 'text', width: 300 },
  { id: 'quantity', label: 'Qty', kind: 'quantity', width: 80 },
  { id: 'unit', label: 'Unit', kind: 'text', width: 64 },
  { id: 'unitCost', label: 'Unit cost', kind: 'money', width: 96 },
  { id: 'pricing', label: 'Markup / margin', kind: 'pricing', width: 124 },
  { id: 'unitPrice', label: 'Unit price', kind: 'money', width: 96 },
  { id: 'lineTotal', label: 'Line total', kind: 'money', width: 108, readOnly: true },
  { id: 'vat', label: 'VAT', kind: 'percent', width: 64 },
  { id: 'optional', label: 'Optional', kind: 'flag', width: 76 },
  { id: 'alternativeGroup', label: 'Alt. group', kind: 'text', width: 104 },
  { id: 'note', label: 'Note', kind: 'text', width: 200 },
] as const satisfies readonly { id: string; label: string; kind: string; width: number; readOnly?: boolean }[];

export type GridColumn = (typeof GRID_COLUMNS)[number];
export type ColumnId = GridColumn['id'];
export type ColumnKind = GridColumn['kind'];

export const COLUMN_COUNT = GRID_COLUMNS.length;

/** Width of the line-number gutter left of the first column, pixels. */
export const GUTTER_WIDTH = 36;
/** The columns that stay in view when the grid scrolls sideways (with the gutter): what the line is. */
export const STICKY_COLUMN_COUNT = 2;

/** Pixels from the grid's left edge to each column's left edge (the gutter first). */
export const COLUMN_LEFT: readonly number[] = GRID_COLUMNS.reduce<number[]>((lefts, c, i) => [...lefts, lefts[i]! + c.width], [GUTTER_WIDTH]);

/** The left offset a sticky column keeps while scrolling sideways, or null for a column that scrolls. */
export const stickyLeft = (col: number): number | null => (col < STICKY_COLUMN_COUNT ? COLUMN_LEFT[col]! : null);

/** The width the sticky gutter and columns cover. */
export const STICKY_WIDTH = COLUMN_LEFT[STICKY_COLUMN_COUNT]!;

/**
 * Where to scroll sideways so a column is fully in view beside the sticky ones; null when
 * it already is (or is itself sticky).
 */
export function scrollLeftToShow(col: number, scrollLeft: number, viewWidth: number): number | null {
  if (col < STICKY_COLUMN_COUNT || col >= GRID_COLUMNS.length) return null;
  const left = COLUMN_LEFT[col]!;
  const right = COLUMN_LEFT[col + 1]!;
  if (left - STICKY_WIDTH < scrollLeft) return Math.max(0, left - STICKY_WIDTH);
  if (right > scrollLeft + viewWidth) return right - viewWidth;
  return null;
}
export const columnIndex = (id: ColumnId): number => GRID_COLUMNS.findIndex((c) => c.id === id);
export const isNumericColumn = (c: GridColumn) => c.kind === 'money' || c.kind === 'quantity' || c.kind === 'percent' || c.kind === 'pricing';
export const isReadOnlyColumn = (c: GridColumn): boolean => 'readOnly' in c && c.readOnly === true;
