/**
 * A designed circuit (placements + catalogue products) mapped to the engine's checks.
 * Figures are checked against published values:
 * - IEC 60228 Table 3, class 5 plain copper 1.5 mm²: 13.3 ohm/km at 20 °C;
 * - the UK/IEC profile works the drop at 70 °C: factor 1 + 0.00393 · 50 = 1.1965 (IEC 60287-1-1 alpha) [derived];
 * - a series string's voltage is the sum of its forward voltages (definition);
 * - series rule of thumb and one terminal per joint (common practice) for the block plan.
 */
import { describe, expect, it } from 'vitest';
import {
  circuitTakeoff,
  evaluateCircuit,
  suggestForCircuit,
  takeoff,
  type CcCircuitDesign,
  type CvCircuitDesign,
  type DesignProduct,
} from '../src/index';

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
const spike350: DesignProduct = {
  ...base,
  id: 'spike',
  kind: 'fitting',
  name: 'Fern spike',
  costMinor: 2100,
  listPriceMinor: 3900,
  spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.35, forwardVoltageV: 3.0 }], ipCode: 'IP66' },
};
const driver350: DesignProduct = {
  ...base,
  id: 'drv-350',
  kind: 'driver',
  name: 'Lantern 350/20',
  costMinor: 2800,
  listPriceMinor: 5200,
  spec: { currentA: 0.35, voltageWindowV: { minV: 6, maxV: 48 }, maxPowerW: 20, efficiencyPct: 88, ipCode: 'IP66' },
};
const driver700: DesignProduct = {
  ...base,
  id: 'drv-700',
  kind: 'driver',
  name: 'Lantern 700/30',
  costMinor: 3000,
  listPriceMinor: 5600,
  spec: { currentA: 0.7, voltageWindowV: { minV: 9, maxV: 42 }, maxPowerW: 30, efficiencyPct: 88, ipCode: 'IP66' },
};
const sixWay: DesignProduct = {
  ...base,
  id: 'block-6',
  kind: 'connector-block',
  name: 'Six-way gel box',
  costMinor: 600,
  listPriceMinor: 1100,
  spec: { terminals: 6, entries: 6, conductorsPerTerminal: 2, ipCode: 'IP68' },
};
const products = [flex15, spike350, driver350, driver700, sixWay];

function ccDesign(over: Partial<CcCircuitDesign> = {}): CcCircuitDesign {
  return {
    kind: 'constant-current',
    driverProductId: 'drv-350',
    driverLocation: 'driver-outdoors',
    fittings: Array.from({ length: 6 }, (_, i) => ({
      id: `f${i + 1}`,
      productId: 'spike',
      label: `Path light ${i + 1}`,
      location: 'exposed-outdoor' as const,
      driveCurrentA: 0.35,
    })),
    driverLead: { cableProductId: 'cable-15', lengthM: 10, method: 'buried-trench' },
    links: [{ cableProductId: 'cable-15', lengthM: 8, method: 'buried-trench' }],
    extensions: [],
    connectorBlockProductId: 'block-6',
    assignment: null,
    acknowledgements: [],
    ...over,
  };
}

const settings = { profile: 'uk-iec' as const };

