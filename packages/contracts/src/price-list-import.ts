import { z } from 'zod';
import { FieldError } from './problem';
import { type PRODUCT_KINDS, ProductKind } from './catalogue';

/**
 * Price-list import: upload a supplier's CSV, map its columns to catalogue fields (remembered
 * per supplier), preview the first rows with their problems, then import every row in one
 * transaction. Rows are matched to existing products by supplier + supplier code.
 */

/** The largest price list accepted, in bytes. */
export const MAX_PRICE_LIST_BYTES = 8 * 1024 * 1024;
/** The most data rows one file may hold. */
export const MAX_PRICE_LIST_ROWS = 50_000;

type FieldInfo = { label: string; kinds: readonly (typeof PRODUCT_KINDS)[number][] | 'all' };

/** Catalogue fields a CSV column can fill. Spec fields say which kinds they belong to. */
export const IMPORT_FIELD_INFO = {
  kind: { label: 'Kind (fitting, driver, cv-supply, cable, connector-block, accessory, labour)', kinds: 'all' },
  supplierCode: { label: 'Supplier code', kinds: 'all' },
  name: { label: 'Name', kinds: 'all' },
  description: { label: 'Description', kinds: 'all' },
  unit: { label: 'Unit', kinds: 'all' },
  cost: { label: 'Cost (trade price)', kinds: 'all' },
  listPrice: { label: 'List price', kinds: 'all' },
  active: { label: 'Active (yes / no)', kinds: 'all' },
  driveMode: { label: 'Drive mode (CC / CV)', kinds: ['fitting'] },
  driveCurrentMa: { label: 'Drive current, mA', kinds: ['fitting'] },
  forwardVoltageV: { label: 'Forward voltage, V', kinds: ['fitting'] },
  powerW: { label: 'Power, W', kinds: ['fitting'] },
  nominalVoltageV: { label: 'Nominal voltage (CV), V', kinds: ['fitting'] },
  lumens: { label: 'Light output, lm', kinds: ['fitting'] },
  beamAngleDeg: { label: 'Beam angle, °', kinds: ['fitting'] },
  colourTemperatureK: { label: 'Colour temperature, K', kinds: ['fitting'] },
  tailLengthM: { label: 'Tail length, m', kinds: ['fitting'] },
  tailAreaMm2: { label: 'Tail conductor, mm²', kinds: ['fitting'] },
  ipCode: { label: 'IP code', kinds: ['fitting', 'driver', 'cv-supply', 'connector-block'] },
  outputCurrentMa: { label: 'Output current, mA', kinds: ['driver'] },
  minVoltageV: { label: 'Lowest output voltage, V', kinds: ['driver'] },
  maxVoltageV: { label: 'Highest output voltage, V', kinds: ['driver'] },
  minPowerW: { label: 'Lowest output power, W', kinds: ['driver'] },
  maxPowerW: { label: 'Maximum output power, W', kinds: ['driver'] },
  efficiencyPct: { label: 'Efficiency, %', kinds: ['driver'] },
  dimming: { label: 'Dimming', kinds: ['driver'] },
  outputVoltageV: { label: 'Output voltage, V', kinds: ['cv-supply'] },
  ratedPowerW: { label: 'Rated power, W', kinds: ['cv-supply'] },
  cores: { label: 'Cores', kinds: ['cable'] },
  areaMm2: { label: 'Cross-section, mm²', kinds: ['cable'] },
  awg: { label: 'Gauge, AWG', kinds: ['cable'] },
  conductorClass: { label: 'Conductor class (1, 2, 5)', kinds: ['cable'] },
  statedOhmPerKm: { label: 'Stated resistance, Ω/km', kinds: ['cable'] },
  cutLengthM: { label: 'Cut length, m', kinds: ['cable'] },
  terminals: { label: 'Terminals', kinds: ['connector-block'] },
  entries: { label: 'Cable entries', kinds: ['connector-block'] },
  conductorsPerTerminal: { label: 'Conductors per terminal', kinds: ['connector-block'] },
  minutes: { label: 'Minutes', kinds: ['labour'] },
  labourRate: { label: 'Rate per hour', kinds: ['labour'] },
} as const satisfies Record<string, FieldInfo>;

