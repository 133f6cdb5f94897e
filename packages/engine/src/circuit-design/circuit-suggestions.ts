/**
 * Suggestions for a designed constant-current string: the catalogue's drivers that fit it
 * (at the drive current its fittings are set to), and when none does, a split into shorter
 * strings with the driver for each.
 */
import { chooseDrivers, type SuitableDriver } from '../drivers/driver-choice';
import { splitRun, type RunCable, type SplitResult } from '../drivers/split-run';
import { finding, type Finding } from '../findings';
import { metres } from '../units/length';
import { roundForDisplay as r2 } from '../units/round';
import type { CcCircuitDesign, CircuitSettings, DesignProduct } from './design-types';
import { circuitInputs, evaluateCircuit, ledDriverOf } from './evaluate-circuit';

export interface DriverSuggestion {
  productId: string;
  name: string;
  costMinor: number | null;
  headroomPct: number;
  complianceVoltageV: number;
  reasons: string[];
}

export interface RejectedSuggestion {
  productId: string;
  name: string;
  reasons: Finding[];
}

export interface SplitSuggestion {
  ok: boolean;
  /** Each string: fitting positions (1-based, inclusive) and its driver. */
  strings: {
    firstFitting: number;
    lastFitting: number;
    productId: string;
    name: string;
    costMinor: number;
    complianceVoltageV: number;
  }[];
  totalCostMinor: number | null;
  findings: Finding[];
}

export interface CircuitSuggestions {
  driveCurrentA: number | null;
  drivers: DriverSuggestion[];
  rejected: RejectedSuggestion[];
  /** Offered when no single driver fits the whole string. */
  split: SplitSuggestion | null;
  findings: Finding[];
}

function describeSuitable(s: SuitableDriver, byId: Map<string, DesignProduct>): DriverSuggestion {
  return {
    productId: s.driver.id,
    name: byId.get(s.driver.id)?.name ?? s.driver.id,
    costMinor: s.costMinor,
    headroomPct: s.headroomPct,
    complianceVoltageV: s.result.complianceVoltageV,
    reasons: s.reasons,
  };
}

/**
 * `products` are those the design names (fittings, cables, block); `drivers` the firm's
 * catalogue drivers to choose from.
 */
export function suggestForCircuit(
  design: CcCircuitDesign,
  products: readonly DesignProduct[],
  drivers: readonly DesignProduct[],
  settings: CircuitSettings,
): CircuitSuggestions {
  const inputs = circuitInputs({ ...design, driverProductId: null }, products, settings);
  if (inputs.kind !== 'constant-current' || !inputs.layout || inputs.layout.fittings.length === 0) {
    return {
      driveCurrentA: null,
      drivers: [],
      rejected: [],
      split: null,
      findings: [
        ...inputs.findings.filter((f) => f.severity === 'error'),
        finding('suggestions-need-fittings', 'info', 'Add fittings (with their products and cables) before asking for drivers.', {
          subject: 'string',
        }),
      ],
    };
  }
  const { layout, driveCurrentA } = inputs;
  const byId = new Map(drivers.map((d) => [d.id, d]));
  const catalogue = drivers.flatMap((d) => (d.kind === 'driver' ? [ledDriverOf(d)] : []));
  const choice = chooseDrivers(layout, catalogue);
  const rejected: RejectedSuggestion[] = choice.rejected.map((r) => ({
    productId: r.driver.id,
    name: byId.get(r.driver.id)?.name ?? r.driver.id,
    reasons: r.reasons,
  }));
  const suitable: DriverSuggestion[] = [];
  for (const s of choice.suitable) {
    if (driveCurrentA !== null && Math.abs(s.driver.currentA - driveCurrentA) > 0.0005) {
      rejected.push({
        productId: s.driver.id,
        name: byId.get(s.driver.id)?.name ?? s.driver.id,
        reasons: [
          finding(
            'driver-current-mismatch',
            'error',
            `Gives ${r2(s.driver.currentA * 1000, 1)} mA; the fittings are set to ${r2(driveCurrentA * 1000, 1)} mA.`,
            { subject: 'driver' },
          ),
        ],
      });
    } else suitable.push(describeSuitable(s, byId));
  }

  let split: SplitSuggestion | null = null;
  const lead = layout.runs.find((r) => r.role === 'driver-lead');
  if (suitable.length === 0 && layout.fittings.length > 1 && lead) {
    // Between fittings in one block the joint is in the block (no cable); across blocks, the link.
    const evaluation = evaluateCircuit({ ...design, driverProductId: null }, products, settings);
    const lastInBlock = new Set((evaluation.blocks?.blocks ?? []).map((b) => b.fittings[b.fittings.length - 1]!));
    const linkRuns = layout.runs.filter((r) => r.role === 'link');
    let nextLink = 0;
    const links: RunCable[] = layout.fittings.slice(1).map((_, k) => {
      if (lastInBlock.has(k + 1) && linkRuns[nextLink]) {
        const l = linkRuns[nextLink++]!;
        return { length: l.length, cable: l.cable };
      }
      return { length: metres(0), cable: lead.cable };
    });
    const atCurrent =
      driveCurrentA === null ? catalogue : catalogue.filter((d) => Math.abs(d.currentA - driveCurrentA) <= 0.0005);
    const result: SplitResult = splitRun(
      {
        fittings: layout.fittings,
        links,
        lead: { length: lead.length, cable: lead.cable },
        profile: layout.profile,
        ...(layout.driverLocation ? { driverLocation: layout.driverLocation } : {}),
        ...(layout.firm ? { firm: layout.firm } : {}),
      },
      atCurrent,
    );
    split = {
      ok: result.ok,
      strings: result.strings.map((s) => ({
        firstFitting: s.from + 1,
        lastFitting: s.to,
        productId: s.driver.id,
        name: byId.get(s.driver.id)?.name ?? s.driver.id,
        costMinor: s.costMinor,
        complianceVoltageV: s.result.complianceVoltageV,
      })),
      totalCostMinor: result.totalCostMinor,
      findings: result.findings,
    };
  }
  return { driveCurrentA, drivers: suitable, rejected, split, findings: choice.stringFindings };
}
