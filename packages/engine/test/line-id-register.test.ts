/**
 * The quote totals' repeated-id check (LineIdRegister) against a plain JavaScript Set: for
 * any list of ids it names the same first repeat, including ids built to collide in the
 * register's hash (same length, same tail), where it must switch to its Map and stay exact.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeQuoteTotals, type QuoteLineInput } from '../src/money';
import { LineIdRegister } from '../src/money/line-id-register';

/** The first index whose id was seen before, and that earlier index, by a Set/Map. */
function firstRepeatBySet(ids: readonly string[]): { at: number; earlier: number } | null {
  const seen = new Map<string, number>();
  for (let i = 0; i < ids.length; i++) {
    const e = seen.get(ids[i]!);
    if (e !== undefined) return { at: i, earlier: e };
    seen.set(ids[i]!, i);
  }
  return null;
}

function firstRepeatByRegister(ids: readonly string[]): { at: number; earlier: number } | null {
  const lines = ids.map((id) => ({ id }));
  const reg = new LineIdRegister(lines, lines.length);
  for (let i = 0; i < lines.length; i++) {
    const earlier = reg.add(lines[i]!.id, i);
    if (earlier !== -1) return { at: i, earlier };
  }
  return null;
}

describe('LineIdRegister', () => {
  it('finds the same first repeated id as a Set, for any ids', () => {
    // a small alphabet and short ids make repeats common
    const id = fc.string({ unit: fc.constantFrom('a', 'b', '-', '1', 'é', '🙂'), minLength: 1, maxLength: 14 });
    fc.assert(
      fc.property(fc.array(id, { maxLength: 300 }), (ids) => {
        expect(firstRepeatByRegister(ids)).toEqual(firstRepeatBySet(ids));
      }),
      { numRuns: 400 },
    );
  });

  it('stays exact when every id has the same length and tail (the Map takes over)', () => {
    // 5,000 ids that differ only before their last 12 characters all land in one chain
    const tail = '-same-tail-0';
    const ids = Array.from({ length: 5000 }, (_, i) => `${String(i).padStart(5, '0')}${tail}`);
    expect(firstRepeatByRegister(ids)).toBeNull();
    // one id from before the switch (the first ~200 go in the table) and one from after it
    expect(firstRepeatByRegister([...ids, ids[50]!])).toEqual({ at: 5000, earlier: 50 });
    expect(firstRepeatByRegister([...ids, ids[1234]!])).toEqual({ at: 5000, earlier: 1234 });
  });

  it('is reused safely from one call to the next (a smaller quote after a larger one)', () => {
    const line = (id: string): QuoteLineInput => ({ id, quantityMilli: 1000, unitPriceMinor: 100, vatRateBp: 2000 });
    const big = Array.from({ length: 3000 }, (_, i) => line(`L${i}`));
    expect(computeQuoteTotals({ lines: big, vatRounding: 'line-nearest-1p' }).lines).toHaveLength(3000);
    // the table still holds the big quote's entries beyond the small one's size; none may leak in
    expect(computeQuoteTotals({ lines: [line('L1'), line('L2')], vatRounding: 'line-nearest-1p' }).lines).toHaveLength(2);
    expect(() => computeQuoteTotals({ lines: [line('L7'), line('L7')], vatRounding: 'line-nearest-1p' })).toThrow(
      /Line id "L7" is used twice \(lines 1 and 2\)/,
    );
  });
});
