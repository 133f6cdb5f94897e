/**
 * Wiring advice for a schedule recorded on site ("as wired") against the schedule that was
 * designed: is it safe to power up, and if not, which conductor ends to move, swap, land or
 * take off, terminal by terminal.
 *
 * The verdict is `checkWiring` on the as-wired schedule alone: an installer may wire it
 * differently from the design and still be right. Only when that check fails does the advice
 * look at the design: every end that sits somewhere other than where the design put it is a
 * candidate correction (move it back, land it, or take off an extra), and the advice is the
 * smallest set of those corrections after which the check passes (every single one, then
 * every pair, then all of them pruned one by one). Two ends on two terminals that trade
 * places are given as one swap. Pure: no I/O, JSON in and out.
 */
import { finding, type Finding } from '../findings';
import { formatConductorEnd, parseConductorEnd, type ConductorEnd } from './conductor-id';
import type { TerminalSchedule } from './terminal-schedule';
import { checkWiring, type WiringCheckResult } from './wiring-check';

export interface TerminalRef {
  block: number;
  terminal: number;
}

export type WiringChangeKind = 'move' | 'swap' | 'land' | 'remove';

export interface WiringChange {
  kind: WiringChangeKind;
  /** The terminal to act at, `block:2/terminal:3`. */
  subject: string;
  at: TerminalRef;
  /** The conductor end to act on, canonical (`fitting:4-`), or the text as written when unreadable. */
  conductor: string;
  /** Where it goes (move, land: `at` itself; remove: null). */
  to: TerminalRef | null;
  /** Swap only: the end it trades places with, which sits at `to`. */
  other: string | null;
  message: string;
}

export interface WiringAdvice {
  /** The check on the as-wired schedule has no error: safe to power up as far as the schedule shows. */
  safeToPowerUp: boolean;
  check: WiringCheckResult;
  /** Terminals whose conductor ends differ from the design, `block:1/terminal:2`, in schedule order. */
  differences: string[];
  /** What to change, smallest set found, in schedule order. Empty when safe. */
  changes: WiringChange[];
  /** Every problem and change beside the terminal it sits at, keyed `block:1/terminal:2`. */
  byTerminal: Record<string, string[]>;
  /** Advice findings (not the check's): `as-wired-differs` (info), `design-not-safe`, `as-wired-shape`, `advice-not-found`. */
  findings: Finding[];
}

interface Correction {
  kind: 'move' | 'land' | 'remove';
  key: string;
  raw: string;
  from: TerminalRef | null;
  to: TerminalRef | null;
}

type Positions = Map<string, { raw: string; at: TerminalRef }[]>;

const subjectOf = (r: TerminalRef): string => `block:${r.block}/terminal:${r.terminal}`;
const sameRef = (a: TerminalRef | null, b: TerminalRef | null): boolean =>
  !!a && !!b && a.block === b.block && a.terminal === b.terminal;
const placeOf = (r: TerminalRef): string => `block ${r.block} terminal ${r.terminal}`;

/** The canonical key of a conductor end text (unreadable text keeps its own spelling, marked). */
function keyOf(text: string): string {
  const end = typeof text === 'string' ? parseConductorEnd(text) : null;
  return end ? formatConductorEnd(end) : `?${String(text)}`;
}

function positions(schedule: TerminalSchedule): Positions {
  const out: Positions = new Map();
  schedule.blocks.forEach((b, bi) =>
    b.terminals.forEach((t, ti) =>
      t.conductors.forEach((raw) => {
        const key = keyOf(raw);
        const list = out.get(key) ?? [];
        list.push({ raw, at: { block: bi + 1, terminal: ti + 1 } });
        out.set(key, list);
      }),
    ),
  );
  return out;
}

