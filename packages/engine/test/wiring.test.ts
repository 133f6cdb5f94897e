/**
 * Wiring check against hand-typed schedules. The rules checked are trade rules with no
 * written source beyond ../shared/REFERENCES.md "LEDs and drivers":
 * - series rule of thumb: driver + to a fitting's +, each later + picks up the previous −,
 *   the last − back to the driver's − (common practice);
 * - constant-current fittings in series on one driver, never in parallel (common practice);
 * - constant-voltage fittings in parallel, across the supply (common practice);
 * - an LED is a diode: reversed, it does not light (definition of forward bias).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkWiring, electricalNodes, parseConductorEnd, type TerminalSchedule } from '../src/index';

const T = (...conductors: string[]) => ({ conductors });

/** Three fittings over two blocks, as an installer would type it. */
function series3(): TerminalSchedule {
  return {
    kind: 'constant-current',
    fittingCount: 3,
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
        terminals: [T('link:1/core:1/end:B', 'fitting:3+'), T('fitting:3-', 'link:1/core:2/end:B')],
      },
    ],
  };
}

/** One block, four fittings in series. */
function series4(): TerminalSchedule {
  return {
    kind: 'constant-current',
    fittingCount: 4,
    blocks: [
      {
        terminals: [
          T('driver+', 'fitting:1+'),
          T('fitting:1-', 'fitting:2+'),
          T('fitting:2-', 'fitting:3+'),
          T('fitting:3-', 'fitting:4+'),
          T('fitting:4-', 'driver-'),
        ],
      },
    ],
  };
}

function edit(s: TerminalSchedule, f: (s: TerminalSchedule) => void): TerminalSchedule {
  const copy = JSON.parse(JSON.stringify(s)) as TerminalSchedule;
  f(copy);
  return copy;
}
const term = (s: TerminalSchedule, b: number, t: number) => s.blocks[b - 1]!.terminals[t - 1]!.conductors;
function swap(s: TerminalSchedule, x: string, y: string): TerminalSchedule {
  return edit(s, (c) => {
    for (const b of c.blocks) for (const t of b.terminals) t.conductors = t.conductors.map((e) => (e === x ? y : e === y ? x : e));
  });
}
function remove(s: TerminalSchedule, x: string): TerminalSchedule {
  return edit(s, (c) => {
    for (const b of c.blocks) for (const t of b.terminals) t.conductors = t.conductors.filter((e) => e !== x);
  });
}
const codes = (s: TerminalSchedule) => checkWiring(s).findings.map((f) => f.code).sort();
const errorCodes = (s: TerminalSchedule) =>
  [...new Set(checkWiring(s).findings.filter((f) => f.severity === 'error').map((f) => f.code))].sort();

describe('conductor ends', () => {
  it.each([
    ['driver+', { kind: 'driver', polarity: '+' }],
    [' Driver − ', { kind: 'driver', polarity: '-' }],
    ['fitting:12-', { kind: 'fitting', fitting: 12, polarity: '-' }],
    ['FITTING:3 +', { kind: 'fitting', fitting: 3, polarity: '+' }],
    ['link:2/core:1/end:a', { kind: 'link', link: 2, core: 1, end: 'A' }],
  ])('parses %j', (text, expected) => {
    expect(parseConductorEnd(text)).toEqual(expected);
  });
  it.each(['fitting:0+', 'fitting:3', 'lamp:1+', 'link:1/core:1', 'link:0/core:1/end:A', 'link:1/core:1/end:C', ''])(
    'rejects %j',
    (text) => {
      expect(parseConductorEnd(text)).toBeNull();
    },
  );
});

