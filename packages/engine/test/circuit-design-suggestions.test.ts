/**
 * The larger-cable suggestion and the side-by-side drive currents for a designed circuit.
 * Figures checked against published values:
 * - IEC 60228 Table 3, class 5 plain copper, max resistance at 20 °C: 1 mm² 19.5, 1.5 mm² 13.3,
 *   2.5 mm² 7.98, 4 mm² 4.95 ohm/km;
 * - the UK/IEC profile works the drop at 70 °C: 1 + 0.00393 · 50 = 1.1965 (IEC 60287-1-1 alpha) [derived];
 * - a series string's voltage is the sum of its forward voltages; compliance = that + I · loop R (definitions);
 * - a constant-voltage fitting draws I = P / V rated (definition); drop limit 5 % (engine default, common practice).
 * Fitting datasheet figures (forward voltages, lumens) are invented for the tests.
 */
import { describe, expect, it } from 'vitest';
import {
  applyCableSuggestion,
  candidateCurrents,
  compareCircuitCurrents,
  evaluateCircuit,
  suggestLargerCable,
  withDriveCurrent,
  type CcCircuitDesign,
  type CvCircuitDesign,
  type DesignProduct,
} from '../src/index';

const base = { unit: 'each', supplierCode: 'X' };
const HOT = 1.1965; // 70 °C over 20 °C for copper (IEC 60287-1-1 alpha 0.00393) [derived]

function flex(id: string, areaMm2: number, costMinor: number): DesignProduct {
  return {
    ...base,
    unit: 'm',
    id,
    kind: 'cable',
    name: `Two-core flex ${areaMm2}`,
    costMinor,
    listPriceMinor: costMinor * 2,
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2, conductorClass: 5, coating: 'plain' } },
  };
}
const flex10 = flex('flex-1', 1, 60);
const flex15 = flex('flex-15', 1.5, 90);
const flex25 = flex('flex-25', 2.5, 140);
const flex40 = flex('flex-4', 4, 210);
const cables = [flex40, flex10, flex25, flex15]; // deliberately unordered

const bollard: DesignProduct = {
  ...base,
  id: 'bollard',
  kind: 'fitting',
  name: 'Heron bollard',
  costMinor: 2500,
  listPriceMinor: 4600,
  spec: {
    driveMode: 'constant-current',
    ratings: [
      { currentA: 0.35, forwardVoltageV: 2.9, lumens: 110 },
      { currentA: 0.7, forwardVoltageV: 3.2, lumens: 200 },
    ],
    ipCode: 'IP66',
  },
};
const drv700: DesignProduct = {
  ...base,
  id: 'drv-700',
  kind: 'driver',
  name: 'Owl 700/30',
  costMinor: 3000,
  listPriceMinor: 5600,
  spec: { currentA: 0.7, voltageWindowV: { minV: 9, maxV: 42 }, maxPowerW: 30, efficiencyPct: 88, ipCode: 'IP66' },
};
const drv350: DesignProduct = {
  ...base,
  id: 'drv-350',
  kind: 'driver',
  name: 'Owl 350/20',
  costMinor: 2600,
  listPriceMinor: 4800,
  spec: { currentA: 0.35, voltageWindowV: { minV: 6, maxV: 48 }, maxPowerW: 20, efficiencyPct: 88, ipCode: 'IP66' },
};
const settings = { profile: 'uk-iec' as const };

function longString(count: number, currentA: number, leadM: number, cable = 'flex-15'): CcCircuitDesign {
  return {
    kind: 'constant-current',
    driverProductId: currentA === 0.7 ? 'drv-700' : 'drv-350',
    driverLocation: 'driver-outdoors',
    fittings: Array.from({ length: count }, (_, i) => ({
      id: `f${i + 1}`,
      productId: 'bollard',
      label: '',
      location: 'exposed-outdoor' as const,
      driveCurrentA: currentA,
    })),
    driverLead: { cableProductId: cable, lengthM: leadM, method: 'buried-trench' },
    links: [],
    extensions: [],
    connectorBlockProductId: null,
    assignment: null,
    acknowledgements: [],
  };
}
const ccProducts = [bollard, drv700, drv350, flex15];

