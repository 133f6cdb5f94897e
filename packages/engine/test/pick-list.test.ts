/**
 * The installer's pick list. Slack of 10 % on every cut is common practice (the takeoff's
 * default); one terminal and one sealed entry per joint is common practice (block planner).
 */
import { describe, expect, it } from 'vitest';
import {
  circuitPickList,
  cutLengthM,
  evaluateCircuit,
  loadGroups,
  type CcCircuitDesign,
  type CvCircuitDesign,
  type DesignProduct,
} from '../src/index';

const base = { unit: 'each', supplierCode: 'X', costMinor: 2100, listPriceMinor: 3900 };
const products: DesignProduct[] = [
  {
    ...base,
    id: 'cable',
    kind: 'cable',
    supplierCode: 'C15',
    name: 'Two-core flex 1.5',
    unit: 'm',
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
  },
  {
    ...base,
    id: 'spike',
    kind: 'fitting',
    supplierCode: 'SP3',
    name: 'Fern spike',
    spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.35, forwardVoltageV: 3.0 }], ipCode: 'IP66' },
  },
  {
    ...base,
    id: 'drv',
    kind: 'driver',
    supplierCode: 'D350',
    name: 'Lantern 350/20',
    spec: { currentA: 0.35, voltageWindowV: { minV: 6, maxV: 48 }, maxPowerW: 20, efficiencyPct: 88, ipCode: 'IP66' },
  },
  {
    ...base,
    id: 'blk',
    kind: 'connector-block',
    supplierCode: 'G6',
    name: 'Six-way gel box',
    spec: { terminals: 6, entries: 6, conductorsPerTerminal: 2, ipCode: 'IP68' },
  },
  {
    ...base,
    id: 'bol',
    kind: 'fitting',
    name: 'Bollard 12 V',
    spec: { driveMode: 'constant-voltage', nominalVoltageV: 12, powerW: 4, ipCode: 'IP65' },
  },
  {
    ...base,
    id: 'psu',
    kind: 'cv-supply',
    name: 'Supply 12 V 60 W',
    spec: { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP67' },
  },
];

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
  driverLead: { cableProductId: 'cable', lengthM: 12, method: 'buried-trench' },
  links: [{ cableProductId: 'cable', lengthM: 8.05, method: 'buried-trench' }],
  extensions: [],
  connectorBlockProductId: 'blk',
  assignment: null,
  acknowledgements: [],
};

describe('cutLengthM', () => {
  it('adds the slack and rounds up to the next 0.1 m', () => {
    expect(cutLengthM(12, 1000)).toBe(13.2); // 12 m + 10 % exactly
    expect(cutLengthM(8.05, 1000)).toBe(8.9); // 8.855 m up to 8.9
    expect(cutLengthM(10, 0)).toBe(10);
    expect(cutLengthM(0.01, 1000)).toBe(0.1);
  });
});

describe('circuitPickList', () => {
  it('puts the driver and the cuts on the bench, fittings, blocks and seals in the van, and no prices', () => {
    const evaluation = evaluateCircuit(cc, products, { profile: 'uk-iec' });
    const list = circuitPickList(cc, evaluation, products, { cableSlackBp: 1000 });
    const plan = evaluation.blocks!;
    const q = Object.fromEntries(list.items.map((i) => [i.key, [i.quantity, i.place]]));
    expect(q).toEqual({
      drv: [1, 'bench'],
      spike: [6, 'van'],
      blk: [plan.blocks.length, 'van'],
      'Entry seals': [plan.totals.seals, 'van'],
      ...(plan.totals.blankingPlugs ? { 'Blanking plugs': [plan.totals.blankingPlugs, 'van'] } : {}),
      ...(plan.totals.reducers ? { 'Seal reducers': [plan.totals.reducers, 'van'] } : {}),
    });
    // 6 fittings over two six-way blocks: a joint each plus the link in block 1 (common practice)
    expect(plan.blocks.length).toBe(2);
    expect(list.cuts.map((c) => [c.label, c.runM, c.cutM])).toEqual([
      ['Driver lead (driver to block 1)', 12, 13.2],
      ['Link 1 (block 1 to block 2)', 8.05, 8.9],
    ]);
    expect(JSON.stringify(list)).not.toMatch(/Minor|price|cost/i);
  });

  it('cuts every span of a constant-voltage daisy chain from the one before', () => {
    const cv: CvCircuitDesign = {
      kind: 'constant-voltage',
      supplyProductId: 'psu',
      supplyLocation: 'driver-outdoors',
      runs: [
        {
          id: 'r',
          label: 'Courtyard',
          layout: 'daisy-chain',
          cableProductId: 'cable',
          method: 'in-duct',
          feederLengthM: 0,
          fittings: [
            { id: 'a', productId: 'bol', label: 'Gate', location: 'exposed-outdoor', spanLengthM: 6 },
            { id: 'b', productId: 'bol', label: 'Bench', location: 'exposed-outdoor', spanLengthM: 4 },
          ],
        },
      ],
      acknowledgements: [],
    };
    const list = circuitPickList(cv, evaluateCircuit(cv, products, { profile: 'uk-iec' }), products);
    expect(list.cuts.map((c) => [c.label, c.cutM])).toEqual([
      ['Courtyard: supply to Gate', 6.6],
      ['Courtyard: Gate to Bench', 4.4],
    ]);
    const groups = loadGroups([{ circuit: 'Courtyard', list }]);
    expect(groups.map((g) => g.place)).toEqual(['bench', 'van']);
    expect(groups[0]!.cableTotals).toEqual([{ productId: 'cable', code: 'C15', name: 'Two-core flex 1.5', totalM: 11 }]);
    expect(groups[1]!.items).toEqual([expect.objectContaining({ key: 'bol', quantity: 2 })]);
  });

  it('refuses a slack that is not whole basis points', () => {
    const list = circuitPickList(cc, evaluateCircuit(cc, products, { profile: 'uk-iec' }), products, { cableSlackBp: 10.5 });
    expect(list.findings.map((f) => f.code)).toEqual(['setting-invalid']);
  });
});
