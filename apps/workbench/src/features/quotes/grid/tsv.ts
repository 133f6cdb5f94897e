/**
 * Tab-separated text, as spreadsheets put it on the clipboard: cells split by tabs, rows by
 * newlines (\n or \r\n); a cell holding a tab, newline or double quote is wrapped in double
 * quotes with inner quotes doubled.
 */

const NEEDS_QUOTES = /[\t\n\r"]/;

export function serialiseTsv(rows: readonly (readonly string[])[]): string {
  return rows.map((cells) => cells.map((c) => (NEEDS_QUOTES.test(c) ? `"${c.replace(/"/g, '""')}"` : c)).join('\t')).join('\n');
}

/** Parse clipboard text into rows of cells. One trailing newline (spreadsheets add one) is dropped. */
export function parseTsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let i = 0;
  let quoted = false;
  let atCellStart = true;
  while (i < text.length) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          cell += '"';
          i += 2;
          continue;
        }
        quoted = false;
        i++;
        continue;
      }
      cell += ch;
      i++;
      continue;
    }
    if (ch === '"' && atCellStart) {
      quoted = true;
      atCellStart = false;
      i++;
      continue;
    }
    if (ch === '\t') {
      row.push(cell);
      cell = '';
      atCellStart = true;
      i++;
      continue;
    }
    if (ch === '\r' || ch === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      atCellStart = true;
      i += ch === '\r' && text[i + 1] === '\n' ? 2 : 1;
      continue;
    }
    cell += ch;
    atCellStart = false;
    i++;
  }
  if (!atCellStart || cell !== '' || row.length > 0) {
    row.push(cell);
    rows.push(row);
  }
  return rows;
}
