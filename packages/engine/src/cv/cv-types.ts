import type { CableSpec } from '../cables/cable-spec';
import type { Finding } from '../findings';
import type { InstallationLocation, IpOverrides } from '../ip-code/installation-location';
import type { CodeProfile, CodeProfileId } from '../profiles/code-profile';
import type { DriveKind } from '../series/series-types';
import type { Length } from '../units/length';

/** A constant-voltage power supply (12 V, 24 V...). */
export interface CvSupply {
  id: string;
  name?: string;
  /** What the unit regulates (default constant-voltage); a constant-current driver is reported. */
  output?: DriveKind;
  nominalVoltageV: number;
  ratedPowerW: number;
  ipCode?: string;
  location?: InstallationLocation;
}

/** A constant-voltage fitting, wired in parallel across the supply. */
export interface CvFitting {
  id: string;
  name?: string;
  powerW: number;
  /** The voltage the fitting is rated at (default: the supply's nominal voltage). */
  nominalVoltageV?: number;
  /** Lowest voltage at the fitting that still works properly, from its datasheet. */
  minVoltageV?: number;
  /** Default constant-voltage; a constant-current fitting here is reported. */
  drive?: DriveKind;
  ipCode?: string;
  location?: InstallationLocation;
}

/** A fitting and the two-core cable that reaches it (from the previous fitting, the supply, or the hub). */
export interface CvSpan {
  length: Length;
  fitting: CvFitting;
}

interface CvRunBase {
  id: string;
  /** The two-core cable used for the run's spans. */
  cable: CableSpec;
  spans: CvSpan[];
}

/** One cable from the supply past every fitting; span k runs from fitting k-1 (or the supply) to fitting k. */
export interface DaisyChainRun extends CvRunBase {
  layout: 'daisy-chain';
}

/** A separate cable from the supply to each fitting; span k is fitting k's own cable. */
export interface HomeRun extends CvRunBase {
  layout: 'home-run';
}

/** A feeder from the supply to a junction, then a spoke to each fitting. */
export interface HubRun extends CvRunBase {
  layout: 'hub';
  feeder: { length: Length; /** Default: the run's cable. */ cable?: CableSpec };
}

export type CvRun = DaisyChainRun | HomeRun | HubRun;
export type CvLayout = CvRun['layout'];

/** A cable the firm stocks, for choosing the smallest that works. */
export interface CvCableOption {
  id: string;
  name?: string;
  cable: CableSpec;
}

export interface CvFirmSettings {
  /** Largest drop from the supply to any fitting, % of nominal (default 5 %). */
  dropLimitPct?: number;
  /** Highest supply loading, % of rated power (default 80 %, common practice). */
  supplyLoadingLimitPct?: number;
  ipOverrides?: IpOverrides;
}

export interface CvInput {
  supply: CvSupply;
  runs: CvRun[];
  profile: CodeProfileId | CodeProfile;
  firm?: CvFirmSettings;
  /** Conductor temperature for the drop, °C (default: the profile's drop working temperature). */
  temperatureC?: number;
  /** Stocked cables to choose from, any order. */
  cableOptions?: CvCableOption[];
}

export interface CvFittingResult {
  runId: string;
  /** Position in the run, 1-based. */
  position: number;
  fittingId: string;
  currentA: number;
  voltageV: number;
  dropV: number;
  /** Drop from the supply's nominal voltage, %. */
  dropPct: number;
  minVoltageV: number | null;
  withinDropLimit: boolean;
  aboveOwnMinimum: boolean;
}

export interface CvWorst {
  runId: string;
  fittingId: string;
  voltageV: number;
  dropPct: number;
}

export interface CvCableChoice {
  id: string;
  name: string;
  areaMm2: number;
  worstDropPct: number;
  worstVoltageV: number;
}

export interface CvRunResult {
  id: string;
  layout: CvLayout;
  fittings: CvFittingResult[];
  worst: CvWorst | null;
  /** Current leaving the supply on this run, A. */
  currentA: number;
  /** Total two-core cable in the run, m. */
  cableLengthM: number;
  cableLossW: number;
  /** Smallest stocked cable (by cross-section) that, used for the whole run (feeder and spans),
   * keeps every fitting within the drop limit and its own minimum; null when none does or no
   * options were given. */
  smallestCable: CvCableChoice | null;
}

export interface CvResult {
  supplyId: string;
  nominalVoltageV: number;
  temperatureC: number;
  dropLimitPct: number;
  fittingCount: number;
  /** Sum of the fittings' rated power, W. */
  loadW: number;
  /** Current drawn from the supply, A. */
  currentA: number;
  /** What the supply puts out, V x I, W (the fittings receive this less the cable loss). */
  outputW: number;
  cableLossW: number;
  loadingPct: number;
  loadingLimitPct: number;
  runs: CvRunResult[];
  worst: CvWorst | null;
  findings: Finding[];
}