/** Plain words for an end, with the fitting's label, e.g. "fitting 4 (Deck 4) −". */
export function endInWords(text: string, labels?: readonly string[]): string {
  const end: ConductorEnd | null = parseConductorEnd(text);
  if (!end) return `"${text}"`;
  const sign = (p: '+' | '-') => (p === '-' ? '−' : '+');
  switch (end.kind) {
    case 'driver':
      return `the driver's ${sign(end.polarity)} lead`;
    case 'fitting': {
      const label = labels?.[end.fitting - 1];
      return `fitting ${end.fitting}${label ? ` (${label})` : ''} ${sign(end.polarity)}`;
    }
    case 'link':
      return `link cable ${end.link} core ${end.core} (end ${end.end})`;
  }
}

function cloneSchedule(s: TerminalSchedule): TerminalSchedule {
  return {
    ...s,
    blocks: s.blocks.map((b) => ({ ...b, terminals: b.terminals.map((t) => ({ ...t, conductors: [...t.conductors] })) })),
  };
}

function terminalAt(s: TerminalSchedule, r: TerminalRef) {
  while (s.blocks.length < r.block) s.blocks.push({ terminals: [] });
  const block = s.blocks[r.block - 1]!;
  while (block.terminals.length < r.terminal) block.terminals.push({ conductors: [] });
  return block.terminals[r.terminal - 1]!;
}

function apply(base: TerminalSchedule, corrections: readonly Correction[]): TerminalSchedule {
  const s = cloneSchedule(base);
  for (const c of corrections) {
    if (c.from) {
      const t = terminalAt(s, c.from);
      const i = t.conductors.findIndex((x) => x === c.raw);
      if (i >= 0) t.conductors.splice(i, 1);
    }
    if (c.to) terminalAt(s, c.to).conductors.push(c.key);
  }
  return s;
}

function* pairs<T>(xs: readonly T[]): Generator<[T, T]> {
  for (let i = 0; i < xs.length; i++) for (let j = i + 1; j < xs.length; j++) yield [xs[i]!, xs[j]!];
}

/** Candidate corrections: every end not where the design has it, in as-wired schedule order. */
function candidates(designed: Positions, wired: Positions): Correction[] {
  const out: Correction[] = [];
  for (const [key, at] of wired) {
    const home = designed.get(key)?.[0]?.at ?? null;
    const landedHome = at.some((p) => sameRef(p.at, home));
    let moved = landedHome;
    for (const p of at) {
      if (sameRef(p.at, home)) continue;
      if (home && !moved) {
        out.push({ kind: 'move', key, raw: p.raw, from: p.at, to: home });
        moved = true;
      } else {
        out.push({ kind: 'remove', key, raw: p.raw, from: p.at, to: null });
      }
    }
  }
  for (const [key, at] of designed) {
    if (!wired.has(key)) out.push({ kind: 'land', key, raw: key, from: null, to: at[0]!.at });
  }
  const order = (c: Correction) => {
    const r = c.from ?? c.to!;
    return r.block * 1e6 + r.terminal;
  };
  return out.sort((a, b) => order(a) - order(b));
}

function smallestFix(asWired: TerminalSchedule, all: Correction[]): Correction[] | null {
  const passes = (set: readonly Correction[]) => checkWiring(apply(asWired, set)).ok;
  for (const c of all) if (passes([c])) return [c];
  if (all.length <= 40) for (const pair of pairs(all)) if (passes(pair)) return pair;
  if (!passes(all)) return null;
  // all of them work: drop each one that is not needed
  let kept = [...all];
  for (const c of all) {
    const without = kept.filter((x) => x !== c);
    if (passes(without)) kept = without;
  }
  return kept;
}

/** What the design lands at a terminal, in words, leaving out one end. */
function designedCompany(designed: TerminalSchedule, r: TerminalRef, except: string, labels?: readonly string[]): string[] {
  const t = designed.blocks[r.block - 1]?.terminals[r.terminal - 1];
  return (t?.conductors ?? [])
    .map(keyOf)
    .filter((k) => k !== except)
    .map((k) => endInWords(k, labels));
}

function joinWords(xs: readonly string[]): string {
  return xs.length <= 1 ? xs.join('') : `${xs.slice(0, -1).join(', ')} and ${xs.at(-1)}`;
}

