/**
 * Wiring advice on a schedule recorded on site. The rules behind the verdict are the wiring
 * check's (series rule of thumb, common practice; an LED is a diode: reversed, it does not
 * light). What is tested here is the advice: that it names the terminal and the end to move,
 * and that doing exactly what it says makes the circuit pass the check.
 */
import { describe, expect, it } from 'vitest';
import {
  adviseWiring,
  asWiredSchedule,
  checkWiring,
  planConnectorBlocks,
  type TerminalSchedule,
  type WiringChange,
} from '../src/index';

const T = (...conductors: string[]) => ({ conductors });

/** Three fittings over two blocks joined by link cable 1, as the block planner writes them. */
function series3(): TerminalSchedule {
  return {
    kind: 'constant-current',
    fittingCount: 3,
    fittingLabels: ['Gate', 'Porch', 'Bench'],
    blocks: [
      {
        conductorsPerTerminal: 2,
        terminals: [
          T('driver+', 'fitting:1+'),
          T('fitting:1-', 'fitting:2+'),
          T('fitting:2-', 'link:1/core:1/end:A'),
          T('driver-', 'link:1/core:2/end:A'),
        ],
      },
      {
        conductorsPerTerminal: 2,
        terminals: [T('link:1/core:1/end:B', 'fitting:3+'), T('fitting:3-', 'link:1/core:2/end:B'), T()],
      },
    ],
  };
}

const copy = (s: TerminalSchedule): TerminalSchedule => JSON.parse(JSON.stringify(s)) as TerminalSchedule;
const cell = (s: TerminalSchedule, b: number, t: number) => s.blocks[b - 1]!.terminals[t - 1]!.conductors;
function moveEnd(s: TerminalSchedule, end: string, from: [number, number], to: [number, number]): TerminalSchedule {
  const c = copy(s);
  const list = cell(c, ...from);
  list.splice(list.indexOf(end), 1);
  cell(c, ...to).push(end);
  return c;
}

/** Do what the advice says, literally. */
function follow(s: TerminalSchedule, changes: readonly WiringChange[]): TerminalSchedule {
  const c = copy(s);
  const at = (r: { block: number; terminal: number }) => {
    while (c.blocks.length < r.block) c.blocks.push({ terminals: [] });
    const b = c.blocks[r.block - 1]!;
    while (b.terminals.length < r.terminal) b.terminals.push({ conductors: [] });
    return b.terminals[r.terminal - 1]!.conductors;
  };
  const take = (r: { block: number; terminal: number }, end: string) => {
    const list = at(r);
    const i = list.findIndex((x) => x.replace(/\s/g, '').toLowerCase() === end.toLowerCase());
    expect(i, `advice says ${end} is on block ${r.block} terminal ${r.terminal}`).toBeGreaterThanOrEqual(0);
    list.splice(i, 1);
  };
  for (const ch of changes) {
    if (ch.kind === 'move') {
      take(ch.at, ch.conductor);
      at(ch.to!).push(ch.conductor);
    } else if (ch.kind === 'swap') {
      take(ch.at, ch.conductor);
      take(ch.to!, ch.other!);
      at(ch.to!).push(ch.conductor);
      at(ch.at).push(ch.other!);
    } else if (ch.kind === 'land') at(ch.at).push(ch.conductor);
    else take(ch.at, ch.conductor);
  }
  return c;
}

