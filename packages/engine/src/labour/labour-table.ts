import type { InstallationMethod } from '../takeoff/circuit';

/**
 * A firm's labour table: minutes per task and the hourly rate. Minutes may have up to three
 * decimals (0.75 min per metre clipped); they are held exactly as thousandths of a minute.
 */
export interface LabourTable {
  /** Minutes to install one fitting, by the catalogue's fitting kind (`spike`, `in-ground`...). */
  minutesPerFitting: Record<string, number>;
  /** For fitting kinds the table does not list; leave out to have them reported instead. */
  defaultMinutesPerFitting?: number;
  /** Minutes to mount and connect one driver or supply. */
  minutesPerDriver: number;
  /** Minutes to make off one connector block. */
  minutesPerConnectorBlock: number;
  /** Minutes per metre of cable, by how it is laid. */
  minutesPerMetre: Record<InstallationMethod, number>;
  /** Minutes to test and commission one circuit. */
  minutesPerCircuitTest: number;
  /** Sell rate per hour, minor units. */
  rateMinorPerHour: number;
  /** What an hour costs the firm, minor units (for margin); optional. */
  costMinorPerHour?: number;
}