function describe(changes: Correction[], designed: TerminalSchedule, labels?: readonly string[]): WiringChange[] {
  const out: WiringChange[] = [];
  const used = new Set<Correction>();
  const say = (k: string) => endInWords(k, labels);
  for (const c of changes) {
    if (used.has(c)) continue;
    used.add(c);
    if (c.kind === 'move') {
      const back = changes.find((d) => !used.has(d) && d.kind === 'move' && sameRef(d.from, c.to) && sameRef(d.to, c.from));
      if (back) {
        used.add(back);
        out.push({
          kind: 'swap',
          subject: subjectOf(c.from!),
          at: c.from!,
          conductor: c.key,
          to: c.to,
          other: back.key,
          message:
            `${cap(placeOf(c.from!))}: ${say(c.key)} lands here, where ${say(back.key)} belongs; ` +
            `swap the two: ${say(c.key)} to ${placeOf(c.to!)} and ${say(back.key)} from there to ${placeOf(c.from!)}.`,
        });
        continue;
      }
      const belongsHere = designedCompany(designed, c.from!, c.key, labels);
      const company = designedCompany(designed, c.to!, c.key, labels);
      out.push({
        kind: 'move',
        subject: subjectOf(c.from!),
        at: c.from!,
        conductor: c.key,
        to: c.to,
        other: null,
        message:
          `${cap(placeOf(c.from!))}: ${say(c.key)} lands here` +
          (belongsHere.length ? `, on the joint for ${joinWords(belongsHere)}` : ', which the design leaves spare') +
          `; move it to ${placeOf(c.to!)}` +
          (company.length ? ` (with ${joinWords(company)}).` : '.'),
      });
    } else if (c.kind === 'land') {
      const company = designedCompany(designed, c.to!, c.key, labels);
      out.push({
        kind: 'land',
        subject: subjectOf(c.to!),
        at: c.to!,
        conductor: c.key,
        to: c.to,
        other: null,
        message:
          `${cap(placeOf(c.to!))}: ${say(c.key)} is not landed anywhere; land it here` +
          (company.length ? ` (with ${joinWords(company)}).` : '.'),
      });
    } else {
      const known = !c.key.startsWith('?');
      out.push({
        kind: 'remove',
        subject: subjectOf(c.from!),
        at: c.from!,
        conductor: known ? c.key : c.raw,
        to: null,
        other: null,
        message: known
          ? `${cap(placeOf(c.from!))}: ${say(c.key)} should not be here (the design lands it ${
              designedPlace(designed, c.key) ?? 'nowhere on this circuit'
            }); take it off this terminal.`
          : `${cap(placeOf(c.from!))}: "${c.raw}" is not a conductor end of this circuit; take it off or correct what was written.`,
      });
    }
  }
  return out;
}

function designedPlace(designed: TerminalSchedule, key: string): string | null {
  for (let b = 0; b < designed.blocks.length; b++) {
    const ts = designed.blocks[b]!.terminals;
    for (let t = 0; t < ts.length; t++)
      if (ts[t]!.conductors.some((x) => keyOf(x) === key)) return `on block ${b + 1} terminal ${t + 1}`;
  }
  return null;
}