export type ImportField = keyof typeof IMPORT_FIELD_INFO;
export const IMPORT_FIELDS = Object.keys(IMPORT_FIELD_INFO) as ImportField[];
export const ImportFieldName = z.enum(IMPORT_FIELDS as [ImportField, ...ImportField[]]);

/** Fields that are about the product's spec rather than its commercial details. */
export const SPEC_IMPORT_FIELDS = IMPORT_FIELDS.filter((f) => IMPORT_FIELD_INFO[f].kinds !== 'all');

const Header = z.string().max(200, 'A column name is at most 200 characters.');

/** Catalogue field -> CSV column header, plus the kind for rows without a kind column. */
export const ColumnMapping = z
  .object({
    columns: z.partialRecord(ImportFieldName, Header),
    defaultKind: ProductKind,
  })
  .refine((m) => Boolean(m.columns.supplierCode), { message: 'Choose the column with the supplier’s code.', path: ['columns', 'supplierCode'] })
  .refine((m) => Boolean(m.columns.name), { message: 'Choose the column with the product name.', path: ['columns', 'name'] });
export type ColumnMapping = z.infer<typeof ColumnMapping>;

export const PriceListUploadFields = z.object({
  supplier: z.string().trim().min(1, 'Enter the supplier this price list comes from.').max(120, 'A supplier is at most 120 characters.'),
});

export const IMPORT_JOB_STATES = ['uploaded', 'running', 'done', 'failed'] as const;

export const ImportRejection = z.object({ row: z.number().int(), reason: z.string(), values: z.record(z.string(), z.string()) });
export type ImportRejection = z.infer<typeof ImportRejection>;

export const ImportJob = z.object({
  id: z.string(),
  supplier: z.string(),
  fileName: z.string(),
  state: z.enum(IMPORT_JOB_STATES),
  totalRows: z.number().int(),
  processedRows: z.number().int(),
  createdCount: z.number().int(),
  updatedCount: z.number().int(),
  rejectedCount: z.number().int(),
  /** The first rejected rows (the CSV download has them all). */
  rejections: z.array(ImportRejection),
  error: z.string().nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type ImportJob = z.infer<typeof ImportJob>;

export const ImportJobResponse = z.object({ job: ImportJob });
export type ImportJobResponse = z.infer<typeof ImportJobResponse>;

// POST /api/product-imports (multipart: file, supplier)
export const PriceListUploadResponse = z.object({
  job: ImportJob,
  headers: z.array(z.string()),
  /** The first few data rows, as text, in column order. */
  sampleRows: z.array(z.array(z.string())),
  encoding: z.string(),
  delimiter: z.string(),
  /** The mapping used last time for this supplier, or one guessed from the headers. */
  suggestedMapping: z.object({ columns: z.partialRecord(ImportFieldName, z.string()), defaultKind: ProductKind }),
  mappingRemembered: z.boolean(),
});
export type PriceListUploadResponse = z.infer<typeof PriceListUploadResponse>;

export const PreviewRow = z.object({
  row: z.number().int(),
  outcome: z.enum(['create', 'update', 'reject']),
  supplierCode: z.string(),
  name: z.string(),
  kind: z.string(),
  errors: z.array(FieldError),
});
export type PreviewRow = z.infer<typeof PreviewRow>;

// POST /api/product-imports/:id/preview
export const PreviewResponse = z.object({ rows: z.array(PreviewRow), totalRows: z.number().int() });
export type PreviewResponse = z.infer<typeof PreviewResponse>;

export const PREVIEW_ROWS = 20;
