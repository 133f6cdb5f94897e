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
export const columnIndex = (id: ColumnId): number => GRID_COLUMNS.findIndex((c) => c.id === id);
export const isNumericColumn = (c: GridColumn) => c.kind === 'money' || c.kind === 'quantity' || c.kind === 'percent' || c.kind === 'pricing';
export const isReadOnlyColumn = (c: GridColumn): boolean => 'readOnly' in c && c.readOnly === true;