describe('constant-current series check', () => {
  it('passes a correct three-fitting string over two blocks and gives the order', () => {
    const r = checkWiring(series3());
    expect(r.ok).toBe(true);
    expect(r.findings).toEqual([]);
    expect(r.seriesOrder).toEqual([1, 2, 3]);
    // the return leg: driver − is common with fitting 3 − through link core 2
    const ret = electricalNodes(series3()).find((n) => n.ends.includes('driver-'))!;
    expect(ret).toEqual({ terminals: ['block:1/terminal:4', 'block:2/terminal:2'], ends: ['driver-', 'fitting:3-'] });
    // typed spellings come back canonical
    const typed = edit(series3(), (c) => (c.blocks[0]!.terminals[0]!.conductors = ['Driver +', 'FITTING:1+']));
    expect(electricalNodes(typed)[0]).toEqual({ terminals: ['block:1/terminal:1'], ends: ['driver+', 'fitting:1+'] });
  });

  it('reads a typed schedule with spaces, capitals and the typographic minus', () => {
    const typed = edit(series3(), (s) => {
      s.blocks[0]!.terminals[0]!.conductors = ['Driver +', 'fitting:1 +'];
      s.blocks[0]!.terminals[1]!.conductors = ['fitting:1 −', 'fitting:2+'];
    });
    expect(checkWiring(typed).ok).toBe(true);
  });

  it('passes fittings in any series order (the loop, not the numbering, matters)', () => {
    const s = swap(swap(series4(), 'fitting:2+', 'fitting:3+'), 'fitting:2-', 'fitting:3-');
    const r = checkWiring(s);
    expect(r.ok).toBe(true);
    expect(r.seriesOrder).toEqual([1, 3, 2, 4]);
  });

  const cases: [string, () => TerminalSchedule, string[], string?][] = [
    ['fitting reversed', () => swap(series3(), 'fitting:2+', 'fitting:2-'), ['fitting-reversed'], 'fitting:2'],
    ['fitting bypassed, chain carried on by the link', () => swap(series3(), 'fitting:2+', 'link:1/core:1/end:A'), ['fitting-bypassed'], 'fitting:2'],
    // driver − swapped with fitting 1 +: the driver is shorted and fitting 4 − now feeds fitting 1 +
    ['short across the driver', () => swap(series4(), 'driver-', 'fitting:1+'), ['fittings-outside-loop', 'short-across-driver']],
    ['open: a fitting end left off', () => remove(series3(), 'fitting:2-'), ['fitting-end-missing', 'open-circuit'], 'fitting:2'],
    ['open: a link core end left off', () => remove(series3(), 'link:1/core:2/end:B'), ['open-circuit']],
    ['open: the driver lead − left off', () => remove(series4(), 'driver-'), ['driver-end-missing', 'open-circuit']],
    ['fitting missing', () => remove(remove(series4(), 'fitting:3+'), 'fitting:3-'), ['fitting-missing', 'open-circuit'], 'fitting:3'],
    [
      'fitting used twice',
      () => edit(series4(), (s) => s.blocks[0]!.terminals.push(T('fitting:2+'))),
      ['fitting-used-twice'],
      'fitting:2',
    ],
    ['unknown fitting', () => edit(series4(), (s) => term(s, 1, 5).push('fitting:5+')), ['fitting-unknown'], 'fitting:5'],
    ['two fittings on a loop of their own', () => swap(series4(), 'fitting:1-', 'fitting:3-'), ['fittings-outside-loop']],
    ['three fittings on a loop of their own', () => swap(series4(), 'fitting:1-', 'fitting:4-'), ['fittings-outside-loop']],
    ['unreadable conductor', () => edit(series4(), (s) => term(s, 1, 2).push('lamp 7')), ['conductor-unrecognised'], 'block:1/terminal:2'],
    ['terminal over its limit', () => edit(series3(), (s) => (s.blocks[0]!.conductorsPerTerminal = 1)), ['terminal-over-limit'], 'block:1/terminal:1'],
    ['driver end written twice', () => edit(series4(), (s) => s.blocks[0]!.terminals.push(T('driver+'))), ['driver-end-repeated']],
    [
      'three ends at one joint',
      () => edit(series4(), (s) => {
        term(s, 1, 2).push('fitting:3+');
        s.blocks[0]!.terminals[2]!.conductors = ['fitting:2-'];
        s.blocks[0]!.terminals.push(T('fitting:2-'));
      }),
      ['circuit-branches', 'fitting-used-twice', 'open-circuit'],
    ],
  ];
  it.each(cases)('%s', (_name, build, expected, subject) => {
    const s = build();
    const r = checkWiring(s);
    expect(r.ok).toBe(false);
    expect(r.seriesOrder).toBeNull();
    expect(errorCodes(s)).toEqual(expected);
    if (subject) expect(r.findings.some((f) => f.subject === subject)).toBe(true);
    for (const f of r.findings) expect(f.message.length).toBeGreaterThan(20);
  });

  it('says where the open circuit is', () => {
    const r = checkWiring(remove(series3(), 'fitting:2-'));
    const open = r.findings.find((f) => f.code === 'open-circuit')!;
    // fitting 3 + sits on block 2 terminal 1, joined to block 1 terminal 3 by link 1 core 1, and nothing else
    expect(open.subject).toBe('block:2/terminal:1');
    expect(open.message).toContain('fitting 3 +');
  });

  it('reports two fittings in parallel on a constant-current driver, and nothing else', () => {
    const s: TerminalSchedule = {
      kind: 'constant-current',
      fittingCount: 3,
      blocks: [
        {
          conductorsPerTerminal: 3,
          terminals: [T('driver+', 'fitting:1+', 'fitting:2+'), T('fitting:1-', 'fitting:2-', 'fitting:3+'), T('fitting:3-', 'driver-')],
        },
      ],
    };
    const r = checkWiring(s);
    expect(r.findings.map((f) => f.code)).toEqual(['fittings-in-parallel']);
    expect(r.findings[0]!.values).toEqual({ fittings: '1,2' });
  });

  it('names a closed loop that is cut off from the driver', () => {
    const r = checkWiring(swap(series4(), 'fitting:1-', 'fitting:3-'));
    const f = r.findings.find((x) => x.code === 'fittings-outside-loop')!;
    expect(f.values).toEqual({ fittings: '2,3' });
    expect(f.message).toContain('closed loop of their own');
  });

  it('warns about a link core landed at one end only but still passes the circuit', () => {
    const s = edit(series3(), (c) => c.blocks[0]!.terminals.push(T('link:1/core:3/end:A')));
    const r = checkWiring(s);
    expect(r.ok).toBe(true);
    expect(codes(s)).toEqual(['link-core-end-unlanded']);
  });

  it.each([
    ['no schedule', null],
    ['blocks not a list', { kind: 'constant-current', fittingCount: 1, blocks: 'b1' }],
    ['no circuit kind', { fittingCount: 1, blocks: [] }],
    ['fractional fitting count', { kind: 'constant-current', fittingCount: 1.5, blocks: [] }],
    ['terminal without conductors', { kind: 'constant-current', fittingCount: 1, blocks: [{ terminals: [{}] }] }],
  ])('bad input, %s, gives a finding not a crash', (_n, input) => {
    const r = checkWiring(input as unknown as TerminalSchedule);
    expect(r.ok).toBe(false);
    expect(r.findings.map((f) => f.code)).toEqual(['schedule-malformed']);
  });
});

