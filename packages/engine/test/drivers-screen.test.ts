import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { CableSpec } from '../src/cables';
import { chooseDrivers, rejectionReasons } from '../src/drivers';
import { prepareString, evaluateDriver } from '../src/series/series-string';
import type { LedDriver, SeriesFitting, StringLayout } from '../src/series';
import { metres } from '../src/units';

// IEC 60228 Table 3: 1.5 mm² class 5 plain (13.3 ohm/km at 20 °C)
const FLEX_15: CableSpec = { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' };

/** Invented fittings; white-LED forward voltages 2.8-3.3 V (from memory). */
const fitting = (vf: number): SeriesFitting => ({
  ratings: [
    { currentA: 0.35, forwardVoltageV: vf - 0.2 },
    { currentA: 0.7, forwardVoltageV: vf },
  ],
  ipCode: 'IP65',
  location: 'exposed-outdoor',
});

/** Drivers around a string of about `stringV` volts: most windows land near it, some far off. */
const driverArb = (stringV: number): fc.Arbitrary<LedDriver> =>
  fc
    .record({
      output: fc.constantFrom<LedDriver['output']>(
        'constant-current',
        'constant-current',
        'constant-current',
        'constant-current',
        'constant-voltage',
      ),
      currentA: fc.constantFrom(0.35, 0.5, 0.7, 0.7, 0.7, 1.05, 0, Number.NaN),
      minFrac: fc.double({ min: 0, max: 1.1, noNaN: true }),
      maxFrac: fc.double({ min: 0.8, max: 2, noNaN: true }),
      window: fc.constantFrom('voltage', 'voltage', 'power', 'both', 'none'),
      maxPowerFrac: fc.option(fc.double({ min: -0.1, max: 2, noNaN: true }), { nil: undefined }),
      efficiency: fc.option(fc.double({ min: 0.5, max: 1.2, noNaN: true }), { nil: undefined }),
      ipCode: fc.option(fc.constantFrom('IP66', 'IP66', 'IP67', 'IP66/IP67', 'IP20', '', 'IPZ9'), { nil: undefined }),
      costMinor: fc.option(fc.integer({ min: 500, max: 520 }), { nil: undefined }),
    })
    .map((r) => {
      const d: LedDriver = { id: '', output: r.output, currentA: r.currentA, ipCode: 'IP66' };
      const minV = r.minFrac * stringV;
      const maxV = r.maxFrac * stringV;
      if (r.window === 'voltage' || r.window === 'both') d.voltageWindowV = { minV, maxV };
      if (r.window === 'power' || r.window === 'both') d.powerWindowW = { minW: minV * 0.7, maxW: maxV * 0.7 };
      if (r.maxPowerFrac !== undefined) d.maxPowerW = r.maxPowerFrac * stringV * 0.7;
      if (r.efficiency !== undefined) d.efficiency = r.efficiency;
      if (r.ipCode === undefined) delete d.ipCode;
      else d.ipCode = r.ipCode;
      if (r.costMinor !== undefined) d.costMinor = r.costMinor;
      return d;
    });

const layoutArb = fc
  .record({
    vfs: fc.array(fc.double({ min: 2.8, max: 12, noNaN: true }), { minLength: 1, maxLength: 12 }),
    only700: fc.boolean(),
    profile: fc.constantFrom<StringLayout['profile']>('uk-iec', 'us-nec'),
    marginPct: fc.constantFrom(0, 10, 25),
  })
  .map(({ vfs, only700, profile, marginPct }) => {
    const layout: StringLayout = {
      fittings: vfs.map((vf) => (only700 ? { ...fitting(vf), ratings: [{ currentA: 0.7, forwardVoltageV: vf }] } : fitting(vf))),
      runs: [{ id: 'lead', role: 'driver-lead', length: metres(5), cable: FLEX_15 }],
      driverLocation: 'driver-outdoors',
      profile,
      firm: { headroomMarginPct: marginPct },
    };
    return { layout, stringV: vfs.reduce((a, b) => a + b, 0) };
  });

describe('chooseDrivers screens each driver as the full check would', () => {
  it('property: suitable exactly when the full evaluation finds no ruling-out finding; ranked on the full figures', () => {
    fc.assert(
      fc.property(
        layoutArb.chain((l) => fc.tuple(fc.constant(l.layout), fc.array(driverArb(l.stringV), { minLength: 1, maxLength: 25 }))),
        ([layout, raw]) => {
          const catalogue = raw.map((d, k) => ({ ...d, id: `d${k}` }));
          const choice = chooseDrivers(layout, catalogue);
          const prepared = prepareString(layout);
          // the reference: the full evaluation of every driver, sifted finding by finding
          const expectSuitable = catalogue.filter((d) => rejectionReasons(prepared, d).length === 0);
          expect(choice.suitable.map((s) => s.driver.id).sort()).toEqual(expectSuitable.map((d) => d.id).sort());
          expect(choice.suitable.length + choice.rejected.length).toBe(catalogue.length);
          for (const r of choice.rejected) expect(r.reasons.length).toBeGreaterThan(0);
          // ranking key: cost, then the full result's headroom, then id
          const ref = expectSuitable
            .map((d) => ({ id: d.id, cost: d.costMinor ?? Infinity, headroom: evaluateDriver(prepared, d).headroomPct ?? 0 }))
            .sort((a, b) =>
              a.cost !== b.cost ? a.cost - b.cost : a.headroom !== b.headroom ? b.headroom - a.headroom : a.id < b.id ? -1 : 1,
            );
          expect(choice.suitable.map((s) => s.driver.id)).toEqual(ref.map((r) => r.id));
          for (const s of choice.suitable) {
            expect(s.headroomPct).toBe(s.result.headroomPct ?? 0);
            expect(s.result.findings.filter((f) => f.severity === 'error' && f.subject === 'driver')).toEqual([]);
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  it('writes out reasons and results in full as JSON', () => {
    const layout: StringLayout = {
      fittings: Array.from({ length: 8 }, () => fitting(3.1)),
      runs: [{ id: 'lead', role: 'driver-lead', length: metres(5), cable: FLEX_15 }],
      driverLocation: 'driver-outdoors',
      profile: 'uk-iec',
    };
    const choice = chooseDrivers(layout, [
      {
        id: 'fits',
        output: 'constant-current',
        currentA: 0.7,
        voltageWindowV: { minV: 9, maxV: 42 },
        efficiency: 0.88,
        ipCode: 'IP66',
        costMinor: 2300,
      },
      {
        id: 'indoor',
        output: 'constant-current',
        currentA: 0.7,
        voltageWindowV: { minV: 9, maxV: 42 },
        efficiency: 0.88,
        ipCode: 'IP20',
        costMinor: 1200,
      },
    ]);
    const json = JSON.parse(JSON.stringify(choice)) as {
      suitable: { driver: { id: string }; reasons: string[]; result: { complianceVoltageV: number } }[];
      rejected: { driver: { id: string }; reasons: { code: string; message: string }[] }[];
    };
    expect(json.suitable[0]!.reasons).toEqual(choice.suitable[0]!.reasons);
    expect(json.suitable[0]!.result.complianceVoltageV).toBeCloseTo(choice.suitable[0]!.result.complianceVoltageV, 12);
    // IP20 outdoors: common practice IP65 for a driver outdoors
    expect(json.rejected[0]!.reasons.map((r) => r.code)).toEqual(['driver-ip-short-of-location']);
    expect(json.rejected[0]!.reasons[0]!.message).toMatch(/IP20/);
  });
});
