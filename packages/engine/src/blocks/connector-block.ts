/**
 * A connector-block type (a sealed junction box with a row of terminals) and the inputs the
 * terminal schedule needs of a series string. The string types are structural and minimal,
 * so a richer series-string type can be passed straight in.
 */

/** A cable as it enters a block: all fields optional, used when known. */
export interface BlockCableRef {
  lengthM?: number;
  /** Outer sheath diameter, for the entry seal. */
  outerDiameterMm?: number;
  /** Conductor cross-section, for the terminal's clamping range. */
  conductorMm2?: number;
}

export interface StringFittingRef {
  /** Used by an assignment; defaults to the fitting's 1-based position ("1", "2", ...). */
  id?: string;
  label?: string;
  /** The fitting's two-core tail (its + and - conductors). */
  tail?: BlockCableRef;
}

export interface SeriesStringLayout {
  /** Fittings in series order: the driver's + reaches fitting 1 first. */
  fittings: readonly StringFittingRef[];
  driverLead?: BlockCableRef;
  /** Two-core cable between consecutive blocks; `lengthsM[i]` is link i+1, else `lengthM`. */
  linkCable?: BlockCableRef & { lengthsM?: readonly number[] };
}

export interface ConnectorBlockType {
  name: string;
  /** Terminals in the block. */
  terminals: number;
  /** Cable entries (glands or grommets), each for one cable. */
  cableEntries: number;
  /** Most conductor ends one terminal clamps. */
  conductorsPerTerminal: number;
  /** e.g. "IP68". */
  ipCode: string;
  /** Sheath diameters an entry seals without a reducer. */
  entrySealRangeMm?: { min: number; max: number };
  /** Conductor sizes a terminal clamps. */
  terminalRangeMm2?: { min: number; max: number };
}

/** Position of a block along the string: which cables besides fitting tails it carries. */
export type BlockPosition = 'only' | 'first' | 'middle' | 'last';

/**
 * Terminals (and, equally, cable entries) a block needs for `fittings` fittings at a
 * position: one terminal per series joint (fittings + 1), plus one for the return leg
 * passing through when a link leaves the block (first, middle). Entries: one per fitting
 * tail, plus the driver lead or incoming link, plus the outgoing link.
 */
export function blockNeeds(fittings: number, position: BlockPosition): { terminals: number; entries: number } {
  const through = position === 'first' || position === 'middle' ? 1 : 0;
  const count = fittings + 1 + through;
  return { terminals: count, entries: count };
}

export function blockPosition(index: number, blockCount: number): BlockPosition {
  if (blockCount === 1) return 'only';
  if (index === 0) return 'first';
  return index === blockCount - 1 ? 'last' : 'middle';
}