function cap(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** Subjects of the terminals a check finding points at (a fitting's or driver's: where its ends land). */
function terminalsOfFinding(f: Finding, wired: Positions): string[] {
  const s = f.subject ?? '';
  if (s.startsWith('block:')) return [s];
  const ends = s === 'driver' ? ['driver+', 'driver-'] : /^fitting:\d+$/.test(s) ? [`${s}+`, `${s}-`] : [];
  return ends.flatMap((e) => (wired.get(e) ?? []).map((p) => subjectOf(p.at)));
}

/** Terminals as a person records them: each block's terminals and the conductor ends on each. */
export interface RecordedBlock {
  terminals: { conductors: readonly string[] }[];
}

/**
 * A schedule recorded on site, as the check reads it: the designed circuit (kind, fittings,
 * labels, each block's conductors per terminal) with the terminals as recorded.
 */
export function asWiredSchedule(designed: TerminalSchedule, blocks: readonly RecordedBlock[]): TerminalSchedule {
  return {
    kind: designed.kind,
    fittingCount: designed.fittingCount,
    ...(designed.fittingLabels ? { fittingLabels: designed.fittingLabels } : {}),
    blocks: blocks.map((b, i) => {
      const limit = designed.blocks[i]?.conductorsPerTerminal;
      return {
        ...(limit !== undefined ? { conductorsPerTerminal: limit } : {}),
        terminals: b.terminals.map((t) => ({ conductors: [...t.conductors] })),
      };
    }),
  };
}

/**
 * Advise on a schedule as wired on site. `designed` is the schedule the installer was given
 * (from `planConnectorBlocks`); `asWired` must describe the same circuit (kind and fitting count).
 */
export function adviseWiring(designed: TerminalSchedule, asWired: TerminalSchedule): WiringAdvice {
  const findings: Finding[] = [];
  const check = checkWiring(asWired);
  const labels = asWired?.fittingLabels ?? designed?.fittingLabels;
  const empty = { safeToPowerUp: check.ok, check, differences: [], changes: [], byTerminal: {}, findings };
  if (!designed || !asWired || designed.kind !== asWired.kind || designed.fittingCount !== asWired.fittingCount) {
    findings.push(
      finding(
        'as-wired-shape',
        'error',
        'The as-wired schedule must describe the same circuit as the design (the same kind and number of fittings).',
      ),
    );
    return { ...empty, safeToPowerUp: false };
  }
  if (check.findings.some((f) => f.code === 'schedule-malformed')) return empty;
  const designedPositions = positions(designed);
  const wiredPositions = positions(asWired);

  const differences = new Set<string>();
  const termCount = Math.max(designed.blocks.length, asWired.blocks.length);
  for (let b = 0; b < termCount; b++) {
    const dt = designed.blocks[b]?.terminals ?? [];
    const wt = asWired.blocks[b]?.terminals ?? [];
    for (let t = 0; t < Math.max(dt.length, wt.length); t++) {
      const d = (dt[t]?.conductors ?? []).map(keyOf).sort().join('|');
      const w = (wt[t]?.conductors ?? []).map(keyOf).sort().join('|');
      if (d !== w) differences.add(subjectOf({ block: b + 1, terminal: t + 1 }));
    }
  }

  const byTerminal: Record<string, string[]> = {};
  const note = (subject: string, message: string) => {
    const list = (byTerminal[subject] ??= []);
    if (!list.includes(message)) list.push(message);
  };

  if (check.ok) {
    if (differences.size > 0)
      findings.push(
        finding(
          'as-wired-differs',
          'info',
          `Wired differently from the design at ${differences.size} terminal${differences.size === 1 ? '' : 's'}, ` +
            'but the check passes: keep this record with the job so the next visit finds it as wired.',
          { values: { terminals: differences.size } },
        ),
      );
    for (const f of check.findings) for (const s of terminalsOfFinding(f, wiredPositions)) note(s, f.message);
    return { safeToPowerUp: true, check, differences: [...differences], changes: [], byTerminal, findings };
  }

  let changes: WiringChange[] = [];
  if (!checkWiring(designed).ok) {
    findings.push(
      finding(
        'design-not-safe',
        'error',
        'The designed schedule itself does not pass the wiring check, so there is nothing safe to compare with. ' +
          'Have the estimator correct the circuit design first.',
      ),
    );
  } else {
    const fix = smallestFix(asWired, candidates(designedPositions, wiredPositions));
    if (fix) changes = describe(fix, designed, labels);
    else
      findings.push(
        finding(
          'advice-not-found',
          'error',
          'No set of moves back towards the design makes this schedule pass; rewire it to the designed schedule.',
        ),
      );
  }
  for (const c of changes) note(c.subject, c.message);
  for (const f of check.findings) for (const s of terminalsOfFinding(f, wiredPositions)) note(s, f.message);
  return { safeToPowerUp: false, check, differences: [...differences], changes, byTerminal, findings };
}
