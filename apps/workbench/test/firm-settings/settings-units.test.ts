/**
 * Per cent, pounds and metres typed by the owner become the contract's basis points, minor
 * units and millimetres exactly (1 % = 100 bp, £1 = 100 p, 1 m = 1000 mm by definition).
 */
import { describe, expect, it } from 'vitest';
import { fromDisplay, ratesFromDisplay, ratesToDisplay, toDisplay } from '../../src/features/firm-settings/settings-units';

describe('settings units', () => {
  it('reads decimals exactly', () => {
    expect(fromDisplay('12.5', 100)).toBe(1250);
    expect(fromDisplay('0.1', 1000)).toBe(100); // 0.1 m = 100 mm; 0.1 * 1000 in floating point is 100.00000000000001
    expect(fromDisplay('35', 100)).toBe(3500);
    expect(fromDisplay('1,250.00', 100)).toBe(125_000);
    expect(fromDisplay('.5', 100)).toBe(50);
  });

  it('leaves too many decimals as a fraction and non-numbers as NaN for the schema to report', () => {
    expect(fromDisplay('12.345', 100)).toBeCloseTo(1234.5, 9);
    expect(Number.isInteger(fromDisplay('12.345', 100))).toBe(false);
    expect(fromDisplay('abc', 100)).toBeNaN();
    expect(fromDisplay('', 100)).toBeNaN();
    expect(fromDisplay('-', 100)).toBeNaN();
    expect(fromDisplay('-2', 100)).toBe(-200);
  });

  it('writes contract units back as short text', () => {
    expect(toDisplay(1250, 100)).toBe('12.5');
    expect(toDisplay(2000, 100)).toBe('20');
    expect(toDisplay(1000, 1000)).toBe('1');
    expect(toDisplay(2500, 1000)).toBe('2.5');
    expect(toDisplay(5, 100)).toBe('0.05');
    expect(toDisplay(undefined, 100)).toBe('');
  });

  it('reads a list of VAT rates', () => {
    // UK VAT standard 20 %, reduced 5 %, zero 0 % (gov.uk, in REFERENCES)
    expect(ratesFromDisplay('20, 5, 0')).toEqual([2000, 500, 0]);
    expect(ratesFromDisplay('20% 5% 0%')).toEqual([2000, 500, 0]);
    expect(ratesFromDisplay('13.5; 9')).toEqual([1350, 900]);
    expect(ratesFromDisplay('20, x')[1]).toBeNaN();
    expect(ratesToDisplay([2000, 500, 0])).toBe('20, 5, 0');
  });
});
