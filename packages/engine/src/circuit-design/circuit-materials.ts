/**
 * What a designed circuit puts on the estimate: its fittings, driver or supply, cable runs
 * and connector blocks as the takeoff and labour modules take them. Block counts come from
 * the evaluated block plan, so the estimate buys the blocks the terminal schedule uses.
 */
import type { CircuitItem, CircuitCableRun, ProductCategory, TakeoffCircuit, TakeoffProduct } from '../takeoff/circuit';
import { metres } from '../units/length';
import type { CircuitDesign, DesignProduct } from './design-types';
import type { CircuitEvaluation } from './evaluate-circuit';

const CATEGORY: Partial<Record<DesignProduct['kind'], ProductCategory>> = {
  fitting: 'fitting',
  driver: 'driver',
  'cv-supply': 'supply',
  cable: 'cable',
  'connector-block': 'connector-block',
  accessory: 'mounting',
};

/** Catalogue products as takeoff prices them: cost and list price per unit (per metre for cable). */
export function takeoffCatalogue(products: readonly DesignProduct[]): TakeoffProduct[] {
  const out: TakeoffProduct[] = [];
  for (const p of products) {
    const category = CATEGORY[p.kind];
    if (!category) continue;
    const t: TakeoffProduct = { id: p.id, name: p.name, category, unitCostMinor: p.costMinor, unitPriceMinor: p.listPriceMinor };
    if (p.kind === 'cable' && p.spec.cutLengthM !== undefined) t.cutLengthM = p.spec.cutLengthM;
    out.push(t);
  }
  return out;
}

function counted(ids: readonly string[]): CircuitItem[] {
  const counts = new Map<string, number>();
  for (const id of ids) counts.set(id, (counts.get(id) ?? 0) + 1);
  return [...counts].map(([productId, count]) => ({ productId, count }));
}

/**
 * The circuit as takeoff and labour read it, or null while it has no driver or supply (there
 * is nothing sound to price until there is one). Runs without a chosen cable are left out.
 */
export function circuitTakeoff(id: string, design: CircuitDesign, evaluation: CircuitEvaluation): TakeoffCircuit | null {
  if (design.kind === 'constant-current') {
    if (design.driverProductId === null) return null;
    const cableRuns: CircuitCableRun[] = [];
    const add = (
      run: { cableProductId: string | null; lengthM: number; method: CircuitCableRun['method'] },
      runId: string,
    ): void => {
      if (run.cableProductId !== null && run.lengthM > 0)
        cableRuns.push({ id: runId, cableProductId: run.cableProductId, length: metres(run.lengthM), method: run.method });
    };
    if (design.driverLead) add(design.driverLead, 'lead');
    design.links.forEach((l, k) => add(l, `link-${k + 1}`));
    design.extensions.forEach((e, k) => add(e, `extension-${k + 1}`));
    const circuit: TakeoffCircuit = {
      id,
      kind: 'constant-current',
      powerProductId: design.driverProductId,
      fittings: counted(design.fittings.map((f) => f.productId)),
      cableRuns,
    };
    const blockCount = evaluation.blocks?.blocks.length ?? 0;
    if (design.connectorBlockProductId !== null && blockCount > 0)
      circuit.connectorBlocks = [{ productId: design.connectorBlockProductId, count: blockCount }];
    return circuit;
  }
  if (design.supplyProductId === null) return null;
  const cableRuns: CircuitCableRun[] = [];
  for (const run of design.runs) {
    if (run.cableProductId === null) continue;
    if (run.layout === 'hub' && run.feederLengthM > 0)
      cableRuns.push({
        id: `${run.id}-feeder`,
        cableProductId: run.cableProductId,
        length: metres(run.feederLengthM),
        method: run.method,
      });
    run.fittings.forEach((f, k) => {
      if (f.spanLengthM > 0)
        cableRuns.push({
          id: `${run.id}-${k + 1}`,
          cableProductId: run.cableProductId!,
          length: metres(f.spanLengthM),
          method: run.method,
        });
    });
  }
  return {
    id,
    kind: 'constant-voltage',
    powerProductId: design.supplyProductId,
    fittings: counted(design.runs.flatMap((r) => r.fittings.map((f) => f.productId))),
    cableRuns,
  };
}
