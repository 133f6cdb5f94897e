/**
 * The grid's selection: an anchor cell and a focus cell; the range is the rectangle between
 * them. Rows and columns are indexes into the flat row list and the column list.
 */
export interface CellRef {
  row: number;
  col: number;
}

export interface Selection {
  anchor: CellRef;
  focus: CellRef;
}

export interface CellRange {
  top: number;
  bottom: number;
  left: number;
  right: number;
}

export function cellSelection(cell: CellRef): Selection {
  return { anchor: cell, focus: cell };
}

export function rangeOf(s: Selection): CellRange {
  return {
    top: Math.min(s.anchor.row, s.focus.row),
    bottom: Math.max(s.anchor.row, s.focus.row),
    left: Math.min(s.anchor.col, s.focus.col),
    right: Math.max(s.anchor.col, s.focus.col),
  };
}

export function inRange(r: CellRange, row: number, col: number): boolean {
  return row >= r.top && row <= r.bottom && col >= r.left && col <= r.right;
}

const clamp = (v: number, lo: number, hi: number) => Math.max(lo, Math.min(hi, v));

export function clampCell(cell: CellRef, rows: number, cols: number): CellRef {
  return { row: clamp(cell.row, 0, Math.max(0, rows - 1)), col: clamp(cell.col, 0, Math.max(0, cols - 1)) };
}

/** Move the focus by (dRow, dCol); `extend` keeps the anchor (Shift+arrow), otherwise both move. */
export function moveSelection(s: Selection, dRow: number, dCol: number, rows: number, cols: number, extend = false): Selection {
  const focus = clampCell({ row: s.focus.row + dRow, col: s.focus.col + dCol }, rows, cols);
  return extend ? { anchor: s.anchor, focus } : cellSelection(focus);
}

/**
 * Tab order: right along the row, then to the first column of the next row (Shift+Tab the
 * reverse). Stays put at the very first and very last cell.
 */
export function tabSelection(s: Selection, backwards: boolean, rows: number, cols: number): Selection {
  let { row, col } = s.focus;
  if (backwards) {
    if (col > 0) col--;
    else if (row > 0) {
      row--;
      col = cols - 1;
    }
  } else if (col < cols - 1) col++;
  else if (row < rows - 1) {
    row++;
    col = 0;
  }
  return cellSelection({ row, col });
}

/** Keep a selection valid after rows were added or removed. */
export function clampSelection(s: Selection, rows: number, cols: number): Selection {
  return { anchor: clampCell(s.anchor, rows, cols), focus: clampCell(s.focus, rows, cols) };
}
