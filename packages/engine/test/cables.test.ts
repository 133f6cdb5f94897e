import { describe, expect, it } from 'vitest';
import {
  awgAreaMm2,
  awgDiameterMm,
  awgGaugeForAreaMm2,
  conductorResistanceOhmPerM,
  describeCable,
  formatAwg,
  loopResistanceOhm,
  nearestAwgGauge,
  nearestMetricSizeMm2,
  type CableSpec,
} from '../src/cables';
import { EngineInputError } from '../src/units';

const metric = (areaMm2: number, conductorClass: 1 | 2 | 5, coating: 'plain' | 'tinned'): CableSpec => ({
  kind: 'metric',
  areaMm2,
  conductorClass,
  coating,
});

// IEC 60228 Tables 1-3, copper, maximum resistance at 20 °C, ohm/km (copied from REFERENCES).
const IEC_60228: [number, number, number, number, number][] = [
  // mm², class 1/2 plain, class 1/2 tinned, class 5 plain, class 5 tinned
  [0.5, 36.0, 36.7, 39.0, 40.1],
  [0.75, 24.5, 24.8, 26.0, 26.7],
  [1.0, 18.1, 18.2, 19.5, 20.0],
  [1.5, 12.1, 12.2, 13.3, 13.7],
  [2.5, 7.41, 7.56, 7.98, 8.21],
  [4, 4.61, 4.7, 4.95, 5.09],
  [6, 3.08, 3.11, 3.3, 3.39],
  [10, 1.83, 1.84, 1.91, 1.95],
];

