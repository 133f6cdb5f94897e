/**
 * A designed constant-current string at other drive currents, side by side, so the estimator
 * can offer the homeowner a brighter or softer option: power, light relative to the current
 * choice, the cheapest catalogue driver that fits at that current, and cost. Built on
 * `compareDriveCurrents`; `withDriveCurrent` is the one-action "use this".
 */
import { compareDriveCurrents } from '../drivers/drive-current-what-if';
import type { Finding } from '../findings';
import type { CcCircuitDesign, CircuitSettings, DesignProduct } from './design-types';
import { circuitInputs, ledDriverOf } from './evaluate-circuit';

export interface DriveCurrentColumn {
  currentA: number;
  /** The fittings are set to this current now. */
  isCurrent: boolean;
  stringForwardVoltageV: number;
  complianceVoltageV: number;
  outputPowerW: number;
  lumens: number | null;
  /** Light as a percentage of the light at the present current (null without lumens for both). */
  relativeLightPct: number | null;
  /** Cheapest catalogue driver that fits at this current. */
  driver: { productId: string; name: string; headroomPct: number; costMinor: number | null } | null;
  /** Fittings' cost plus the driver's, minor units (null when a cost is missing or no driver fits). */
  totalCostMinor: number | null;
  /** Ratings findings at this current (above a fitting's rating, between ratings). */
  findings: Finding[];
}

export interface DriveCurrentComparison {
  columns: DriveCurrentColumn[];
  /** Why there is nothing to compare (no fittings, a product missing). */
  findings: Finding[];
}

const SAME = 0.0005;

/** The currents worth comparing: every rated current of the string's fittings plus the present one. */
export function candidateCurrents(design: CcCircuitDesign, products: readonly DesignProduct[]): number[] {
  const byId = new Map(products.map((p) => [p.id, p]));
  const out: number[] = [];
  const add = (i: number) => {
    if (Number.isFinite(i) && i > 0 && !out.some((x) => Math.abs(x - i) < SAME)) out.push(i);
  };
  for (const f of design.fittings) {
    add(f.driveCurrentA);
    const p = byId.get(f.productId);
    if (p?.kind === 'fitting' && p.spec.driveMode === 'constant-current') for (const r of p.spec.ratings) add(r.currentA);
  }
  return out.sort((a, b) => a - b);
}

export function compareCircuitCurrents(
  design: CcCircuitDesign,
  products: readonly DesignProduct[],
  drivers: readonly DesignProduct[],
  settings: CircuitSettings,
  currentsA: readonly number[] = candidateCurrents(design, products),
): DriveCurrentComparison {
  const inputs = circuitInputs({ ...design, driverProductId: null }, products, settings);
  if (inputs.kind !== 'constant-current' || !inputs.layout || inputs.layout.fittings.length === 0)
    return { columns: [], findings: inputs.findings.filter((f) => f.severity === 'error') };
  const names = new Map(drivers.map((d) => [d.id, d.name]));
  const catalogue = drivers.flatMap((d) => (d.kind === 'driver' ? [ledDriverOf(d)] : []));
  const options = compareDriveCurrents(inputs.layout, currentsA, catalogue);
  const present = inputs.driveCurrentA;
  const base = options.find((o) => present !== null && Math.abs(o.currentA - present) < SAME)?.lumens ?? null;
  return {
    columns: options.map((o) => ({
      currentA: o.currentA,
      isCurrent: present !== null && Math.abs(o.currentA - present) < SAME,
      stringForwardVoltageV: o.stringForwardVoltageV,
      complianceVoltageV: o.complianceVoltageV,
      outputPowerW: o.outputPowerW,
      lumens: o.lumens,
      relativeLightPct: o.lumens !== null && base !== null && base > 0 ? (o.lumens / base) * 100 : null,
      driver: o.driver
        ? {
            productId: o.driver.driver.id,
            name: names.get(o.driver.driver.id) ?? o.driver.driver.id,
            headroomPct: o.driver.headroomPct,
            costMinor: o.driver.costMinor,
          }
        : null,
      totalCostMinor: o.totalCostMinor,
      findings: o.findings,
    })),
    findings: [],
  };
}

/** "Use this": every fitting at this current, on the column's driver (or no driver when none fits). */
export function withDriveCurrent(
  design: CcCircuitDesign,
  column: Pick<DriveCurrentColumn, 'currentA' | 'driver'>,
): CcCircuitDesign {
  return {
    ...design,
    fittings: design.fittings.map((f) => ({ ...f, driveCurrentA: column.currentA })),
    driverProductId: column.driver?.productId ?? null,
  };
}
