/**
 * Connector blocks and the terminal schedule. Rules checked (../shared/REFERENCES.md,
 * "LEDs and drivers", all common practice):
 * - series rule of thumb: driver + lands on fitting 1 +, each later fitting's + picks up the
 *   previous fitting's -, the last fitting's - returns to the driver's -;
 * - constant-current fittings in series on one driver.
 * Entry seals and blanking plugs: a seal on every used entry, a blanking plug in every spare
 * one, a reducer for a cable thinner than the entry's range (common practice).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  blockLayoutFromSeries,
  blockNeeds,
  checkWiring,
  electricalNodes,
  planConnectorBlocks,
  type BlockPlanInput,
  type ConnectorBlockType,
  type StringFittingRef,
} from '../src/index';

const blockType = (terminals: number, cableEntries = terminals, extra: Partial<ConnectorBlockType> = {}): ConnectorBlockType => ({
  name: 'Test block',
  terminals,
  cableEntries,
  conductorsPerTerminal: 2,
  ipCode: 'IP68',
  ...extra,
});
const fittings = (n: number, f: (i: number) => StringFittingRef = () => ({})): StringFittingRef[] =>
  Array.from({ length: n }, (_, i) => f(i));
type PlanArgs = Partial<BlockPlanInput> & { n?: number };
const plan = (input: PlanArgs) =>
  planConnectorBlocks({
    string: input.string ?? { fittings: fittings(input.n ?? 3), linkCable: { lengthM: 6 } },
    blockType: input.blockType ?? blockType(6),
    ...(input.assignment ? { assignment: input.assignment } : {}),
  });
const errorCodes = (p: ReturnType<typeof plan>) => p.findings.filter((f) => f.severity === 'error').map((f) => f.code);

describe('block needs', () => {
  // one terminal per joint (fittings + 1), one more for the return passing through when a link leaves
  it.each([
    [1, 'only', 2],
    [4, 'only', 5],
    [1, 'first', 3],
    [3, 'middle', 5],
    [3, 'last', 4],
  ] as const)('%i fitting(s) in the %s block need %i terminals and entries', (k, position, needed) => {
    expect(blockNeeds(k, position)).toEqual({ terminals: needed, entries: needed });
  });
});

describe('assigning fittings to blocks in order by capacity', () => {
  it.each([
    // terminals, entries, fittings -> fittings per block
    [6, 6, 5, [5]],
    [6, 6, 6, [4, 2]],
    [6, 6, 7, [4, 3]],
    [6, 6, 13, [4, 4, 5]],
    [3, 3, 3, [1, 2]],
    [3, 3, 4, [1, 1, 2]],
    [12, 4, 5, [2, 3]], // entries are the limit
    [4, 12, 5, [2, 3]], // terminals are the limit
    [2, 2, 1, [1]],
  ])('%i terminals, %i entries, %i fittings -> %j', (t, e, n, sizes) => {
    const p = plan({ n, blockType: blockType(t, e) });
    expect(errorCodes(p)).toEqual([]);
    expect(p.blocks.map((b) => b.fittings.length)).toEqual(sizes);
    expect(p.links).toHaveLength(sizes.length - 1);
  });

  it('uses the fewest blocks the capacity allows, never over a block, fittings in order', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.integer({ min: 3, max: 12 }), fc.integer({ min: 3, max: 12 }), (n, t, e) => {
        const p = plan({ n, blockType: blockType(t, e) });
        const room = Math.min(t, e);
        // lower bound: every block but the last loses two places (joint into it, return through it), the last one
        const fewest = n <= room - 1 ? 1 : 1 + Math.ceil((n - (room - 1)) / (room - 2));
        expect(p.blocks).toHaveLength(fewest);
        expect(p.blocks.flatMap((b) => b.fittings)).toEqual(fittings(n).map((_, i) => i + 1));
        for (const b of p.blocks) {
          expect(b.terminals.length).toBeLessThanOrEqual(t);
          expect(b.entries.used).toBeLessThanOrEqual(e);
          for (const term of b.terminals) expect(term.conductors.length).toBeLessThanOrEqual(2);
        }
      }),
      { numRuns: 200 },
    );
  }, 30_000);
});

describe('terminal schedule follows the series rule', () => {
  it('lands the seven fittings of a two-block string as the series rule says', () => {
    const p = plan({ n: 7, blockType: blockType(6) });
    expect(p.blocks.map((b) => b.terminals.map((t) => t.conductors))).toEqual([
      [
        ['driver+', 'fitting:1+'],
        ['fitting:1-', 'fitting:2+'],
        ['fitting:2-', 'fitting:3+'],
        ['fitting:3-', 'fitting:4+'],
        ['fitting:4-', 'link:1/core:1/end:A'],
        ['driver-', 'link:1/core:2/end:A'],
      ],
      [
        ['link:1/core:1/end:B', 'fitting:5+'],
        ['fitting:5-', 'fitting:6+'],
        ['fitting:6-', 'fitting:7+'],
        ['fitting:7-', 'link:1/core:2/end:B'],
      ],
    ]);
    expect(p.links).toEqual([{ number: 1, fromBlock: 1, toBlock: 2, lengthM: 6, cores: 2, forwardCore: 1, returnCore: 2 }]);
  });

  it('for any size and capacity the electrical nodes are exactly driver+/f1+, fk-/fk+1+, fn-/driver-', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 3, max: 9 }), (n, t) => {
        const p = plan({ n, blockType: blockType(t) });
        const r = checkWiring(p);
        expect(r.ok).toBe(true);
        expect(r.seriesOrder).toEqual(fittings(n).map((_, i) => i + 1));
        const expected = [['driver+', 'fitting:1+']];
        for (let k = 1; k < n; k++) expected.push([`fitting:${k}-`, `fitting:${k + 1}+`]);
        expected.push([`fitting:${n}-`, 'driver-']);
        const got = electricalNodes(p).map((x) => [...x.ends].sort()).sort();
        expect(got).toEqual(expected.map((x) => x.sort()).sort());
      }),
      { numRuns: 150 },
    );
  }, 30_000);

  it('carries the return leg on core 2 of every link, back through every block to the driver', () => {
    const p = plan({ n: 10, blockType: blockType(4) });
    expect(p.blocks.length).toBeGreaterThan(3);
    for (const link of p.links) {
      expect(link.returnCore).toBe(2);
      const from = p.blocks[link.fromBlock - 1]!;
      const back = from.terminals.find((t) => t.conductors.includes(`link:${link.number}/core:2/end:A`))!;
      const inbound = link.fromBlock === 1 ? 'driver-' : `link:${link.number - 1}/core:2/end:B`;
      expect(back.conductors).toEqual([inbound, `link:${link.number}/core:2/end:A`]);
    }
    const last = p.blocks[p.blocks.length - 1]!;
    expect(last.terminals[last.terminals.length - 1]!.conductors).toEqual(['fitting:10-', `link:${p.links.length}/core:2/end:B`]);
  });

  it('takes a given assignment as it is', () => {
    const p = plan({
      string: { fittings: fittings(5, (i) => ({ id: `lamp-${i + 1}` })), linkCable: { lengthsM: [4, 9.5] } },
      blockType: blockType(6),
      assignment: [['lamp-1'], ['lamp-2', 'lamp-3', 'lamp-4'], ['lamp-5']],
    });
    expect(errorCodes(p)).toEqual([]);
    expect(p.blocks.map((b) => b.fittings)).toEqual([[1], [2, 3, 4], [5]]);
    expect(p.links.map((l) => l.lengthM)).toEqual([4, 9.5]);
    expect(p.totals.linkLengthM).toBe(13.5);
    expect(checkWiring(p).ok).toBe(true);
  });
});

describe('entries, seals, reducers and blanking plugs', () => {
  it('counts a seal per used entry, a reducer per thin cable and a plug per spare entry', () => {
    const p = plan({
      string: {
        fittings: fittings(7, (i) => ({ tail: { outerDiameterMm: i % 2 === 0 ? 5 : 7 } })),
        driverLead: { outerDiameterMm: 8 },
        linkCable: { lengthM: 10, outerDiameterMm: 8 },
      },
      blockType: blockType(6, 8, { entrySealRangeMm: { min: 6, max: 10 } }),
    });
    const [b1, b2] = p.blocks;
    // block 1: driver lead, fittings 1-4, link 1 = 6 of 8 entries; fittings 1 and 3 are 5 mm (< 6)
    expect(b1!.entries).toMatchObject({ total: 8, used: 6, spare: 2, seals: 6, reducers: 2, blankingPlugs: 2 });
    // block 2: link 1, fittings 5-7 = 4 of 8; fittings 5 and 7 are 5 mm
    expect(b2!.entries).toMatchObject({ total: 8, used: 4, spare: 4, seals: 4, reducers: 2, blankingPlugs: 4 });
    expect(b1!.entries.cables.map((c) => c.cable)).toEqual(['driver-lead', 'fitting:1', 'fitting:2', 'fitting:3', 'fitting:4', 'link:1']);
    expect(p.totals).toMatchObject({ blocks: 2, seals: 10, reducers: 4, blankingPlugs: 6 });
    expect(p.findings).toEqual([]);
  });

  it('rejects a cable too thick for the entries', () => {
    const p = plan({
      string: { fittings: fittings(2, (i) => ({ tail: { outerDiameterMm: i === 1 ? 12 : 7 } })), driverLead: { outerDiameterMm: 7 } },
      blockType: blockType(6, 6, { entrySealRangeMm: { min: 6, max: 10 } }),
    });
    expect(errorCodes(p)).toEqual(['cable-too-large-for-entry']);
    expect(p.blocks[0]!.entries.cables[2]).toMatchObject({ cable: 'fitting:2', fit: 'too-large' });
  });

  it('notes when cable sizes are unknown', () => {
    const p = plan({ n: 2 });
    expect(p.findings.map((f) => [f.code, f.severity])).toEqual([['cable-size-unknown', 'info']]);
  });

  it('rejects conductors outside the terminal clamping range', () => {
    const p = plan({
      string: { fittings: fittings(2, () => ({ tail: { conductorMm2: 0.5 } })), driverLead: { conductorMm2: 6 } },
      blockType: blockType(6, 6, { terminalRangeMm2: { min: 0.5, max: 4 } }),
    });
    expect(p.findings.filter((f) => f.code === 'conductor-outside-terminal-range').map((f) => f.subject)).toEqual(['driver']);
  });
});

describe('bad input gives clear findings', () => {
  const five = { fittings: fittings(5, (i) => ({ id: `F${i + 1}` })), linkCable: { lengthM: 3 } };
  it.each<[string, PlanArgs, string[]]>([
    ['block too small for one fitting and the link onward', { n: 3, blockType: blockType(2) }, ['block-too-small']],
    ['block with too few entries', { n: 3, blockType: blockType(8, 2) }, ['block-too-small']],
    ['one conductor per terminal', { n: 3, blockType: blockType(6, 6, { conductorsPerTerminal: 1 }) }, ['conductors-per-terminal-exceeded']],
    ['no fittings', { n: 0 }, ['string-empty']],
    ['nonsense block type', { n: 2, blockType: blockType(0, 2.5) }, ['block-type-invalid', 'block-type-invalid']],
    ['unknown fitting in the assignment', { string: five, assignment: [['F1', 'F2', 'F3'], ['F4', 'F9']] }, ['assignment-unknown-fitting', 'assignment-fitting-missing']],
    ['fitting assigned twice', { string: five, assignment: [['F1', 'F2', 'F3'], ['F3', 'F4', 'F5']] }, ['assignment-fitting-repeated']],
    ['fitting left out', { string: five, assignment: [['F1', 'F2'], ['F3', 'F4']] }, ['assignment-fitting-missing']],
    ['assignment out of order', { string: five, assignment: [['F1', 'F3'], ['F2', 'F4', 'F5']] }, ['assignment-out-of-order']],
    ['empty block in the assignment', { string: five, assignment: [['F1', 'F2', 'F3', 'F4', 'F5'], []] }, ['assignment-empty-block']],
    ['block over capacity', { string: five, blockType: blockType(4), assignment: [['F1', 'F2', 'F3'], ['F4', 'F5']] }, ['block-over-capacity']],
    ['duplicate fitting ids', { string: { fittings: [{ id: 'A' }, { id: 'A' }] }, assignment: [['A']] }, ['fitting-id-duplicate']],
    ['negative link length', { string: { fittings: fittings(8), linkCable: { lengthM: -2 } } }, ['link-length-invalid']],
  ])('%s', (_name, input, expected) => {
    const p = plan(input);
    expect(errorCodes(p)).toEqual(expected);
    expect(p.blocks).toEqual(expected.includes('link-length-invalid') ? p.blocks : []);
    for (const f of p.findings) expect(f.message.length).toBeGreaterThan(20);
  });

  it('says where an out-of-order assignment goes wrong', () => {
    const p = plan({ string: five, assignment: [['F1', 'F2'], ['F4', 'F3', 'F5']] });
    expect(p.findings[0]).toMatchObject({ code: 'assignment-out-of-order', subject: 'block:2', values: { found: 4, expected: 3 } });
  });

  it('warns when a link has no length', () => {
    const p = plan({ string: { fittings: fittings(8) } });
    expect(p.findings.filter((f) => f.code === 'link-length-unknown')).toHaveLength(1);
    expect(p.links[0]!.lengthM).toBeNull();
    expect(p.totals.linkLengthM).toBeNull();
  });

  it('never crashes on missing input', () => {
    const p = planConnectorBlocks({} as unknown as BlockPlanInput);
    expect(errorCodes(p)).toEqual(['block-type-missing', 'string-empty']);
  });
});

describe("installer's step list", () => {
  it('isolates first, mounts and lays cables, then lands each terminal block by block, then checks', () => {
    const p = plan({ string: { fittings: fittings(7, (i) => ({ label: `Path light ${i + 1}` })), linkCable: { lengthM: 12 } } });
    const texts = p.steps.map((s) => s.text);
    expect(texts[0]).toMatch(/isolate/);
    expect(texts[0]).toMatch(/licensed electrician/);
    expect(texts[1]).toBe('Mount block 1 (Test block, IP68) near fittings 1-4.');
    expect(texts[3]).toBe(
      'Lay link cable 1 (two-core, 12 m) from block 1 to block 2. Core 1 carries the string on; core 2 carries the return back to the driver -.',
    );
    expect(texts).toContain('Block 1 terminal 1: land driver lead + and fitting 1 (Path light 1) + (driver + to the first fitting).');
    expect(texts).toContain('Block 1 terminal 2: land fitting 1 (Path light 1) - and fitting 2 (Path light 2) +.');
    expect(texts).toContain('Block 2 terminal 4: land fitting 7 (Path light 7) - and link cable 1 core 2 (end B) (last fitting - returns to driver -).');
    expect(texts).toContain(
      'Bring 6 cables into block 1 (6 entries) and seal each entry: driver lead, tails of fittings 1-4 and link cable 1.',
    );
    expect(texts).toContain(
      'Bring 4 cables into block 2 (6 entries) and seal each entry; fit blanking plugs in the 2 spare entries: link cable 1 and tails of fittings 5-7.',
    );
    // one landing step per terminal, in block order
    const landings = p.steps.filter((s) => / terminal \d+: land /.test(s.text)).map((s) => s.block);
    expect(landings).toEqual([1, 1, 1, 1, 1, 1, 2, 2, 2, 2]);
    expect(texts.findIndex((t) => t.startsWith('Lay link'))).toBeLessThan(texts.findIndex((t) => t.startsWith('Block 1 terminal 1')));
    expect(texts[texts.length - 1]).toMatch(/confirm each fitting lights/);
    expect(texts).toContain("Leave block 2's other 2 terminals empty.");
  });
});

describe('from a series string as the string check takes it', () => {
  it('maps names, tails, the driver lead and link runs (feet to metres, AWG to mm²)', () => {
    const layout = blockLayoutFromSeries({
      fittings: [
        { id: 'a', name: 'Oak uplight', ratings: [{ currentA: 0.35, forwardVoltageV: 9 }] },
        {
          id: 'b',
          ratings: [{ currentA: 0.35, forwardVoltageV: 9 }],
          tail: { length: { value: 1, unit: 'm' }, cable: { kind: 'metric', areaMm2: 0.75, conductorClass: 5, coating: 'plain' } },
        },
      ],
      runs: [
        { role: 'driver-lead', length: { value: 10, unit: 'ft' }, cable: { kind: 'awg', gauge: 14, stranding: 'stranded' } },
        { role: 'link', length: { value: 6, unit: 'm' }, cable: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
      ],
    });
    expect(layout.fittings).toEqual([
      { id: 'a', label: 'Oak uplight' },
      { id: 'b', tail: { lengthM: 1, conductorMm2: 0.75 } },
    ]);
    // 10 ft x 0.3048 m/ft (international foot, exact)
    expect(layout.driverLead!.lengthM).toBeCloseTo(3.048, 9);
    // 14 AWG: d = 0.127 mm * 92^((36 - 14)/39) = 1.628 mm, area 2.08 mm² (REFERENCES [derived], ASTM B258 [memory])
    expect(layout.driverLead!.conductorMm2).toBeCloseTo(2.08, 2);
    expect(layout.linkCable).toEqual({ conductorMm2: 1.5, lengthsM: [6] });
    const plan = planConnectorBlocks({ string: layout, blockType: blockType(6), assignment: [['a'], ['b']] });
    expect(errorCodes(plan)).toEqual([]);
    expect(plan.links[0]!.lengthM).toBe(6);
    expect(plan.steps).toContainEqual({ block: 1, text: 'Block 1 terminal 1: land driver lead + and fitting 1 (Oak uplight) + (driver + to the first fitting).' });
  });
});

describe('any input', () => {
  it('never crashes; a plan without errors always passes the wiring check', () => {
    const input = fc.record({
      n: fc.integer({ min: 0, max: 12 }),
      terminals: fc.integer({ min: -1, max: 8 }),
      entries: fc.integer({ min: 0, max: 8 }),
      cpt: fc.integer({ min: 0, max: 3 }),
      assignment: fc.option(fc.array(fc.array(fc.integer({ min: 0, max: 13 }).map((k) => `F${k}`), { maxLength: 5 }), { maxLength: 5 }), {
        nil: undefined,
      }),
    });
    fc.assert(
      fc.property(input, ({ n, terminals, entries, cpt, assignment }) => {
        const p = planConnectorBlocks({
          string: { fittings: fittings(n, (i) => ({ id: `F${i + 1}` })), linkCable: { lengthM: 2 } },
          blockType: blockType(terminals, entries, { conductorsPerTerminal: cpt }),
          ...(assignment ? { assignment } : {}),
        });
        if (errorCodes(p).length === 0) {
          expect(p.blocks.length).toBeGreaterThan(0);
          expect(checkWiring(p).ok).toBe(true);
        } else expect(p.blocks).toEqual([]);
      }),
      { numRuns: 1000, seed: 3 },
    );
  }, 30_000);
});
