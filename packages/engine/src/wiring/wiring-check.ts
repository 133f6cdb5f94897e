/**
 * Wiring check: read any terminal schedule, build the circuit graph and say whether it is
 * what the driver needs.
 *
 * Terminals are the graph's starting nodes; each link-cable core joins the terminal its A
 * end lands on with the terminal its B end lands on (union-find), so an electrical node is
 * a set of terminals joined by cores. The driver and the fittings are the two-ended
 * elements between nodes. Then:
 *
 * - constant current: one series loop, driver + -> fitting + ... fitting - -> next fitting
 *   + ... -> driver -, every fitting met at its + first (forward-biased). Constant-current
 *   fittings go in series on one driver, never in parallel (common practice).
 * - constant voltage: every fitting straight across the supply, + to + and - to -
 *   (constant-voltage fittings are wired in parallel, common practice).
 *
 * Anything else is reported with where it is. The verdict depends only on which element
 * ends (driver ±, fitting k ±) are electrically common, plus the per-terminal conductor
 * counts and the ends missing, repeated or unreadable; `electricalNodes` returns that partition.
 */
import { finding, hasErrors, type Finding } from '../findings';
import { describeConductorEnd, formatConductorEnd, newConductorScan, scanConductorEnd, type ConductorEnd } from './conductor-id';
import type { WiringKind, TerminalSchedule } from './terminal-schedule';
import { LinkCores } from './link-cores';
import { NodeEnds } from './node-ends';
import { UnionFind } from './union-find';

export interface WiringNode {
  /** Terminals that are electrically one node, e.g. `block:1/terminal:3`, in schedule order. */
  terminals: string[];
  /** Driver and fitting ends on this node, canonical form, in schedule order. */
  ends: string[];
}

export interface WiringCheckResult {
  kind: WiringKind;
  /** True when there is no error finding: the circuit is what the driver needs. */
  ok: boolean;
  /** Constant current, complete loop only: fitting numbers in the order the current meets them. */
  seriesOrder: number[] | null;
  findings: Finding[];
}

const NONE = -1;

/** Element end index: driver+ 0, driver- 1, fitting k + 2k, fitting k - 2k+1. */
function elementEnd(index: number): ConductorEnd {
  const polarity = (index & 1) === 0 ? '+' : '-';
  return index < 2 ? { kind: 'driver', polarity } : { kind: 'fitting', fitting: index >> 1, polarity };
}

function list(xs: readonly (string | number)[]): string {
  const s = xs.map(String);
  if (s.length <= 1) return s.join('');
  return `${s.slice(0, -1).join(', ')} and ${s[s.length - 1]}`;
}

export function checkWiring(schedule: TerminalSchedule): WiringCheckResult {
  return readCircuit(schedule, false).result;
}

/**
 * The electrical nodes that carry at least one driver or fitting end, each with its
 * terminals (for showing which terminals are common); the partition the check judges.
 */
export function electricalNodes(schedule: TerminalSchedule): WiringNode[] {
  return readCircuit(schedule, true).nodes;
}

