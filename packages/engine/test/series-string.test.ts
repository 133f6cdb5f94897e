import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { CableSpec } from '../src/cables';
import { checkSeriesString, type LedDriver, type SeriesFitting, type SeriesStringInput } from '../src/series';
import { metres } from '../src/units';

// IEC 60228 Table 3: 1.5 mm² class 5 plain, 13.3 ohm/km at 20 °C
const FLEX_15: CableSpec = { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' };
// at 70 °C (UK profile working temperature, BS 7671 Appendix 4): factor 1 + 0.00393 · 50 = 1.1965 [derived]
const FLEX_15_70C_OHM_PER_M = 0.0133 * 1.1965;

/** An invented 3 W-class path light: Vf 3.1 V at 700 mA (white power LED 3.0-3.3 V, from memory). */
function pathLight(extra: Partial<SeriesFitting> = {}): SeriesFitting {
  return { id: 'Lanternfly 3', ratings: [{ currentA: 0.7, forwardVoltageV: 3.1, lumens: 210 }], ipCode: 'IP65', location: 'exposed-outdoor', ...extra };
}

const DRIVER_700: LedDriver = {
  id: 'Moth CC 700/30',
  output: 'constant-current',
  currentA: 0.7,
  voltageWindowV: { minV: 9, maxV: 42 },
  maxPowerW: 30,
  efficiency: 0.88,
  // dual-coded: IP67 alone would not meet the IP65 a driver outdoors needs (IEC 60529 clause 6)
  ipCode: 'IP66/IP67',
  costMinor: 2400,
};

function input(n: number, extra: Partial<SeriesStringInput> = {}): SeriesStringInput {
  return {
    driver: DRIVER_700,
    driverLocation: 'driver-outdoors',
    fittings: Array.from({ length: n }, () => pathLight()),
    runs: [{ id: 'lead', role: 'driver-lead', length: metres(10), cable: FLEX_15 }],
    profile: 'uk-iec',
    ...extra,
  };
}

const codes = (r: { findings: { code: string }[] }): string[] => r.findings.map((f) => f.code);

describe('checkSeriesString: the worked example', () => {
  const r = checkSeriesString(input(8));
  const loop = 2 * 10 * FLEX_15_70C_OHM_PER_M; // two-core loop, REFERENCES [derived]
  const vc = 8 * 3.1 + 0.7 * loop; // string Vf is the sum of forward voltages (definition) plus I·R
  it('adds forward voltages and the cable drop', () => {
    expect(r.stringForwardVoltageV).toBeCloseTo(24.8, 12);
    expect(r.cableLoopResistanceOhm).toBeCloseTo(loop, 12);
    expect(r.cableDropV).toBeCloseTo(0.7 * loop, 12);
    expect(r.complianceVoltageV).toBeCloseTo(vc, 12);
  });
  it('derives power, loss, input power and headroom', () => {
    // P = Vf · I (definition); input = output / efficiency
    expect(r.fittingsPowerW).toBeCloseTo(24.8 * 0.7, 12);
    expect(r.cableLossW).toBeCloseTo(0.7 * 0.7 * loop, 12);
    expect(r.outputPowerW).toBeCloseTo(vc * 0.7, 12);
    expect(r.inputPowerW).toBeCloseTo((vc * 0.7) / 0.88, 12);
    const loading = Math.max(vc / 42, (vc * 0.7) / 30);
    expect(r.loadingPct).toBeCloseTo(loading * 100, 10);
    expect(r.headroomPct).toBeCloseTo((1 - loading) * 100, 10);
    expect(r.lumens).toBe(8 * 210);
  });
  it('counts how many of these fittings the driver can take', () => {
    // upper voltage min(42 V, 30 W / 0.7 A) = 42 V; within the 10 % margin, 37.8 V (common practice 10-20 %)
    expect(r.maxFittings).toBe(Math.floor((42 - 0.7 * loop) / 3.1));
    expect(r.maxFittingsWithinMargin).toBe(Math.floor((37.8 - 0.7 * loop) / 3.1));
    expect(r.maxFittingsBasis).toBe('uniform');
  });
  it('is clean', () => {
    expect(codes(r)).toEqual([]);
    expect(r.ok).toBe(true);
  });
});

describe('checkSeriesString: findings', () => {
  it('flags a fitting rated below the driver current (destroyed) and above it (dim)', () => {
    // common practice: a CC fitting on a driver of higher current than its rating is destroyed
    const low = checkSeriesString(input(4, { fittings: [pathLight(), pathLight({ ratings: [{ currentA: 0.35, forwardVoltageV: 2.9 }] })] }));
    expect(codes(low)).toContain('current-above-rating');
    expect(low.findings.find((f) => f.code === 'current-above-rating')!.subject).toBe('fitting:2');
    expect(low.ok).toBe(false);
    const high = checkSeriesString(input(4, { fittings: [pathLight({ ratings: [{ currentA: 1.05, forwardVoltageV: 3.3 }] })] }));
    expect(codes(high)).toContain('current-below-rating');
    expect(high.findings.find((f) => f.code === 'current-below-rating')!.severity).toBe('warning');
  });

  it('uses the rating at the driver current, power given as P / I', () => {
    // REFERENCES [derived]: a fitting rated P watts at I amps drops P / I volts (1 W at 350 mA ≈ 2.9 V)
    const multi = pathLight({ ratings: [{ currentA: 0.35, powerW: 1 }, { currentA: 0.7, forwardVoltageV: 3.1 }] });
    const at350 = checkSeriesString({ ...input(1, { fittings: [multi], runs: [] }), driver: { ...DRIVER_700, id: 'd350', currentA: 0.35 } });
    expect(at350.stringForwardVoltageV).toBeCloseTo(1 / 0.35, 12);
    expect(at350.stringForwardVoltageV).toBeCloseTo(2.9, 1);
    expect(codes(at350)).not.toContain('current-above-rating');
    const between = checkSeriesString({ ...input(1, { fittings: [multi], runs: [] }), driver: { ...DRIVER_700, id: 'd525', currentA: 0.525 } });
    expect(codes(between)).toContain('current-between-ratings');
    expect(between.stringForwardVoltageV).toBeCloseTo((1 / 0.35 + 3.1) / 2, 12);
  });

  it('refuses constant-current fittings on a constant-voltage supply', () => {
    // common practice: a constant-current fitting on a constant-voltage supply is destroyed
    const r = checkSeriesString({ ...input(3), driver: { ...DRIVER_700, output: 'constant-voltage' } });
    expect(codes(r)).toContain('cc-fitting-on-cv-supply');
    expect(r.ok).toBe(false);
    const cvFitting = checkSeriesString(input(2, { fittings: [pathLight({ drive: 'constant-voltage' })] }));
    expect(codes(cvFitting)).toContain('cv-fitting-on-cc-driver');
  });

  it('flags voltage below and above the window', () => {
    // 2 fittings: 6.2 V + drop < 9 V minimum; 14 fittings: 43.4 V > 42 V maximum
    expect(codes(checkSeriesString(input(2)))).toContain('voltage-below-window');
    expect(codes(checkSeriesString(input(14)))).toContain('voltage-above-window');
  });

  it('checks a power-window-only driver against its power window', () => {
    // REFERENCES [derived]: a driver rated Pmin-Pmax at I has voltage window Pmin/I - Pmax/I
    const byPower: LedDriver = { id: 'Moth P', output: 'constant-current', currentA: 0.7, powerWindowW: { minW: 10, maxW: 20 }, ipCode: 'IP66' };
    const few = checkSeriesString({ ...input(3, { runs: [] }), driver: byPower }); // 9.3 V · 0.7 A = 6.51 W
    expect(codes(few)).toContain('power-below-window');
    const many = checkSeriesString({ ...input(10, { runs: [] }), driver: byPower }); // 31 V · 0.7 = 21.7 W
    expect(codes(many)).toContain('power-above-window');
    const fits = checkSeriesString({ ...input(6, { runs: [] }), driver: byPower }); // 18.6 V · 0.7 = 13.02 W
    expect(codes(fits).filter((c) => c.startsWith('power'))).toEqual([]);
    expect(fits.maxFittings).toBe(Math.floor(20 / 0.7 / 3.1));
    expect(fits.powerWindowPositionPct).toBeCloseTo(((13.02 - 10) / 10) * 100, 10);
  });

  it("warns when headroom is under the firm's margin (default 10 %)", () => {
    // common practice: leave 10-20 % headroom; 13 fittings: 40.3 V + 0.22 V of 42 V = 96.5 % loading
    expect(codes(checkSeriesString(input(12)))).not.toContain('headroom-below-margin'); // 89.1 %
    const r = checkSeriesString(input(13));
    expect(codes(r)).toContain('headroom-below-margin');
    const relaxed = checkSeriesString(input(13, { firm: { headroomMarginPct: 3 } }));
    expect(codes(relaxed)).not.toContain('headroom-below-margin');
  });

  it("flags a compliance voltage above the profile's ELV limits", () => {
    // IEC 60598-1 8.2.3: outdoor exposed SELV parts 30 V DC; 12 fittings need about 37.4 V
    expect(codes(checkSeriesString(input(12)))).toContain('above-exposed-selv-outdoor-limit');
    expect(codes(checkSeriesString(input(9)))).not.toContain('above-exposed-selv-outdoor-limit'); // 27.9 V + drop
    // NEC 411: 60 V DC (from memory); 20 fittings at 3.1 V = 62 V
    const big: LedDriver = { ...DRIVER_700, voltageWindowV: { minV: 20, maxV: 100 }, maxPowerW: 100 };
    const us = checkSeriesString({ ...input(20), driver: big, profile: 'us-nec' });
    expect(codes(us)).toContain('above-nec-411-limit');
    expect(us.findings.find((f) => f.code === 'above-nec-411-limit')!.severity).toBe('error');
  });

  it('flags IP codes short of the location for fittings and the driver', () => {
    // common practice: exposed outdoor IP65; driver outdoors IP65
    const r = checkSeriesString({
      ...input(8, { fittings: [...Array.from({ length: 7 }, () => pathLight()), pathLight({ ipCode: 'IP44' })] }),
      driver: { ...DRIVER_700, ipCode: 'IP20' },
    });
    const short = r.findings.filter((f) => f.code.endsWith('ip-short-of-location')).map((f) => [f.code, f.subject]);
    expect(short).toEqual([
      ['fitting-ip-short-of-location', 'fitting:8'],
      ['driver-ip-short-of-location', 'driver'],
    ]);
    const firm = checkSeriesString(input(8, { firm: { ipOverrides: { 'exposed-outdoor': 'IP68' } } }));
    // every fitting that falls short is named on its own, even when they share one code
    expect(firm.findings.filter((f) => f.code === 'fitting-ip-short-of-location').map((f) => f.subject)).toEqual(
      Array.from({ length: 8 }, (_, k) => `fitting:${k + 1}`),
    );
  });

  it('turns bad input into findings, never a crash', () => {
    const r = checkSeriesString({
      ...input(2),
      fittings: [{ ratings: [] }, pathLight({ tail: { length: metres(-2), cable: FLEX_15 } })],
      runs: [{ role: 'link', length: metres(3), cable: { kind: 'metric', areaMm2: 3, conductorClass: 2, coating: 'plain' } }],
      driver: { id: 'x', output: 'constant-current', currentA: 0.7 },
    });
    expect(codes(r)).toEqual(
      expect.arrayContaining(['fitting-rating-missing', 'length-invalid', 'cable-size-not-in-table', 'driver-window-missing']),
    );
    expect(r.ok).toBe(false);
    expect(() => JSON.stringify(r)).not.toThrow();
  });

  it('counts fitting tails in the loop', () => {
    const withTail = checkSeriesString(input(1, { fittings: [pathLight({ tail: { length: metres(2), cable: FLEX_15 } })], runs: [] }));
    expect(withTail.cableLoopResistanceOhm).toBeCloseTo(2 * 2 * FLEX_15_70C_OHM_PER_M, 12);
    expect(withTail.fittings[0]!.tailDropV).toBeCloseTo(0.7 * 4 * FLEX_15_70C_OHM_PER_M, 12);
  });
});

describe('property: string voltage is additive (definition)', () => {
  const vfArb = fc.array(fc.double({ min: 2.5, max: 40, noNaN: true }), { minLength: 1, maxLength: 20 });
  it('the forward voltage of a joined string is the sum of its parts', () => {
    fc.assert(
      fc.property(vfArb, vfArb, fc.double({ min: 0, max: 50, noNaN: true }), (a, b, leadM) => {
        const mk = (vs: number[]): SeriesFitting[] => vs.map((v) => ({ ratings: [{ currentA: 0.7, forwardVoltageV: v }] }));
        const run = (vs: number[]) =>
          checkSeriesString({ ...input(0), fittings: mk(vs), runs: [{ role: 'driver-lead', length: metres(leadM), cable: FLEX_15 }] });
        const ra = run(a);
        const rb = run(b);
        const rab = run([...a, ...b]);
        expect(rab.stringForwardVoltageV).toBeCloseTo(ra.stringForwardVoltageV + rb.stringForwardVoltageV, 9);
        // drop is never negative and the compliance voltage is Vf plus drop
        expect(rab.cableDropV).toBeGreaterThanOrEqual(0);
        expect(rab.complianceVoltageV).toBeCloseTo(rab.stringForwardVoltageV + rab.cableDropV, 9);
      }),
    );
  });
});
