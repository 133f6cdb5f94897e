import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeQuoteTotals } from '../src/money';
import { materialQuoteLines, takeoff, type TakeoffCircuit, type TakeoffProduct } from '../src/takeoff';
import { feet, metres } from '../src/units/length';

// Invented demo catalogue (no real products).
const catalogue: TakeoffProduct[] = [
  {
    id: 'fx-spike-3w',
    name: 'Linnet 3 W spike light',
    category: 'fitting',
    fittingKind: 'spike',
    unitCostMinor: 2100,
    unitPriceMinor: 3900,
  },
  {
    id: 'fx-deck-1w',
    name: 'Wren 1 W deck light',
    category: 'fitting',
    fittingKind: 'deck',
    unitCostMinor: 900,
    unitPriceMinor: 1800,
  },
  { id: 'drv-350', name: 'Hollow 350 mA driver', category: 'driver', unitCostMinor: 2500, unitPriceMinor: 4500 },
  { id: 'psu-12v-60', name: 'Hollow 12 V 60 W supply', category: 'supply', unitCostMinor: 3000, unitPriceMinor: 5200 },
  { id: 'cab-2x1.5', name: '2-core 1.5 mm² outdoor flex', category: 'cable', unitCostMinor: 95, unitPriceMinor: 180 },
  {
    id: 'cab-2x2.5',
    name: '2-core 2.5 mm² outdoor flex',
    category: 'cable',
    unitCostMinor: 140,
    unitPriceMinor: 260,
    cutLengthM: 5,
  },
  {
    id: 'blk-gel-4',
    name: 'Gel-filled 4-way connector block',
    category: 'connector-block',
    unitCostMinor: 650,
    unitPriceMinor: 1100,
  },
  { id: 'seal-m16', name: 'M16 entry seal', category: 'seal', unitCostMinor: 40, unitPriceMinor: 90 },
  { id: 'red-m20-m16', name: 'M20 to M16 reducer', category: 'reducer', unitCostMinor: 60, unitPriceMinor: 120 },
  { id: 'box-ip66', name: 'IP66 driver enclosure', category: 'enclosure', unitCostMinor: 1500, unitPriceMinor: 2800 },
  { id: 'clip-pack', name: 'Cable clips, pack of 50', category: 'mounting', unitCostMinor: 300, unitPriceMinor: 600 },
];

const pathCircuit: TakeoffCircuit = {
  id: 'path',
  kind: 'constant-current',
  powerProductId: 'drv-350',
  fittings: [{ productId: 'fx-spike-3w', count: 6 }],
  cableRuns: [
    { id: 'lead', cableProductId: 'cab-2x1.5', length: metres(12.5), method: 'buried-trench' },
    { id: 'links', cableProductId: 'cab-2x1.5', length: metres(18.2), method: 'in-duct' },
  ],
  connectorBlocks: [{ productId: 'blk-gel-4', count: 3 }],
  seals: [
    { productId: 'seal-m16', count: 12 },
    { productId: 'red-m20-m16', count: 2 },
  ],
  accessories: [{ productId: 'box-ip66' }],
};

const deckCircuit: TakeoffCircuit = {
  id: 'deck',
  kind: 'constant-voltage',
  powerProductId: 'psu-12v-60',
  fittings: [{ productId: 'fx-deck-1w', count: 10 }],
  cableRuns: [
    { cableProductId: 'cab-2x1.5', length: metres(7), method: 'surface-clipped' },
    { cableProductId: 'cab-2x2.5', length: feet(30), method: 'surface-clipped' },
  ],
  accessories: [{ productId: 'clip-pack', count: 1 }],
};