function readCircuit(schedule: TerminalSchedule, wantNodes: boolean): { result: WiringCheckResult; nodes: WiringNode[] } {
  const malformed = shapeProblem(schedule);
  const kind: WiringKind = schedule?.kind === 'constant-voltage' ? 'constant-voltage' : 'constant-current';
  if (malformed) {
    const findings = [finding('schedule-malformed', 'error', malformed)];
    return { result: { kind, ok: false, seriesOrder: null, findings }, nodes: [] };
  }

  const n = schedule.fittingCount;
  const labels = schedule.fittingLabels;
  const findings: Finding[] = [];
  const say = (end: ConductorEnd): string => describeConductorEnd(end, labels);

  // 1. Terminals, and where every conductor end lands.
  let terminalTotal = 0;
  for (const block of schedule.blocks) terminalTotal += block.terminals.length;
  const termBlock = new Int32Array(terminalTotal);
  const termNumber = new Int32Array(terminalTotal);
  let nextTerminal = 0;
  const endTerminal = new Int32Array(2 * n + 2).fill(NONE);
  const endText: string[] = wantNodes ? new Array<string>(2 * n + 2) : [];
  const repeats = new Map<number, number[]>(); // element end -> every terminal it lands on
  const linkCores = new LinkCores(terminalTotal);
  const scan = newConductorScan();
  const unknownFittings = new Map<number, number[]>();

  for (let bi = 0; bi < schedule.blocks.length; bi++) {
    const block = schedule.blocks[bi]!;
    for (let ti = 0; ti < block.terminals.length; ti++) {
      const terminal = block.terminals[ti]!;
      const t = nextTerminal++;
      termBlock[t] = bi + 1;
      termNumber[t] = ti + 1;
      const limit = block.conductorsPerTerminal;
      if (limit !== undefined && terminal.conductors.length > limit) {
        findings.push(
          finding(
            'terminal-over-limit',
            'error',
            `Block ${bi + 1} terminal ${ti + 1} has ${terminal.conductors.length} conductor ends on it; ` +
              `it takes at most ${limit}. Use another terminal or a larger block.`,
            { subject: where(bi + 1, ti + 1), values: { conductors: terminal.conductors.length, limit } },
          ),
        );
      }
      for (const text of terminal.conductors) {
        if (!scanConductorEnd(text, scan)) {
          findings.push(
            finding(
              'conductor-unrecognised',
              'error',
              `"${String(text)}" on block ${bi + 1} terminal ${ti + 1} is not a conductor end the check knows. ` +
                'Write driver+ / driver-, fitting:3+ / fitting:3-, or link:2/core:1/end:A.',
              { subject: where(bi + 1, ti + 1) },
            ),
          );
          continue;
        }
        if (scan.kind === 'link') {
          linkCores.add(scan.link, scan.core, scan.endB, t);
          continue;
        }
        if (scan.kind === 'fitting' && scan.fitting > n) {
          const at = unknownFittings.get(scan.fitting) ?? [];
          at.push(t);
          unknownFittings.set(scan.fitting, at);
          continue;
        }
        const e = (scan.kind === 'driver' ? 0 : 2 * scan.fitting) + (scan.minus ? 1 : 0);
        if (endTerminal[e] === NONE) {
          endTerminal[e] = t;
          if (wantNodes && scan.canonical) endText[e] = text;
        } else {
          const at = repeats.get(e) ?? [endTerminal[e]!];
          at.push(t);
          repeats.set(e, at);
        }
      }
    }
  }
  const terminalCount = terminalTotal;
  const at = (t: number): string => `block ${termBlock[t]} terminal ${termNumber[t]}`;
  const subjectOf = (t: number): string => where(termBlock[t]!, termNumber[t]!);

  for (const [k, ts] of [...unknownFittings].sort((x, y) => x[0] - y[0])) {
    findings.push(
      finding(
        'fitting-unknown',
        'error',
        `Fitting ${k} appears on ${list(ts.map(at))}, but this circuit has ${n} fitting${n === 1 ? '' : 's'}.`,
        { subject: `fitting:${k}`, values: { fitting: k, fittingCount: n } },
      ),
    );
  }

  // Repeated ends: a fitting used twice, or a driver lead end landed in two places.
  const repeatedFittings = new Map<number, string[]>();
  for (const [e, ts] of [...repeats].sort((x, y) => x[0] - y[0])) {
    const end = elementEnd(e);
    if (end.kind === 'fitting') {
      const prev = repeatedFittings.get(end.fitting) ?? [];
      prev.push(`${say(end)} on ${list(ts.map(at))}`);
      repeatedFittings.set(end.fitting, prev);
    } else {
      findings.push(
        finding(
          'driver-end-repeated',
          'error',
          `The ${say(end)} is written on ${list(ts.map(at))}; one conductor end lands on one terminal.`,
          { subject: 'driver' },
        ),
      );
    }
  }
  for (const [k, what] of repeatedFittings) {
    findings.push(
      finding(
        'fitting-used-twice',
        'error',
        `Fitting ${k} is used more than once: ${what.join('; ')}. Each fitting's tail lands once.`,
        { subject: `fitting:${k}` },
      ),
    );
  }

  // Missing ends.
  for (const p of [0, 1]) {
    if (endTerminal[p] === NONE) {
      findings.push(
        finding(
          'driver-end-missing',
          'error',
          `The ${say(elementEnd(p))} is not on any terminal, so the circuit is open at the driver.`,
          { subject: 'driver' },
        ),
      );
    }
  }
  for (let k = 1; k <= n; k++) {
    const plus = endTerminal[2 * k] !== NONE;
    const minus = endTerminal[2 * k + 1] !== NONE;
    if (!plus && !minus) {
      findings.push(
        finding('fitting-missing', 'error', `Fitting ${k}${labelOf(labels, k)} is not on the schedule at all.`, {
          subject: `fitting:${k}`,
        }),
      );
    } else if (!plus || !minus) {
      const missing = elementEnd(2 * k + (plus ? 1 : 0));
      const present = 2 * k + (plus ? 0 : 1);
      findings.push(
        finding(
          'fitting-end-missing',
          'error',
          `The ${say(missing)} is not on any terminal (its other conductor is on ${at(endTerminal[present]!)}), ` +
            'so the circuit is open there.',
          { subject: `fitting:${k}` },
        ),
      );
    }
  }

  // 2. Electrical nodes: terminals joined by link cores.
  const uf = new UnionFind(terminalCount);
  linkCores.forEach(
    (a, b) => uf.union(a, b),
    (rec) => {
      const name = `link cable ${rec.link} core ${rec.core}`;
      if (rec.a.length > 1 || rec.b.length > 1) {
        const both = [...rec.a.map((t) => `end A on ${at(t)}`), ...rec.b.map((t) => `end B on ${at(t)}`)];
        findings.push(
          finding('link-end-repeated', 'error', `${cap(name)} has an end written twice: ${list(both)}.`, {
            subject: `link:${rec.link}/core:${rec.core}`,
          }),
        );
      }
      const ends = [...rec.a, ...rec.b];
      for (let i = 1; i < ends.length; i++) uf.union(ends[0]!, ends[i]!);
      if (rec.a.length === 0 || rec.b.length === 0) {
        const landed = rec.a.length ? 'A' : 'B';
        const missing = rec.a.length ? 'B' : 'A';
        findings.push(
          finding(
            'link-core-end-unlanded',
            'warning',
            `${cap(name)} has end ${landed} on ${at(ends[0]!)} but end ${missing} is not on any terminal. ` +
              'A core that carries nothing should be insulated and parked, not left loose (common practice).',
            { subject: `link:${rec.link}/core:${rec.core}` },
          ),
        );
      }
    },
  );

  const elementCount = 2 * n + 2;
  const nodeOf = new Int32Array(elementCount).fill(NONE);
  for (let e = 0; e < elementCount; e++) {
    const t = endTerminal[e]!;
    if (t !== NONE) nodeOf[e] = uf.find(t);
  }
  const nodeEnds = NodeEnds.group(nodeOf, terminalCount);

  let nodeTerminals: Map<number, number[]> | null = null;
  const terminalsOf = (root: number): number[] => {
    if (!nodeTerminals) {
      nodeTerminals = new Map();
      for (let t = 0; t < terminalCount; t++) {
        const r = uf.find(t);
        const xs = nodeTerminals.get(r);
        if (xs) xs.push(t);
        else nodeTerminals.set(r, [t]);
      }
    }
    return nodeTerminals.get(root) ?? [];
  };
  const nodeAt = (root: number): string => {
    const ts = terminalsOf(root);
    return ts.length === 1 ? at(ts[0]!) : `${list(ts.map(at))} (joined by link cable cores)`;
  };
  const endAt = (e: number): string => at(endTerminal[e]!);

  const ctx: Analysis = { n, terminalCount, nodeOf, nodeEnds, say, nodeAt, endAt, subjectOf, endTerminal, findings };
  const seriesOrder = kind === 'constant-current' ? analyseSeries(ctx) : (analyseParallel(ctx), null);

  const nodes: WiringNode[] = [];
  if (wantNodes) {
    const firstTerminal = new Map<number, number>();
    nodeEnds.forEachRoot((r) => {
      let first = terminalCount;
      for (let i = 0; i < nodeEnds.count(r); i++) first = Math.min(first, endTerminal[nodeEnds.end(r, i)]!);
      firstTerminal.set(r, first);
    });
    const roots = nodeEnds.keys().sort((x, y) => firstTerminal.get(x)! - firstTerminal.get(y)!);
    const byLanding = (x: number, y: number) => endTerminal[x]! - endTerminal[y]! || x - y;
    for (const r of roots) {
      const ends = nodeEnds.list(r);
      const order = ends.length === 2 ? (byLanding(ends[0]!, ends[1]!) <= 0 ? ends : [ends[1]!, ends[0]!]) : [...ends].sort(byLanding);
      nodes.push({
        terminals: terminalsOf(r).map(subjectOf),
        ends: order.map((e) => endText[e] ?? formatConductorEnd(elementEnd(e))),
      });
    }
  }

  const ok = !hasErrors(findings);
  return { result: { kind, ok, seriesOrder: ok ? seriesOrder : null, findings }, nodes };
}