describe('evaluateCircuit, constant current', () => {
  it('checks a 6-fitting string over two blocks with the published figures', () => {
    const e = evaluateCircuit(ccDesign(), products, settings);
    expect(e.series).not.toBeNull();
    // sum of forward voltages: 6 x 3.0 V (definition)
    expect(e.series!.stringForwardVoltageV).toBeCloseTo(18, 9);
    // loop 2 x (10 + 8) m x 13.3 ohm/km (IEC 60228 Table 3) x 1.1965 (70 °C, derived) at 0.35 A
    expect(e.series!.cableDropV).toBeCloseTo(0.35 * 2 * 18 * 0.0133 * 1.1965, 6);
    expect(e.series!.complianceVoltageV).toBeCloseTo(18 + 0.35 * 2 * 18 * 0.0133 * 1.1965, 6);
    // a 6-terminal block takes 4 fittings when a link leaves it (fittings + 2), then 2 (common practice)
    expect(e.blocks!.blocks.map((b) => b.fittings)).toEqual([
      [1, 2, 3, 4],
      [5, 6],
    ]);
    expect(e.blocks!.blocks[0]!.terminals[0]!.conductors).toEqual(['driver+', 'fitting:1+']);
    expect(e.wiring!.ok).toBe(true);
    expect(e.wiring!.seriesOrder).toEqual([1, 2, 3, 4, 5, 6]);
    expect(e.findings.filter((f) => f.severity === 'error')).toEqual([]);
    expect(e.ok).toBe(true);
  });

  it('reports a wrong-current driver at the driver, and the overdriven fittings at each fitting', () => {
    const e = evaluateCircuit(ccDesign({ driverProductId: 'drv-700' }), products, settings);
    const mismatch = e.findings.find((f) => f.code === 'driver-current-mismatch');
    expect(mismatch).toMatchObject({ severity: 'error', subject: 'driver' });
    // 700 mA through a fitting rated 350 mA destroys it (REFERENCES, LEDs and drivers, common practice)
    expect(e.findings.filter((f) => f.code === 'current-above-rating').map((f) => f.subject)).toEqual([
      'fitting:1',
      'fitting:2',
      'fitting:3',
      'fitting:4',
      'fitting:5',
      'fitting:6',
    ]);
    expect(e.ok).toBe(false);
  });

  it('keeps an acknowledged error but no longer counts it as blocking', () => {
    const design = ccDesign({ fittings: ccDesign().fittings.map((f, i) => (i === 5 ? { ...f, driveCurrentA: 0.5 } : f)) });
    const before = evaluateCircuit(design, products, settings);
    expect(before.findings.find((f) => f.code === 'fittings-at-different-currents')?.subject).toBe('string');
    const codes = before.findings
      .filter((f) => f.severity === 'error')
      .map((f) => ({ code: f.code, subject: f.subject ?? null, reason: 'Agreed with the client on site' }));
    const after = evaluateCircuit({ ...design, acknowledgements: codes }, products, settings);
    expect(after.ok).toBe(true);
    expect(after.findings.find((f) => f.code === 'fittings-at-different-currents')?.acknowledged).toBe(
      'Agreed with the client on site',
    );
  });

  it('names a product that is missing or of the wrong kind instead of throwing', () => {
    const e = evaluateCircuit(ccDesign({ driverProductId: 'gone', connectorBlockProductId: 'cable-15' }), products, settings);
    expect(e.findings.find((f) => f.code === 'product-not-in-catalogue')?.subject).toBe('driver');
    expect(e.findings.find((f) => f.code === 'product-wrong-kind')?.subject).toBe('blocks');
    expect(e.series).toBeNull();
  });

  it('without a driver shows the string at the chosen current', () => {
    const e = evaluateCircuit(ccDesign({ driverProductId: null }), products, settings);
    expect(e.preview!.stringForwardVoltageV).toBeCloseTo(18, 9);
    expect(e.findings.find((f) => f.code === 'driver-not-chosen')?.severity).toBe('warning');
  });

  it('gives takeoff the blocks the schedule uses', () => {
    const design = ccDesign();
    const e = evaluateCircuit(design, products, settings);
    const circuit = circuitTakeoff('c1', design, e)!;
    expect(circuit.fittings).toEqual([{ productId: 'spike', count: 6 }]);
    expect(circuit.connectorBlocks).toEqual([{ productId: 'block-6', count: 2 }]);
    const m = takeoff({ circuits: [circuit], catalogue: [] });
    expect(m.findings.some((f) => f.code === 'product-unknown')).toBe(true); // takeoff needs the catalogue too
  });
});

describe('suggestForCircuit', () => {
  it('offers the driver at the fittings’ current and rejects the other with the reason', () => {
    const s = suggestForCircuit(ccDesign({ driverProductId: null }), products, [driver350, driver700], settings);
    expect(s.drivers.map((d) => d.productId)).toEqual(['drv-350']);
    expect(s.rejected.map((r) => r.productId)).toEqual(['drv-700']);
    expect(s.split).toBeNull();
  });

  it('splits a string too long for any one driver', () => {
    // 20 x 3.0 V = 60 V is above the 48 V window, and 60 V x 0.35 A = 21 W above the 20 W maximum (P = V I)
    const long = ccDesign({
      driverProductId: null,
      connectorBlockProductId: null,
      links: [],
      fittings: Array.from({ length: 20 }, (_, i) => ({
        id: `f${i + 1}`,
        productId: 'spike',
        label: '',
        location: 'exposed-outdoor' as const,
        driveCurrentA: 0.35,
      })),
    });
    const s = suggestForCircuit(long, products, [driver350], settings);
    expect(s.drivers).toEqual([]);
    expect(s.split?.ok).toBe(true);
    expect(s.split!.strings.length).toBeGreaterThanOrEqual(2);
    expect(s.split!.strings[0]!.firstFitting).toBe(1);
    expect(s.split!.strings.at(-1)!.lastFitting).toBe(20);
  });
});

describe('evaluateCircuit, constant voltage', () => {
  it('gives the voltage at each fitting of a daisy chain', () => {
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
    const design: CvCircuitDesign = {
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
          fittings: ['a', 'b', 'c', 'd'].map((id) => ({
            id,
            productId: 'deck',
            label: '',
            location: 'under-decking' as const,
            spanLengthM: 5,
          })),
        },
      ],
      acknowledgements: [],
    };
    const e = evaluateCircuit(design, [supply, deck, flex15], settings);
    // 6 W / 12 V = 0.5 A each; loop per 5 m span 2 x 5 x 0.0133 x 1.1965 (IEC 60228 Table 3, 70 °C derived);
    // segment j carries every load beyond it (REFERENCES, voltage drop, derived)
    const r = 2 * 5 * 0.0133 * 1.1965;
    const v1 = 12 - 2 * r;
    const v2 = v1 - 1.5 * r;
    const v3 = v2 - 1 * r;
    const v4 = v3 - 0.5 * r;
    expect(e.cv!.runs[0]!.fittings.map((f) => f.voltageV)).toEqual([v1, v2, v3, v4].map((v) => expect.closeTo(v, 6)));
    expect(e.cv!.loadW).toBeCloseTo(24, 9);
    const takeoffCircuit = circuitTakeoff('c2', design, e)!;
    expect(takeoffCircuit.cableRuns.reduce((n, run) => n + run.length.value, 0)).toBe(20);
  });
});
