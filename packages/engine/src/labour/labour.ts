/**
 * Labour from circuits and a firm's labour table: minutes per fitting kind, per driver or
 * supply, per connector block, per metre by installation method and for testing each
 * circuit. Minutes are exact thousandths (`minutesMilli`); cable minutes use the measured
 * run length (no slack) in mm, rounded half-up to a thousandth of a minute. The price is the
 * total minutes at the hourly rate, rounded half-up to a minor unit once, then shared across
 * the lines by largest remainder so the lines add up to it exactly.
 */
import { finding, type Finding } from '../findings';
import { allocateMinor } from '../money/allocate';
import { mulDiv } from '../money/integer-math';
import type { QuoteLineInput } from '../money/quote-totals';
import { indexCatalogue } from '../takeoff/catalogue';
import { INSTALLATION_METHODS, type InstallationMethod, type TakeoffCircuit, type TakeoffProduct } from '../takeoff/circuit';
import { listOf, shown } from '../takeoff/input-guards';
import { isEngineInputError } from '../units/engine-input-error';
import { lengthInMetres } from '../units/length';
import type { LabourTable } from './labour-table';

export type LabourTask = 'fitting' | 'driver' | 'connector-block' | 'cable' | 'testing';

export interface LabourSource {
  circuitId: string;
  minutesMilli: number;
}

export interface LabourLine {
  task: LabourTask;
  /** Fitting kind, installation method, or the task name. */
  key: string;
  /** Plain words for the estimate, e.g. "Install fittings: spike". */
  label: string;
  /** items x 1000, cable in mm, circuits x 1000. */
  quantityMilli: number;
  unit: 'each' | 'm' | 'circuit';
  minutesPerUnitMilli: number;
  minutesMilli: number;
  sources: LabourSource[];
  /** This line's share of the labour price, minor units. */
  priceMinor: number;
  /** This line's share of the labour cost, minor units; null without a cost rate. */
  costMinor: number | null;
}

export interface LabourInput {
  circuits: readonly TakeoffCircuit[];
  catalogue: readonly TakeoffProduct[];
  table: LabourTable;
}

export interface LabourResult {
  lines: LabourLine[];
  minutesMilli: number;
  byCircuit: LabourSource[];
  priceMinor: number;
  costMinor: number | null;
  findings: Finding[];
}

const METHOD_WORDS: Record<InstallationMethod, string> = {
  'surface-clipped': 'surface-clipped',
  'buried-trench': 'buried in trench',
  'in-duct': 'in duct',
};

/** Minutes (up to three decimals, zero or more) -> thousandths, or null with a finding. */
function minutesMilli(value: unknown, what: string, findings: Finding[]): number | null {
  const scaled = typeof value === 'number' && Number.isFinite(value) ? Math.round(value * 1000) : NaN;
  if (
    !(scaled >= 0) ||
    !Number.isSafeInteger(scaled) ||
    Math.abs(scaled - (value as number) * 1000) > 1e-6 * Math.max(1, scaled)
  ) {
    findings.push(
      finding(
        'labour-table-invalid',
        'error',
        `The labour table's ${what} must be minutes, zero or more, with at most three decimals; got ${shown(value)}.`,
        {
          subject: 'labour-table',
        },
      ),
    );
    return null;
  }
  return scaled;
}

function rateMinor(value: unknown, what: string, findings: Finding[]): number | null {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 0) {
    findings.push(
      finding(
        'labour-table-invalid',
        'error',
        `The labour table's ${what} must be a whole number of minor units per hour, zero or more; got ${shown(value)}.`,
        {
          subject: 'labour-table',
        },
      ),
    );
    return null;
  }
  return value;
}

interface Tally {
  task: LabourTask;
  key: string;
  label: string;
  unit: LabourLine['unit'];
  perUnit: number;
  quantityMilli: number;
  minutesMilli: number;
  sources: LabourSource[];
}

