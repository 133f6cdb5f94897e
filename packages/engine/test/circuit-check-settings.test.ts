/**
 * The firm's own limits reach the circuit checks through CircuitSettings: the voltage-drop
 * limit of constant-voltage runs and the minimum IP codes by location.
 * Figures:
 * - IEC 60228 Table 3, class 5 plain copper 1.5 mm²: 13.3 ohm/km at 20 °C;
 * - the UK/IEC profile works the drop at 70 °C: factor 1 + 0.00393 · 50 = 1.1965 (IEC 60287-1-1 alpha) [derived];
 * - default limit 5 % of nominal (BS 7671 Section 715, from memory); default minimum for an
 *   exposed outdoor fitting IP65 (IEC 60529 codes, common practice);
 * - IEC 60529: IP66 does not include the immersion of IP67.
 */
import { describe, expect, it } from 'vitest';
import { evaluateCircuit, type CcCircuitDesign, type CvCircuitDesign, type DesignProduct } from '../src/index';

const base = { unit: 'each', supplierCode: 'X' };
const flex15: DesignProduct = {
  ...base,
  id: 'cable-15',
  kind: 'cable',
  name: 'Two-core flex 1.5',
  costMinor: 90,
  listPriceMinor: 160,
  unit: 'm',
  spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
};
const supply: DesignProduct = {
  ...base,
  id: 'psu',
  kind: 'cv-supply',
  name: 'Moss 12 V 60 W',
  costMinor: 2000,
  listPriceMinor: 3500,
  spec: { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP66' },
};
const deck: DesignProduct = {
  ...base,
  id: 'deck',
  kind: 'fitting',
  name: 'Deck light',
  costMinor: 900,
  listPriceMinor: 1800,
  spec: { driveMode: 'constant-voltage', nominalVoltageV: 12, powerW: 6, ipCode: 'IP66' },
};
const spike: DesignProduct = {
  ...base,
  id: 'spike',
  kind: 'fitting',
  name: 'Fern spike',
  costMinor: 2100,
  listPriceMinor: 3900,
  spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.35, forwardVoltageV: 3.0 }], ipCode: 'IP66' },
};
const driver: DesignProduct = {
  ...base,
  id: 'drv-350',
  kind: 'driver',
  name: 'Lantern 350/20',
  costMinor: 2800,
  listPriceMinor: 5200,
  spec: { currentA: 0.35, voltageWindowV: { minV: 6, maxV: 48 }, maxPowerW: 20, efficiencyPct: 88, ipCode: 'IP66' },
};

const chain: CvCircuitDesign = {
  kind: 'constant-voltage',
  supplyProductId: 'psu',
  supplyLocation: 'driver-outdoors',
  runs: [
    {
      id: 'r1',
      label: 'Deck',
      layout: 'daisy-chain',
      cableProductId: 'cable-15',
      method: 'surface-clipped',
      feederLengthM: 0,
      fittings: ['a', 'b', 'c', 'd'].map((id) => ({ id, productId: 'deck', label: '', location: 'under-decking' as const, spanLengthM: 5 })),
    },
  ],
  acknowledgements: [],
};

const string: CcCircuitDesign = {
  kind: 'constant-current',
  driverProductId: 'drv-350',
  driverLocation: 'driver-outdoors',
  fittings: [1, 2, 3].map((i) => ({ id: `f${i}`, productId: 'spike', label: `Path light ${i}`, location: 'exposed-outdoor' as const, driveCurrentA: 0.35 })),
  driverLead: { cableProductId: 'cable-15', lengthM: 10, method: 'buried-trench' },
  links: [],
  extensions: [],
  connectorBlockProductId: null,
  assignment: null,
  acknowledgements: [],
};

const overLimit = (settings: Parameters<typeof evaluateCircuit>[2]) =>
  evaluateCircuit(chain, [supply, deck, flex15], settings)
    .findings.filter((f) => f.code === 'cv-drop-over-limit')
    .map((f) => f.subject);

describe('the firm’s voltage-drop limit', () => {
  // 6 W / 12 V = 0.5 A a fitting; loop per 5 m span r = 2 x 5 x 0.0133 x 1.1965 ohm (IEC 60228 Table 3,
  // 70 °C derived). Drops from 12 V: a 2r (2.65 %), b 3.5r (4.64 %), c 4.5r (5.97 %), d 5r (6.63 %).
  it('uses 5 % when the firm has not set one', () => {
    expect(overLimit({ profile: 'uk-iec' })).toEqual(['run:r1/fitting:c', 'run:r1/fitting:d']);
  });

  it('flags more fittings under a tighter 4 % limit and none under 7 %', () => {
    expect(overLimit({ profile: 'uk-iec', dropLimitPct: 4 })).toEqual(['run:r1/fitting:b', 'run:r1/fitting:c', 'run:r1/fitting:d']);
    expect(overLimit({ profile: 'uk-iec', dropLimitPct: 7 })).toEqual([]);
    expect(evaluateCircuit(chain, [supply, deck, flex15], { profile: 'uk-iec', dropLimitPct: 4 }).cv!.dropLimitPct).toBe(4);
  });
});

describe('the firm’s IP minimums', () => {
  const short = (settings: Parameters<typeof evaluateCircuit>[2]) =>
    evaluateCircuit(string, [spike, driver, flex15], settings)
      .findings.filter((f) => f.code === 'fitting-ip-short-of-location')
      .map((f) => f.subject);

  it('passes IP66 fittings outdoors against the default IP65', () => {
    expect(short({ profile: 'uk-iec' })).toEqual([]);
  });

  it('flags every IP66 fitting when the firm asks IP67 outdoors (IEC 60529: 6 does not include immersion)', () => {
    expect(short({ profile: 'uk-iec', ipOverrides: { 'exposed-outdoor': 'IP67' } })).toEqual(['fitting:1', 'fitting:2', 'fitting:3']);
  });

  it('applies a constant-voltage run’s minimum too', () => {
    const e = evaluateCircuit(chain, [supply, deck, flex15], { profile: 'uk-iec', ipOverrides: { 'under-decking': 'IP67' } });
    expect(e.findings.filter((f) => f.code === 'fitting-ip-short-of-location')).toHaveLength(4);
  });
});