interface Analysis {
  n: number;
  terminalCount: number;
  nodeOf: Int32Array;
  nodeEnds: NodeEnds;
  say: (end: ConductorEnd) => string;
  nodeAt: (root: number) => string;
  endAt: (e: number) => string;
  subjectOf: (t: number) => string;
  endTerminal: Int32Array;
  findings: Finding[];
}

function bothEnds(a: Analysis, k: number): boolean {
  return a.nodeOf[2 * k] !== NONE && a.nodeOf[2 * k + 1] !== NONE;
}

function bypassed(a: Analysis, k: number): boolean {
  return bothEnds(a, k) && a.nodeOf[2 * k] === a.nodeOf[2 * k + 1];
}

function reportShortAndBypass(a: Analysis): void {
  const { nodeOf, findings } = a;
  if (nodeOf[0] !== NONE && nodeOf[0] === nodeOf[1]) {
    findings.push(
      finding(
        'short-across-driver',
        'error',
        `The driver's + and - meet at ${a.nodeAt(nodeOf[0]!)}: a short circuit across the driver output.`,
        { subject: 'driver' },
      ),
    );
  }
  for (let k = 1; k <= a.n; k++) {
    if (bypassed(a, k)) {
      findings.push(
        finding(
          'fitting-bypassed',
          'error',
          `Fitting ${k}'s + and - are on the same node (${a.nodeAt(nodeOf[2 * k]!)}), so it is bypassed and ` +
            'will not light.',
          { subject: `fitting:${k}` },
        ),
      );
    }
  }
}