describe('adviseWiring', () => {
  it('passes the design itself with no changes and no differences', () => {
    const a = adviseWiring(series3(), series3());
    expect(a.safeToPowerUp).toBe(true);
    expect(a.changes).toEqual([]);
    expect(a.differences).toEqual([]);
    expect(a.findings).toEqual([]);
  });

  it('names the terminal and the exact move when a return lands on the + joint', () => {
    // fitting 3's − tail put on block 2 terminal 1 (the + joint) instead of terminal 2 (the return)
    const wired = moveEnd(series3(), 'fitting:3-', [2, 2], [2, 1]);
    const a = adviseWiring(series3(), wired);
    expect(a.safeToPowerUp).toBe(false);
    expect(a.check.ok).toBe(false);
    expect(a.changes).toHaveLength(1);
    const [ch] = a.changes;
    expect(ch).toMatchObject({
      kind: 'move',
      subject: 'block:2/terminal:1',
      conductor: 'fitting:3-',
      to: { block: 2, terminal: 2 },
    });
    expect(ch!.message).toBe(
      'Block 2 terminal 1: fitting 3 (Bench) − lands here, on the joint for link cable 1 core 1 (end B) and fitting 3 (Bench) +; ' +
        'move it to block 2 terminal 2 (with link cable 1 core 2 (end B)).',
    );
    expect(a.byTerminal['block:2/terminal:1']).toContain(ch!.message);
    expect(checkWiring(follow(wired, a.changes)).ok).toBe(true);
  });

  it('gives a reversed fitting as one swap on its two terminals', () => {
    const reversed = copy(series3());
    cell(reversed, 1, 2)[1] = 'fitting:2-';
    cell(reversed, 1, 3)[0] = 'fitting:2+';
    const a = adviseWiring(series3(), reversed);
    expect(checkWiring(reversed).findings.map((f) => f.code)).toContain('fitting-reversed');
    expect(a.changes).toHaveLength(1);
    expect(a.changes[0]).toMatchObject({
      kind: 'swap',
      at: { block: 1, terminal: 2 },
      conductor: 'fitting:2-',
      to: { block: 1, terminal: 3 },
      other: 'fitting:2+',
    });
    expect(a.changes[0]!.message).toContain(
      'Block 1 terminal 2: fitting 2 (Porch) − lands here, where fitting 2 (Porch) + belongs',
    );
    // the check's own finding (about fitting 2) is shown beside both of its terminals
    expect(a.byTerminal['block:1/terminal:3']!.some((m) => m.startsWith('Fitting 2 is reversed'))).toBe(true);
    expect(checkWiring(follow(reversed, a.changes)).ok).toBe(true);
  });

  it('says where to land an end that was left off, and to take off one landed twice', () => {
    const missing = copy(series3());
    cell(missing, 1, 3).splice(0, 1); // fitting:2- left loose
    const a = adviseWiring(series3(), missing);
    expect(a.changes).toEqual([
      expect.objectContaining({ kind: 'land', subject: 'block:1/terminal:3', conductor: 'fitting:2-' }),
    ]);
    expect(a.changes[0]!.message).toBe(
      'Block 1 terminal 3: fitting 2 (Porch) − is not landed anywhere; land it here (with link cable 1 core 1 (end A)).',
    );
    const twice = copy(series3());
    cell(twice, 2, 3).push('fitting:1+');
    const b = adviseWiring(series3(), twice);
    expect(b.changes).toEqual([
      expect.objectContaining({ kind: 'remove', subject: 'block:2/terminal:3', conductor: 'fitting:1+' }),
    ]);
    expect(b.changes[0]!.message).toContain('the design lands it on block 1 terminal 1');
  });

  it('asks to take off text that is not a conductor end', () => {
    const wired = copy(series3());
    cell(wired, 2, 3).push('brown');
    const a = adviseWiring(series3(), wired);
    expect(a.safeToPowerUp).toBe(false);
    expect(a.changes).toEqual([expect.objectContaining({ kind: 'remove', conductor: 'brown', subject: 'block:2/terminal:3' })]);
  });

  it('reads recorded terminals against the designed circuit, keeping its labels and terminal limits', () => {
    const s = asWiredSchedule(series3(), [{ terminals: [T('driver+', 'fitting:1+', 'fitting:2+')] }]);
    expect(s).toEqual({
      kind: 'constant-current',
      fittingCount: 3,
      fittingLabels: ['Gate', 'Porch', 'Bench'],
      blocks: [{ conductorsPerTerminal: 2, terminals: [T('driver+', 'fitting:1+', 'fitting:2+')] }],
    });
    expect(checkWiring(s).findings.map((f) => f.code)).toContain('terminal-over-limit');
  });

  it('accepts a different but correct wiring and records where it differs', () => {
    // the whole fitting-3 return joint moved to the spare terminal 3 of block 2
    const wired = copy(series3());
    cell(wired, 2, 3).push(...cell(wired, 2, 2).splice(0));
    const a = adviseWiring(series3(), wired);
    expect(a.safeToPowerUp).toBe(true);
    expect(a.changes).toEqual([]);
    expect(a.differences).toEqual(['block:2/terminal:2', 'block:2/terminal:3']);
    expect(a.findings.map((f) => f.code)).toEqual(['as-wired-differs']);
  });

  it('refuses to advise against a design that fails, or a schedule of another circuit', () => {
    const badDesign = moveEnd(series3(), 'fitting:3-', [2, 2], [2, 1]);
    expect(adviseWiring(badDesign, moveEnd(series3(), 'driver+', [1, 1], [2, 3])).findings.map((f) => f.code)).toEqual([
      'design-not-safe',
    ]);
    const other = { ...series3(), fittingCount: 4 };
    const a = adviseWiring(series3(), other);
    expect(a.safeToPowerUp).toBe(false);
    expect(a.findings.map((f) => f.code)).toEqual(['as-wired-shape']);
  });

  it('after any single swap or removal of a planned string, following the advice always passes the check', () => {
    const plan = planConnectorBlocks({
      string: {
        fittings: Array.from({ length: 7 }, (_, i) => ({ id: `f${i + 1}`, label: `Light ${i + 1}` })),
        linkCable: { lengthM: 6 },
      },
      blockType: { name: 'Five-way gel box', terminals: 5, cableEntries: 5, conductorsPerTerminal: 2, ipCode: 'IP68' },
    });
    expect(checkWiring(plan).ok).toBe(true);
    const ends: { b: number; t: number; i: number }[] = [];
    plan.blocks.forEach((b, bi) =>
      b.terminals.forEach((t, ti) => t.conductors.forEach((_, i) => ends.push({ b: bi, t: ti, i }))),
    );
    let unsafe = 0;
    const variants: TerminalSchedule[] = [];
    for (let x = 0; x < ends.length; x++) {
      const removed = copy(plan);
      removed.blocks[ends[x]!.b]!.terminals[ends[x]!.t]!.conductors.splice(ends[x]!.i, 1);
      variants.push(removed);
      for (let y = x + 1; y < ends.length; y++) {
        const s = copy(plan);
        const p = ends[x]!;
        const q = ends[y]!;
        const a = s.blocks[p.b]!.terminals[p.t]!.conductors;
        const c = s.blocks[q.b]!.terminals[q.t]!.conductors;
        [a[p.i], c[q.i]] = [c[q.i]!, a[p.i]!];
        variants.push(s);
      }
    }
    for (const v of variants) {
      const advice = adviseWiring(plan, v);
      expect(advice.safeToPowerUp).toBe(checkWiring(v).ok);
      if (advice.safeToPowerUp) continue;
      unsafe++;
      expect(advice.changes.length).toBeGreaterThan(0);
      expect(advice.changes.length).toBeLessThanOrEqual(2);
      expect(checkWiring(follow(v, advice.changes)).ok).toBe(true);
    }
    expect(unsafe).toBeGreaterThan(100);
  });
});
