/**
 * The installer's step list for a block plan, in the order the work is done, in plain words.
 */
import { hasTextAt, newConductorScan, scanConductorEnd } from '../wiring/conductor-id';
import { flatText } from '../wiring/flat-text';
import type { BlockPlan } from './block-plan';
import { describeCable, type EntryUse } from './entry-seals';

export interface InstallerStep {
  /** The block the step is about, or null for the whole circuit. */
  block: number | null;
  text: string;
}

const ISOLATE =
  "Switch off and isolate the driver's supply before you start. Mains-side work, protective devices and " +
  'certification follow local wiring rules and are for a licensed electrician; this schedule covers the ' +
  'extra-low-voltage side.';
const CONFIRM =
  'Compare every block with this schedule before closing its lid, then switch on and confirm each fitting lights. ' +
  'In a series string one open joint leaves every fitting dark, and a reversed fitting stays dark.';

/** `labels[k-1]` names fitting k; an empty label leaves the fitting by number only. */
export function installerSteps(plan: BlockPlan, labels: readonly string[]): InstallerStep[] {
  // Sized once: the two whole-circuit steps, a mount step per block and a step per link, then
  // per block its entries, one step per terminal and the spare terminals.
  let count = 2 + plan.blocks.length + plan.links.length;
  for (const block of plan.blocks) count += 1 + block.terminals.length + (block.spareTerminals > 0 ? 1 : 0);
  const steps = new Array<InstallerStep>(count);
  let s = 0;
  steps[s++] = { block: null, text: ISOLATE };
  for (const block of plan.blocks) {
    steps[s++] = {
      block: block.number,
      text: flatText(`Mount block ${block.number} (${str(block.blockType)}, ${str(block.ipCode)}) near ${fittingRange(block.fittings)}.`),
    };
  }
  for (const link of plan.links) {
    const length = link.lengthM === null ? 'length to be measured' : `${link.lengthM} m`;
    steps[s++] = {
      block: null,
      text: flatText(
        `Lay link cable ${link.number} (two-core, ${length}) from block ${link.fromBlock} to block ${link.toBlock}. ` +
          `Core ${link.forwardCore} carries the string on; core ${link.returnCore} carries the return back to the driver -.`,
      ),
    };
  }
  // "fitting 3 (Oak uplight)": each fitting appears on two terminals one after the other
  // (its - on one joint, its + on the one before), so the last name made is kept for the next.
  let lastK = 0;
  let lastName = '';
  const nameOf = (k: number): string => {
    if (k !== lastK) {
      const label = labels[k - 1];
      lastName = label ? `fitting ${k} (${label})` : `fitting ${k}`;
      lastK = k;
    }
    return lastName;
  };
  const scan = newConductorScan();
  const describe = (text: string): string => {
    if (!scanConductorEnd(text, scan)) return text;
    const sign = scan.minus ? '-' : '+';
    if (scan.kind === 'driver') return `driver lead ${sign}`;
    if (scan.kind === 'link') return `link cable ${scan.link} core ${scan.core} (end ${scan.endB ? 'B' : 'A'})`;
    return `${nameOf(scan.fitting)} ${sign}`;
  };
  /** Step text for a joint between two fittings (the common case) in one template; null otherwise. */
  const fittingJoint = (head: string, terminal: number, a: string, b: string): string | null => {
    if (!scanConductorEnd(a, scan) || scan.kind !== 'fitting') return null;
    const ka = scan.fitting;
    const and = scan.minus ? ' - and ' : ' + and ';
    if (!scanConductorEnd(b, scan) || scan.kind !== 'fitting') return null;
    const end = scan.minus ? ' -.' : ' +.';
    return `${head}${terminal}: land ${nameOf(ka)}${and}${nameOf(scan.fitting)}${end}`;
  };
  for (const block of plan.blocks) {
    const e = block.entries;
    const cables = e.used === 1 ? 'cable' : 'cables';
    const reducers = e.reducers > 0 ? `, with a reducer on the ${e.reducers} thinner cable${e.reducers === 1 ? '' : 's'}` : '';
    const plugs = e.blankingPlugs > 0 ? `; fit blanking plugs in the ${e.blankingPlugs} spare ${e.blankingPlugs === 1 ? 'entry' : 'entries'}` : '';
    steps[s++] = {
      block: block.number,
      text: flatText(
        `Bring ${e.used} ${cables} into block ${block.number} (${e.total} entries) and seal each entry${reducers}${plugs}: ` +
          `${cableList(block.fittings, e.cables)}.`,
      ),
    };
    const head = flatText(`Block ${block.number} terminal `); // shared by the block's joint texts
    for (let i = 0; i < block.terminals.length; i++) {
      const t = block.terminals[i]!;
      const c = t.conductors;
      const joint = c.length === 2 && !t.note ? fittingJoint(head, i + 1, c[0]!, c[1]!) : null;
      const lands = joint ? '' : c.length === 2 ? `${describe(c[0]!)} and ${describe(c[1]!)}` : list(c.map(describe));
      const text = joint ?? `Block ${block.number} terminal ${i + 1}: land ${lands}${t.note ? ` (${t.note})` : ''}.`;
      steps[s++] = { block: block.number, text: flatText(text) };
    }
    if (block.spareTerminals > 0) {
      const plural = block.spareTerminals === 1 ? '' : 's';
      steps[s++] = {
        block: block.number,
        text: flatText(`Leave block ${block.number}'s other ${block.spareTerminals} terminal${plural} empty.`),
      };
    }
  }
  steps[s] = { block: null, text: CONFIRM };
  return steps;
}

/** A part of a text as the step list has always written it: missing parts as nothing. */
function str(x: unknown): string {
  return x === undefined || x === null ? '' : String(x);
}

/** "driver lead, tails of fittings 1-4 and link cable 1". */
function cableList(fittings: readonly number[], cables: readonly EntryUse[]): string {
  const names: string[] = [];
  for (const c of cables) if (!hasTextAt(c.cable, 'fitting:')) names.push(describeCable(c.cable));
  const tails = fittings.length === 1 ? `tail of fitting ${fittings[0]}` : `tails of ${fittingRange(fittings)}`;
  names.splice(1, 0, tails);
  return list(names);
}

function fittingRange(fittings: readonly number[]): string {
  const a = fittings[0];
  const b = fittings[fittings.length - 1];
  return a === b ? `fitting ${a}` : `fittings ${a}-${b}`;
}

function list(xs: readonly string[]): string {
  if (xs.length <= 1) return xs.join('');
  return `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`;
}
