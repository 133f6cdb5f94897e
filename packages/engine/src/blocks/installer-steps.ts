/**
 * The installer's step list for a block plan, in the order the work is done, in plain words.
 */
import { parseConductorEnd, type ConductorEnd } from '../wiring/conductor-id';
import type { BlockPlan } from './block-plan';

export interface InstallerStep {
  /** The block the step is about, or null for the whole circuit. */
  block: number | null;
  text: string;
}

export function installerSteps(plan: BlockPlan, say: (end: ConductorEnd) => string): InstallerStep[] {
  const steps: InstallerStep[] = [];
  const add = (block: number | null, text: string) => steps.push({ block, text });
  add(
    null,
    "Switch off and isolate the driver's supply before you start. Mains-side work, protective devices and " +
      'certification follow local wiring rules and are for a licensed electrician; this schedule covers the ' +
      'extra-low-voltage side.',
  );
  for (const block of plan.blocks) {
    add(block.number, `Mount block ${block.number} (${block.blockType}, ${block.ipCode}) near ${fittingRange(block.fittings)}.`);
  }
  for (const link of plan.links) {
    const length = link.lengthM === null ? 'length to be measured' : `${link.lengthM} m`;
    add(
      null,
      `Lay link cable ${link.number} (two-core, ${length}) from block ${link.fromBlock} to block ${link.toBlock}. ` +
        `Core ${link.forwardCore} carries the string on; core ${link.returnCore} carries the return back to the driver −.`,
    );
  }
  for (const block of plan.blocks) {
    const e = block.entries;
    const names = e.cables.map((c) => c.description);
    let seals = `Bring ${e.used} cable${e.used === 1 ? '' : 's'} into block ${block.number} (${e.total} entries) and seal each entry`;
    if (e.reducers > 0) seals += `, with a reducer on the ${e.reducers} thinner cable${e.reducers === 1 ? '' : 's'}`;
    if (e.blankingPlugs > 0) seals += `; fit blanking plugs in the ${e.blankingPlugs} spare entr${e.blankingPlugs === 1 ? 'y' : 'ies'}`;
    seals += `: ${list(names)}.`;
    add(block.number, seals);
    block.terminals.forEach((t, i) => {
      const ends = t.conductors.map((c) => {
        const end = parseConductorEnd(c);
        return end ? say(end) : c;
      });
      add(block.number, `Block ${block.number} terminal ${i + 1}: land ${list(ends)} (${t.note}).`);
    });
    if (block.spareTerminals > 0) {
      add(block.number, `Leave block ${block.number}'s other ${block.spareTerminals} terminal${block.spareTerminals === 1 ? '' : 's'} empty.`);
    }
  }
  add(
    null,
    'Compare every block with this schedule before closing its lid, then switch on and confirm each fitting lights. ' +
      'In a series string one open joint leaves every fitting dark, and a reversed fitting stays dark.',
  );
  return steps;
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