describe('takeoff', () => {
  const result = takeoff({
    circuits: [pathCircuit, deckCircuit],
    catalogue,
    settings: { cableSlackBp: 1000, cableCutLengthM: 1 },
  });
  const byId = (id: string) => result.lines.find((l) => l.productId === id)!;

  it('lists every material grouped by category, with no findings for a clean design', () => {
    expect(result.findings).toEqual([]);
    expect(result.lines.map((l) => l.productId)).toEqual([
      'fx-spike-3w',
      'fx-deck-1w',
      'drv-350',
      'psu-12v-60',
      'cab-2x1.5',
      'cab-2x2.5',
      'blk-gel-4',
      'seal-m16',
      'red-m20-m16',
      'box-ip66',
      'clip-pack',
    ]);
  });

  it('counts items and says which circuit each came from', () => {
    expect(byId('fx-spike-3w')).toMatchObject({
      quantityMilli: 6000,
      unit: 'each',
      sources: [{ circuitId: 'path', quantityMilli: 6000 }],
    });
    expect(byId('seal-m16').quantityMilli).toBe(12_000);
    expect(byId('drv-350').sources).toEqual([{ circuitId: 'path', quantityMilli: 1000 }]);
  });

  it('adds slack to the cable runs per cable type and rounds up to the cut length', () => {
    // [derived] by hand: 12.5 + 18.2 + 7 = 37.7 m of 1.5 mm²; +10 % = 41.47 m; up to whole metres: 42 m.
    expect(byId('cab-2x1.5')).toMatchObject({
      unit: 'm',
      quantityMilli: 42_000,
      cable: { runMilli: 37_700, slackMilli: 3770, roundingMilli: 530, cutLengthMilli: 1000, runCount: 3 },
      sources: [
        { circuitId: 'path', quantityMilli: 30_700 },
        { circuitId: 'deck', quantityMilli: 7000 },
      ],
    });
    // 30 ft = 9.144 m exactly (international foot, 0.3048 m); +10 % = 10.0584 m; the product's own
    // 5 m cut length takes it up to 15 m.
    expect(byId('cab-2x2.5')).toMatchObject({
      quantityMilli: 15_000,
      cable: { runMilli: 9144, slackMilli: 915, cutLengthMilli: 5000 },
    });
  });

  it('feeds the estimate: material lines priced through money', () => {
    const q = materialQuoteLines(result.lines, { vatRateBp: 2000 });
    expect(q.findings).toEqual([]);
    const totals = computeQuoteTotals({ lines: q.lines, vatRounding: 'line-nearest-1p' });
    // 42 m x £1.80 = £75.60; 15 m x £2.60 = £39.00
    expect(totals.lines.find((l) => l.id === 'material:cab-2x1.5')!.netMinor).toBe(7560);
    expect(totals.lines.find((l) => l.id === 'material:cab-2x2.5')!.netMinor).toBe(3900);
    expect(totals.netMinor).toBe(6 * 3900 + 10 * 1800 + 4500 + 5200 + 7560 + 3900 + 3 * 1100 + 12 * 90 + 2 * 120 + 2800 + 600);
  });

  it('reports mismatches instead of crashing', () => {
    const bad = takeoff({
      catalogue,
      circuits: [
        { ...deckCircuit, id: 'wrong-power', powerProductId: 'drv-350' },
        {
          ...pathCircuit,
          id: 'odd',
          fittings: [{ productId: 'nope' }, { productId: 'cab-2x1.5' }, { productId: 'fx-spike-3w', count: 1.5 }],
        },
        { ...pathCircuit, id: 'odd', cableRuns: [{ cableProductId: 'cab-2x1.5', length: metres(-3), method: 'in-duct' }] },
      ],
    });
    const codes = bad.findings.map((f) => f.code);
    expect(codes).toEqual(
      expect.arrayContaining([
        'power-product-mismatch',
        'product-unknown',
        'product-wrong-category',
        'item-count-invalid',
        'circuit-duplicate-id',
        'length-invalid',
      ]),
    );
    expect(bad.findings.find((f) => f.code === 'power-product-mismatch')!.severity).toBe('error');
  });

  it('gives JSON-serialisable results', () => {
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
  });

  it('treats a catalogue price that is not whole minor units as missing', () => {
    const r = takeoff({
      catalogue: [{ ...catalogue[0]!, unitPriceMinor: 39.5 }],
      circuits: [
        { ...pathCircuit, powerProductId: 'fx-spike-3w', cableRuns: [], connectorBlocks: [], seals: [], accessories: [] },
      ],
    });
    expect(r.findings.map((f) => f.code)).toContain('catalogue-price-invalid');
    expect(r.lines[0]!.unitPriceMinor).toBeNull();
    expect(materialQuoteLines(r.lines, { vatRateBp: 2000 }).findings.map((f) => f.code)).toEqual(['price-missing']);
  });

  it('uses the firm defaults (10 % slack, 1 m cut) when no settings are given', () => {
    const r = takeoff({
      catalogue,
      circuits: [{ ...deckCircuit, cableRuns: [{ cableProductId: 'cab-2x1.5', length: metres(10), method: 'in-duct' }] }],
    });
    expect(r.lines.find((l) => l.productId === 'cab-2x1.5')!.quantityMilli).toBe(11_000);
  });
});

