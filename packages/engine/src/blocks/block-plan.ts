/**
 * The terminal schedule for a constant-current series string spread over connector blocks.
 *
 * Series rule (common practice): the driver's + lands on fitting 1's +, each later fitting's +
 * picks up the previous fitting's -, and the last fitting's - returns to the driver's -.
 * Across blocks, link cable n joins block n to block n+1: core 1 carries the string on,
 * core 2 carries the return leg back through every block to the driver's -.
 *
 * Layout inside block j (fittings a..b):
 *   entry joint   driver+ (block 1) or link j-1 core 1 end B, with fitting a +
 *   joints        fitting k -, fitting k+1 +          for k = a..b-1
 *   exit joint    fitting b -, link j core 1 end A    (not the last block)
 *   return        driver- (block 1) or link j-1 core 2 end B, with link j core 2 end A
 *   last block    fitting b - with the return (driver- or link j-1 core 2 end B)
 */
import { finding, hasErrors, type Finding } from '../findings';
import type { ScheduleBlock, ScheduleTerminal, TerminalSchedule } from '../wiring/terminal-schedule';
import {
  blockNeeds,
  blockPosition,
  type BlockCableRef,
  type ConnectorBlockType,
  type SeriesStringLayout,
} from './connector-block';
import { blockEntries, entryUse, type BlockEntries, type EntryUse } from './entry-seals';
import { installerSteps, type InstallerStep } from './installer-steps';
import { fittingEndText, linkEndText, linkText } from '../wiring/conductor-id';

export interface BlockPlanInput {
  string: SeriesStringLayout;
  blockType: ConnectorBlockType;
  /**
   * Fitting ids per block, in series order (block 1 first). Leave out to fill blocks in
   * order up to their capacity.
   */
  assignment?: readonly (readonly string[])[];
}

/** A terminal of the plan; `note` marks the joints that involve the driver lead or a link. */
export type PlannedTerminal = ScheduleTerminal;

export interface PlannedBlock extends ScheduleBlock {
  /** 1-based, the same as its position in `blocks`. */
  number: number;
  label: string;
  blockType: string;
  ipCode: string;
  conductorsPerTerminal: number;
  /** Fitting positions (1-based) whose tails land in this block. */
  fittings: number[];
  terminals: PlannedTerminal[];
  spareTerminals: number;
  entries: BlockEntries;
}

export interface PlannedLink {
  /** Link n runs from block n (end A) to block n+1 (end B). */
  number: number;
  fromBlock: number;
  toBlock: number;
  lengthM: number | null;
  cores: 2;
  /** Carries the string on to the next block. */
  forwardCore: 1;
  /** Carries the return leg back towards the driver's -. */
  returnCore: 2;
}

/** A terminal schedule (pass it to `checkWiring` as it is) plus what the installer needs. */
export interface BlockPlan extends TerminalSchedule {
  kind: 'constant-current';
  /** Each fitting's label, or an empty string where none was given. */
  fittingLabels: string[];
  blocks: PlannedBlock[];
  links: PlannedLink[];
  steps: InstallerStep[];
  totals: { blocks: number; seals: number; reducers: number; blankingPlugs: number; linkLengthM: number | null };
  findings: Finding[];
}