/** Constant current: one loop from driver + through every fitting, + first, to driver -. */
function analyseSeries(a: Analysis): number[] | null {
  const { n, nodeOf, findings } = a;
  reportShortAndBypass(a);
  // A bypassed fitting is a wire loop on one node: it takes no part in the loop.
  let nodeEnds = a.nodeEnds;
  let anyBypass = false;
  for (let k = 1; k <= n && !anyBypass; k++) anyBypass = bypassed(a, k);
  if (anyBypass) nodeEnds = a.nodeEnds.filtered((e) => e < 2 || !bypassed(a, e >> 1));

  // Fittings sharing both nodes are in parallel.
  // Only a node with three or more ends can hold a parallel branch on the driver's loop.
  const pairs = new Map<number, number[]>();
  const span = a.terminalCount;
  for (let k = 1; k <= n; k++) {
    if (!bothEnds(a, k) || bypassed(a, k)) continue;
    const x = nodeOf[2 * k]!;
    const y = nodeOf[2 * k + 1]!;
    if (nodeEnds.count(x) < 3 && nodeEnds.count(y) < 3) continue;
    const key = Math.min(x, y) * span + Math.max(x, y);
    const group = pairs.get(key);
    if (group) group.push(k);
    else pairs.set(key, [k]);
  }
  const parallelExtra = new Map<number, number>(); // node -> ends explained by parallel groups
  const implicated = new Set<number>(); // fittings already named by a finding below
  for (const group of pairs.values()) {
    if (group.length < 2) continue;
    const k = group[0]!;
    const x = nodeOf[2 * k]!;
    const y = nodeOf[2 * k + 1]!;
    // Fittings whose two nodes carry nothing else form a closed loop of their own
    // (reported below as outside the loop), not a parallel branch on the driver.
    if (nodeEnds.count(x) === group.length && nodeEnds.count(y) === group.length) continue;
    for (const j of group) implicated.add(j);
    parallelExtra.set(x, (parallelExtra.get(x) ?? 0) + group.length - 1);
    parallelExtra.set(y, (parallelExtra.get(y) ?? 0) + group.length - 1);
    findings.push(
      finding(
        'fittings-in-parallel',
        'error',
        `Fittings ${list(group)} are in parallel (all between ${a.nodeAt(x)} and ${a.nodeAt(y)}). On a ` +
          'constant-current driver they share the current unevenly and one can be overdriven; wire them in ' +
          'series (common practice).',
        { subject: `fitting:${k}`, values: { fittings: group.join(',') } },
      ),
    );
  }

  // Open ends and branches.
  const markNode = (ends: readonly number[]) => {
    for (const e of ends) if (e >= 2) implicated.add(e >> 1);
  };
  nodeEnds.forEachRoot((root) => {
    const count = nodeEnds.count(root);
    if (count === 1) {
      markNode([nodeEnds.end(root, 0)]);
      const e = nodeEnds.end(root, 0);
      findings.push(
        finding(
          'open-circuit',
          'error',
          `Open circuit at ${a.endAt(e)}: the ${a.say(elementEnd(e))} lands there and nothing else connects to it.`,
          { subject: a.subjectOf(a.endTerminal[e]!) },
        ),
      );
    } else if (count - (parallelExtra.get(root) ?? 0) > 2) {
      const ends = nodeEnds.list(root);
      markNode(ends);
      findings.push(
        finding(
          'circuit-branches',
          'error',
          `${cap(list(ends.map((e) => a.say(elementEnd(e)))))} all meet at ${a.nodeAt(root)}. In a series ` +
            'string only two conductor ends are common at each joint, so the current splits here.',
          { subject: a.subjectOf(a.endTerminal[ends[0]!]!) },
        ),
      );
    }
  });

  // Walk the loop from driver + forwards and from driver - backwards.
  const visited = new Uint8Array(n + 1);
  const reversed: number[] = [];
  // Sized once; the order is only given back when the walk met all n fittings.
  const order = new Array<number>(n);
  let ordered = 0;
  const walk = (start: number, forwards: boolean): boolean => {
    let arrived = start;
    for (let steps = 0; steps <= n; steps++) {
      if (nodeOf[arrived] === NONE) return false;
      const node = nodeOf[arrived]!;
      if (nodeEnds.count(node) !== 2) return false;
      const first = nodeEnds.end(node, 0);
      const other = first === arrived ? nodeEnds.end(node, 1) : first;
      if (other < 2) return other === (forwards ? 1 : 0);
      const k = other >> 1;
      if (visited[k]) return false;
      visited[k] = 1;
      if (forwards) order[ordered++] = k;
      const enteredAtPlus = (other & 1) === 0;
      if (enteredAtPlus !== forwards) reversed.push(k);
      arrived = other ^ 1;
    }
    return false;
  };
  const closed = walk(0, true);
  if (!closed) walk(1, false);

  for (const k of reversed.sort((x, y) => x - y)) {
    findings.push(
      finding(
        'fitting-reversed',
        'error',
        `Fitting ${k} is reversed: the current reaches its - (${a.endAt(2 * k + 1)}) before its + ` +
          `(${a.endAt(2 * k)}). Swap its two conductors; an LED does not light backwards.`,
        { subject: `fitting:${k}` },
      ),
    );
  }

  const outside: number[] = [];
  for (let k = 1; k <= n; k++) {
    if (!visited[k] && bothEnds(a, k) && !bypassed(a, k) && !implicated.has(k)) outside.push(k);
  }
  if (outside.length > 0) {
    const inSet = new Set(outside);
    const ownLoop = outside.every((k) =>
      [2 * k, 2 * k + 1].every((e) => {
        const ends = nodeEnds.list(nodeOf[e]!);
        return ends.length === 2 && ends.every((x) => x >= 2 && inSet.has(x >> 1));
      }),
    );
    findings.push(
      finding(
        'fittings-outside-loop',
        'error',
        `Fitting${outside.length === 1 ? '' : 's'} ${list(outside)} ${outside.length === 1 ? 'is' : 'are'} not on ` +
          "the path from the driver's + to its -" +
          (ownLoop ? ': they form a closed loop of their own and will not light.' : ' and will not light.'),
        { subject: `fitting:${outside[0]}`, values: { fittings: outside.join(',') } },
      ),
    );
  }

  if (!closed && !hasErrors(findings)) {
    findings.push(
      finding('open-circuit', 'error', "The circuit does not return from the driver's + to its -.", {
        subject: 'driver',
      }),
    );
  }
  return closed && ordered === n && reversed.length === 0 ? order : null;
}

