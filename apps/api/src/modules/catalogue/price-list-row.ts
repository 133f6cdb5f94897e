import {
  DIMMING_METHODS,
  IMPORT_FIELD_INFO,
  PRODUCT_KIND_LABELS,
  PRODUCT_KINDS,
  ProductInput,
  SPEC_IMPORT_FIELDS,
  type ColumnMapping,
  type FieldError,
  type ImportField,
  type ProductInputParsed,
  type ProductKind,
} from '@gloaming/contracts';
import { parseMoney } from '@gloaming/engine';

/** Reading one price-list row into a catalogue product, with the reasons when it cannot be. */

export type RowResult =
  | { ok: true; input: ProductInputParsed; specFromRow: boolean }
  | { ok: false; errors: FieldError[]; reason: string; supplierCode: string; name: string; kind: string };

interface CellReader {
  text(field: ImportField): string | undefined;
  number(field: ImportField): number | undefined;
  money(field: ImportField): number | undefined;
}

/**
 * Decimal text as written in price lists. With a semicolon delimiter the comma is the decimal
 * mark and dots or spaces group thousands (common practice in continental spreadsheets);
 * otherwise the dot is the decimal mark and commas group thousands. Currency signs are dropped.
 */
export function normaliseDecimal(text: string, decimalComma: boolean): string {
  const bare = text.replace(/[£€$\s\u00a0]/g, '');
  return decimalComma ? bare.replace(/\./g, '').replace(',', '.') : bare.replace(/,/g, '');
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)$/;

function kindFrom(text: string | undefined, fallback: ProductKind): ProductKind | string {
  if (!text) return fallback;
  const t = text.trim().toLowerCase().replace(/[\s_]+/g, '-');
  const direct = PRODUCT_KINDS.find((k) => k === t);
  if (direct) return direct;
  const byLabel = PRODUCT_KINDS.find((k) => PRODUCT_KIND_LABELS[k].toLowerCase().replace(/\s+/g, '-') === t);
  return byLabel ?? text.trim();
}

function yesNo(text: string | undefined): boolean | string | undefined {
  if (text === undefined) return undefined;
  const t = text.trim().toLowerCase();
  if (['yes', 'y', 'true', '1', 'active'].includes(t)) return true;
  if (['no', 'n', 'false', '0', 'inactive'].includes(t)) return false;
  return text;
}

/** The spec for a kind from the row's spec columns; absent cells stay absent for zod to judge. */
function specFor(kind: ProductKind, cell: CellReader): Record<string, unknown> {
  const mA = (field: ImportField) => {
    const v = cell.number(field);
    return v === undefined ? undefined : v / 1000;
  };
  switch (kind) {
    case 'fitting': {
      const mode = cell.text('driveMode')?.trim().toLowerCase().replace(/[\s_]+/g, '-');
      const cv = mode ? ['cv', 'constant-voltage'].includes(mode) : cell.number('nominalVoltageV') !== undefined;
      const tailLength = cell.number('tailLengthM');
      const optics = {
        lumens: cell.number('lumens'),
        beamAngleDeg: cell.number('beamAngleDeg'),
        colourTemperatureK: cell.number('colourTemperatureK'),
        ipCode: cell.text('ipCode'),
        // tails are flexible cords: IEC 60228 class 5 (common practice for fitting leads)
        tail:
          tailLength === undefined
            ? undefined
            : { lengthM: tailLength, conductor: { kind: 'metric', areaMm2: cell.number('tailAreaMm2'), conductorClass: 5, coating: 'plain' } },
      };
      if (mode && !cv && !['cc', 'constant-current'].includes(mode)) return { driveMode: cell.text('driveMode'), ...optics };
      if (cv) return { driveMode: 'constant-voltage', nominalVoltageV: cell.number('nominalVoltageV'), powerW: cell.number('powerW'), ...optics };
      const currentA = mA('driveCurrentMa');
      const rating = { currentA, forwardVoltageV: cell.number('forwardVoltageV'), powerW: cell.number('powerW') };
      return { driveMode: 'constant-current', ratings: currentA === undefined && !rating.forwardVoltageV && !rating.powerW ? [] : [rating], ...optics };
    }
    case 'driver': {
      const minPower = cell.number('minPowerW');
      const maxPower = cell.number('maxPowerW');
      const dimming = cell.text('dimming');
      return {
        currentA: mA('outputCurrentMa'),
        voltageWindowV: { minV: cell.number('minVoltageV'), maxV: cell.number('maxVoltageV') },
        powerWindowW: minPower === undefined ? undefined : { minW: minPower, maxW: maxPower },
        maxPowerW: maxPower,
        efficiencyPct: cell.number('efficiencyPct'),
        ipCode: cell.text('ipCode'),
        dimming: dimming ? (DIMMING_METHODS.find((d) => d.toLowerCase() === dimming.trim().toLowerCase()) ?? dimming) : undefined,
      };
    }
    case 'cv-supply':
      return { outputVoltageV: cell.number('outputVoltageV'), ratedPowerW: cell.number('ratedPowerW'), ipCode: cell.text('ipCode') };
    case 'cable': {
      const awg = cell.number('awg');
      const conductor =
        awg !== undefined && cell.number('areaMm2') === undefined
          ? { kind: 'awg', gauge: awg, stranding: 'stranded' }
          : { kind: 'metric', areaMm2: cell.number('areaMm2'), conductorClass: cell.number('conductorClass'), coating: 'plain' };
      return { cores: cell.number('cores'), conductor, statedOhmPerKm: cell.number('statedOhmPerKm'), cutLengthM: cell.number('cutLengthM') };
    }
    case 'connector-block':
      return {
        terminals: cell.number('terminals'),
        entries: cell.number('entries'),
        conductorsPerTerminal: cell.number('conductorsPerTerminal'),
        ipCode: cell.text('ipCode'),
      };
    case 'accessory':
      return {};
    case 'labour':
      return { minutes: cell.number('minutes'), rateMinorPerHour: cell.money('labourRate') };
  }
}