describe('constant-voltage check', () => {
  /** Two blocks: + and − buses carried on by link 1 cores 1 and 2. */
  function bus2(): TerminalSchedule {
    return {
      kind: 'constant-voltage',
      fittingCount: 3,
      blocks: [
        { terminals: [T('driver+', 'fitting:1+', 'link:1/core:1/end:A'), T('driver-', 'fitting:1-', 'link:1/core:2/end:A')] },
        { terminals: [T('link:1/core:1/end:B', 'fitting:2+', 'fitting:3+'), T('link:1/core:2/end:B', 'fitting:2-', 'fitting:3-')] },
      ],
    };
  }
  it('passes every fitting across the supply', () => {
    const r = checkWiring(bus2());
    expect(r.ok).toBe(true);
    expect(r.findings).toEqual([]);
    expect(r.seriesOrder).toBeNull();
    expect(electricalNodes(bus2()).map((n) => n.ends.length)).toEqual([4, 4]);
  });
  it.each([
    ['reversed fitting', () => swap(bus2(), 'fitting:2+', 'fitting:2-'), ['fitting-reversed']],
    ['short across the supply', () => swap(bus2(), 'driver-', 'link:1/core:1/end:A'), ['fitting-bypassed', 'short-across-driver']],
    ['missing fitting', () => remove(remove(bus2(), 'fitting:3-'), 'fitting:3+'), ['fitting-missing']],
    ['fitting end open', () => edit(remove(bus2(), 'fitting:3-'), (s) => s.blocks[1]!.terminals.push(T('fitting:3-'))), ['open-circuit']],
    ['link core off: the far block loses its −', () => remove(bus2(), 'link:1/core:2/end:B'), ['fittings-in-series']],
    [
      'fittings in series on a constant-voltage supply',
      () =>
        ({
          kind: 'constant-voltage',
          fittingCount: 2,
          blocks: [{ terminals: [T('driver+', 'fitting:1+'), T('fitting:1-', 'fitting:2+'), T('fitting:2-', 'driver-')] }],
        }) satisfies TerminalSchedule,
      ['fittings-in-series'],
    ],
  ])('%s', (_n, build, expected) => {
    expect(errorCodes(build())).toEqual(expected);
  });
});

describe('any schedule a person might type', () => {
  it('never crashes, and every error names a stable kebab-case code and a place or thing', () => {
    const conductor = fc.oneof(
      fc.constantFrom('driver+', 'driver-', 'Driver −', 'lamp', '', 'fitting:0+', 'link:1/core:1/end:C'),
      fc.tuple(fc.integer({ min: 1, max: 6 }), fc.constantFrom('+', '-')).map(([k, p]) => `fitting:${k}${p}`),
      fc.tuple(fc.integer({ min: 1, max: 2 }), fc.integer({ min: 1, max: 3 }), fc.constantFrom('A', 'B')).map(
        ([l, c, e]) => `link:${l}/core:${c}/end:${e}`,
      ),
    );
    const schedule = fc.record({
      kind: fc.constantFrom('constant-current' as const, 'constant-voltage' as const),
      fittingCount: fc.integer({ min: 0, max: 5 }),
      blocks: fc.array(
        fc.record({
          conductorsPerTerminal: fc.option(fc.integer({ min: 1, max: 3 }), { nil: undefined }),
          terminals: fc.array(fc.record({ conductors: fc.array(conductor, { maxLength: 4 }) }), { maxLength: 6 }),
        }),
        { maxLength: 3 },
      ),
    });
    fc.assert(
      fc.property(schedule, (s) => {
        const r = checkWiring(s);
        expect(r.ok).toBe(!r.findings.some((f) => f.severity === 'error'));
        for (const f of r.findings) {
          expect(f.code).toMatch(/^[a-z]+(-[a-z]+)*$/);
          expect(f.message.length).toBeGreaterThan(10);
        }
        electricalNodes(s);
      }),
      { numRuns: 2000, seed: 42 },
    );
  }, 30_000);
});
