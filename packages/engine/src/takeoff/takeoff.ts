/**
 * Material takeoff: from circuits to material lines (fittings, drivers or supplies, cable
 * metres per cable type, connector blocks, seals and reducers, enclosures and mounting
 * accessories), each saying which circuits it came from.
 *
 * Quantities are exact thousandths (`quantityMilli`, as in money): a count of 3 is 3000, a
 * cable length is in millimetres. A run given in feet is converted and rounded to the
 * nearest millimetre. Cable per type = the sum of its runs, plus the firm's slack, rounded
 * up to the millimetre, then rounded up to a whole number of cut lengths (the product's own
 * cut length, else the firm's).
 */
import { finding, type Finding } from '../findings';
import { divRound, mulDiv } from '../money/integer-math';
import { isEngineInputError } from '../units/engine-input-error';
import { lengthInMetres } from '../units/length';
import { indexCatalogue } from './catalogue';
import { listOf, shown } from './input-guards';
import {
  INSTALLATION_METHODS,
  PRODUCT_CATEGORIES,
  type CircuitItem,
  type ProductCategory,
  type TakeoffCircuit,
  type TakeoffProduct,
} from './circuit';

export interface TakeoffSettings {
  /** Extra cable on top of the measured runs, basis points (default 1000 = 10 %, common practice). */
  cableSlackBp?: number;
  /** Cable is bought in whole multiples of this many metres (default 1 m). */
  cableCutLengthM?: number;
}

export const DEFAULT_CABLE_SLACK_BP = 1000;
export const DEFAULT_CABLE_CUT_LENGTH_M = 1;

export interface MaterialSource {
  circuitId: string;
  /** What this circuit contributes, thousandths (cable: measured run length in mm, no slack). */
  quantityMilli: number;
}

export interface CableQuantity {
  /** Measured runs, mm. */
  runMilli: number;
  slackMilli: number;
  /** Added to reach a whole number of cut lengths, mm. */
  roundingMilli: number;
  cutLengthMilli: number;
  runCount: number;
}

export interface MaterialLine {
  productId: string;
  name: string;
  category: ProductCategory;
  unit: 'each' | 'm';
  /** Exact thousandths: items x 1000, or cable in mm. */
  quantityMilli: number;
  sources: MaterialSource[];
  /** How a cable line's metres were reached; null for counted items. */
  cable: CableQuantity | null;
  unitCostMinor: number | null;
  unitPriceMinor: number | null;
}

export interface TakeoffInput {
  circuits: readonly TakeoffCircuit[];
  catalogue: readonly TakeoffProduct[];
  settings?: TakeoffSettings;
}

export interface TakeoffResult {
  /** Grouped by category (fittings, drivers, supplies, cable, blocks, seals, reducers,
   * enclosures, mounting), then in order of first appearance. */
  lines: MaterialLine[];
  findings: Finding[];
}

type Slot = 'fitting' | 'power' | 'cable' | 'connector-block' | 'seal' | 'accessory';

const EXPECTED: Record<Slot, readonly ProductCategory[]> = {
  fitting: ['fitting'],
  power: ['driver', 'supply'],
  cable: ['cable'],
  'connector-block': ['connector-block'],
  seal: ['seal', 'reducer'],
  accessory: ['enclosure', 'mounting'],
};

const SLOT_WORDS: Record<Slot, string> = {
  fitting: 'a fitting',
  power: 'a driver or supply',
  cable: 'a cable',
  'connector-block': 'a connector block',
  seal: 'a seal or reducer',
  accessory: 'an enclosure or mounting accessory',
};

interface Tally {
  product: TakeoffProduct;
  quantityMilli: number;
  sources: MaterialSource[];
  runCount: number;
  order: number;
}

function toMillimetres(metres: number): number {
  return Math.round(metres * 1000);
}

/** Whole-number count of an item, or a finding saying why not. */
function itemCount(item: CircuitItem, subject: string): { count: number } | { finding: Finding } {
  if (typeof item !== 'object' || item === null) {
    return { finding: finding('item-invalid', 'error', 'Each item needs a product id and a count.', { subject }) };
  }
  const count = item.count ?? 1;
  if (!Number.isSafeInteger(count) || count < 0) {
    return {
      finding: finding(
        'item-count-invalid',
        'error',
        `The count for "${shown(item.productId)}" must be a whole number, zero or more; got ${shown(count)}.`,
        {
          subject,
        },
      ),
    };
  }
  return { count };
}

