import { detect } from 'chardet';
import iconv from 'iconv-lite';
import Papa from 'papaparse';

/** A supplier's price list, decoded and split into a header row and data rows. */
export interface PriceListTable {
  encoding: string;
  delimiter: string;
  headers: string[];
  rows: string[][];
}

export class PriceListFileError extends Error {}

/**
 * Text from the file's bytes. A byte-order mark or bytes that are valid UTF-8 decide UTF-8;
 * otherwise chardet's statistical guess (typically ISO-8859-1 or windows-1252 for spreadsheets
 * saved on older desktops) is decoded with iconv-lite.
 */
export function decodePriceList(bytes: Buffer): { text: string; encoding: string } {
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf)
    return { text: bytes.subarray(3).toString('utf8'), encoding: 'UTF-8' };
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return { text: iconv.decode(bytes.subarray(2), 'utf16le'), encoding: 'UTF-16LE' };
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return { text: iconv.decode(bytes.subarray(2), 'utf16be'), encoding: 'UTF-16BE' };
  try {
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(bytes), encoding: 'UTF-8' };
  } catch {
    // not UTF-8: ask chardet below
  }
  const guess = detect(bytes);
  const encoding = guess && iconv.encodingExists(guess) ? guess : 'windows-1252';
  return { text: iconv.decode(bytes, encoding), encoding };
}

/** Column names: trimmed, blanks named by position, repeats numbered so each is unique. */
function uniqueHeaders(raw: string[]): string[] {
  const seen = new Map<string, number>();
  return raw.map((cell, index) => {
    const base = cell.trim() || `Column ${index + 1}`;
    const n = (seen.get(base) ?? 0) + 1;
    seen.set(base, n);
    return n === 1 ? base : `${base} (${n})`;
  });
}

/** Magic numbers of files people upload by mistake instead of a CSV. */
const NOT_CSV: { name: string; magic: number[] }[] = [
  { name: 'a spreadsheet workbook or another zip file (save it as CSV first)', magic: [0x50, 0x4b, 0x03, 0x04] },
  { name: 'an older Excel workbook (save it as CSV first)', magic: [0xd0, 0xcf, 0x11, 0xe0] },
  { name: 'a PDF', magic: [0x25, 0x50, 0x44, 0x46] },
  { name: 'a PNG image', magic: [0x89, 0x50, 0x4e, 0x47] },
  { name: 'a JPEG image', magic: [0xff, 0xd8, 0xff] },
  { name: 'a GIF image', magic: [0x47, 0x49, 0x46, 0x38] },
];
/** A control character no text price list holds (tab, line breaks and form feed are fine). */
function hasBinaryCharacter(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c <= 0x08 || (c >= 0x0e && c <= 0x1f) || c === 0x7f) return true;
  }
  return false;
}

/**
 * Refuse a file whose bytes are not text, whatever it is called: its magic number names what
 * it looks like, else control characters give it away.
 */
function mustBeText(bytes: Buffer, text: string): void {
  const known = NOT_CSV.find((k) => k.magic.every((b, i) => bytes[i] === b));
  if (known) throw new PriceListFileError(`This file is ${known.name}, not a CSV price list.`);
  if (hasBinaryCharacter(text.slice(0, 64 * 1024)))
    throw new PriceListFileError('This file is not a text CSV price list (it holds binary data). Save the list as CSV and upload that.');
}

/** Decode and parse; papaparse guesses the delimiter among comma, semicolon, tab and bar. */
export function readPriceList(bytes: Buffer, maxRows: number): PriceListTable {
  const { text, encoding } = decodePriceList(bytes);
  mustBeText(bytes, text);
  const parsed = Papa.parse<string[]>(text, {
    delimiter: '',
    delimitersToGuess: [',', ';', '\t', '|'],
    skipEmptyLines: 'greedy',
  });
  const [first, ...rows] = parsed.data;
  if (!first || first.every((cell) => cell.trim() === ''))
    throw new PriceListFileError('The file has no header row. The first line should name the columns.');
  if (rows.length === 0) throw new PriceListFileError('The file has a header row but no products under it.');
  if (rows.length > maxRows) throw new PriceListFileError(`The file has ${rows.length} rows; split it into files of at most ${maxRows}.`);
  const headers = uniqueHeaders(first);
  return { encoding, delimiter: parsed.meta.delimiter, headers, rows };
}

/** One data row as header -> cell text. */
export function rowValues(headers: readonly string[], row: readonly string[]): Record<string, string> {
  const values: Record<string, string> = {};
  headers.forEach((header, i) => {
    values[header] = row[i] ?? '';
  });
  return values;
}

/**
 * Rejected rows as CSV for a spreadsheet. Cells that a spreadsheet would run as a formula
 * (starting with = + - @, tab or carriage return) are prefixed with a single quote by
 * papaparse's `escapeFormulae`; a BOM tells spreadsheets the file is UTF-8.
 */
export function rejectionsCsv(headers: readonly string[], rejections: readonly { row: number; reason: string; values: Record<string, string> }[]): string {
  const data = rejections.map((r) => [String(r.row), r.reason, ...headers.map((h) => r.values[h] ?? '')]);
  return `\ufeff${Papa.unparse({ fields: ['Row', 'Reason', ...headers], data }, { escapeFormulae: true, newline: '\r\n' })}\r\n`;
}
