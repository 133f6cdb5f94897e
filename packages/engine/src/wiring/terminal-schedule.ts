/**
 * The terminal schedule: which conductor ends land on which terminal of which connector
 * block. Plain JSON, so the installer's pack, the api and a person typing one in by hand all
 * use the same shape. Blocks and terminals are numbered by their position (1-based).
 */

export type WiringKind = 'constant-current' | 'constant-voltage';

export interface ScheduleTerminal {
  /** Conductor ends landed here, in the form of `parseConductorEnd` (`driver+`, `fitting:3-`...). */
  conductors: string[];
  /** Free words for the installer, e.g. "return to driver −". Ignored by the check. */
  note?: string;
}

export interface ScheduleBlock {
  label?: string;
  /** Most conductor ends one terminal takes (from the block's data sheet). */
  conductorsPerTerminal?: number;
  terminals: ScheduleTerminal[];
}

export interface TerminalSchedule {
  kind: WiringKind;
  /** Fittings on the circuit: `fitting:1` ... `fitting:<fittingCount>`. */
  fittingCount: number;
  /** Optional names for messages, by fitting position (index 0 is fitting 1). */
  fittingLabels?: string[];
  blocks: ScheduleBlock[];
}
