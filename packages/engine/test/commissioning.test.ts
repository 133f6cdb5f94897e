/**
 * Commissioning readings. Ranges (see src/commissioning): driver current ± 5 %, string and
 * fitting voltage ± 10 % and supply voltage ± 5 % (common practice); constant-voltage far
 * fitting within 5 % of nominal (BS 7671 Section 715, from memory); insulation at least
 * 0.5 MΩ at 250 V DC for SELV (BS 7671 Table 64, from memory).
 * Expected figures: a series string's voltage is the sum of its forward voltages (definition)
 * plus the cable drop; 1.5 mm² class 5 plain copper is 13.3 ohm/km at 20 °C (IEC 60228 Table 3),
 * worked at 70 °C with 1 + 0.00393 · 50 = 1.1965 (IEC 60287-1-1 alpha).
 */
import { describe, expect, it } from 'vitest';
import {
  COMMISSIONING_CHECKS,
  commissioningPlan,
  evaluateCircuit,
  judgeReadings,
  type CcCircuitDesign,
  type CvCircuitDesign,
  type DesignProduct,
} from '../src/index';

const base = { unit: 'each', supplierCode: 'X', costMinor: 100, listPriceMinor: 200 };
const flex15: DesignProduct = {
  ...base,
  id: 'cable-15',
  kind: 'cable',
  name: 'Two-core flex 1.5',
  spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
};
const spike: DesignProduct = {
  ...base,
  id: 'spike',
  kind: 'fitting',
  name: 'Fern spike',
  spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.35, forwardVoltageV: 3.0 }], ipCode: 'IP66' },
};
const driver: DesignProduct = {
  ...base,
  id: 'drv',
  kind: 'driver',
  name: 'Lantern 350/20',
  spec: { currentA: 0.35, voltageWindowV: { minV: 6, maxV: 48 }, maxPowerW: 20, efficiencyPct: 88, ipCode: 'IP66' },
};
const block: DesignProduct = {
  ...base,
  id: 'blk',
  kind: 'connector-block',
  name: 'Six-way gel box',
  spec: { terminals: 6, entries: 6, conductorsPerTerminal: 2, ipCode: 'IP68' },
};
const bollard: DesignProduct = {
  ...base,
  id: 'bol',
  kind: 'fitting',
  name: 'Bollard 12 V 6 W',
  spec: { driveMode: 'constant-voltage', nominalVoltageV: 12, powerW: 6, ipCode: 'IP65' },
};
const supply: DesignProduct = {
  ...base,
  id: 'psu',
  kind: 'cv-supply',
  name: 'Supply 12 V 60 W',
  spec: { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP67' },
};
const products = [flex15, spike, driver, block, bollard, supply];

const cc: CcCircuitDesign = {
  kind: 'constant-current',
  driverProductId: 'drv',
  driverLocation: 'driver-outdoors',
  fittings: Array.from({ length: 6 }, (_, i) => ({
    id: `f${i + 1}`,
    productId: 'spike',
    label: `Path ${i + 1}`,
    location: 'exposed-outdoor' as const,
    driveCurrentA: 0.35,
  })),
  driverLead: { cableProductId: 'cable-15', lengthM: 10, method: 'buried-trench' },
  links: [{ cableProductId: 'cable-15', lengthM: 8, method: 'buried-trench' }],
  extensions: [],
  connectorBlockProductId: 'blk',
  assignment: null,
  acknowledgements: [],
};

describe('commissioningPlan', () => {
  it('expects the driver current, the string voltage and the last fitting for a constant-current string', () => {
    const plan = commissioningPlan(evaluateCircuit(cc, products, { profile: 'uk-iec' }));
    const byKey = Object.fromEntries(plan.readings.map((r) => [r.key, r]));
    // 0.35 A ± 5 %
    expect(byKey['output-current']).toMatchObject({ unit: 'A', expected: 0.35, min: 0.333, max: 0.368 });
    // 6 × 3.0 V = 18 V plus the drop in the 10 m lead (the link carries the return too): at least 18 V
    const v = byKey['output-voltage']!;
    expect(v.expected!).toBeGreaterThan(18);
    // 10 m lead loop 2 · 10 · 0.0133 · 1.1965 = 0.3183 ohm at 0.35 A = 0.111 V at the very least
    expect(v.expected!).toBeGreaterThanOrEqual(18.111);
    expect(v.min).toBeCloseTo(v.expected! * 0.9, 2);
    expect(v.max).toBeCloseTo(v.expected! * 1.1, 2);
    expect(byKey['far-fitting-voltage']).toMatchObject({ expected: 3, min: 2.7, max: 3.3 });
    expect(byKey['insulation-resistance']).toMatchObject({ unit: 'MΩ', min: 0.5, max: null });
    expect(plan.checks.map((c) => c.key)).toEqual(COMMISSIONING_CHECKS.map((c) => c.key));
    expect(plan.checks.find((c) => c.key === 'mains-by-electrician')!.label).toContain('licensed electrician');
  });

  it('expects nominal ± 5 % at a 12 V supply and the far fitting within the 5 % drop limit', () => {
    const cv: CvCircuitDesign = {
      kind: 'constant-voltage',
      supplyProductId: 'psu',
      supplyLocation: 'driver-outdoors',
      runs: [
        {
          id: 'r1',
          label: 'Courtyard',
          layout: 'daisy-chain',
          cableProductId: 'cable-15',
          method: 'buried-trench',
          feederLengthM: 0,
          fittings: ['a', 'b', 'c', 'd'].map((id) => ({
            id,
            productId: 'bol',
            label: id,
            location: 'exposed-outdoor' as const,
            spanLengthM: 5,
          })),
        },
      ],
      acknowledgements: [],
    };
    const plan = commissioningPlan(evaluateCircuit(cv, products, { profile: 'uk-iec' }));
    const byKey = Object.fromEntries(plan.readings.map((r) => [r.key, r]));
    expect(byKey['output-voltage']).toMatchObject({ expected: 12, min: 11.4, max: 12.6 });
    // 4 × 6 W / 12 V = 2 A
    expect(byKey['output-current']).toMatchObject({ expected: 2, min: null, max: 2.2 });
    // 5 % of 12 V below nominal = 11.4 V
    expect(byKey['far-fitting-voltage']).toMatchObject({ min: 11.4, max: 12 });
    expect(byKey['far-fitting-voltage']!.expected!).toBeLessThan(12);
  });

  it('says there is nothing to expect when no driver is chosen', () => {
    const plan = commissioningPlan(evaluateCircuit({ ...cc, driverProductId: null }, products, { profile: 'uk-iec' }));
    expect(plan.findings.map((f) => f.code)).toEqual(['commissioning-no-driver']);
    expect(plan.readings.map((r) => r.key)).toEqual(['insulation-resistance']);
  });
});

describe('judgeReadings', () => {
  const plan = commissioningPlan(evaluateCircuit(cc, products, { profile: 'uk-iec' }));
  const expected = plan.readings.find((r) => r.key === 'output-voltage')!.expected!;

  it('flags readings outside the range with both figures, and is complete only when all is in', () => {
    const j = judgeReadings(plan, {
      readings: { 'output-current': 0.351, 'output-voltage': expected, 'far-fitting-voltage': 2.1, 'insulation-resistance': 0.2 },
      checks: { 'polarity-checked': true },
    });
    const status = Object.fromEntries(j.readings.map((r) => [r.key, r.status]));
    expect(status).toEqual({
      'output-current': 'in-range',
      'output-voltage': 'in-range',
      'far-fitting-voltage': 'low',
      'insulation-resistance': 'low',
    });
    expect(j.flagged).toBe(2);
    expect(j.complete).toBe(false);
    expect(j.findings[0]!.message).toContain('2.1 V is below the expected 2.7-3.3 V');
    expect(j.findings[1]!.message).toContain('at least 0.5 MΩ');

    const done = judgeReadings(plan, {
      readings: { 'output-current': 0.35, 'output-voltage': expected, 'far-fitting-voltage': 3.05, 'insulation-resistance': 200 },
      checks: Object.fromEntries(COMMISSIONING_CHECKS.map((c) => [c.key, true])),
    });
    expect(done.flagged).toBe(0);
    expect(done.complete).toBe(true);
  });

  it('treats a missing or non-finite value as not entered, and a high current as high', () => {
    const j = judgeReadings(plan, { readings: { 'output-current': 0.4, 'output-voltage': Number.NaN }, checks: {} });
    const status = Object.fromEntries(j.readings.map((r) => [r.key, r.status]));
    expect(status['output-current']).toBe('high');
    expect(status['output-voltage']).toBe('not-entered');
    expect(status['far-fitting-voltage']).toBe('not-entered');
  });
});
