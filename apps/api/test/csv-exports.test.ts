/**
 * The api's CSV export (a price list's rejected rows) neutralises every cell a spreadsheet
 * would run as a formula: text starting with = + - @, a tab or a carriage return gets a
 * leading single quote, as OWASP's "CSV Injection" page advises. (The workbench's figures CSV
 * has the same rule, tested in apps/workbench/test/figures/csv.test.ts.)
 */
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { rejectionsCsv } from '../src/modules/catalogue/price-list-file';

describe('rejected rows CSV', () => {
  it('prefixes every formula-looking cell with a quote and leaves plain text and the row numbers alone', () => {
    const hostile = ['=HYPERLINK("http://x.invalid","click")', '+44 1632 960000', '-2+3', '@SUM(A1:A9)', '\t=1', '\r=1'];
    const csv = rejectionsCsv(
      ['Code', 'Name'],
      hostile.map((value, i) => ({ row: i + 2, reason: `bad price ${value}`, values: { Code: value, Name: 'Deck light' } })),
    );
    expect(csv.startsWith('\ufeff')).toBe(true);
    const parsed = Papa.parse<string[]>(csv.slice(1), { skipEmptyLines: true }).data;
    expect(parsed[0]).toEqual(['Row', 'Reason', 'Code', 'Name']);
    hostile.forEach((value, i) => {
      const [row, reason, code, name] = parsed[i + 1]!;
      expect(row).toBe(String(i + 2));
      expect(code).toBe(`'${value}`);
      expect(reason).toBe(`bad price ${value}`); // starts with a letter: left as it is
      expect(name).toBe('Deck light');
    });
    // no cell of the file, as a spreadsheet reads it, starts a formula
    for (const cells of parsed) for (const cell of cells) expect(cell).not.toMatch(/^[=+\-@\t\r]/);
  });
});