/** Material lines from circuits. Never throws for bad circuit data: it reports findings. */
export function takeoff(input: TakeoffInput): TakeoffResult {
  const { byId, findings } = indexCatalogue(input.catalogue);
  const settings = input.settings ?? {};
  let slackBp = settings.cableSlackBp ?? DEFAULT_CABLE_SLACK_BP;
  if (!Number.isSafeInteger(slackBp) || slackBp < 0) {
    findings.push(
      finding(
        'setting-invalid',
        'error',
        `Cable slack must be a whole number of basis points, zero or more; using ${DEFAULT_CABLE_SLACK_BP / 100} %.`,
        {
          subject: 'settings:cableSlackBp',
        },
      ),
    );
    slackBp = DEFAULT_CABLE_SLACK_BP;
  }
  const firmCut =
    cutLength(settings.cableCutLengthM, 'settings:cableCutLengthM', findings) ?? toMillimetres(DEFAULT_CABLE_CUT_LENGTH_M);

  const tallies = new Map<string, Tally>();
  const circuitIds = new Set<string>();
  let order = 0;

  const add = (circuitId: string, productId: string, slot: Slot, quantityMilli: number, subject: string): boolean => {
    const product = byId.get(productId);
    if (!product) {
      findings.push(
        finding(
          'product-unknown',
          'error',
          `Circuit "${circuitId}" uses product "${shown(productId)}", which is not in the catalogue.`,
          {
            subject,
          },
        ),
      );
      return false;
    }
    if (!EXPECTED[slot].includes(product.category)) {
      findings.push(
        finding(
          'product-wrong-category',
          'error',
          `Circuit "${circuitId}" lists "${product.name}" as ${SLOT_WORDS[slot]}, but the catalogue has it as a ${product.category}.`,
          {
            subject,
            values: { productId, category: product.category },
          },
        ),
      );
    }
    let t = tallies.get(productId);
    if (!Number.isSafeInteger(quantityMilli) || !Number.isSafeInteger((t?.quantityMilli ?? 0) + quantityMilli)) {
      findings.push(
        finding(
          'quantity-out-of-range',
          'error',
          `Circuit "${circuitId}": the quantity of "${product.name}" is too large to count exactly; check the count or length.`,
          {
            subject,
          },
        ),
      );
      return false;
    }
    if (!t) {
      t = { product, quantityMilli: 0, sources: [], runCount: 0, order: order++ };
      tallies.set(productId, t);
    }
    t.quantityMilli += quantityMilli;
    const last = t.sources[t.sources.length - 1];
    if (last && last.circuitId === circuitId) last.quantityMilli += quantityMilli;
    else t.sources.push({ circuitId, quantityMilli });
    if (slot === 'cable') t.runCount++;
    return true;
  };

  const addItems = (c: TakeoffCircuit, items: readonly CircuitItem[] | undefined, slot: Slot, what: string) => {
    if (items === undefined) return;
    if (!Array.isArray(items)) {
      findings.push(
        finding('circuit-invalid', 'error', `Circuit "${c.id}": ${what} must be a list.`, { subject: `circuit:${c.id}` }),
      );
      return;
    }
    items.forEach((item, k) => {
      const subject = `circuit:${c.id}/${what}:${k + 1}`;
      const n = itemCount(item, subject);
      if ('finding' in n) findings.push(n.finding);
      else if (n.count > 0) add(c.id, item.productId, slot, n.count * 1000, subject);
    });
  };

  const circuits = listOf(input.circuits, 'circuits', findings);
  for (const c of circuits) {
    if (typeof c !== 'object' || c === null || typeof c.id !== 'string' || c.id === '') {
      findings.push(finding('circuit-invalid', 'error', 'Every circuit needs an id.'));
      continue;
    }
    if (circuitIds.has(c.id)) {
      findings.push(
        finding('circuit-duplicate-id', 'error', `Circuit id "${c.id}" is used twice; its materials are counted for each.`, {
          subject: `circuit:${c.id}`,
        }),
      );
    }
    circuitIds.add(c.id);
    if (c.kind !== 'constant-current' && c.kind !== 'constant-voltage') {
      findings.push(
        finding('circuit-invalid', 'error', `Circuit "${c.id}" must be constant-current or constant-voltage.`, {
          subject: `circuit:${c.id}`,
        }),
      );
    }

    const powerSubject = `circuit:${c.id}/power`;
    if (add(c.id, c.powerProductId, 'power', 1000, powerSubject)) {
      const p = byId.get(c.powerProductId)!;
      const want = c.kind === 'constant-current' ? 'driver' : c.kind === 'constant-voltage' ? 'supply' : p.category;
      if ((p.category === 'driver' || p.category === 'supply') && p.category !== want) {
        findings.push(
          finding(
            'power-product-mismatch',
            'error',
            c.kind === 'constant-current'
              ? `Circuit "${c.id}" is constant-current but "${p.name}" is a constant-voltage supply; constant-current fittings need a constant-current driver.`
              : `Circuit "${c.id}" is constant-voltage but "${p.name}" is a constant-current driver; constant-voltage fittings need a constant-voltage supply.`,
            { subject: powerSubject, values: { productId: p.id } },
          ),
        );
      }
    }

    addItems(c, c.fittings, 'fitting', 'fitting');
    if (Array.isArray(c.fittings) && c.fittings.length === 0) {
      findings.push(
        finding('circuit-without-fittings', 'warning', `Circuit "${c.id}" has no fittings.`, { subject: `circuit:${c.id}` }),
      );
    }

    if (!Array.isArray(c.cableRuns)) {
      findings.push(
        finding('circuit-invalid', 'error', `Circuit "${c.id}": cable runs must be a list.`, { subject: `circuit:${c.id}` }),
      );
    } else {
      c.cableRuns.forEach((run, k) => {
        const subject = `circuit:${c.id}/cable:${run?.id ?? k + 1}`;
        if (typeof run !== 'object' || run === null) {
          findings.push(
            finding(
              'cable-run-invalid',
              'error',
              `Cable run ${k + 1} on circuit "${c.id}" needs a cable, a length and a method.`,
              { subject },
            ),
          );
          return;
        }
        let mm: number;
        try {
          mm = toMillimetres(lengthInMetres(run.length, subject));
        } catch (e) {
          if (isEngineInputError(e)) {
            findings.push(e.finding);
            return;
          }
          throw e;
        }
        if (!INSTALLATION_METHODS.includes(run.method)) {
          findings.push(
            finding(
              'installation-method-unknown',
              'error',
              `Cable run ${run.id ?? k + 1} on circuit "${c.id}" has an unknown installation method "${shown(run.method)}".`,
              {
                subject,
              },
            ),
          );
        }
        add(c.id, run.cableProductId, 'cable', mm, subject);
      });
    }

    addItems(c, c.connectorBlocks, 'connector-block', 'block');
    addItems(c, c.seals, 'seal', 'seal');
    addItems(c, c.accessories, 'accessory', 'accessory');
  }

  const lines: MaterialLine[] = [];
  const rank = (cat: ProductCategory) => PRODUCT_CATEGORIES.indexOf(cat);
  const sorted = [...tallies.values()].sort((a, b) => rank(a.product.category) - rank(b.product.category) || a.order - b.order);
  for (const t of sorted) {
    const p = t.product;
    let quantityMilli = t.quantityMilli;
    let cable: CableQuantity | null = null;
    if (p.category === 'cable') {
      const cut = p.cutLengthM === undefined ? firmCut : (cutLength(p.cutLengthM, `product:${p.id}`, findings) ?? firmCut);
      const bought = purchasedCable(t.quantityMilli, slackBp, cut);
      if (bought === null) {
        findings.push(
          finding(
            'quantity-out-of-range',
            'error',
            `The cable for "${p.name}" is too long to add slack and round exactly; it is listed as measured.`,
            {
              subject: `product:${p.id}`,
            },
          ),
        );
      }
      const withSlack = bought?.withSlack ?? t.quantityMilli;
      const total = bought?.total ?? t.quantityMilli;
      cable = {
        runMilli: t.quantityMilli,
        slackMilli: withSlack - t.quantityMilli,
        roundingMilli: total - withSlack,
        cutLengthMilli: cut,
        runCount: t.runCount,
      };
      quantityMilli = total;
    }
    lines.push({
      productId: p.id,
      name: p.name,
      category: p.category,
      unit: p.category === 'cable' ? 'm' : 'each',
      quantityMilli,
      sources: t.sources,
      cable,
      unitCostMinor: p.unitCostMinor ?? null,
      unitPriceMinor: p.unitPriceMinor ?? null,
    });
  }
  return { lines, findings };
}

/** Runs + slack (rounded up to the mm), then up to whole cut lengths; null when too large to hold exactly. */
function purchasedCable(runMilli: number, slackBp: number, cutMilli: number): { withSlack: number; total: number } | null {
  try {
    const withSlack = mulDiv(runMilli, 10_000 + slackBp, 10_000, 'up');
    const total = divRound(withSlack, cutMilli, 'up') * cutMilli;
    return Number.isSafeInteger(total) ? { withSlack, total } : null;
  } catch {
    return null;
  }
}

/** A cut length in metres -> mm, or null with a finding when it is not positive. */
function cutLength(metres: number | undefined, subject: string, findings: Finding[]): number | null {
  if (metres === undefined) return null;
  const mm = Number.isFinite(metres) ? toMillimetres(metres) : NaN;
  if (!(mm >= 1) || !Number.isSafeInteger(mm)) {
    findings.push(
      finding('setting-invalid', 'error', `A cable cut length must be at least 1 mm; got ${shown(metres)} m.`, { subject }),
    );
    return null;
  }
  return mm;
}
