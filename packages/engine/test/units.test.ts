import { describe, expect, it } from 'vitest';
import { EngineInputError, feet, feetToMetres, lengthInMetres, metres, metresToFeet, ohmPerKftToOhmPerKm } from '../src/units';

describe('lengths', () => {
  it('uses the exact international foot', () => {
    // 1959 international yard and pound agreement: 1 ft = 0.3048 m exactly
    expect(feetToMetres(100)).toBeCloseTo(30.48, 12);
    expect(metresToFeet(30.48)).toBeCloseTo(100, 12);
    expect(lengthInMetres(feet(50))).toBeCloseTo(15.24, 12);
    expect(lengthInMetres(metres(12.5))).toBe(12.5);
  });

  it('converts US ohm/kft to ohm/km', () => {
    // NEC Chapter 9 Table 8, 14 AWG solid 3.07 ohm/kft = 3.07 / 0.3048 ohm/km
    expect(ohmPerKftToOhmPerKm(3.07)).toBeCloseTo(10.0722, 4);
  });

  it('rejects negative or unit-less lengths with a finding', () => {
    expect(() => lengthInMetres(metres(-1))).toThrow(EngineInputError);
    expect(() => lengthInMetres({ value: 3, unit: 'yd' as 'm' })).toThrow(/metres or feet/);
    expect(() => lengthInMetres(metres(Number.POSITIVE_INFINITY), 'cable:lead')).toThrow(EngineInputError);
  });
});