export function planConnectorBlocks(input: BlockPlanInput): BlockPlan {
  const findings: Finding[] = [];
  const fittings = Array.isArray(input?.string?.fittings) ? input.string.fittings : [];
  const n = fittings.length;
  const labels = fittings.map((f) => (typeof f?.label === 'string' ? f.label : ''));
  const empty = (): BlockPlan => ({
    kind: 'constant-current',
    fittingCount: n,
    fittingLabels: labels,
    blocks: [],
    links: [],
    steps: [],
    totals: { blocks: 0, seals: 0, reducers: 0, blankingPlugs: 0, linkLengthM: null },
    findings,
  });

  const type = input?.blockType;
  validateBlockType(type, findings);
  if (n === 0) {
    findings.push(finding('string-empty', 'error', 'The string has no fittings, so there is nothing to land.'));
  }
  if (hasErrors(findings)) return empty();

  const groups = input.assignment === undefined ? assignInOrder(n, type, findings) : checkAssignment(input, findings);
  if (!groups || hasErrors(findings)) return empty();

  const linkRef = input.string.linkCable;
  // Conductor ends and cable names come from the shared tables of canonical texts
  // (fittingEndText, linkEndText): written once, flat, and shared by every plan.
  const m = groups.length;
  const blocks = new Array<PlannedBlock>(m);
  const links = new Array<PlannedLink>(m - 1);

  for (let j = 1; j <= m; j++) {
    const group = groups[j - 1]!;
    const a = group[0]!;
    const b = group[group.length - 1]!;
    const last = j === m;
    const fromDriver = j === 1;
    // Sized once: a joint per fitting and one in, plus the exit and the return when a link leaves.
    const terminals = new Array<PlannedTerminal>(group.length + (last ? 1 : 2));
    let ti = 0;
    terminals[ti++] = fromDriver
      ? { conductors: ['driver+', fittingEndText(a, '+')], note: 'driver + to the first fitting' }
      : { conductors: [linkEndText(j - 1, 1, 'B'), fittingEndText(a, '+')], note: `string in from block ${j - 1}` };
    for (let k = a; k < b; k++) terminals[ti++] = { conductors: [fittingEndText(k, '-'), fittingEndText(k + 1, '+')] };
    const returnIn = fromDriver ? 'driver-' : linkEndText(j - 1, 2, 'B');
    if (last) {
      terminals[ti] = { conductors: [fittingEndText(b, '-'), returnIn], note: 'last fitting - returns to driver -' };
    } else {
      terminals[ti++] = { conductors: [fittingEndText(b, '-'), linkEndText(j, 1, 'A')], note: `string on to block ${j + 1}` };
      terminals[ti] = { conductors: [returnIn, linkEndText(j, 2, 'A')], note: 'return leg to driver -, passing through' };
    }

    const uses = new Array<EntryUse>(group.length + (last ? 1 : 2));
    let ui = 0;
    uses[ui++] = fromDriver
      ? entryUse(j, type, 'driver-lead', input.string.driverLead, findings)
      : entryUse(j, type, linkText(j - 1), linkRef, findings);
    for (let i = 0; i < group.length; i++) {
      const k = group[i]!;
      uses[ui++] = entryUse(j, type, fittingEndText(k, ''), fittings[k - 1]?.tail, findings);
    }
    if (!last) uses[ui] = entryUse(j, type, linkText(j), linkRef, findings);

    blocks[j - 1] = {
      number: j,
      label: `Block ${j}`,
      blockType: type.name,
      ipCode: type.ipCode,
      conductorsPerTerminal: type.conductorsPerTerminal,
      fittings: group,
      terminals,
      spareTerminals: type.terminals - terminals.length,
      entries: blockEntries(type, uses),
    };
    if (!last) links[j - 1] = { number: j, fromBlock: j, toBlock: j + 1, lengthM: null, cores: 2, forwardCore: 1, returnCore: 2 };
  }

  for (const link of links) link.lengthM = linkLength(linkRef, link.number, findings);
  checkConductorSizes(input, type, findings);
  const sizeUnknown = blocks.some((blk) => blk.entries.cables.some((c) => c.fit === 'size-unknown'));
  if (sizeUnknown) {
    findings.push(
      finding(
        'cable-size-unknown',
        'info',
        type.entrySealRangeMm
          ? 'Some cable sheath diameters are not given, so their entry seals are counted without checking the size.'
          : `Block type ${type.name} has no entry sealing range, so seals are counted without checking cable sizes.`,
      ),
    );
  }

  let seals = 0;
  let reducers = 0;
  let blankingPlugs = 0;
  for (const blk of blocks) {
    seals += blk.entries.seals;
    reducers += blk.entries.reducers;
    blankingPlugs += blk.entries.blankingPlugs;
  }
  let linkLengthM: number | null = 0;
  for (const l of links) linkLengthM = l.lengthM === null || linkLengthM === null ? null : linkLengthM + l.lengthM;
  const plan: BlockPlan = {
    kind: 'constant-current',
    fittingCount: n,
    fittingLabels: labels,
    blocks,
    links,
    steps: [],
    totals: { blocks: m, seals, reducers, blankingPlugs, linkLengthM },
    findings,
  };
  plan.steps = installerSteps(plan, labels);
  return plan;
}

function isCount(x: unknown, min: number): x is number {
  return typeof x === 'number' && Number.isInteger(x) && x >= min;
}