describe('suggestLargerCable, constant current', () => {
  it('finds the smallest stocked conductor that brings the compliance voltage into the window', () => {
    const design = longString(12, 0.7, 200);
    const before = evaluateCircuit(design, ccProducts, settings);
    // 12 x 3.2 V + 0.7 A x 2 x 200 m x 13.3 ohm/km (IEC 60228 Table 3) x 1.1965 = 38.4 + 4.456 = 42.86 V > 42 V
    expect(before.series!.complianceVoltageV).toBeCloseTo(38.4 + 0.7 * 400 * 0.0133 * HOT, 6);
    expect(before.findings.map((f) => f.code)).toContain('voltage-above-window');

    const s = suggestLargerCable(design, ccProducts, cables, settings, before);
    expect(s.needed).toBe(true);
    expect(s.changes).toHaveLength(1);
    const c = s.changes[0]!;
    // 1 mm² (19.5 ohm/km) is worse than what is there; 2.5 mm² is the smallest better one that does
    expect(c).toMatchObject({
      target: 'string',
      productId: 'flex-25',
      measure: 'compliance-voltage',
      clears: ['voltage-above-window'],
    });
    expect(c.ohmPerKm20).toBeCloseTo(7.98, 9); // IEC 60228 Table 3, 2.5 mm² class 5 plain
    expect(c.conductor).toBe('2.5 mm² class 5 plain');
    expect(c.beforeV).toBeCloseTo(before.series!.complianceVoltageV, 9);
    // 38.4 + 0.7 x 400 m x 7.98 ohm/km x 1.1965 = 41.07 V
    expect(c.afterV).toBeCloseTo(38.4 + 0.7 * 400 * 0.00798 * HOT, 6);

    const after = evaluateCircuit(applyCableSuggestion(design, s.changes), [...ccProducts, flex25], settings);
    expect(after.findings.map((f) => f.code)).not.toContain('voltage-above-window');
    expect(after.series!.complianceVoltageV).toBeCloseTo(c.afterV, 9);
  });

  it('moves every run of the string (lead, links, extensions) to the suggested cable', () => {
    const design: CcCircuitDesign = {
      ...longString(12, 0.7, 150),
      links: [{ cableProductId: 'flex-15', lengthM: 30, method: 'in-duct' }],
      extensions: [{ cableProductId: 'flex-15', lengthM: 20, method: 'buried-trench', label: 'to the pond' }],
    };
    const s = suggestLargerCable(design, ccProducts, cables, settings);
    expect(s.changes[0]?.productId).toBe('flex-25');
    const applied = applyCableSuggestion(design, s.changes);
    expect([
      applied.driverLead!.cableProductId,
      ...applied.links.map((l) => l.cableProductId),
      ...applied.extensions.map((e) => e.cableProductId),
    ]).toEqual(['flex-25', 'flex-25', 'flex-25']);
    expect(applied.extensions[0]!.label).toBe('to the pond');
  });

  it('says nothing is needed when the cable causes no failure', () => {
    const s = suggestLargerCable(longString(6, 0.7, 20), ccProducts, cables, settings);
    expect(s).toEqual({ needed: false, changes: [], findings: [] });
  });

  it('says so when no stocked cable can help because the fittings alone exceed the window', () => {
    // 14 x 3.2 V = 44.8 V is over the 42 V window before any cable
    const s = suggestLargerCable(longString(14, 0.7, 10), ccProducts, cables, settings);
    expect(s.needed).toBe(true);
    expect(s.changes).toEqual([]);
    expect(s.findings[0]).toMatchObject({ code: 'larger-cable-none-fits', values: { stringForwardVoltageV: 44.8 } });
  });

  it('offers nothing smaller than what is there', () => {
    const design = longString(12, 0.7, 200, 'flex-25');
    // 41.07 V fits; make it fail with a longer lead on 2.5 mm²: 38.4 + 0.7 x 2 x 330 x 0.00798 x 1.1965 = 42.81 V
    const longer = { ...design, driverLead: { ...design.driverLead!, lengthM: 330 } };
    const s = suggestLargerCable(longer, [...ccProducts, flex25], [flex10, flex15, flex25], settings);
    expect(s.changes).toEqual([]);
    expect(s.findings.map((f) => f.code)).toEqual(['larger-cable-none-fits']);
    const with4 = suggestLargerCable(longer, [...ccProducts, flex25], cables, settings);
    expect(with4.changes[0]?.productId).toBe('flex-4');
    expect(with4.changes[0]?.ohmPerKm20).toBeCloseTo(4.95, 9); // IEC 60228 Table 3, 4 mm² class 5 plain
  });
});

