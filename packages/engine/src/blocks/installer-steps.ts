/**
 * The installer's step list for a block plan, in the order the work is done, in plain words.
 */
import { newConductorScan, scanConductorEnd } from '../wiring/conductor-id';
import type { BlockPlan } from './block-plan';
import { describeCable, type EntryUse } from './entry-seals';

export interface InstallerStep {
  /** The block the step is about, or null for the whole circuit. */
  block: number | null;
  text: string;
}

/**
 * Step texts are joined from parts rather than concatenated: a schedule of thousands of
 * terminals then holds compact flat strings, not chains of fragments.
 */
/** `labels[k-1]` names fitting k; an empty label leaves the fitting by number only. */
export function installerSteps(plan: BlockPlan, labels: readonly string[]): InstallerStep[] {
  const steps: InstallerStep[] = [];
  const add = (block: number | null, ...parts: (string | number)[]) => steps.push({ block, text: parts.join('') });
  const addParts = (block: number, parts: (string | number)[]) => steps.push({ block, text: parts.join('') });
  add(
    null,
    "Switch off and isolate the driver's supply before you start. Mains-side work, protective devices and " +
      'certification follow local wiring rules and are for a licensed electrician; this schedule covers the ' +
      'extra-low-voltage side.',
  );
  for (const block of plan.blocks) {
    add(block.number, 'Mount block ', block.number, ' (', block.blockType, ', ', block.ipCode, ') near ', fittingRange(block.fittings), '.');
  }
  for (const link of plan.links) {
    add(
      null,
      'Lay link cable ',
      link.number,
      ' (two-core, ',
      link.lengthM === null ? 'length to be measured' : `${link.lengthM} m`,
      ') from block ',
      link.fromBlock,
      ' to block ',
      link.toBlock,
      '. Core ',
      link.forwardCore,
      ' carries the string on; core ',
      link.returnCore,
      ' carries the return back to the driver -.',
    );
  }
  const parts: (string | number)[] = [];
  const scan = newConductorScan();
  const describe = (text: string): void => {
    if (!scanConductorEnd(text, scan)) parts.push(text);
    else if (scan.kind === 'fitting') {
      const label = labels[scan.fitting - 1];
      if (label) parts.push('fitting ', scan.fitting, ' (', label, scan.minus ? ') -' : ') +');
      else parts.push('fitting ', scan.fitting, scan.minus ? ' -' : ' +');
    }
    else if (scan.kind === 'driver') parts.push(scan.minus ? 'driver lead -' : 'driver lead +');
    else parts.push('link cable ', scan.link, ' core ', scan.core, scan.endB ? ' (end B)' : ' (end A)');
  };
  for (const block of plan.blocks) {
    const e = block.entries;
    const cables = e.used === 1 ? ' cable' : ' cables';
    const plugs = e.blankingPlugs === 1 ? ' spare entry' : ' spare entries';
    add(
      block.number,
      'Bring ',
      e.used,
      cables,
      ' into block ',
      block.number,
      ' (',
      e.total,
      ' entries) and seal each entry',
      e.reducers > 0 ? `, with a reducer on the ${e.reducers} thinner cable${e.reducers === 1 ? '' : 's'}` : '',
      e.blankingPlugs > 0 ? `; fit blanking plugs in the ${e.blankingPlugs}${plugs}` : '',
      ': ',
      cableList(block.fittings, e.cables),
      '.',
    );
    for (let i = 0; i < block.terminals.length; i++) {
      const t = block.terminals[i]!;
      parts.length = 0;
      parts.push('Block ', block.number, ' terminal ', i + 1, ': land ');
      for (let ci = 0; ci < t.conductors.length; ci++) {
        if (ci > 0) parts.push(ci === t.conductors.length - 1 ? ' and ' : ', ');
        describe(t.conductors[ci]!);
      }
      if (t.note) parts.push(' (', t.note, ').');
      else parts.push('.');
      addParts(block.number, parts);
    }
    if (block.spareTerminals > 0) {
      const s = block.spareTerminals === 1 ? '' : 's';
      add(block.number, 'Leave block ', block.number, "'s other ", block.spareTerminals, ' terminal', s, ' empty.');
    }
  }
  add(
    null,
    'Compare every block with this schedule before closing its lid, then switch on and confirm each fitting lights. ' +
      'In a series string one open joint leaves every fitting dark, and a reversed fitting stays dark.',
  );
  return steps;
}

/** "driver lead, tails of fittings 1-4 and link cable 1". */
function cableList(fittings: readonly number[], cables: readonly EntryUse[]): string {
  const names: string[] = [];
  for (const c of cables) if (!c.cable.startsWith('fitting:')) names.push(describeCable(c.cable));
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
