/**
 * The estimate lines a revision's circuits put on the grid: materials from the engine's
 * takeoff (fittings, driver or supply, cable metres with slack and cut lengths, connector
 * blocks) and labour from its labour table, one set per circuit with `circuitId` set.
 *
 * Regenerating keeps every manual line, keeps a derived line the estimator overrode (it stays
 * flagged `overridden`), drops the rest of the derived lines and writes fresh ones; lines of a
 * circuit that no longer exists go, overridden or not.
 */
import { createHash } from 'node:crypto';
import { DEFAULT_DESIGN_SETTINGS, type EstimateContent, type EstimateLine, type EstimateSection, type Product, type RevisionSettings } from '@gloaming/contracts';
import { newId } from '@gloaming/db';
import {
  circuitTakeoff,
  labour,
  takeoff,
  takeoffCatalogue,
  type CircuitDesign,
  type CircuitEvaluation,
  type LabourTable,
  type TakeoffSettings,
} from '@gloaming/engine';

export interface DerivingCircuit {
  id: string;
  area: string;
  name: string;
  design: CircuitDesign;
  evaluation: CircuitEvaluation;
}

/**
 * The labour table for a revision: the minutes the firm had set when the revision was made
 * (its settings snapshot; the contracts' common-practice defaults for revisions made before
 * firms kept their own), at the revision's hourly rate. Fittings of every kind take the
 * firm's minutes per fitting.
 */
export function labourTableFor(settings: RevisionSettings): LabourTable {
  const m = (settings.design ?? DEFAULT_DESIGN_SETTINGS).labourMinutes;
  return {
    minutesPerFitting: {},
    defaultMinutesPerFitting: m.minutesPerFitting,
    minutesPerDriver: m.minutesPerDriver,
    minutesPerConnectorBlock: m.minutesPerConnectorBlock,
    minutesPerMetre: { ...m.minutesPerMetre },
    minutesPerCircuitTest: m.minutesPerCircuitTest,
    rateMinorPerHour: settings.labourRateMinorPerHour,
  };
}

/** Cable slack and cut length as the revision's settings give them, for the takeoff. */
export function takeoffSettingsFor(settings: RevisionSettings): TakeoffSettings {
  const d = settings.design ?? DEFAULT_DESIGN_SETTINGS;
  return { cableSlackBp: d.cableSlackBp, cableCutLengthM: d.cableCutLengthMm / 1000 };
}

/** A stable line id for a circuit's derived line, so an override is recognised on the next save. */
export function derivedLineId(circuitId: string, key: string): string {
  return `d-${createHash('sha256').update(`${circuitId}|${key}`).digest('hex').slice(0, 40)}`;
}

function circuitLabel(c: DerivingCircuit): string {
  return c.name ? `${c.area}: ${c.name}` : c.area;
}

/** The derived lines of one circuit, in the order takeoff and labour give them. */
export function circuitLines(c: DerivingCircuit, products: readonly Product[], settings: RevisionSettings): EstimateLine[] {
  const circuit = circuitTakeoff(c.id, c.design, c.evaluation);
  if (!circuit) return [];
  const catalogue = takeoffCatalogue(products);
  const codes = new Map(products.map((p) => [p.id, p.supplierCode]));
  const note = `From circuit ${circuitLabel(c)}`;
  const line = (
    key: string,
    fields: Pick<EstimateLine, 'productId' | 'description' | 'quantityMilli' | 'unit' | 'unitCostMinor' | 'unitPriceMinor'>,
  ): EstimateLine => {
    const l: EstimateLine = {
      id: derivedLineId(c.id, key),
      ...fields,
      pricingMode: 'fixed',
      pricingBp: settings.markupPercentBp,
      vatRateBp: settings.defaultVatRateBp,
      discount: null,
      optional: false,
      alternativeGroup: null,
      selected: true,
      note,
      circuitId: c.id,
      overridden: false,
    };
    const code = fields.productId ? codes.get(fields.productId) : undefined;
    if (code !== undefined) l.productCode = code;
    return l;
  };
  const out: EstimateLine[] = [];
  for (const m of takeoff({ circuits: [circuit], catalogue, settings: takeoffSettingsFor(settings) }).lines) {
    const cable = m.cable;
    out.push(
      line(`material:${m.productId}`, {
        productId: m.productId,
        description: cable ? `${m.name} (runs plus slack, to whole cut lengths)` : m.name,
        quantityMilli: m.quantityMilli,
        unit: m.unit,
        unitCostMinor: m.unitCostMinor ?? 0,
        unitPriceMinor: m.unitPriceMinor ?? 0,
      }),
    );
  }
  const lab = labour({
    circuits: [circuit],
    catalogue,
    table: labourTableFor(settings),
  });
  for (const l of lab.lines) {
    out.push(
      line(`labour:${l.task}:${l.key}`, {
        productId: null,
        description: `Labour: ${l.label}`,
        quantityMilli: 1000,
        unit: 'job',
        unitCostMinor: l.costMinor ?? 0,
        unitPriceMinor: l.priceMinor,
      }),
    );
  }
  return out;
}

const sameArea = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();

/** The revision's estimate with its circuits' lines rewritten (see the module note). */
export function regenerateDerivedLines(
  content: EstimateContent,
  circuits: readonly DerivingCircuit[],
  products: readonly Product[],
  settings: RevisionSettings,
): EstimateContent {
  const live = new Set(circuits.map((c) => c.id));
  const kept = new Set<string>();
  const sections: EstimateSection[] = content.sections.map((s) => ({
    ...s,
    lines: s.lines.filter((l) => {
      if (l.circuitId === null) return true;
      const keep = l.overridden && live.has(l.circuitId);
      if (keep) kept.add(l.id);
      return keep;
    }),
  }));
  for (const c of circuits) {
    const fresh = circuitLines(c, products, settings).filter((l) => !kept.has(l.id));
    if (fresh.length === 0) continue;
    let section = sections.find((s) => sameArea(s.name, c.area));
    if (!section) {
      section = { id: newId(), name: c.area, lines: [] };
      sections.push(section);
    }
    section.lines.push(...fresh);
  }
  return { ...content, sections };
}