function validateBlockType(type: ConnectorBlockType | undefined, findings: Finding[]): asserts type is ConnectorBlockType {
  if (typeof type !== 'object' || type === null) {
    findings.push(finding('block-type-missing', 'error', 'Choose a connector-block type first.'));
    return;
  }
  const bad = (what: string) =>
    findings.push(
      finding('block-type-invalid', 'error', `Block type ${String(type.name)}: ${what}.`, { subject: 'block-type' }),
    );
  if (!isCount(type.terminals, 1)) bad('the number of terminals must be a whole number of at least 1');
  if (!isCount(type.cableEntries, 1)) bad('the number of cable entries must be a whole number of at least 1');
  if (!isCount(type.conductorsPerTerminal, 1)) bad('conductors per terminal must be a whole number of at least 1');
  else if (type.conductorsPerTerminal < 2) {
    findings.push(
      finding(
        'conductors-per-terminal-exceeded',
        'error',
        `Every series joint puts two conductor ends on one terminal, but block type ${type.name} takes only ` +
          `${type.conductorsPerTerminal} per terminal.`,
        { subject: 'block-type', values: { needed: 2, limit: type.conductorsPerTerminal } },
      ),
    );
  }
  for (const [name, r] of [
    ['entry sealing range', type.entrySealRangeMm],
    ['terminal conductor range', type.terminalRangeMm2],
  ] as const) {
    if (r !== undefined && !(r.min >= 0 && r.max >= r.min)) bad(`the ${name} must run from a smaller to a larger size`);
  }
}

/** Fill blocks in order: as many fittings as fit, keeping room for the link onward. */
function assignInOrder(n: number, type: ConnectorBlockType, findings: Finding[]): number[][] | null {
  const room = Math.min(type.terminals, type.cableEntries);
  const single = blockNeeds(1, n === 1 ? 'only' : 'first');
  if (room < single.terminals) {
    const short = type.terminals < single.terminals ? `${type.terminals} terminals` : `${type.cableEntries} cable entries`;
    findings.push(
      finding(
        'block-too-small',
        'error',
        `Block type ${type.name} has ${short}; even one fitting needs ${single.terminals} terminals and ` +
          `${single.entries} entries here (its tail, the ${n === 1 ? 'driver lead' : 'driver lead and the link onward'}).`,
        { subject: 'block-type', values: { needed: single.terminals, terminals: type.terminals, entries: type.cableEntries } },
      ),
    );
    return null;
  }
  const groups: number[][] = [];
  let next = 1;
  while (next <= n) {
    const left = n - next + 1;
    const take = blockNeeds(left, groups.length === 0 ? 'only' : 'last').terminals <= room ? left : room - 2;
    const group = new Array<number>(take);
    for (let k = 0; k < take; k++) group[k] = next + k;
    groups.push(group);
    next += take;
  }
  return groups;
}