/** Constant voltage: every fitting straight across the supply, + to +, - to -. */
function analyseParallel(a: Analysis): void {
  const { n, nodeOf, nodeEnds, findings } = a;
  reportShortAndBypass(a);
  const plus = nodeOf[0]!;
  const minus = nodeOf[1]!;
  // Without both supply ends, or with them shorted, there are no rails to measure against;
  // those faults are already reported.
  if (plus === NONE || minus === NONE || plus === minus) return;
  const rail = (x: number): boolean => x === plus || x === minus;

  for (let k = 1; k <= n; k++) {
    if (!bothEnds(a, k) || bypassed(a, k)) continue;
    const x = nodeOf[2 * k]!;
    const y = nodeOf[2 * k + 1]!;
    if (x === minus && y === plus) {
      findings.push(
        finding(
          'fitting-reversed',
          'error',
          `Fitting ${k} is reversed: its + (${a.endAt(2 * k)}) is on the supply's - and its - ` +
            `(${a.endAt(2 * k + 1)}) on the supply's +. Swap its two conductors.`,
          { subject: `fitting:${k}` },
        ),
      );
    }
  }

  // Ends on nodes other than the supply's: a series joint, or an open end.
  const offRail: [number, number[]][] = [];
  nodeEnds.forEachRoot((root) => {
    if (!rail(root)) offRail.push([root, nodeEnds.list(root)]);
  });
  for (const [root, ends] of offRail) {
    const fittingsHere = [...new Set(ends.map((e) => e >> 1))].filter((k) => !bypassed(a, k));
    if (fittingsHere.length === 0) continue;
    if (fittingsHere.length >= 2) {
      findings.push(
        finding(
          'fittings-in-series',
          'error',
          `Fittings ${list(fittingsHere)} are joined in series at ${a.nodeAt(root)}. On a constant-voltage ` +
            "supply each fitting goes straight across the supply's + and - (common practice).",
          { subject: `fitting:${fittingsHere[0]}`, values: { fittings: fittingsHere.join(',') } },
        ),
      );
    } else {
      const e = ends.find((x) => x >> 1 === fittingsHere[0])!;
      findings.push(
        finding(
          'open-circuit',
          'error',
          `Open circuit at ${a.endAt(e)}: the ${a.say(elementEnd(e))} is not connected to the supply.`,
          { subject: a.subjectOf(a.endTerminal[e]!) },
        ),
      );
    }
  }
  for (const p of [0, 1]) {
    if (nodeEnds.count(nodeOf[p]!) === 1 && n > 0) {
      findings.push(
        finding(
          'open-circuit',
          'error',
          `Open circuit at ${a.endAt(p)}: the ${a.say(elementEnd(p))} lands there and no fitting connects to it.`,
          { subject: a.subjectOf(a.endTerminal[p]!) },
        ),
      );
    }
  }
}

