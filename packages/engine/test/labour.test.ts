import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { labour, labourQuoteLines, type LabourTable } from '../src/labour';
import { computeQuoteTotals } from '../src/money';
import type { TakeoffCircuit, TakeoffProduct } from '../src/takeoff';
import { metres } from '../src/units/length';

// Invented demo catalogue and labour table (an invented firm's figures).
const catalogue: TakeoffProduct[] = [
  { id: 'fx-spike', name: 'Linnet spike light', category: 'fitting', fittingKind: 'spike' },
  { id: 'fx-inground', name: 'Marten in-ground uplight', category: 'fitting', fittingKind: 'in-ground' },
  { id: 'fx-pond', name: 'Heron pond light', category: 'fitting', fittingKind: 'underwater' },
  { id: 'drv', name: 'Hollow 350 mA driver', category: 'driver' },
  { id: 'cab', name: '2-core 1.5 mm² flex', category: 'cable' },
  { id: 'blk', name: 'Gel connector block', category: 'connector-block' },
];

const table: LabourTable = {
  minutesPerFitting: { spike: 12, 'in-ground': 45 },
  minutesPerDriver: 30,
  minutesPerConnectorBlock: 8,
  minutesPerMetre: { 'surface-clipped': 1.5, 'buried-trench': 6, 'in-duct': 2.25 },
  minutesPerCircuitTest: 20,
  rateMinorPerHour: 4500,
  costMinorPerHour: 2800,
};

const circuit: TakeoffCircuit = {
  id: 'front-bed',
  kind: 'constant-current',
  powerProductId: 'drv',
  fittings: [
    { productId: 'fx-spike', count: 5 },
    { productId: 'fx-inground', count: 2 },
  ],
  cableRuns: [
    { cableProductId: 'cab', length: metres(10), method: 'buried-trench' },
    { cableProductId: 'cab', length: metres(4.2), method: 'surface-clipped' },
  ],
  connectorBlocks: [{ productId: 'blk', count: 3 }],
};

describe('labour', () => {
  it('adds minutes per task from the labour table and prices them at the hourly rate', () => {
    const r = labour({ circuits: [circuit], catalogue, table });
    expect(r.findings).toEqual([]);
    // [derived] by hand: spikes 5 x 12 = 60; in-ground 2 x 45 = 90; driver 30; blocks 3 x 8 = 24;
    // trench 10 m x 6 = 60; clipped 4.2 m x 1.5 = 6.3; test 20. Total 290.3 min.
    expect(r.lines.map((l) => [l.task, l.key, l.minutesMilli])).toEqual([
      ['fitting', 'spike', 60_000],
      ['fitting', 'in-ground', 90_000],
      ['driver', 'driver', 30_000],
      ['connector-block', 'connector-block', 24_000],
      ['cable', 'buried-trench', 60_000],
      ['cable', 'surface-clipped', 6300],
      ['testing', 'testing', 20_000],
    ]);
    expect(r.minutesMilli).toBe(290_300);
    // 290.3 min at £45/h = £217.725 -> £217.73 (half-up); cost at £28/h = £135.473 -> £135.47
    expect(r.priceMinor).toBe(21_773);
    expect(r.costMinor).toBe(13_547);
    expect(r.lines.reduce((s, l) => s + l.priceMinor, 0)).toBe(r.priceMinor);
    expect(r.byCircuit).toEqual([{ circuitId: 'front-bed', minutesMilli: 290_300 }]);
  });

  it('gives JSON-serialisable results', () => {
    const r = labour({ circuits: [circuit], catalogue, table });
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it('becomes estimate lines that add up to the labour price', () => {
    const r = labour({ circuits: [circuit, { ...circuit, id: 'back-bed' }], catalogue, table });
    const q = computeQuoteTotals({ lines: labourQuoteLines(r, { vatRateBp: 2000 }), vatRounding: 'invoice-down-1p' });
    expect(q.netMinor).toBe(r.priceMinor);
    expect(q.costMinor).toBe(r.costMinor);
    expect(r.lines[0]!.sources).toEqual([
      { circuitId: 'front-bed', minutesMilli: 60_000 },
      { circuitId: 'back-bed', minutesMilli: 60_000 },
    ]);
  });

  it('reports a fitting kind with no minutes, or falls back to the default', () => {
    const c: TakeoffCircuit = { ...circuit, fittings: [{ productId: 'fx-pond', count: 2 }] };
    const missing = labour({ circuits: [c], catalogue, table });
    expect(missing.findings.map((f) => f.code)).toEqual(['labour-rate-missing']);
    expect(missing.lines.some((l) => l.task === 'fitting')).toBe(false);
    const withDefault = labour({ circuits: [c], catalogue, table: { ...table, defaultMinutesPerFitting: 25 } });
    expect(withDefault.lines.find((l) => l.task === 'fitting')).toMatchObject({ key: 'underwater', minutesMilli: 50_000 });
  });

  it('reports a malformed labour table instead of crashing', () => {
    const r = labour({ circuits: [circuit], catalogue, table: { ...table, minutesPerDriver: -5, rateMinorPerHour: 45.5 } });
    expect(r.findings.map((f) => f.code)).toEqual(['labour-table-invalid', 'labour-table-invalid']);
    expect(r.priceMinor).toBe(0);
  });

  it('line shares always add up to the price (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            spikes: fc.integer({ min: 0, max: 40 }),
            mm: fc.integer({ min: 0, max: 500_000 }),
            blocks: fc.integer({ min: 0, max: 20 }),
          }),
          {
            minLength: 1,
            maxLength: 8,
          },
        ),
        fc.integer({ min: 0, max: 20_000 }),
        (cs, rate) => {
          const circuits: TakeoffCircuit[] = cs.map((x, i) => ({
            id: `c${i}`,
            kind: 'constant-current',
            powerProductId: 'drv',
            fittings: [{ productId: 'fx-spike', count: x.spikes }],
            cableRuns: [{ cableProductId: 'cab', length: metres(x.mm / 1000), method: 'in-duct' }],
            connectorBlocks: [{ productId: 'blk', count: x.blocks }],
          }));
          const r = labour({ circuits, catalogue, table: { ...table, rateMinorPerHour: rate } });
          expect(r.lines.reduce((s, l) => s + l.priceMinor, 0)).toBe(r.priceMinor);
          expect(r.byCircuit.reduce((s, c) => s + c.minutesMilli, 0)).toBe(r.minutesMilli);
          expect(r.lines.reduce((s, l) => s + l.minutesMilli, 0)).toBe(r.minutesMilli);
          // price within half a minor unit of minutes x rate / 60
          expect(Math.abs(r.priceMinor - (r.minutesMilli * rate) / 60_000)).toBeLessThanOrEqual(0.5);
        },
      ),
      { numRuns: 200 },
    );
  });
});
