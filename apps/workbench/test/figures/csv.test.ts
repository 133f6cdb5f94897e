import { describe, expect, it } from 'vitest';
import { csvCell, toCsv } from '../../src/lib/csv';

describe('figures CSV', () => {
  it('quotes as RFC 4180 says: commas, quotes and line breaks in double quotes, quotes doubled, CRLF rows', () => {
    expect(
      toCsv(
        ['Reason', 'Quotes'],
        [
          ['Too dear, "for now"', 2],
          ['Line\nbreak', 1],
        ],
      ),
    ).toBe('Reason,Quotes\r\n"Too dear, ""for now""",2\r\n"Line\nbreak",1\r\n');
  });

  it('neutralises text a spreadsheet would run as a formula (OWASP CSV injection), never numbers', () => {
    expect(csvCell('=HYPERLINK("http://x.invalid")')).toBe(`"'=HYPERLINK(""http://x.invalid"")"`);
    expect(csvCell('+44 1632')).toBe("'+44 1632");
    expect(csvCell('-2')).toBe("'-2");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell('\tcmd')).toBe("'\tcmd");
    expect(csvCell(-2)).toBe('-2');
    expect(csvCell(null)).toBe('');
    expect(csvCell(Number.NaN)).toBe('');
  });
});