describe('suggestLargerCable, constant voltage', () => {
  const supply: DesignProduct = {
    ...base,
    id: 'psu-12',
    kind: 'cv-supply',
    name: 'Kestrel 12 V 60 W',
    costMinor: 2400,
    listPriceMinor: 4500,
    spec: { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP66' },
  };
  const strip: DesignProduct = {
    ...base,
    id: 'deck-6',
    kind: 'fitting',
    name: 'Deck light 6 W',
    costMinor: 900,
    listPriceMinor: 1700,
    spec: { driveMode: 'constant-voltage', nominalVoltageV: 12, powerW: 6, ipCode: 'IP66' },
  };
  const design: CvCircuitDesign = {
    kind: 'constant-voltage',
    supplyProductId: 'psu-12',
    supplyLocation: 'driver-outdoors',
    acknowledgements: [],
    runs: [
      {
        id: 'deck',
        label: 'Deck edge',
        layout: 'daisy-chain',
        cableProductId: 'flex-15',
        method: 'surface-clipped',
        feederLengthM: 0,
        fittings: ['a', 'b', 'c', 'd'].map((id) => ({
          id,
          productId: 'deck-6',
          label: '',
          location: 'exposed-outdoor' as const,
          spanLengthM: 5,
        })),
      },
      {
        id: 'step',
        label: 'Step',
        layout: 'daisy-chain',
        cableProductId: 'flex-15',
        method: 'surface-clipped',
        feederLengthM: 0,
        fittings: [{ id: 's1', productId: 'deck-6', label: '', location: 'exposed-outdoor' as const, spanLengthM: 2 }],
      },
    ],
  };
  const products = [supply, strip, flex15];

  it('gives the failing run the smallest stocked cable that keeps its last fitting within 5 %', () => {
    // 0.5 A per fitting; segments carry 2, 1.5, 1, 0.5 A over 5 m each: drop = 2 x 5 m x R x 5 A = 50 R
    const drop = (ohmPerKm: number) => 50 * (ohmPerKm / 1000) * HOT;
    const before = evaluateCircuit(design, products, settings);
    expect(before.cv!.runs[0]!.worst!.voltageV).toBeCloseTo(12 - drop(13.3), 6); // 6.6 % on 1.5 mm²
    // fitting c: 2 x 5 m x R x 4.5 A = 45 R = 0.716 V, 5.97 %; fitting d 6.63 %: both over 5 %
    expect(before.findings.filter((f) => f.code === 'cv-drop-over-limit').map((f) => f.subject)).toEqual([
      'run:deck/fitting:c',
      'run:deck/fitting:d',
    ]);

    const s = suggestLargerCable(design, products, cables, settings, before);
    expect(s.needed).toBe(true);
    expect(s.changes).toHaveLength(1); // the one-fitting step run is fine as it is
    expect(s.changes[0]).toMatchObject({
      target: 'run:deck',
      productId: 'flex-25',
      measure: 'worst-fitting-voltage',
      clears: ['cv-drop-over-limit'],
    });
    expect(s.changes[0]!.afterV).toBeCloseTo(12 - drop(7.98), 6); // 3.98 % on 2.5 mm² (IEC 60228 Table 3)

    const applied = applyCableSuggestion(design, s.changes);
    expect(applied.runs.map((r) => r.cableProductId)).toEqual(['flex-25', 'flex-15']);
    const after = evaluateCircuit(applied, [...products, flex25], settings);
    expect(after.findings.map((f) => f.code)).not.toContain('cv-drop-over-limit');
  });

  it('reports a run no stocked cable can fix', () => {
    const long = {
      ...design,
      runs: [{ ...design.runs[0]!, fittings: design.runs[0]!.fittings.map((f) => ({ ...f, spanLengthM: 40 })) }],
    };
    const s = suggestLargerCable(long, products, cables, settings);
    expect(s.changes).toEqual([]);
    expect(s.findings).toMatchObject([{ code: 'larger-cable-none-fits', subject: 'run:deck' }]);
  });
});

describe('compareCircuitCurrents', () => {
  const design = longString(6, 0.35, 10);
  const drivers = [drv350, drv700];

  it('lists every rated current of the fittings beside the present one', () => {
    expect(candidateCurrents(design, ccProducts)).toEqual([0.35, 0.7]);
  });

  it('gives power, relative light, the cheapest fitting driver and cost per current', () => {
    const c = compareCircuitCurrents(design, ccProducts, drivers, settings);
    expect(c.columns.map((x) => x.currentA)).toEqual([0.35, 0.7]);
    const [soft, bright] = c.columns;
    const loop = 2 * 10 * 0.0133 * HOT; // IEC 60228 Table 3 at 70 °C
    expect(soft!.isCurrent).toBe(true);
    expect(soft!.complianceVoltageV).toBeCloseTo(6 * 2.9 + 0.35 * loop, 6);
    expect(soft!.outputPowerW).toBeCloseTo(0.35 * (6 * 2.9 + 0.35 * loop), 6);
    expect(bright!.outputPowerW).toBeCloseTo(0.7 * (6 * 3.2 + 0.7 * loop), 6);
    expect(soft!.relativeLightPct).toBeCloseTo(100, 9);
    expect(bright!.relativeLightPct).toBeCloseTo((200 / 110) * 100, 6); // invented datasheet lumens
    expect(soft!.driver).toMatchObject({ productId: 'drv-350', name: 'Owl 350/20' });
    expect(bright!.driver).toMatchObject({ productId: 'drv-700', name: 'Owl 700/30' });
    expect(soft!.totalCostMinor).toBe(6 * 2500 + 2600);
    expect(bright!.totalCostMinor).toBe(6 * 2500 + 3000);
  });

  it('has no driver for a current the catalogue does not serve', () => {
    const c = compareCircuitCurrents(design, ccProducts, [drv350], settings);
    expect(c.columns[1]).toMatchObject({ currentA: 0.7, driver: null, totalCostMinor: null });
  });

  it('"use this" sets every fitting and the driver', () => {
    const c = compareCircuitCurrents(design, ccProducts, drivers, settings);
    const next = withDriveCurrent(design, c.columns[1]!);
    expect(next.fittings.every((f) => f.driveCurrentA === 0.7)).toBe(true);
    expect(next.driverProductId).toBe('drv-700');
    const e = evaluateCircuit(next, ccProducts, settings);
    expect(e.findings.filter((f) => f.severity === 'error')).toEqual([]);
  });

  it('compares nothing for an empty string', () => {
    expect(compareCircuitCurrents({ ...design, fittings: [] }, ccProducts, drivers, settings).columns).toEqual([]);
  });
});