/** A zod issue path -> the import field (and so the CSV column) it came from. */
function fieldForPath(path: readonly PropertyKey[]): ImportField | undefined {
  const key = path.map(String).join('.');
  const direct: Record<string, ImportField> = {
    kind: 'kind',
    supplierCode: 'supplierCode',
    name: 'name',
    description: 'description',
    unit: 'unit',
    costMinor: 'cost',
    listPriceMinor: 'listPrice',
    active: 'active',
    'spec.driveMode': 'driveMode',
    'spec.nominalVoltageV': 'nominalVoltageV',
    'spec.powerW': 'powerW',
    'spec.ratings': 'driveCurrentMa',
    'spec.ratings.0.currentA': 'driveCurrentMa',
    'spec.ratings.0.forwardVoltageV': 'forwardVoltageV',
    'spec.ratings.0.powerW': 'powerW',
    'spec.currentA': 'outputCurrentMa',
    'spec.voltageWindowV.minV': 'minVoltageV',
    'spec.voltageWindowV.maxV': 'maxVoltageV',
    'spec.powerWindowW.minW': 'minPowerW',
    'spec.powerWindowW.maxW': 'maxPowerW',
    'spec.maxPowerW': 'maxPowerW',
    'spec.tail.lengthM': 'tailLengthM',
    'spec.tail.conductor.areaMm2': 'tailAreaMm2',
    'spec.conductor.areaMm2': 'areaMm2',
    'spec.conductor.gauge': 'awg',
    'spec.conductor.conductorClass': 'conductorClass',
    'spec.rateMinorPerHour': 'labourRate',
  };
  if (direct[key]) return direct[key];
  const last = String(path[path.length - 1] ?? '');
  return (SPEC_IMPORT_FIELDS as readonly string[]).includes(last) ? (last as ImportField) : undefined;
}

export interface RowContext {
  supplier: string;
  mapping: ColumnMapping;
  decimalComma: boolean;
  /** The stored product with the same supplier code, if any (its spec is kept when the row has no spec columns). */
  existing?: { kind: string; spec: Record<string, unknown> } | undefined;
}

/** Whether the mapping fills any spec column for this kind. */
function mapsSpecFor(mapping: ColumnMapping, kind: ProductKind): boolean {
  return SPEC_IMPORT_FIELDS.some((f) => {
    const kinds = IMPORT_FIELD_INFO[f].kinds;
    return Boolean(mapping.columns[f]) && kinds !== 'all' && (kinds as readonly string[]).includes(kind);
  });
}

export function readRow(values: Record<string, string>, ctx: RowContext): RowResult {
  const cellErrors: FieldError[] = [];
  const text = (field: ImportField): string | undefined => {
    const header = ctx.mapping.columns[field];
    const v = header === undefined ? undefined : values[header]?.trim();
    return v ? v : undefined;
  };
  const cell: CellReader = {
    text,
    number(field) {
      const t = text(field);
      if (t === undefined) return undefined;
      const n = normaliseDecimal(t, ctx.decimalComma);
      if (!NUMBER.test(n)) {
        cellErrors.push({ path: field, message: `“${t}” is not a number.` });
        return undefined;
      }
      return Number(n);
    },
    money(field) {
      const t = text(field);
      if (t === undefined) return undefined;
      const parsed = parseMoney(normaliseDecimal(t, ctx.decimalComma));
      if (!parsed.ok) {
        cellErrors.push({ path: field, message: `“${t}” is not an amount of money.` });
        return undefined;
      }
      return parsed.value;
    },
  };
  const kind = kindFrom(text('kind'), ctx.mapping.defaultKind);
  const knownKind = PRODUCT_KINDS.find((k) => k === kind);
  const keepSpec = knownKind !== undefined && ctx.existing?.kind === knownKind && !mapsSpecFor(ctx.mapping, knownKind);
  const candidate = {
    kind,
    supplier: ctx.supplier,
    supplierCode: text('supplierCode'),
    name: text('name'),
    description: text('description'),
    unit: text('unit'),
    costMinor: cell.money('cost'),
    listPriceMinor: cell.money('listPrice'),
    active: yesNo(text('active')),
    spec: knownKind ? (keepSpec ? ctx.existing!.spec : specFor(knownKind, cell)) : {},
  };
  const parsed = ProductInput.safeParse(candidate);
  const failedCells = new Set(cellErrors.map((e) => e.path));
  const errors = [...cellErrors];
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = fieldForPath(issue.path);
      const path = field ?? issue.path.map(String).join('.');
      if (!failedCells.has(path) && !errors.some((e) => e.path === path)) errors.push({ path, message: issue.message });
    }
  }
  if (parsed.success && errors.length === 0) return { ok: true, input: parsed.data, specFromRow: !keepSpec };
  const reason = errors
    .map((e) => {
      const info = (IMPORT_FIELD_INFO as Record<string, { label: string }>)[e.path];
      const column = ctx.mapping.columns[e.path as ImportField];
      return `${info ? info.label.replace(/ \(.*\)$/, '') : e.path}${column ? ` (column “${column}”)` : ''}: ${e.message}`;
    })
    .join('; ');
  return { ok: false, errors, reason, supplierCode: text('supplierCode') ?? '', name: text('name') ?? '', kind: String(kind) };
}