/** Check a given assignment: known fittings, each once, contiguous and in series order, blocks big enough. */
function checkAssignment(input: BlockPlanInput, findings: Finding[]): number[][] | null {
  const fittings = input.string.fittings;
  const type = input.blockType;
  const assignment = input.assignment!;
  const byId = new Map<string, number>();
  fittings.forEach((f, i) => {
    const id = f?.id ?? String(i + 1);
    if (byId.has(id)) {
      findings.push(
        finding('fitting-id-duplicate', 'error', `Two fittings share the id "${id}", so an assignment cannot tell them apart.`, {
          subject: `fitting:${i + 1}`,
        }),
      );
    } else byId.set(id, i + 1);
  });
  if (hasErrors(findings)) return null;
  if (!Array.isArray(assignment) || assignment.some((g) => !Array.isArray(g))) {
    findings.push(finding('assignment-malformed', 'error', 'The assignment must be a list of blocks, each a list of fitting ids.'));
    return null;
  }
  const seen = new Map<number, number>();
  const groups: number[][] = [];
  assignment.forEach((ids, bi) => {
    if (ids.length === 0) {
      findings.push(
        finding('assignment-empty-block', 'error', `Block ${bi + 1} has no fittings; leave it out.`, { subject: `block:${bi + 1}` }),
      );
    }
    const group: number[] = [];
    for (const id of ids) {
      const k = byId.get(String(id));
      if (k === undefined) {
        findings.push(
          finding('assignment-unknown-fitting', 'error', `Block ${bi + 1} lists fitting "${String(id)}", which is not on this string.`, {
            subject: `block:${bi + 1}`,
          }),
        );
        continue;
      }
      const before = seen.get(k);
      if (before !== undefined) {
        findings.push(
          finding(
            'assignment-fitting-repeated',
            'error',
            `Fitting ${k} (${String(id)}) is assigned to block ${before}${before === bi + 1 ? ' twice' : ` and to block ${bi + 1}`}.`,
            { subject: `fitting:${k}` },
          ),
        );
        continue;
      }
      seen.set(k, bi + 1);
      group.push(k);
    }
    groups.push(group);
  });
  const missing: number[] = [];
  for (let k = 1; k <= fittings.length; k++) if (!seen.has(k)) missing.push(k);
  if (missing.length > 0) {
    findings.push(
      finding(
        'assignment-fitting-missing',
        'error',
        `Fitting${missing.length === 1 ? '' : 's'} ${missing.join(', ')} ${missing.length === 1 ? 'is' : 'are'} not assigned to any block.`,
        { subject: `fitting:${missing[0]}`, values: { fittings: missing.join(',') } },
      ),
    );
  }
  if (hasErrors(findings)) return null;

  // Series order: reading the blocks in turn must give fitting 1, 2, 3 ... n.
  let expected = 1;
  for (const [bi, group] of groups.entries()) {
    for (const k of group) {
      if (k !== expected) {
        findings.push(
          finding(
            'assignment-out-of-order',
            'error',
            `Block ${bi + 1} has fitting ${k} where the string continues with fitting ${expected}. Blocks take ` +
              'fittings in series order, each block carrying on where the one before stopped.',
            { subject: `block:${bi + 1}`, values: { found: k, expected } },
          ),
        );
        return null;
      }
      expected++;
    }
  }

  groups.forEach((group, bi) => {
    const need = blockNeeds(group.length, blockPosition(bi, groups.length));
    const over: string[] = [];
    if (need.terminals > type.terminals) over.push(`${need.terminals} terminals (it has ${type.terminals})`);
    if (need.entries > type.cableEntries) over.push(`${need.entries} cable entries (it has ${type.cableEntries})`);
    if (over.length > 0) {
      findings.push(
        finding(
          'block-over-capacity',
          'error',
          `Block ${bi + 1} with ${group.length} fitting${group.length === 1 ? '' : 's'} needs ${over.join(' and ')}. ` +
            'Move fittings to the next block or use a larger block.',
          { subject: `block:${bi + 1}`, values: { terminalsNeeded: need.terminals, entriesNeeded: need.entries } },
        ),
      );
    }
  });
  return groups;
}

function linkLength(ref: (BlockCableRef & { lengthsM?: readonly number[] }) | undefined, link: number, findings: Finding[]): number | null {
  const length = ref?.lengthsM?.[link - 1] ?? ref?.lengthM;
  if (length === undefined) {
    findings.push(
      finding('link-length-unknown', 'warning', `Link cable ${link} has no length; give one so it can be cut and costed.`, {
        subject: `link:${link}`,
      }),
    );
    return null;
  }
  if (!(typeof length === 'number' && Number.isFinite(length) && length > 0)) {
    findings.push(
      finding('link-length-invalid', 'error', `Link cable ${link}'s length must be a positive number of metres.`, {
        subject: `link:${link}`,
      }),
    );
    return null;
  }
  return length;
}

function checkConductorSizes(input: BlockPlanInput, type: ConnectorBlockType, findings: Finding[]): void {
  const range = type.terminalRangeMm2;
  if (!range) return;
  const outside = (ref: BlockCableRef | undefined): boolean => {
    const mm2 = ref?.conductorMm2;
    return mm2 !== undefined && !(mm2 >= range.min && mm2 <= range.max);
  };
  const report = (mm2: number, what: string, subject: string) =>
    findings.push(
      finding(
        'conductor-outside-terminal-range',
        'error',
        `The ${what} has ${mm2} mm² conductors; block type ${type.name}'s terminals clamp ${range.min}-${range.max} mm².`,
        { subject, values: { conductorMm2: mm2, minMm2: range.min, maxMm2: range.max } },
      ),
    );
  const { driverLead, linkCable, fittings } = input.string;
  if (outside(driverLead)) report(driverLead!.conductorMm2!, 'driver lead', 'driver');
  if (outside(linkCable)) report(linkCable!.conductorMm2!, 'link cable', 'link');
  for (let i = 0; i < fittings.length; i++) {
    const tail = fittings[i]?.tail;
    if (outside(tail)) report(tail!.conductorMm2!, `fitting ${i + 1} tail`, `fitting:${i + 1}`);
  }
}
