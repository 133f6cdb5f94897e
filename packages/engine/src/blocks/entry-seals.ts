/**
 * Cable entries of one block: a seal on every entry used, a reducer where the cable is
 * thinner than the entry seals on its own, a blanking plug in every spare entry (an open
 * entry defeats the block's IP rating; common practice).
 */
import { finding, type Finding } from '../findings';
import type { BlockCableRef, ConnectorBlockType } from './connector-block';

export type EntryFit = 'seal' | 'seal-with-reducer' | 'too-large' | 'size-unknown';

export interface EntryUse {
  /** `driver-lead`, `fitting:3` (its tail) or `link:2`. */
  cable: string;
  outerDiameterMm: number | null;
  fit: EntryFit;
}

export interface BlockEntries {
  total: number;
  used: number;
  spare: number;
  /** One per used entry (sized to the entry; unknown cable sizes still take one). */
  seals: number;
  /** Reducing inserts for cables below the entry's sealing range. */
  reducers: number;
  /** For the spare entries. */
  blankingPlugs: number;
  cables: EntryUse[];
}

/** How one cable (`driver-lead`, `fitting:3`, `link:2`) enters block `blockNumber`. */
export function entryUse(
  blockNumber: number,
  type: ConnectorBlockType,
  cable: string,
  ref: BlockCableRef | undefined,
  findings: Finding[],
): EntryUse {
  const range = type.entrySealRangeMm;
  const d = ref?.outerDiameterMm;
  let fit: EntryFit;
  if (d === undefined || !range) fit = 'size-unknown';
  else if (d < range.min) fit = 'seal-with-reducer';
  else if (d > range.max) fit = 'too-large';
  else fit = 'seal';
  if (fit === 'too-large') {
    findings.push(
      finding(
        'cable-too-large-for-entry',
        'error',
        `The ${describeCable(cable)} (${d} mm across) is too thick for an entry of block ${blockNumber}, which seals ` +
          `${range!.min}-${range!.max} mm. Choose a block with larger entries.`,
        { subject: `block:${blockNumber}`, values: { outerDiameterMm: d!, entryMaxMm: range!.max } },
      ),
    );
  }
  return { cable, outerDiameterMm: d ?? null, fit };
}

/** Seals, reducers and blanking plugs for a block's entries. */
export function blockEntries(type: ConnectorBlockType, uses: EntryUse[]): BlockEntries {
  let reducers = 0;
  for (const u of uses) if (u.fit === 'seal-with-reducer') reducers++;
  const used = uses.length;
  const spare = Math.max(0, type.cableEntries - used);
  return { total: type.cableEntries, used, spare, seals: used, reducers, blankingPlugs: spare, cables: uses };
}

/** Plain words for an entry's cable id: "driver lead", "fitting 3 tail", "link cable 2". */
export function describeCable(cable: string): string {
  if (cable === 'driver-lead') return 'driver lead';
  if (cable.startsWith('fitting:')) return `fitting ${cable.slice(8)} tail`;
  if (cable.startsWith('link:')) return `link cable ${cable.slice(5)}`;
  return cable;
}
