import type { CableSpec } from '../cables/cable-spec';
import type { Finding } from '../findings';
import type { InstallationLocation, IpOverrides } from '../ip-code/installation-location';
import type { CodeProfile, CodeProfileId } from '../profiles/code-profile';
import type { Length } from '../units/length';

/** A fitting's rating at one drive current: forward voltage, or power (then Vf = P / I). */
export interface DriveRating {
  currentA: number;
  forwardVoltageV?: number;
  powerW?: number;
  /** Light output at this current, lm, when the datasheet gives it. */
  lumens?: number;
}

export type DriveKind = 'constant-current' | 'constant-voltage';

/** Two-core cable from a fitting to its connection point (counted in the loop). */
export interface FittingTail {
  length: Length;
  cable: CableSpec;
}

export interface SeriesFitting {
  id?: string;
  name?: string;
  /** Default constant-current. */
  drive?: DriveKind;
  /** One rating per drive current the fitting may be run at. */
  ratings: DriveRating[];
  ipCode?: string;
  location?: InstallationLocation;
  tail?: FittingTail;
  unitCostMinor?: number;
}

export type CableRole = 'driver-lead' | 'link' | 'extension';

/** A two-core cable in the loop: driver lead, link between connector blocks, extension. */
export interface CableRun {
  id?: string;
  role: CableRole;
  length: Length;
  cable: CableSpec;
}

export interface LedDriver {
  id: string;
  name?: string;
  output: DriveKind;
  /** Output current for a constant-current driver, A. */
  currentA: number;
  voltageWindowV?: { minV: number; maxV: number };
  powerWindowW?: { minW: number; maxW: number };
  /** Rated maximum output power, W (when not the top of the power window). */
  maxPowerW?: number;
  /** Output power / input power, 0-1. */
  efficiency?: number;
  ipCode?: string;
  /** Trade cost in minor units (pence, cents). */
  costMinor?: number;
}

export interface FirmSettings {
  /** Headroom to keep below the driver's maximum, % (default 10). */
  headroomMarginPct?: number;
  ipOverrides?: IpOverrides;
}

/** Everything about a string except the driver: what driver choice and splitting vary over. */
export interface StringLayout {
  fittings: SeriesFitting[];
  runs: CableRun[];
  driverLocation?: InstallationLocation;
  profile: CodeProfileId | CodeProfile;
  firm?: FirmSettings;
  /** Conductor temperature for drop work, °C (default: the profile's). */
  temperatureC?: number;
}

export interface SeriesStringInput extends StringLayout {
  driver: LedDriver;
}

export type DriveStatus = 'rated' | 'between-ratings' | 'above-rating' | 'below-rating' | 'no-rating';

export interface FittingAtCurrent {
  index: number;
  id?: string;
  status: DriveStatus;
  forwardVoltageV: number;
  powerW: number;
  lumens: number | null;
  tailLoopResistanceOhm: number;
  tailDropV: number;
}

export interface CableAtCurrent {
  subject: string;
  role: CableRole;
  lengthM: number;
  loopResistanceOhm: number;
  dropV: number;
  lossW: number;
}

export interface SeriesStringResult {
  driverId: string;
  currentA: number;
  fittingCount: number;
  stringForwardVoltageV: number;
  /** Loop resistance of every cable in the string (runs and fitting tails), ohm. */
  cableLoopResistanceOhm: number;
  cableDropV: number;
  /** What the driver must reach: forward voltage plus cable drop, V. */
  complianceVoltageV: number;
  fittingsPowerW: number;
  cableLossW: number;
  outputPowerW: number;
  efficiency: number;
  inputPowerW: number;
  /** Output against the driver's maximum (voltage or power, whichever is nearer), %. */
  loadingPct: number | null;
  /** Where the output power sits in the power window: 0 at the bottom, 100 at the top, %. */
  powerWindowPositionPct: number | null;
  headroomPct: number | null;
  headroomW: number | null;
  lumens: number | null;
  /** Largest count of these fittings the driver can take (to its maximum, and within the firm margin). */
  maxFittings: number | null;
  maxFittingsWithinMargin: number | null;
  /** `uniform` when every fitting is alike; `largest-fitting` counts copies of the hungriest one. */
  maxFittingsBasis: 'uniform' | 'largest-fitting' | null;
  fittings: FittingAtCurrent[];
  cables: CableAtCurrent[];
  findings: Finding[];
  ok: boolean;
}
