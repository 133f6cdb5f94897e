/**
 * The circuit editor's pure pieces: reordering in wiring order, the drive current a product
 * suggests, links matched to the block plan, and the live check agreeing with a stored one.
 * Figures: a series string's voltage is the sum of its forward voltages (definition); a block
 * that passes a link on needs fittings + 2 terminals (common practice, the engine's block plan).
 */
import { describe, expect, it } from 'vitest';
import { CircuitDesign, Product, emptyCircuitDesign, type CcCircuitDesign } from '@gloaming/contracts';
import { evaluateCircuit } from '@gloaming/engine';
import { addFitting, defaultDriveCurrentA, fitLinks, moveFitting, moveItem } from '../../src/features/circuits/design-edits';
import { agreesWithSaved } from '../../src/features/circuits/hooks/use-live-circuit';

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
  id: '00000000-0000-4000-8000-000000000001',
  kind: 'fitting',
  supplierCode: 'OW-SP3',
  name: 'Fernlight spike',
  costMinor: 2100,
  listPriceMinor: 3900,
  spec: {
    driveMode: 'constant-current',
    ratings: [
      { currentA: 0.5, forwardVoltageV: 3.2 },
      { currentA: 0.35, forwardVoltageV: 3.0 },
    ],
    ipCode: 'IP66',
  },
});
const block = Product.parse({
  ...common,
  id: '00000000-0000-4000-8000-000000000002',
  kind: 'connector-block',
  supplierCode: 'OW-G6',
  name: 'Six-way gel box',
  costMinor: 600,
  listPriceMinor: 1100,
  spec: { terminals: 6, entries: 6, conductorsPerTerminal: 2, ipCode: 'IP68' },
});

function sixFittings(): CcCircuitDesign {
  let d = emptyCircuitDesign('constant-current') as CcCircuitDesign;
  for (let i = 0; i < 6; i++) d = addFitting(d, spike);
  return { ...d, connectorBlockProductId: block.id };
}

describe('circuit design edits', () => {
  it('moves an item and clamps at the ends', () => {
    expect(moveItem(['a', 'b', 'c'], 0, 1)).toEqual(['b', 'a', 'c']);
    expect(moveItem(['a', 'b', 'c'], 2, 1)).toEqual(['a', 'b', 'c']);
    expect(moveItem(['a', 'b', 'c'], 2, -2)).toEqual(['c', 'a', 'b']);
  });

  it('adds fittings with their own ids at the lowest rated current, and reorders them', () => {
    const d = sixFittings();
    expect(d.fittings.map((f) => f.id)).toEqual(['f1', 'f2', 'f3', 'f4', 'f5', 'f6']);
    expect(defaultDriveCurrentA(spike)).toBe(0.35);
    expect(d.fittings.every((f) => f.driveCurrentA === 0.35)).toBe(true);
    expect(moveFitting(d, 5, -1).fittings.map((f) => f.id)).toEqual(['f1', 'f2', 'f3', 'f4', 'f6', 'f5']);
    expect(CircuitDesign.safeParse(d).success).toBe(true);
  });

  it('matches the link cables to the blocks the plan uses', () => {
    const d = sixFittings();
    const e = evaluateCircuit(d, [spike, block], { profile: 'uk-iec' });
    // 6 terminals: 4 fittings in a block a link leaves (4 + 2), then 2
    expect(e.blocks?.blocks.map((b) => b.fittings)).toEqual([
      [1, 2, 3, 4],
      [5, 6],
    ]);
    expect(fitLinks(d, e.blocks!.blocks.length).links).toHaveLength(1);
    expect(fitLinks(fitLinks(d, 2), 1).links).toHaveLength(0);
  });

  it('agrees with a stored check only when it is the same', () => {
    const d = sixFittings();
    const live = evaluateCircuit(d, [spike, block], { profile: 'uk-iec' });
    expect(live.preview?.stringForwardVoltageV).toBeCloseTo(18, 9); // 6 x 3.0 V at 350 mA
    const stored = JSON.parse(JSON.stringify(live)) as unknown;
    expect(agreesWithSaved(live, stored)).toBe(true);
    const moved = evaluateCircuit(
      { ...d, fittings: d.fittings.map((f, i) => (i === 0 ? { ...f, driveCurrentA: 0.5 } : f)) },
      [spike, block],
      { profile: 'uk-iec' },
    );
    expect(agreesWithSaved(moved, stored)).toBe(false);
  });
});