describe('metric conductor resistance', () => {
  it.each(IEC_60228)('%s mm² at 20 °C matches IEC 60228 Tables 1-3', (mm2, c12p, c12t, c5p, c5t) => {
    // IEC 60228 Table 1 (class 1) and Table 2 (class 2), plain and tinned
    expect(conductorResistanceOhmPerM(metric(mm2, 1, 'plain'), 20) * 1000).toBeCloseTo(c12p, 10);
    expect(conductorResistanceOhmPerM(metric(mm2, 2, 'plain'), 20) * 1000).toBeCloseTo(c12p, 10);
    expect(conductorResistanceOhmPerM(metric(mm2, 2, 'tinned'), 20) * 1000).toBeCloseTo(c12t, 10);
    // IEC 60228 Table 3, class 5 plain and tinned
    expect(conductorResistanceOhmPerM(metric(mm2, 5, 'plain'), 20) * 1000).toBeCloseTo(c5p, 10);
    expect(conductorResistanceOhmPerM(metric(mm2, 5, 'tinned'), 20) * 1000).toBeCloseTo(c5t, 10);
  });

  it('defaults to 20 °C', () => {
    // IEC 60228 Table 3, class 5 plain, 1.5 mm²: 13.3 ohm/km
    expect(conductorResistanceOhmPerM(metric(1.5, 5, 'plain'))).toBeCloseTo(0.0133, 12);
  });

  it('corrects to 70 °C with alpha 0.00393 (factor 1.1965)', () => {
    // REFERENCES [derived]: 1 + 0.00393 · 50 = 1.1965; IEC 60228 Table 3, 2.5 mm² class 5 plain 7.98 ohm/km
    expect(conductorResistanceOhmPerM(metric(2.5, 5, 'plain'), 70) * 1000).toBeCloseTo(7.98 * 1.1965, 10);
  });

  it('agrees with IEC 60228 Annex B kt = 254.5 / (234.5 + t) within 0.1 %', () => {
    // IEC 60228 Annex B: R20 = Rt · kt. Going the other way, Rt = R20 / kt.
    for (const t of [0, 40, 70, 90]) {
      const kt = 254.5 / (234.5 + t);
      const r = conductorResistanceOhmPerM(metric(1, 2, 'plain'), t) * 1000;
      expect(Math.abs(r - 18.1 / kt) / (18.1 / kt)).toBeLessThan(0.001);
    }
  });

  it('is the resistivity formula within the table maxima for class 1/2 plain', () => {
    // IEC 60287-1-1 Table 1: rho20 = 1.7241e-8 ohm·m; table maxima sit up to about 8 % above rho/A (rounded cross-sections).
    for (const [mm2, c12p] of IEC_60228) {
      const rhoOverA = (1.7241e-8 / (mm2 * 1e-6)) * 1000;
      expect(c12p).toBeGreaterThanOrEqual(rhoOverA * 0.99);
      expect(c12p).toBeLessThan(rhoOverA * 1.1);
    }
  });

  it("uses the supplier's stated figure instead of the table", () => {
    const spec: CableSpec = { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain', stated: { ohmPerKm: 12.7 } };
    expect(conductorResistanceOhmPerM(spec, 20)).toBeCloseTo(0.0127, 12);
    // stated at 70 °C, brought back to 20 °C with alpha 0.00393 (IEC 60287-1-1)
    const hot: CableSpec = { ...spec, stated: { ohmPerKm: 12.7 * 1.1965, atC: 70 } };
    expect(conductorResistanceOhmPerM(hot, 20)).toBeCloseTo(0.0127, 12);
    // an off-table size works when the supplier states a figure
    const odd: CableSpec = { kind: 'metric', areaMm2: 0.22, conductorClass: 5, coating: 'tinned', stated: { ohmPerKm: 92 } };
    expect(conductorResistanceOhmPerM(odd, 20)).toBeCloseTo(0.092, 12);
  });
});

// NFPA 70 (NEC) Chapter 9 Table 8, DC resistance at 75 °C, ohm/kft, uncoated copper.
const NEC_TABLE_8: [number, number, number][] = [
  [18, 7.77, 7.95],
  [16, 4.89, 4.99],
  [14, 3.07, 3.14],
  [12, 1.93, 1.98],
  [10, 1.21, 1.24],
  [8, 0.764, 0.778],
];
// Floyd, Electric Circuit Fundamentals, wire-gauge table: solid copper at 20 °C, ohm/kft.
const FLOYD_SOLID_20C: Record<number, number> = { 18: 6.385, 16: 4.016, 14: 2.525, 12: 1.588, 10: 0.9989, 8: 0.6282 };

const KFT_M = 304.8;

describe('AWG conductor resistance', () => {
  it.each(NEC_TABLE_8)('%s AWG at 75 °C equals NEC Chapter 9 Table 8', (gauge, solid, stranded) => {
    // NEC Chapter 9 Table 8, uncoated copper, 75 °C
    expect(conductorResistanceOhmPerM({ kind: 'awg', gauge, stranding: 'solid' }, 75) * KFT_M).toBeCloseTo(solid, 10);
    expect(conductorResistanceOhmPerM({ kind: 'awg', gauge, stranding: 'stranded' }, 75) * KFT_M).toBeCloseTo(stranded, 10);
  });

  it.each(NEC_TABLE_8)('%s AWG solid corrected to 20 °C is within 0.5 %% of the Floyd table', (gauge) => {
    // NEC Table 8 note R2 = R1 [1 + 0.00323 (T2 − 75)], checked against Floyd, Electric Circuit Fundamentals
    const r = conductorResistanceOhmPerM({ kind: 'awg', gauge, stranding: 'solid' }, 20) * KFT_M;
    const floyd = FLOYD_SOLID_20C[gauge]!;
    // Table 8 gives three significant figures: 1.21 carries ±0.41 % of rounding on its own
    expect(Math.abs(r - floyd) / floyd).toBeLessThan(0.005);
  });

  it.each(NEC_TABLE_8)('%s AWG solid: the diameter formula with rho 1/58 reproduces both tables', (gauge, solid) => {
    // REFERENCES [derived]: d = 0.127 mm · 92^((36 − n)/39), R = rho L / A, rho20 = 1/58 ohm·mm²/m
    const r20PerKft = ((1 / 58) / awgAreaMm2(gauge)) * KFT_M;
    expect(Math.abs(r20PerKft - FLOYD_SOLID_20C[gauge]!) / FLOYD_SOLID_20C[gauge]!).toBeLessThan(0.002);
    const r75 = r20PerKft * (1 + 0.00393 * 55); // IEC 60287-1-1 alpha20
    expect(Math.abs(r75 - solid) / solid).toBeLessThan(0.005);
  });

  it('stranded is higher than solid for every listed gauge', () => {
    // NEC Chapter 9 Table 8: stranded column is above solid (lay of the strands)
    for (const [gauge] of NEC_TABLE_8) {
      expect(conductorResistanceOhmPerM({ kind: 'awg', gauge, stranding: 'stranded' }, 20)).toBeGreaterThan(
        conductorResistanceOhmPerM({ kind: 'awg', gauge, stranding: 'solid' }, 20),
      );
    }
  });
});

describe('AWG geometry and metric equivalents', () => {
  it('uses the defining diameter formula', () => {
    // d = 0.127 mm · 92^((36 − n)/39): 36 AWG is 0.127 mm, 0000 (written −3) is 0.46 in = 11.684 mm
    expect(awgDiameterMm(36)).toBeCloseTo(0.127, 12);
    expect(awgDiameterMm(-3)).toBeCloseTo(11.684, 2);
    expect(awgGaugeForAreaMm2(awgAreaMm2(14))).toBeCloseTo(14, 10);
  });

  it.each([
    [0.75, 18],
    [1.5, 16],
    [2.5, 14],
    [4, 12],
    [6, 10],
    [10, 8],
  ])('%s mm² pairs with %s AWG (ISO/IEC 61918 Annex F)', (mm2, awg) => {
    // ISO/IEC 61918 Annex F nearest-size table
    expect(nearestAwgGauge(mm2)).toBe(awg);
    expect(nearestMetricSizeMm2(awg)).toBe(mm2);
  });

  it('formats aught sizes', () => {
    expect(formatAwg(0)).toBe('1/0');
    expect(formatAwg(-3)).toBe('4/0');
    expect(formatAwg(12)).toBe('12');
  });
});

describe('loop resistance and bad input', () => {
  it('is twice the length times the conductor resistance', () => {
    // IEC 60228 Table 3, 1.5 mm² class 5 plain: 13.3 ohm/km; 25 m two-core run = 50 m of conductor
    expect(loopResistanceOhm(metric(1.5, 5, 'plain'), 25, 20)).toBeCloseTo(0.665, 12);
    // at 70 °C (BS 7671 working temperature for thermoplastic), factor 1.1965 [derived]
    expect(loopResistanceOhm(metric(1.5, 5, 'plain'), 25, 70)).toBeCloseTo(0.665 * 1.1965, 12);
  });

  it('throws a clear EngineInputError for sizes not in the table and bad specs', () => {
    expect(() => conductorResistanceOhmPerM(metric(3, 2, 'plain'))).toThrow(EngineInputError);
    expect(() => conductorResistanceOhmPerM(metric(3, 2, 'plain'))).toThrow(/not in the IEC 60228 table/);
    expect(() => conductorResistanceOhmPerM({ kind: 'awg', gauge: 22, stranding: 'solid' })).toThrow(/NEC Table 8/);
    expect(() => conductorResistanceOhmPerM({ kind: 'awg', gauge: 14.5, stranding: 'solid' })).toThrow(EngineInputError);
    expect(() => conductorResistanceOhmPerM(metric(-1, 2, 'plain'))).toThrow(EngineInputError);
    expect(() => conductorResistanceOhmPerM(metric(1.5, 2, 'plain'), Number.NaN)).toThrow(/temperature/);
    expect(() => loopResistanceOhm(metric(1.5, 2, 'plain'), -3)).toThrow(EngineInputError);
    try {
      conductorResistanceOhmPerM(metric(3, 2, 'plain'));
    } catch (e) {
      expect((e as EngineInputError).finding.code).toBe('cable-size-not-in-table');
      expect((e as EngineInputError).finding.severity).toBe('error');
    }
  });

  it('describes cables for messages', () => {
    expect(describeCable(metric(1.5, 5, 'plain'))).toBe('1.5 mm² class 5 plain');
    expect(describeCable({ kind: 'awg', gauge: 12, stranding: 'stranded' })).toBe('12 AWG stranded');
  });
});