/** Labour for circuits. Never throws for bad data: it reports findings and leaves the item out. */
export function labour(input: LabourInput): LabourResult {
  const { byId, findings } = indexCatalogue(input.catalogue);
  const table: Partial<LabourTable> = typeof input.table === 'object' && input.table !== null ? input.table : {};
  const perDriver = minutesMilli(table.minutesPerDriver, 'minutes per driver', findings);
  const perBlock = minutesMilli(table.minutesPerConnectorBlock, 'minutes per connector block', findings);
  const perTest = minutesMilli(table.minutesPerCircuitTest, 'minutes per circuit test', findings);
  const perDefaultFitting =
    table.defaultMinutesPerFitting === undefined
      ? null
      : minutesMilli(table.defaultMinutesPerFitting, 'default minutes per fitting', findings);
  const perFitting = new Map<string, number | null>();
  const fittingMinutes =
    typeof table.minutesPerFitting === 'object' && table.minutesPerFitting !== null ? table.minutesPerFitting : {};
  for (const [kind, m] of Object.entries(fittingMinutes)) {
    perFitting.set(kind, minutesMilli(m, `minutes for a "${kind}" fitting`, findings));
  }
  const perMetre = new Map<InstallationMethod, number | null>();
  for (const method of INSTALLATION_METHODS) {
    const m = table.minutesPerMetre?.[method];
    if (m !== undefined) perMetre.set(method, minutesMilli(m, `minutes per metre ${METHOD_WORDS[method]}`, findings));
  }
  const sellRate = rateMinor(table.rateMinorPerHour, 'hourly rate', findings);
  const costRate = table.costMinorPerHour === undefined ? null : rateMinor(table.costMinorPerHour, 'hourly cost', findings);

  const tallies = new Map<string, Tally>();
  const byCircuit = new Map<string, number>();
  let byCircuitTotal = 0; // all minutes so far, kept within the safe-integer range
  const reported = new Set<string>();
  const once = (key: string, f: () => Finding) => {
    if (!reported.has(key)) {
      reported.add(key);
      findings.push(f());
    }
  };

  const add = (
    circuitId: string,
    task: LabourTask,
    key: string,
    label: string,
    unit: LabourLine['unit'],
    perUnit: number,
    quantityMilli: number,
  ) => {
    let minutes: number;
    try {
      minutes = mulDiv(quantityMilli, perUnit, 1000, 'half-up');
      if (!Number.isSafeInteger(byCircuitTotal + minutes)) throw new Error('overflow');
    } catch {
      once(`too-large:${circuitId}`, () =>
        finding(
          'labour-out-of-range',
          'error',
          `The labour on circuit "${circuitId}" is too large to add up exactly; check the counts, lengths and the labour table.`,
          {
            subject: `circuit:${circuitId}`,
          },
        ),
      );
      return;
    }
    byCircuitTotal += minutes;
    const id = `${task}|${key}`;
    let t = tallies.get(id);
    if (!t) {
      t = { task, key, label, unit, perUnit, quantityMilli: 0, minutesMilli: 0, sources: [] };
      tallies.set(id, t);
    }
    t.quantityMilli += quantityMilli;
    t.minutesMilli += minutes;
    const last = t.sources[t.sources.length - 1];
    if (last && last.circuitId === circuitId) last.minutesMilli += minutes;
    else t.sources.push({ circuitId, minutesMilli: minutes });
    byCircuit.set(circuitId, (byCircuit.get(circuitId) ?? 0) + minutes);
  };

  const count = (item: { count?: number } | null | undefined) => {
    if (typeof item !== 'object' || item === null) return null;
    const c = item.count ?? 1;
    return Number.isSafeInteger(c) && c >= 0 ? c : null;
  };

  for (const c of listOf(input.circuits, 'circuits', findings)) {
    if (typeof c !== 'object' || c === null || typeof c.id !== 'string' || c.id === '') {
      findings.push(finding('circuit-invalid', 'error', 'Every circuit needs an id.'));
      continue;
    }
    byCircuit.set(c.id, byCircuit.get(c.id) ?? 0);

    for (const [k, item] of listOf(c.fittings, `circuit ${c.id} fittings`, findings).entries()) {
      const subject = `circuit:${c.id}/fitting:${k + 1}`;
      const n = count(item);
      const product = n === null ? undefined : byId.get(item.productId);
      if (n === null) {
        findings.push(
          finding(
            'item-count-invalid',
            'error',
            `The count for "${shown(item?.productId)}" must be a whole number, zero or more.`,
            { subject },
          ),
        );
        continue;
      }
      if (!product) {
        findings.push(
          finding(
            'product-unknown',
            'error',
            `Circuit "${c.id}" uses product "${shown(item.productId)}", which is not in the catalogue.`,
            { subject },
          ),
        );
        continue;
      }
      const kind = product.fittingKind ?? 'unspecified';
      const own = perFitting.get(kind);
      const per = own === undefined ? perDefaultFitting : own;
      if (per === null) {
        if (own === undefined) {
          once(`kind:${kind}`, () =>
            finding(
              'labour-rate-missing',
              'warning',
              `The labour table has no minutes for "${kind}" fittings (e.g. "${product.name}") and no default; they carry no labour until one is set.`,
              {
                subject: `fitting-kind:${kind}`,
              },
            ),
          );
        }
        continue;
      }
      add(c.id, 'fitting', kind, `Install fittings: ${kind}`, 'each', per, n * 1000);
    }

    if (perDriver !== null && c.powerProductId !== undefined)
      add(c.id, 'driver', 'driver', 'Mount and connect drivers and supplies', 'each', perDriver, 1000);

    for (const [k, item] of listOf(c.connectorBlocks, `circuit ${c.id} connector blocks`, findings).entries()) {
      const n = count(item);
      if (n === null) {
        findings.push(
          finding(
            'item-count-invalid',
            'error',
            `The count for "${shown(item?.productId)}" must be a whole number, zero or more.`,
            {
              subject: `circuit:${c.id}/block:${k + 1}`,
            },
          ),
        );
        continue;
      }
      if (perBlock !== null)
        add(c.id, 'connector-block', 'connector-block', 'Make off connector blocks', 'each', perBlock, n * 1000);
    }

    for (const [k, run] of listOf(c.cableRuns, `circuit ${c.id} cable runs`, findings).entries()) {
      const subject = `circuit:${c.id}/cable:${run?.id ?? k + 1}`;
      if (typeof run !== 'object' || run === null) {
        findings.push(
          finding('cable-run-invalid', 'error', `Cable run ${k + 1} on circuit "${c.id}" needs a cable, a length and a method.`, {
            subject,
          }),
        );
        continue;
      }
      let mm: number;
      try {
        mm = Math.round(lengthInMetres(run.length, subject) * 1000);
      } catch (e) {
        if (isEngineInputError(e)) {
          findings.push(e.finding);
          continue;
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
        continue;
      }
      const per = perMetre.get(run.method);
      if (per === undefined) {
        once(`method:${run.method}`, () =>
          finding(
            'labour-rate-missing',
            'warning',
            `The labour table has no minutes per metre for cable ${METHOD_WORDS[run.method]}; those runs carry no labour until it is set.`,
            {
              subject: `installation-method:${run.method}`,
            },
          ),
        );
        continue;
      }
      if (per !== null) add(c.id, 'cable', run.method, `Lay cable: ${METHOD_WORDS[run.method]}`, 'm', per, mm);
    }

    if (perTest !== null) add(c.id, 'testing', 'testing', 'Test and commission circuits', 'circuit', perTest, 1000);
  }

  const taskOrder: LabourTask[] = ['fitting', 'driver', 'connector-block', 'cable', 'testing'];
  const ordered = [...tallies.values()].sort((a, b) => taskOrder.indexOf(a.task) - taskOrder.indexOf(b.task));
  const total = ordered.reduce((s, t) => s + t.minutesMilli, 0);
  // minutes (thousandths) x rate per hour / 60,000
  const price = (rate: number | null): number | null => {
    if (rate === null) return null;
    try {
      return mulDiv(total, rate, 60_000, 'half-up');
    } catch {
      findings.push(
        finding(
          'labour-out-of-range',
          'error',
          'The labour price is too large to hold exactly; check the hourly rate and the minutes.',
          { subject: 'labour-table' },
        ),
      );
      return null;
    }
  };
  const priceMinor = price(sellRate) ?? 0;
  const costMinor = price(costRate);
  const weights = ordered.map((t) => t.minutesMilli);
  const canShare = total > 0;
  const prices = canShare ? allocateMinor(priceMinor, weights) : weights.map(() => 0);
  const costs = costMinor === null ? null : canShare ? allocateMinor(costMinor, weights) : weights.map(() => 0);

  const lines: LabourLine[] = ordered.map((t, i) => ({
    task: t.task,
    key: t.key,
    label: t.label,
    quantityMilli: t.quantityMilli,
    unit: t.unit,
    minutesPerUnitMilli: t.perUnit,
    minutesMilli: t.minutesMilli,
    sources: t.sources,
    priceMinor: prices[i]!,
    costMinor: costs === null ? null : costs[i]!,
  }));
  return {
    lines,
    minutesMilli: total,
    byCircuit: [...byCircuit].map(([circuitId, m]) => ({ circuitId, minutesMilli: m })),
    priceMinor,
    costMinor,
    findings,
  };
}

/** Labour as estimate lines: one lump line per labour line, so they add up to the labour price. */
export function labourQuoteLines(result: LabourResult, options: { vatRateBp: number; idPrefix?: string }): QuoteLineInput[] {
  const prefix = options.idPrefix ?? 'labour:';
  return result.lines.map((l) => {
    const q: QuoteLineInput = {
      id: `${prefix}${l.task}:${l.key}`,
      quantityMilli: 1000,
      unitPriceMinor: l.priceMinor,
      vatRateBp: options.vatRateBp,
    };
    if (l.costMinor !== null) q.unitCostMinor = l.costMinor;
    return q;
  });
}
