/**
 * The larger-cable suggestion for a designed circuit: when the cable's drop makes a check
 * fail, which of the firm's stocked cables fixes it.
 *
 * - Constant current: the driver cannot reach the string's compliance voltage
 *   (`voltage-above-window`) or the output power with the cable's loss is over the driver's
 *   maximum (`power-above-window`). The suggestion is one cable for every run of the string
 *   (lead, links, extensions): the smallest stocked conductor that clears both.
 * - Constant voltage: a fitting of a run is over the drop limit (`cv-drop-over-limit`) or
 *   below its own minimum voltage (`cv-below-fitting-minimum`). The suggestion is, per failing
 *   run, the smallest stocked conductor for that run that clears them.
 *
 * Conductor resistances come from the cable tables (IEC 60228 for metric sizes, NEC Chapter 9
 * Table 8 for AWG, or the supplier's stated figure); every candidate is re-checked with
 * `evaluateCircuit`, so the figures shown after applying it are exactly the suggestion's.
 */
import { conductorResistanceOhmPerM, describeCable } from '../cables/cable-spec';
import { isEngineInputError } from '../units/engine-input-error';
import { finding, type Finding } from '../findings';
import { roundForDisplay as r2 } from '../units/round';
import type { CcCircuitDesign, CircuitDesign, CircuitSettings, CvCircuitDesign, DesignProduct } from './design-types';
import { cableSpecOf, evaluateCircuit, type CircuitEvaluation } from './evaluate-circuit';

/** Constant-current findings a smaller cable drop can clear. */
export const CC_CABLE_FIXABLE = ['voltage-above-window', 'power-above-window'] as const;
/** Constant-voltage findings a smaller cable drop can clear. */
export const CV_CABLE_FIXABLE = ['cv-drop-over-limit', 'cv-below-fitting-minimum'] as const;

export interface CableChange {
  /** `string` for every run of a constant-current string; `run:<id>` for one constant-voltage run. */
  target: string;
  /** The cable product to use there. */
  productId: string;
  name: string;
  /** The conductor, e.g. "2.5 mm² class 5 plain". */
  conductor: string;
  /** Resistance of one conductor at 20 °C, ohm/km (from the cable tables or the supplier). */
  ohmPerKm20: number;
  /** What the figure below measures. */
  measure: 'compliance-voltage' | 'worst-fitting-voltage';
  beforeV: number;
  afterV: number;
  /** The finding codes it clears there. */
  clears: string[];
}

export interface CableSuggestion {
  /** Nothing to fix: no finding here that cable size causes. */
  needed: boolean;
  changes: CableChange[];
  /** Why no stocked cable helps, when none does (per target). */
  findings: Finding[];
}

interface Candidate {
  product: Extract<DesignProduct, { kind: 'cable' }>;
  ohmPerM: number;
}

/** Stocked cables, least conductor resistance last (smallest conductor that will do first). */
function candidatesOf(cables: readonly DesignProduct[]): Candidate[] {
  const out: Candidate[] = [];
  for (const p of cables) {
    if (p.kind !== 'cable') continue;
    try {
      out.push({ product: p, ohmPerM: conductorResistanceOhmPerM(cableSpecOf(p.spec.conductor, p.spec.statedOhmPerKm), 20) });
    } catch (err) {
      if (!isEngineInputError(err)) throw err; // a size the tables lack without a stated figure: not offered
    }
  }
  return out.sort(
    (a, b) => b.ohmPerM - a.ohmPerM || a.product.costMinor - b.product.costMinor || a.product.id.localeCompare(b.product.id),
  );
}

function resistanceOf(id: string | null, byId: ReadonlyMap<string, Candidate>): number | null {
  return id === null ? null : (byId.get(id)?.ohmPerM ?? null);
}

function codesIn(evaluation: CircuitEvaluation, codes: readonly string[], subject?: (s: string) => boolean): string[] {
  return [
    ...new Set(
      evaluation.findings.filter((f) => codes.includes(f.code) && (!subject || subject(f.subject ?? ''))).map((f) => f.code),
    ),
  ];
}

function change(
  c: Candidate,
  target: string,
  measure: CableChange['measure'],
  beforeV: number,
  afterV: number,
  clears: string[],
): CableChange {
  return {
    target,
    productId: c.product.id,
    name: c.product.name,
    conductor: describeCable(cableSpecOf(c.product.spec.conductor)),
    ohmPerKm20: c.ohmPerM * 1000,
    measure,
    beforeV,
    afterV,
    clears,
  };
}

/** Every run of a constant-current string on this cable. */
export function withStringCable(design: CcCircuitDesign, cableProductId: string): CcCircuitDesign {
  return {
    ...design,
    driverLead: design.driverLead ? { ...design.driverLead, cableProductId } : null,
    links: design.links.map((l) => ({ ...l, cableProductId })),
    extensions: design.extensions.map((e) => ({ ...e, cableProductId })),
  };
}

/** One constant-voltage run on this cable. */
export function withRunCable(design: CvCircuitDesign, runId: string, cableProductId: string): CvCircuitDesign {
  return { ...design, runs: design.runs.map((r) => (r.id === runId ? { ...r, cableProductId } : r)) };
}

