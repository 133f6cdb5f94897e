/**
 * A circuit as the estimator designs it (what the api stores per quote revision) and the
 * catalogue products it names. These are structural: the contracts' zod schemas produce
 * values of exactly these shapes, so the api and the workbench pass them straight in and
 * both get the same engine inputs from `evaluateCircuit`.
 */
import type { InstallationLocation, IpOverrides } from '../ip-code/installation-location';
import type { CodeProfileId } from '../profiles/code-profile';
import type { InstallationMethod } from '../takeoff/circuit';

/** A copper conductor as the catalogue gives it. */
export type DesignConductor =
  | { kind: 'metric'; areaMm2: number; conductorClass: 1 | 2 | 5; coating: 'plain' | 'tinned' }
  | { kind: 'awg'; gauge: number; stranding: 'solid' | 'stranded' };

export interface DesignDriveRating {
  currentA: number;
  forwardVoltageV?: number | undefined;
  powerW?: number | undefined;
  lumens?: number | undefined;
}

interface ProductBase {
  id: string;
  name: string;
  costMinor: number;
  listPriceMinor: number;
  unit: string;
  supplierCode: string;
}

export type FittingProductSpec =
  | {
      driveMode: 'constant-current';
      ratings: DesignDriveRating[];
      ipCode: string;
      tail?: { lengthM: number; conductor: DesignConductor } | undefined;
    }
  | {
      driveMode: 'constant-voltage';
      nominalVoltageV: number;
      powerW: number;
      ipCode: string;
      tail?: { lengthM: number; conductor: DesignConductor } | undefined;
    };

export type DesignProduct =
  | (ProductBase & { kind: 'fitting'; spec: FittingProductSpec })
  | (ProductBase & {
      kind: 'driver';
      spec: {
        currentA: number;
        voltageWindowV: { minV: number; maxV: number };
        powerWindowW?: { minW: number; maxW: number } | undefined;
        maxPowerW: number;
        efficiencyPct?: number | undefined;
        ipCode: string;
      };
    })
  | (ProductBase & { kind: 'cv-supply'; spec: { outputVoltageV: number; ratedPowerW: number; ipCode: string } })
  | (ProductBase & {
      kind: 'cable';
      spec: { cores: number; conductor: DesignConductor; statedOhmPerKm?: number | undefined; cutLengthM?: number | undefined };
    })
  | (ProductBase & {
      kind: 'connector-block';
      spec: { terminals: number; entries: number; conductorsPerTerminal: number; ipCode: string };
    })
  | (ProductBase & { kind: 'accessory' | 'labour'; spec: object });

/** A two-core cable run of the design: which cable, how long, how it is laid. */
export interface DesignCableRun {
  cableProductId: string | null;
  lengthM: number;
  method: InstallationMethod;
}

export interface DesignAcknowledgement {
  code: string;
  subject: string | null;
  reason: string;
}

export interface CcFittingPlacement {
  /** The design's own id for this placement (stable while fittings are reordered). */
  id: string;
  productId: string;
  label: string;
  location: InstallationLocation;
  /** The current the estimator means to run this fitting at, A. */
  driveCurrentA: number;
}

export interface CcCircuitDesign {
  kind: 'constant-current';
  driverProductId: string | null;
  driverLocation: InstallationLocation;
  /** In wiring order: the driver's + reaches the first. */
  fittings: CcFittingPlacement[];
  driverLead: DesignCableRun | null;
  /** links[k] joins connector block k+1 to block k+2. */
  links: DesignCableRun[];
  extensions: (DesignCableRun & { label: string })[];
  connectorBlockProductId: string | null;
  /** Fitting placement ids per block, in series order; null lets the engine fill blocks in order. */
  assignment: string[][] | null;
  acknowledgements: DesignAcknowledgement[];
}

export interface CvFittingPlacement {
  id: string;
  productId: string;
  label: string;
  location: InstallationLocation;
  /** The cable reaching this fitting: from the previous one (daisy chain), the supply (home run) or the hub. */
  spanLengthM: number;
}

export interface CvRunDesign {
  id: string;
  label: string;
  layout: 'daisy-chain' | 'home-run' | 'hub';
  cableProductId: string | null;
  method: InstallationMethod;
  /** Hub only: supply to the junction. */
  feederLengthM: number;
  fittings: CvFittingPlacement[];
}

export interface CvCircuitDesign {
  kind: 'constant-voltage';
  supplyProductId: string | null;
  supplyLocation: InstallationLocation;
  runs: CvRunDesign[];
  acknowledgements: DesignAcknowledgement[];
}

export type CircuitDesign = CcCircuitDesign | CvCircuitDesign;

/** The firm's settings the checks use. */
export interface CircuitSettings {
  profile: CodeProfileId;
  /** Headroom to keep below a driver's maximum, % (engine default 10). */
  headroomMarginPct?: number;
  /** Largest voltage drop on a constant-voltage run, % of nominal (engine default 5). */
  dropLimitPct?: number;
  /** The firm's own minimum IP codes, replacing the defaults location by location. */
  ipOverrides?: IpOverrides;
}