describe('takeoff properties', () => {
  const circuitArb = (i: number) =>
    fc
      .record({
        fittings: fc.array(
          fc.record({ productId: fc.constantFrom('fx-spike-3w', 'fx-deck-1w'), count: fc.integer({ min: 0, max: 20 }) }),
          { maxLength: 4 },
        ),
        runs: fc.array(
          fc.record({ cable: fc.constantFrom('cab-2x1.5', 'cab-2x2.5'), mm: fc.integer({ min: 0, max: 200_000 }) }),
          { maxLength: 5 },
        ),
        blocks: fc.integer({ min: 0, max: 10 }),
      })
      .map((r): TakeoffCircuit => ({
        id: `c${i}`,
        kind: 'constant-current',
        powerProductId: 'drv-350',
        fittings: r.fittings,
        cableRuns: r.runs.map((x) => ({
          cableProductId: x.cable,
          length: metres(x.mm / 1000),
          method: 'buried-trench' as const,
        })),
        connectorBlocks: [{ productId: 'blk-gel-4', count: r.blocks }],
      }));
  const designArb = fc.integer({ min: 1, max: 6 }).chain((n) => fc.tuple(...Array.from({ length: n }, (_, i) => circuitArb(i))));

  it('counted lines equal the sum of their sources, and cable covers runs plus slack within one cut', () => {
    fc.assert(
      fc.property(designArb, fc.integer({ min: 0, max: 3000 }), fc.integer({ min: 1, max: 50 }), (circuits, slackBp, cutM) => {
        const r = takeoff({ circuits, catalogue, settings: { cableSlackBp: slackBp, cableCutLengthM: cutM } });
        expect(r.findings.filter((f) => f.severity === 'error')).toEqual([]);
        for (const l of r.lines) {
          const fromSources = l.sources.reduce((s, x) => s + x.quantityMilli, 0);
          if (l.cable) {
            expect(fromSources).toBe(l.cable.runMilli);
            const need = (l.cable.runMilli * (10_000 + slackBp)) / 10_000;
            expect(l.quantityMilli).toBeGreaterThanOrEqual(need);
            expect(l.quantityMilli - need).toBeLessThan(l.cable.cutLengthMilli + 1);
            expect(l.quantityMilli % l.cable.cutLengthMilli).toBe(0);
            expect(l.cable.runMilli + l.cable.slackMilli + l.cable.roundingMilli).toBe(l.quantityMilli);
          } else {
            expect(fromSources).toBe(l.quantityMilli);
          }
        }
        const drivers = r.lines.find((l) => l.productId === 'drv-350')!;
        expect(drivers.quantityMilli).toBe(circuits.length * 1000);
      }),
      { numRuns: 200 },
    );
  });
});
