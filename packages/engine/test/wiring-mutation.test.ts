/**
 * Mutation test for the wiring check (engine issue, section 6).
 *
 * For generated schedules (fast-check: string sizes, block capacities, given or automatic
 * assignments), the generated schedule passes, and every single swap of two conductor ends
 * and every single removed conductor end is either reported (an error finding) or provably
 * equivalent.
 *
 * Equivalence, precisely: two schedules are equivalent when the partition of the element
 * ends (driver+, driver-, fitting:k+, fitting:k-) into electrical nodes is the same: the same
 * ends are present and each pair of them is joined (through terminals and link-cable cores)
 * in one schedule exactly when it is in the other. The driver and the fittings cannot tell two
 * such schedules apart. The partition is computed here with its own small union-find, not
 * with the engine's. The assertion is two-sided: equivalent mutations must pass (the check
 * does not depend on anything else), the rest must be reported. Per-terminal conductor
 * counts never rise under a swap or a removal, so the limit cannot change the verdict.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkWiring, planConnectorBlocks, type BlockPlanInput, type TerminalSchedule } from '../src/index';

/** Element-end partition, canonical text: groups sorted, ends sorted. */
function elementPartition(s: TerminalSchedule): string {
  const parent = new Map<string, string>();
  const find = (x: string): string => {
    while (parent.get(x) !== x) x = parent.get(x)!;
    return x;
  };
  const join = (x: string, y: string) => parent.set(find(x), find(y));
  const cores = new Map<string, string>(); // "link/core" -> first terminal seen
  const elementAt: [string, string][] = [];
  s.blocks.forEach((b, bi) =>
    b.terminals.forEach((t, ti) => {
      const id = `${bi}/${ti}`;
      parent.set(id, id);
      for (const c of t.conductors) {
        const link = /^link:(\d+)\/core:(\d+)\/end:[AB]$/.exec(c);
        if (link) {
          const key = `${link[1]}/${link[2]}`;
          const other = cores.get(key);
          if (other === undefined) cores.set(key, id);
          else join(other, id);
        } else if (/^(driver|fitting:\d+)[+-]$/.test(c)) elementAt.push([c, id]);
      }
    }),
  );
  const groups = new Map<string, string[]>();
  for (const [end, id] of elementAt) {
    const r = find(id);
    groups.set(r, [...(groups.get(r) ?? []), end]);
  }
  return JSON.stringify([...groups.values()].map((g) => g.sort().join(' ')).sort());
}

type Slot = [block: number, terminal: number, index: number];
function slots(s: TerminalSchedule): Slot[] {
  const out: Slot[] = [];
  s.blocks.forEach((b, bi) => b.terminals.forEach((t, ti) => t.conductors.forEach((_c, ci) => out.push([bi, ti, ci]))));
  return out;
}
const at = (s: TerminalSchedule, [b, t]: Slot) => s.blocks[b]!.terminals[t]!.conductors;

function swapped(s: TerminalSchedule, x: Slot, y: Slot): TerminalSchedule {
  const m = JSON.parse(JSON.stringify(s)) as TerminalSchedule;
  const cx = at(m, x)[x[2]]!;
  at(m, x)[x[2]] = at(m, y)[y[2]]!;
  at(m, y)[y[2]] = cx;
  return m;
}
function removed(s: TerminalSchedule, x: Slot): TerminalSchedule {
  const m = JSON.parse(JSON.stringify(s)) as TerminalSchedule;
  at(m, x).splice(x[2], 1);
  return m;
}

/** A plain copy holding only the schedule fields, as a person or the api would store it. */
function scheduleOnly(s: TerminalSchedule): TerminalSchedule {
  return {
    kind: s.kind,
    fittingCount: s.fittingCount,
    blocks: s.blocks.map((b) => ({
      conductorsPerTerminal: b.conductorsPerTerminal,
      terminals: b.terminals.map((t) => ({ conductors: [...t.conductors] })),
    })),
  };
}

const inOrder = fc
  .record({
    n: fc.integer({ min: 1, max: 14 }),
    terminals: fc.integer({ min: 3, max: 8 }),
    entries: fc.integer({ min: 3, max: 9 }),
    conductorsPerTerminal: fc.integer({ min: 2, max: 3 }),
  })
  .map(
    ({ n, terminals, entries, conductorsPerTerminal }): BlockPlanInput => ({
      string: { fittings: Array.from({ length: n }, (_, i) => ({ id: `F${i + 1}` })), linkCable: { lengthM: 5 } },
      blockType: { name: 'Test block', terminals, cableEntries: entries, conductorsPerTerminal, ipCode: 'IP68' },
    }),
  );

const assigned = fc.array(fc.integer({ min: 1, max: 4 }), { minLength: 1, maxLength: 5 }).map((sizes): BlockPlanInput => {
  const n = sizes.reduce((a, b) => a + b, 0);
  const assignment: string[][] = [];
  let next = 1;
  for (const size of sizes) {
    assignment.push(Array.from({ length: size }, (_, i) => `F${next + i}`));
    next += size;
  }
  return {
    string: { fittings: Array.from({ length: n }, (_, i) => ({ id: `F${i + 1}` })), linkCable: { lengthM: 5 } },
    blockType: { name: 'Roomy block', terminals: 6, cableEntries: 6, conductorsPerTerminal: 2, ipCode: 'IP68' },
    assignment,
  };
});