/** Apply every change of a suggestion to the design. */
export function applyCableSuggestion<D extends CircuitDesign>(design: D, changes: readonly CableChange[]): D {
  let next: CircuitDesign = design;
  for (const c of changes) {
    if (next.kind === 'constant-current' && c.target === 'string') next = withStringCable(next, c.productId);
    else if (next.kind === 'constant-voltage' && c.target.startsWith('run:'))
      next = withRunCable(next, c.target.slice(4), c.productId);
  }
  return next as D;
}

function suggestCc(
  design: CcCircuitDesign,
  products: readonly DesignProduct[],
  candidates: Candidate[],
  settings: CircuitSettings,
  current: CircuitEvaluation,
): CableSuggestion {
  const failing = codesIn(current, CC_CABLE_FIXABLE, (s) => s === 'driver');
  if (failing.length === 0 || !current.series) return { needed: false, changes: [], findings: [] };
  const byId = new Map(candidates.map((c) => [c.product.id, c]));
  const used = [
    design.driverLead?.cableProductId ?? null,
    ...design.links.map((l) => l.cableProductId),
    ...design.extensions.map((e) => e.cableProductId),
  ]
    .map((id) => resistanceOf(id, byId))
    .filter((r): r is number => r !== null);
  const worstNow = used.length ? Math.max(...used) : Infinity;
  const pool = [...products.filter((p) => !byId.has(p.id)), ...candidates.map((c) => c.product)];
  for (const c of candidates) {
    if (!(c.ohmPerM < worstNow)) continue; // only a conductor better than the worst one in use
    const trial = evaluateCircuit(withStringCable(design, c.product.id), pool, settings);
    if (!trial.series || codesIn(trial, failing, (s) => s === 'driver').length > 0) continue;
    return {
      needed: true,
      changes: [
        change(c, 'string', 'compliance-voltage', current.series.complianceVoltageV, trial.series.complianceVoltageV, failing),
      ],
      findings: [],
    };
  }
  const driveOnly = current.series.stringForwardVoltageV;
  return {
    needed: true,
    changes: [],
    findings: [
      finding(
        'larger-cable-none-fits',
        'info',
        `No stocked cable clears this on its own: the fittings alone need ${r2(driveOnly)} V and the cable adds ${r2(current.series.cableDropV)} V. Split the string or choose another driver.`,
        { subject: 'string', values: { stringForwardVoltageV: r2(driveOnly, 3), cableDropV: r2(current.series.cableDropV, 3) } },
      ),
    ],
  };
}

function suggestCv(
  design: CvCircuitDesign,
  products: readonly DesignProduct[],
  candidates: Candidate[],
  settings: CircuitSettings,
  current: CircuitEvaluation,
): CableSuggestion {
  if (!current.cv) return { needed: false, changes: [], findings: [] };
  const byId = new Map(candidates.map((c) => [c.product.id, c]));
  const pool = [...products.filter((p) => !byId.has(p.id)), ...candidates.map((c) => c.product)];
  const changes: CableChange[] = [];
  const findings: Finding[] = [];
  let needed = false;
  for (const run of design.runs) {
    const prefix = `run:${run.id}/`;
    const inRun = (s: string) => s.startsWith(prefix);
    const failing = codesIn(current, CV_CABLE_FIXABLE, inRun);
    if (failing.length === 0) continue;
    needed = true;
    const before = current.cv.runs.find((r) => r.id === run.id)?.worst?.voltageV;
    const now = resistanceOf(run.cableProductId, byId) ?? Infinity;
    let found = false;
    for (const c of candidates) {
      if (!(c.ohmPerM < now)) continue;
      const trial = evaluateCircuit(withRunCable(design, run.id, c.product.id), pool, settings);
      if (!trial.cv || codesIn(trial, failing, inRun).length > 0) continue;
      const after = trial.cv.runs.find((r) => r.id === run.id)?.worst?.voltageV;
      changes.push(change(c, `run:${run.id}`, 'worst-fitting-voltage', before ?? 0, after ?? 0, failing));
      found = true;
      break;
    }
    if (!found)
      findings.push(
        finding(
          'larger-cable-none-fits',
          'info',
          `No stocked cable keeps every fitting of run "${run.label || run.id}" within limits: shorten it, split it into two runs or feed it from a hub.`,
          { subject: `run:${run.id}` },
        ),
      );
  }
  return { needed, changes, findings };
}

/**
 * Which stocked cable fixes the drop of this circuit, if any. `products` are those the design
 * names; `cables` the firm's stocked cables to choose from (other kinds are ignored).
 */
export function suggestLargerCable(
  design: CircuitDesign,
  products: readonly DesignProduct[],
  cables: readonly DesignProduct[],
  settings: CircuitSettings,
  current: CircuitEvaluation = evaluateCircuit(design, products, settings),
): CableSuggestion {
  const candidates = candidatesOf(cables);
  return design.kind === 'constant-current'
    ? suggestCc(design, products, candidates, settings, current)
    : suggestCv(design, products, candidates, settings, current);
}
