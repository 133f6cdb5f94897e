/**
 * Placing fittings in connector blocks by hand: each fitting's block read from the design or
 * the engine's plan, and a pick that keeps the series order (the string runs through block 1,
 * then block 2, ... — the block plan's rule, common practice) and checks clean in the engine.
 */
import { describe, expect, it } from 'vitest';
import { Product, type CcCircuitDesign } from '@gloaming/contracts';
import { evaluateCircuit } from '@gloaming/engine';
import { assignFittingToBlock, fittingBlocks, letEngineAssign } from '../../src/features/circuits/design-edits';

const when = '2026-12-01T00:00:00.000Z';
const common = {
  supplier: 'Owlbrook Trade',
  description: '',
  unit: 'each',
  active: true,
  createdAt: when,
  updatedAt: when,
  version: 1,
};
const spike = Product.parse({
  ...common,
  id: '00000000-0000-4000-8000-000000000011',
  kind: 'fitting',
  supplierCode: 'OW-SP3',
  name: 'Fernlight spike',
  costMinor: 2100,
  listPriceMinor: 3900,
  spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.35, forwardVoltageV: 3.0 }], ipCode: 'IP66' },
});
const block = Product.parse({
  ...common,
  id: '00000000-0000-4000-8000-000000000012',
  kind: 'connector-block',
  supplierCode: 'OW-G6',
  name: 'Six-way gel box',
  costMinor: 600,
  listPriceMinor: 1100,
  spec: { terminals: 6, entries: 6, conductorsPerTerminal: 2, ipCode: 'IP68' },
});

const design: CcCircuitDesign = {
  kind: 'constant-current',
  driverProductId: null,
  driverLocation: 'driver-outdoors',
  fittings: Array.from({ length: 6 }, (_, i) => ({
    id: `f${i + 1}`,
    productId: spike.id,
    label: '',
    location: 'exposed-outdoor' as const,
    driveCurrentA: 0.35,
  })),
  driverLead: null,
  links: [],
  extensions: [],
  connectorBlockProductId: block.id,
  assignment: null,
  acknowledgements: [],
};
const settings = { profile: 'uk-iec' as const };

describe('block assignment', () => {
  it("reads each fitting's block from the engine's plan when the design leaves it to the engine", () => {
    const plan = evaluateCircuit(design, [spike, block], settings).blocks!.blocks;
    // six-way block passing a link on takes fittings + 2 terminals: 4, then 2 (common practice)
    expect(fittingBlocks(design, plan)).toEqual([1, 1, 1, 1, 2, 2]);
    expect(fittingBlocks(design, null)).toEqual([null, null, null, null, null, null]);
  });

  it('moves a fitting to another block, carrying the later ones so the order holds', () => {
    const blocks = [1, 1, 1, 1, 2, 2];
    const next = assignFittingToBlock(design, blocks, 2, 2);
    expect(next.assignment).toEqual([
      ['f1', 'f2'],
      ['f3', 'f4', 'f5', 'f6'],
    ]);
    expect(fittingBlocks(next, null)).toEqual([1, 1, 2, 2, 2, 2]);
    const e = evaluateCircuit(next, [spike, block], settings);
    expect(e.blocks!.blocks.map((b) => b.fittings)).toEqual([
      [1, 2],
      [3, 4, 5, 6],
    ]);
    expect(e.findings.filter((f) => f.code.startsWith('assignment-'))).toEqual([]);
  });

  it('pulls earlier fittings back and drops blocks left empty', () => {
    // fitting 5 into block 1: fittings 1-4 are there already; block 2 keeps only fitting 6
    const next = assignFittingToBlock(design, [1, 1, 1, 1, 2, 2], 4, 1);
    expect(next.assignment).toEqual([['f1', 'f2', 'f3', 'f4', 'f5'], ['f6']]);
    // fitting 1 into a new block 3: everything after it follows, blocks 1 and 2 empty and dropped
    expect(assignFittingToBlock(design, [1, 1, 1, 1, 2, 2], 0, 3).assignment).toEqual([['f1', 'f2', 'f3', 'f4', 'f5', 'f6']]);
  });

  it('reports an over-full block from the engine rather than refusing the pick', () => {
    const next = assignFittingToBlock(design, [1, 1, 1, 1, 2, 2], 5, 1); // all six in one six-way block: 7 joints
    expect(next.assignment).toEqual([['f1', 'f2', 'f3', 'f4', 'f5', 'f6']]);
    const codes = evaluateCircuit(next, [spike, block], settings).findings.map((f) => f.code);
    expect(codes.some((c) => c === 'block-over-capacity' || c === 'block-too-small')).toBe(true);
  });

  it('hands the blocks back to the engine, and ignores picks out of range', () => {
    const manual = assignFittingToBlock(design, [1, 1, 1, 1, 2, 2], 2, 2);
    expect(letEngineAssign(manual).assignment).toBeNull();
    expect(assignFittingToBlock(design, [], 9, 1)).toBe(design);
    expect(assignFittingToBlock(design, [], 0, 0)).toBe(design);
  });
});