const tally = { schedules: 0, swaps: 0, equivalentAcrossTerminals: 0, reported: 0, removals: 0 };

function mutateAll(schedule: TerminalSchedule): void {
  const base = checkWiring(schedule);
  expect(base.findings.filter((f) => f.severity === 'error')).toEqual([]);
  expect(base.ok).toBe(true);
  const original = elementPartition(schedule);
  const all = slots(schedule);
  tally.schedules++;
  for (let i = 0; i < all.length; i++) {
    for (let j = i + 1; j < all.length; j++) {
      const m = swapped(schedule, all[i]!, all[j]!);
      const equivalent = elementPartition(m) === original;
      const r = checkWiring(m);
      if (r.ok !== equivalent) {
        throw new Error(`swap ${JSON.stringify([all[i], all[j]])}: ok ${r.ok}, equivalent ${equivalent}, ${JSON.stringify(r.findings)}`);
      }
      tally.swaps++;
      if (equivalent && (all[i]![0] !== all[j]![0] || all[i]![1] !== all[j]![1])) tally.equivalentAcrossTerminals++;
      if (!equivalent) tally.reported++;
    }
    const m = removed(schedule, all[i]!);
    const r = checkWiring(m);
    const equivalent = elementPartition(m) === original;
    if (r.ok !== equivalent) throw new Error(`removal ${JSON.stringify(all[i])}: ok ${r.ok}, equivalent ${equivalent}`);
    // a schedule with every conductor carrying current has no removable end
    expect(equivalent).toBe(false);
    tally.removals++;
  }
}

describe('wiring check mutation test (generated constant-current schedules)', () => {
  it('every generated schedule passes; every swap and removal is reported or equivalent', () => {
    fc.assert(
      fc.property(fc.oneof(inOrder, assigned), (input) => {
        const plan = planConnectorBlocks(input);
        expect(plan.findings.filter((f) => f.severity === 'error')).toEqual([]);
        mutateAll(scheduleOnly(plan));
      }),
      { numRuns: 60, seed: 20240601 },
    );
    // Both branches were exercised: real faults, and swaps across terminals that change nothing
    // electrically (e.g. a fitting's − moved to the far end of the link core it was joined to).
    expect(tally.reported).toBeGreaterThan(1000);
    expect(tally.equivalentAcrossTerminals).toBeGreaterThan(0);
  }, 60_000);

  it('the equivalence is not trivial: an example of each kind', () => {
    const plan = scheduleOnly(
      planConnectorBlocks({
        string: { fittings: [{}, {}, {}] },
        blockType: { name: 'Three-way', terminals: 3, cableEntries: 3, conductorsPerTerminal: 2, ipCode: 'IP68' },
      }),
    );
    const original = elementPartition(plan);
    // block 1 terminal 2 holds fitting 1 − with link 1 core 1 end A; block 2 terminal 1 holds
    // link 1 core 1 end B with fitting 2 +. Swapping the two fitting ends changes nothing electrically.
    expect(at(plan, [0, 1, 0])).toEqual(['fitting:1-', 'link:1/core:1/end:A']);
    expect(at(plan, [1, 0, 0])).toEqual(['link:1/core:1/end:B', 'fitting:2+']);
    const same = swapped(plan, [0, 1, 0], [1, 0, 1]);
    expect(elementPartition(same)).toBe(original);
    expect(checkWiring(same).ok).toBe(true);
    // swapping fitting 1 + (block 1 terminal 1) with fitting 1 − (terminal 2) reverses it
    const rev = swapped(plan, [0, 0, 1], [0, 1, 0]);
    expect(elementPartition(rev)).not.toBe(original);
    expect(checkWiring(rev).findings.map((f) => f.code)).toEqual(['fitting-reversed']);
  });
});

/** Constant-voltage bus over m blocks: + and − carried on by link cores 1 and 2. */
function cvBus(sizes: readonly number[]): TerminalSchedule {
  let k = 1;
  const blocks = sizes.map((size, j) => {
    const plus = [j === 0 ? 'driver+' : `link:${j}/core:1/end:B`];
    const minus = [j === 0 ? 'driver-' : `link:${j}/core:2/end:B`];
    for (let i = 0; i < size; i++, k++) {
      plus.push(`fitting:${k}+`);
      minus.push(`fitting:${k}-`);
    }
    if (j < sizes.length - 1) {
      plus.push(`link:${j + 1}/core:1/end:A`);
      minus.push(`link:${j + 1}/core:2/end:A`);
    }
    return { terminals: [{ conductors: plus }, { conductors: minus }] };
  });
  return { kind: 'constant-voltage', fittingCount: k - 1, blocks };
}

describe('wiring check mutation test (constant-voltage buses)', () => {
  it('every bus passes; every swap and removal is reported or equivalent', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 4 }), { minLength: 1, maxLength: 4 }), (sizes) => {
        mutateAll(cvBus(sizes));
      }),
      { numRuns: 40, seed: 7 },
    );
  }, 60_000);
});
