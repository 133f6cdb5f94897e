import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { CableSpec } from '../src/cables';
import { chooseDrivers, compareDriveCurrents, segmentLayout, splitRun, type RunToSplit } from '../src/drivers';
import type { LedDriver, SeriesFitting, StringLayout } from '../src/series';
import { metres } from '../src/units';

// IEC 60228 Table 3: 1.5 mm² class 5 plain (13.3 ohm/km at 20 °C)
const FLEX_15: CableSpec = { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' };

/** Invented fittings and drivers. Forward voltages from the white-LED 3.0-3.3 V range (from memory). */
const spike = (vf = 3.1): SeriesFitting => ({
  id: 'Glowworm spike',
  ratings: [
    { currentA: 0.35, forwardVoltageV: vf - 0.2, lumens: 110 },
    { currentA: 0.7, forwardVoltageV: vf, lumens: 200 },
  ],
  ipCode: 'IP65',
  location: 'exposed-outdoor',
  unitCostMinor: 3500,
});

const cc = (id: string, currentA: number, minV: number, maxV: number, costMinor: number, extra: Partial<LedDriver> = {}): LedDriver => ({
  id,
  output: 'constant-current',
  currentA,
  voltageWindowV: { minV, maxV },
  efficiency: 0.88,
  ipCode: 'IP66',
  costMinor,
  ...extra,
});

const CATALOGUE: LedDriver[] = [
  cc('wide-700', 0.7, 9, 48, 3100),
  cc('small-700', 0.7, 9, 24, 1900),
  cc('mid-700', 0.7, 9, 36, 2300),
  cc('mid-700-b', 0.7, 9, 42, 2300),
  cc('indoor-700', 0.7, 9, 36, 1200, { ipCode: 'IP20' }),
  cc('cv-12', 0.7, 9, 36, 900, { output: 'constant-voltage' }),
  cc('mid-350', 0.35, 9, 36, 1500),
  cc('big-1050', 1.05, 9, 36, 1500),
];

function layout(n: number): StringLayout {
  return {
    fittings: Array.from({ length: n }, () => spike()),
    runs: [{ id: 'lead', role: 'driver-lead', length: metres(5), cable: FLEX_15 }],
    driverLocation: 'driver-outdoors',
    profile: 'uk-iec',
  };
}

describe('chooseDrivers', () => {
  const choice = chooseDrivers(layout(8), CATALOGUE.filter((d) => d.id !== 'mid-350')); // about 24.9 V at 700 mA
  it('ranks the suitable ones by cost, then headroom, each with why it fits', () => {
    // equal cost 23.00: mid-700-b (42 V) has more headroom than mid-700 (36 V); common practice 10 % headroom
    expect(choice.suitable.map((s) => s.driver.id)).toEqual(['mid-700-b', 'mid-700', 'wide-700']);
    expect(choice.suitable[0]!.reasons.join(' ')).toMatch(/700 mA/);
    expect(choice.suitable[0]!.reasons.join(' ')).toMatch(/9-42 V window/);
  });
  it('says why each rejected one does not fit', () => {
    const why = Object.fromEntries(choice.rejected.map((r) => [r.driver.id, r.reasons.map((f) => f.code)]));
    expect(why['small-700']).toContain('voltage-above-window'); // 24.9 V > 24 V
    expect(why['indoor-700']).toEqual(['driver-ip-short-of-location']); // IP20 outdoors; common practice IP65
    expect(why['cv-12']![0]).toBe('cc-fitting-on-cv-supply');
    expect(why['big-1050']).toContain('current-above-rating'); // rated 350/700 mA
  });
  it('lets a fitting rated at several currents take a lower-current driver', () => {
    const at350 = chooseDrivers(layout(8), [cc('mid-350', 0.35, 9, 36, 1500)]);
    expect(at350.suitable.map((s) => s.driver.id)).toEqual(['mid-350']);
  });
});

describe('compareDriveCurrents (what-if)', () => {
  it('sets the same fittings side by side at 350 and 700 mA', () => {
    const rows = compareDriveCurrents(layout(8), [0.35, 0.7], CATALOGUE);
    const [low, high] = rows;
    // P = Vf · I (definition): 8 · 2.9 V · 0.35 A and 8 · 3.1 V · 0.7 A
    expect(low!.fittingsPowerW).toBeCloseTo(8 * 2.9 * 0.35, 10);
    expect(high!.fittingsPowerW).toBeCloseTo(8 * 3.1 * 0.7, 10);
    expect(low!.lumens).toBe(8 * 110);
    expect(high!.lumens).toBe(8 * 200);
    expect(low!.driver!.driver.id).toBe('mid-350');
    expect(high!.driver!.driver.id).toBe('mid-700-b');
    expect(low!.totalCostMinor).toBe(8 * 3500 + 1500);
    expect(high!.totalCostMinor).toBe(8 * 3500 + 2300);
  });
});

function run(fittings: SeriesFitting[], linkM = 3): RunToSplit {
  return {
    fittings,
    links: fittings.slice(1).map(() => ({ length: metres(linkM), cable: FLEX_15 })),
    lead: { length: metres(5), cable: FLEX_15 },
    driverLocation: 'driver-outdoors',
    profile: 'uk-iec',
  };
}

/** Cheapest cost by trying every set of cut points, each string priced by chooseDrivers (the full check). */
function bruteForce(r: RunToSplit, catalogue: LedDriver[]): number | null {
  const n = r.fittings.length;
  let best: number | null = null;
  for (let mask = 0; mask < 1 << (n - 1); mask++) {
    let total = 0;
    let from = 0;
    let ok = true;
    for (let k = 1; k <= n && ok; k++) {
      if (k === n || mask & (1 << (k - 1))) {
        const pick = chooseDrivers(segmentLayout(r, from, k), catalogue).suitable.find((s) => s.costMinor !== null);
        if (!pick) ok = false;
        else total += pick.costMinor!;
        from = k;
      }
    }
    if (ok && (best === null || total < best)) best = total;
  }
  return best;
}

describe('splitRun', () => {
  it('splits a long run into contiguous strings that each pass the full check', () => {
    const r = splitRun(run(Array.from({ length: 30 }, () => spike())), CATALOGUE);
    expect(r.ok).toBe(true);
    expect(r.strings[0]!.from).toBe(0);
    expect(r.strings.at(-1)!.to).toBe(30);
    for (let k = 1; k < r.strings.length; k++) expect(r.strings[k]!.from).toBe(r.strings[k - 1]!.to);
    for (const s of r.strings) expect(s.result.ok).toBe(true);
    expect(r.totalCostMinor).toBe(r.strings.reduce((a, s) => a + s.costMinor, 0));
    expect(r.excludedDrivers.map((e) => e.driver.id).sort()).toEqual(['cv-12', 'indoor-700']);
  });

  it('says which fitting makes it impossible: no driver at its current', () => {
    const odd: SeriesFitting = { id: 'Beetle 500', ratings: [{ currentA: 0.5, forwardVoltageV: 9 }] };
    const r = splitRun(run([spike(), spike(), spike(), odd, spike()]), CATALOGUE);
    expect(r.ok).toBe(false);
    expect(r.findings[0]!.code).toBe('split-impossible');
    expect(r.findings[0]!.subject).toBe('fitting:4');
    expect(r.findings[0]!.message).toMatch(/500 mA/);
  });

  it('says which fitting makes it impossible: too much alone', () => {
    const huge: SeriesFitting = { id: 'Floodmoth', ratings: [{ currentA: 0.7, forwardVoltageV: 47 }] };
    const r = splitRun(run([spike(), huge]), CATALOGUE);
    expect(r.findings[0]!.subject).toBe('fitting:2');
    expect(r.findings[0]!.message).toMatch(/Even alone/);
  });

  it('reports a bad run instead of crashing', () => {
    const r = splitRun({ ...run([spike(), spike()]), links: [] }, CATALOGUE);
    expect(r.findings[0]!.code).toBe('run-links-mismatch');
    const cv = splitRun(run([spike(), { ...spike(), drive: 'constant-voltage' }]), CATALOGUE);
    expect(cv.findings.map((f) => f.code)).toContain('cv-fitting-on-cc-driver');
  });

  it('property: never worse than brute force for n <= 8', () => {
    const fittingArb = fc.record({
      vf: fc.double({ min: 2.6, max: 12, noNaN: true }),
      only350: fc.boolean(),
    });
    const driverArb = fc.record({
      currentA: fc.constantFrom(0.35, 0.7),
      minV: fc.double({ min: 1, max: 20, noNaN: true }),
      span: fc.double({ min: 3, max: 40, noNaN: true }),
      cost: fc.integer({ min: 500, max: 5000 }),
      byPower: fc.boolean(),
    });
    fc.assert(
      fc.property(fc.array(fittingArb, { minLength: 1, maxLength: 8 }), fc.array(driverArb, { minLength: 1, maxLength: 6 }), (fs, ds) => {
        const fittings: SeriesFitting[] = fs.map((f) => ({
          ratings: f.only350 ? [{ currentA: 0.35, forwardVoltageV: f.vf * 0.95 }] : [{ currentA: 0.35, forwardVoltageV: f.vf * 0.95 }, { currentA: 0.7, forwardVoltageV: f.vf }],
        }));
        const catalogue: LedDriver[] = ds.map((d, k) =>
          d.byPower
            ? { id: `p${k}`, output: 'constant-current', currentA: d.currentA, powerWindowW: { minW: d.minV * d.currentA, maxW: (d.minV + d.span) * d.currentA }, ipCode: 'IP66', costMinor: d.cost }
            : { id: `v${k}`, output: 'constant-current', currentA: d.currentA, voltageWindowV: { minV: d.minV, maxV: d.minV + d.span }, ipCode: 'IP66', costMinor: d.cost },
        );
        const r = run(fittings, 2);
        const dp = splitRun(r, catalogue);
        const brute = bruteForce(r, catalogue);
        if (brute === null) {
          expect(dp.ok).toBe(false);
        } else {
          expect(dp.ok).toBe(true);
          expect(dp.totalCostMinor!).toBeLessThanOrEqual(brute);
          expect(dp.totalCostMinor!).toBe(brute); // DP is exact, so it also never beats a true optimum
        }
      }),
      { numRuns: 150 },
    );
  });
});
