import type { Finding } from '../findings';
import { prepareString, stringAtCurrent } from '../series/series-string';
import { CURRENT_TOLERANCE_A } from '../series/fitting-drive';
import type { LedDriver, StringLayout } from '../series/series-types';
import { chooseDriversPrepared, type SuitableDriver } from './driver-choice';

export interface DriveCurrentOption {
  currentA: number;
  stringForwardVoltageV: number;
  cableDropV: number;
  complianceVoltageV: number;
  fittingsPowerW: number;
  outputPowerW: number;
  /** Total light, lm, when every fitting's datasheet gives lumens at (or around) this current. */
  lumens: number | null;
  /** Cheapest suitable driver at this current from the catalogue, or null. */
  driver: SuitableDriver | null;
  driverCostMinor: number | null;
  /** Fittings' own cost (the same at every current) plus the driver's, minor units. */
  totalCostMinor: number | null;
  /** Current-mismatch findings at this current. */
  findings: Finding[];
}

/**
 * The same fittings and cables at other drive currents, side by side: power, light where
 * lumens are known, the cheapest driver the catalogue offers at that current, and cost.
 */
export function compareDriveCurrents(layout: StringLayout, currentsA: readonly number[], catalogue: readonly LedDriver[]): DriveCurrentOption[] {
  const prepared = prepareString(layout);
  const loop = prepared.runsLoopOhm + prepared.tailsLoopOhm;
  let fittingsCost: number | null = 0;
  for (const f of layout.fittings) fittingsCost = fittingsCost === null || f.unitCostMinor === undefined ? null : fittingsCost + f.unitCostMinor;
  return currentsA
    .filter((i) => Number.isFinite(i) && i > 0)
    .map((currentA) => {
      const at = stringAtCurrent(prepared, currentA);
      const cableDropV = currentA * loop;
      const complianceVoltageV = at.forwardVoltageV + cableDropV;
      const atThisCurrent = catalogue.filter((d) => d.output === 'constant-current' && Math.abs(d.currentA - currentA) <= CURRENT_TOLERANCE_A);
      const choice = chooseDriversPrepared(prepared, atThisCurrent);
      const driver = choice.suitable[0] ?? null;
      const driverCostMinor = driver?.costMinor ?? null;
      return {
        currentA,
        stringForwardVoltageV: at.forwardVoltageV,
        cableDropV,
        complianceVoltageV,
        fittingsPowerW: at.forwardVoltageV * currentA,
        outputPowerW: complianceVoltageV * currentA,
        lumens: at.lumens,
        driver,
        driverCostMinor,
        totalCostMinor: driverCostMinor === null || fittingsCost === null ? null : driverCostMinor + fittingsCost,
        findings: at.findings,
      };
    });
}