function where(block: number, terminal: number): string {
  return `block:${block}/terminal:${terminal}`;
}

function cap(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function labelOf(labels: readonly string[] | undefined, k: number): string {
  const l = labels?.[k - 1];
  return l ? ` (${l})` : '';
}

function shapeProblem(s: TerminalSchedule): string | null {
  if (typeof s !== 'object' || s === null) return 'The terminal schedule is empty.';
  if (s.kind !== 'constant-current' && s.kind !== 'constant-voltage') {
    return 'The schedule must say whether the circuit is constant-current or constant-voltage.';
  }
  if (!Number.isInteger(s.fittingCount) || s.fittingCount < 0 || s.fittingCount > 1_000_000) {
    return 'The schedule must say how many fittings the circuit has (a whole number).';
  }
  if (!Array.isArray(s.blocks)) return 'The schedule has no list of blocks.';
  for (let bi = 0; bi < s.blocks.length; bi++) {
    const b = s.blocks[bi];
    if (typeof b !== 'object' || b === null || !Array.isArray(b.terminals)) {
      return `Block ${bi + 1} has no list of terminals.`;
    }
    if (b.conductorsPerTerminal !== undefined && !(Number.isInteger(b.conductorsPerTerminal) && b.conductorsPerTerminal >= 1)) {
      return `Block ${bi + 1}'s conductors per terminal must be a whole number of at least 1.`;
    }
    for (let ti = 0; ti < b.terminals.length; ti++) {
      const t = b.terminals[ti];
      if (typeof t !== 'object' || t === null || !Array.isArray(t.conductors)) {
        return `Block ${bi + 1} terminal ${ti + 1} has no list of conductors.`;
      }
    }
  }
  return null;
}
