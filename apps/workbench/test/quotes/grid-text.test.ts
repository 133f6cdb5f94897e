import { describe, expect, it } from 'vitest';
import { evaluateArithmetic, evaluateScaled } from '../../src/features/quotes/grid/expression';
import { parseTsv, serialiseTsv } from '../../src/features/quotes/grid/tsv';

describe('tab-separated clipboard text', () => {
  it('round-trips cells holding tabs, newlines and double quotes', () => {
    const rows = [
      ['Uplighter "Birch"', '3', 'each'],
      ['Cable\t2-core', 'line one\nline two', ''],
      ['', 'say "hi"\r\nthere', '12.50'],
    ];
    const text = serialiseTsv(rows);
    expect(text.split('\n')[0]).toBe('"Uplighter ""Birch"""\t3\teach');
    expect(parseTsv(text)).toEqual(rows);
  });

  it('reads what spreadsheets put on the clipboard: CRLF rows, a trailing newline, empty cells', () => {
    expect(parseTsv('a\tb\r\n\tc\r\n')).toEqual([
      ['a', 'b'],
      ['', 'c'],
    ]);
    expect(parseTsv('one')).toEqual([['one']]);
    expect(parseTsv('')).toEqual([]);
    expect(parseTsv('a\t\n')).toEqual([['a', '']]);
  });

  it('keeps a quote that is not at the start of a cell as a character', () => {
    expect(parseTsv('12" spike\t2')).toEqual([['12" spike', '2']]);
  });
});

describe('arithmetic in numeric cells', () => {
  it('works out + - * / and brackets', () => {
    expect(evaluateArithmetic('3*12.5')).toEqual({ ok: true, value: 37.5 });
    expect(evaluateArithmetic('(2+3)*4')).toEqual({ ok: true, value: 20 });
    expect(evaluateArithmetic('-4 + 10 / 4')).toEqual({ ok: true, value: -1.5 });
  });

  it('scales exactly to the cell precision: pence, thousandths', () => {
    expect(evaluateScaled('3*12.5', 3)).toEqual({ ok: true, value: 37_500 });
    expect(evaluateScaled('0.1+0.2', 2)).toEqual({ ok: true, value: 30 }); // float noise removed
    expect(evaluateScaled('10/3', 2)).toEqual({ ok: true, value: 333 });
    expect(evaluateScaled('1.005', 3)).toEqual({ ok: true, value: 1005 });
    expect(evaluateScaled('2/3', 2)).toEqual({ ok: true, value: 67 });
  });

  it('refuses code and anything that is not a sum', () => {
    for (const text of ['alert(1)', 'process.exit()', 'constructor', '1;2', '"3"', '2**8', '1 2', '(1)(2)', 'x=1', '1e3', '0x10', '[1]', '1/0', '']) {
      const r = evaluateArithmetic(text);
      expect(r.ok, text).toBe(false);
    }
    expect(evaluateArithmetic('9'.repeat(400))).toMatchObject({ ok: false });
  });
});
