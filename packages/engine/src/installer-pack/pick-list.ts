/**
 * The installer's pick list for a designed circuit: what to load, grouped by where it is
 * prepared. Cable is cut to length at the bench (each run plus the firm's slack, rounded up
 * to the next 0.1 m) and drivers or supplies are set up there; fittings, connector blocks and
 * their seals, reducers and blanking plugs go in the van as stock. No prices: this list is
 * for the people who fit the job. Pure: JSON in and out.
 */
import { finding, type Finding } from '../findings';
import type { CircuitDesign, DesignProduct } from '../circuit-design/design-types';
import type { CircuitEvaluation } from '../circuit-design/evaluate-circuit';

export type LoadPlace = 'bench' | 'van';

export type PickWhat = 'fitting' | 'driver' | 'supply' | 'connector-block' | 'seal' | 'reducer' | 'blanking-plug';

export interface PickItem {
  /** Stable within a list: the product id, or the sundry's name. */
  key: string;
  productId: string | null;
  code: string;
  name: string;
  what: PickWhat;
  quantity: number;
  unit: string;
  place: LoadPlace;
}

export interface CableCut {
  /** Which run, in the installer's words: "Driver lead", "Link 1 (block 1 to block 2)". */
  label: string;
  productId: string | null;
  code: string;
  name: string;
  /** The run as designed, m. */
  runM: number;
  /** What to cut: the run plus slack, rounded up to 0.1 m. */
  cutM: number;
}

export interface CircuitPickList {
  items: PickItem[];
  cuts: CableCut[];
  findings: Finding[];
}

export interface PickListSettings {
  /** Slack added to every cut, basis points (1000 = 10 %, common practice; the engine's takeoff default). */
  cableSlackBp?: number;
}

const DEFAULT_SLACK_BP = 1000;

/** A run plus slack, rounded up to the next 0.1 m (in whole millimetres first, so 12 m + 10 % is 13.2 m, not 13.3). */
export function cutLengthM(runM: number, slackBp: number): number {
  const mm = Math.round(runM * 1000);
  const withSlack = Math.ceil((mm * (10_000 + slackBp)) / 10_000 - 1e-9);
  return Math.ceil(withSlack / 100 - 1e-9) / 10;
}

export function circuitPickList(
  design: CircuitDesign,
  evaluation: CircuitEvaluation,
  products: readonly DesignProduct[],
  settings: PickListSettings = {},
): CircuitPickList {
  const findings: Finding[] = [];
  const slack = settings.cableSlackBp ?? DEFAULT_SLACK_BP;
  if (!Number.isInteger(slack) || slack < 0 || slack > 10_000) {
    findings.push(finding('setting-invalid', 'error', 'Cable slack must be a whole number of basis points from 0 to 10000.'));
    return { items: [], cuts: [], findings };
  }
  const byId = new Map(products.map((p) => [p.id, p]));
  const items = new Map<string, PickItem>();
  const add = (
    id: string | null,
    what: PickWhat,
    quantity: number,
    place: LoadPlace,
    sundry?: { name: string; unit: string },
  ) => {
    if (quantity <= 0) return;
    const p = id ? byId.get(id) : undefined;
    if (id && !p) {
      findings.push(finding('product-unknown', 'warning', `A product on this circuit is no longer in the catalogue (${id}).`));
    }
    const key = id ?? sundry!.name;
    const prev = items.get(key);
    if (prev) prev.quantity += quantity;
    else
      items.set(key, {
        key,
        productId: id,
        code: p?.supplierCode ?? '',
        name: p?.name ?? sundry?.name ?? 'Unknown product',
        what,
        quantity,
        unit: p?.unit ?? sundry?.unit ?? 'each',
        place,
      });
  };
  const cuts: CableCut[] = [];
  const cut = (label: string, cableId: string | null, runM: number) => {
    if (!(runM > 0)) return;
    const p = cableId ? byId.get(cableId) : undefined;
    cuts.push({
      label,
      productId: cableId,
      code: p?.supplierCode ?? '',
      name: p?.name ?? 'Cable not chosen',
      runM,
      cutM: cutLengthM(runM, slack),
    });
  };

  if (design.kind === 'constant-current') {
    add(design.driverProductId, 'driver', design.driverProductId ? 1 : 0, 'bench');
    for (const f of design.fittings) add(f.productId, 'fitting', 1, 'van');
    const plan = evaluation.blocks;
    if (plan && plan.blocks.length > 0) {
      add(design.connectorBlockProductId, 'connector-block', design.connectorBlockProductId ? plan.blocks.length : 0, 'van');
      add(null, 'seal', plan.totals.seals, 'van', { name: 'Entry seals', unit: 'each' });
      add(null, 'reducer', plan.totals.reducers, 'van', { name: 'Seal reducers', unit: 'each' });
      add(null, 'blanking-plug', plan.totals.blankingPlugs, 'van', { name: 'Blanking plugs', unit: 'each' });
    }
    if (design.driverLead) cut('Driver lead (driver to block 1)', design.driverLead.cableProductId, design.driverLead.lengthM);
    design.links.forEach((l, i) => cut(`Link ${i + 1} (block ${i + 1} to block ${i + 2})`, l.cableProductId, l.lengthM));
    design.extensions.forEach((e, i) =>
      cut(e.label ? `Extension: ${e.label}` : `Extension ${i + 1}`, e.cableProductId, e.lengthM),
    );
  } else {
    add(design.supplyProductId, 'supply', design.supplyProductId ? 1 : 0, 'bench');
    for (const run of design.runs) {
      const name = run.label || run.id;
      if (run.layout === 'hub') cut(`${name}: feeder to the hub`, run.cableProductId, run.feederLengthM);
      run.fittings.forEach((f, k) => {
        add(f.productId, 'fitting', 1, 'van');
        const to = f.label || `fitting ${k + 1}`;
        const from =
          run.layout === 'daisy-chain'
            ? k === 0
              ? 'supply'
              : run.fittings[k - 1]!.label || `fitting ${k}`
            : run.layout === 'hub'
              ? 'hub'
              : 'supply';
        cut(`${name}: ${from} to ${to}`, run.cableProductId, f.spanLengthM);
      });
    }
  }
  return { items: [...items.values()], cuts, findings };
}

export interface LoadGroup {
  place: LoadPlace;
  items: PickItem[];
  /** Bench only: every cut, with the circuit it is for. */
  cuts: (CableCut & { circuit: string })[];
  /** Bench only: total cut per cable product, m. */
  cableTotals: { productId: string | null; code: string; name: string; totalM: number }[];
}

/** The pick lists of a job's circuits gathered by load place: the bench first, then the van. */
export function loadGroups(lists: readonly { circuit: string; list: CircuitPickList }[]): LoadGroup[] {
  const groups: LoadGroup[] = (['bench', 'van'] as const).map((place) => ({ place, items: [], cuts: [], cableTotals: [] }));
  for (const { circuit, list } of lists) {
    for (const item of list.items) {
      const g = groups.find((x) => x.place === item.place)!;
      const prev = g.items.find((x) => x.key === item.key);
      if (prev) prev.quantity += item.quantity;
      else g.items.push({ ...item });
    }
    const bench = groups[0]!;
    for (const c of list.cuts) {
      bench.cuts.push({ ...c, circuit });
      const key = c.productId;
      const prev = bench.cableTotals.find((x) => x.productId === key);
      if (prev) prev.totalM = Math.round((prev.totalM + c.cutM) * 10) / 10;
      else bench.cableTotals.push({ productId: key, code: c.code, name: c.name, totalM: c.cutM });
    }
  }
  return groups;
}
