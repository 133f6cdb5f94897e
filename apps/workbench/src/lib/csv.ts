/**
 * CSV for downloads (RFC 4180: comma separated, CRLF rows, fields with a comma, quote or line
 * break in double quotes, quotes doubled). Text that a spreadsheet would read as a formula
 * (starting with = + - @ or a tab / carriage return) gets a leading apostrophe, as OWASP's
 * CSV-injection advice says; numbers are written as numbers.
 */
export type CsvCell = string | number | null;

const FORMULA_START = /^[=+\-@\t\r]/;

export function csvCell(value: CsvCell): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const safe = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

/** Offer `text` as a file download (UTF-8 with a byte-order mark so spreadsheets read £ right). */
export function downloadText(fileName: string, text: string, type = 'text/csv;charset=utf-8'): void {
  const url = URL.createObjectURL(new Blob(['\uFEFF', text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
