import { parseIpCode } from '@gloaming/engine';
import { z } from 'zod';
import { PageQuery, Version } from './customers';

/**
 * The firm's catalogue. Every product has the commercial fields (supplier, supplier code,
 * name, unit, cost, list price, active) and a `spec` whose shape depends on its `kind`.
 * Electrical names follow the engine (currentA, forwardVoltageV, voltageWindowV...) so a
 * product's spec feeds the circuit checks without renaming. Money is integer minor units.
 */

export const PRODUCT_KINDS = ['fitting', 'driver', 'cv-supply', 'cable', 'connector-block', 'accessory', 'labour'] as const;
export const ProductKind = z.enum(PRODUCT_KINDS, `A product kind is one of ${PRODUCT_KINDS.join(', ')}.`);
export type ProductKind = z.infer<typeof ProductKind>;

/** Our names for the kinds, as the catalogue tabs and the import wizard show them. */
export const PRODUCT_KIND_LABELS: Record<ProductKind, string> = {
  fitting: 'Light fittings',
  driver: 'LED drivers',
  'cv-supply': '12/24 V supplies',
  cable: 'Cable',
  'connector-block': 'Connector blocks',
  accessory: 'Sundries',
  labour: 'Labour',
};

const MAX_MINOR = 100_000_000; // £1m in pence for one catalogue item: far beyond any garden part
export const MinorAmount = z
  .number('Enter an amount.')
  .int('Use whole pence.')
  .min(0, 'Cannot be negative.')
  .max(MAX_MINOR, 'That amount is too large.');

const positive = (what: string, max: number) =>
  z.number(`Enter ${what}.`).positive(`${what[0]!.toUpperCase()}${what.slice(1)} must be more than 0.`).max(max, `That is more than ${max}.`);
const wholeCount = (what: string, max: number) =>
  z.number(`Enter ${what}.`).int(`${what[0]!.toUpperCase()}${what.slice(1)} is a whole number.`).min(1, 'At least 1.').max(max, `At most ${max}.`);

/**
 * IEC 60529 IP code, read by the engine's parser (one rule for the whole product): IP65, IPX4,
 * IP6X, dual codes such as IP66/IP67 or IP66/67, additional (A-D) and supplementary (H M S W)
 * letters, and ISO 20653's 9K. Stored in the parser's normal form (upper case, dual codes in full).
 */
export const IpCodeText = z
  .string()
  .trim()
  .max(40, 'Write an IP code like IP65, IP67 or IPX4.')
  .transform((text, ctx) => {
    const parsed = parseIpCode(text);
    if (parsed.ok) return parsed.code.text;
    ctx.addIssue({ code: 'custom', message: 'Write an IP code like IP65, IP66/IP67 or IPX4.' });
    return z.NEVER;
  });

/** Copper conductor by metric cross-section (IEC 60228 classes 1, 2 and 5). */
const MetricConductor = z.object({
  kind: z.literal('metric'),
  areaMm2: positive('a cross-section in mm²', 400),
  conductorClass: z.union([z.literal(1), z.literal(2), z.literal(5)], 'The IEC 60228 class is 1, 2 or 5.'),
  coating: z.enum(['plain', 'tinned'], 'The conductor is plain or tinned.').default('plain'),
});
/** Copper conductor by American Wire Gauge (1/0 is 0, 4/0 is -3). */
const AwgConductor = z.object({
  kind: z.literal('awg'),
  gauge: z.number('Enter the gauge.').int('A gauge is a whole number.').min(-3, 'Thickest is 4/0 (-3).').max(40, 'Thinnest is 40 AWG.'),
  stranding: z.enum(['solid', 'stranded'], 'The conductor is solid or stranded.').default('stranded'),
});
export const Conductor = z.discriminatedUnion('kind', [MetricConductor, AwgConductor], 'Give the conductor in mm² or AWG.');
export type Conductor = z.infer<typeof Conductor>;

/** A fitting's rating at one drive current: forward voltage, or power (then Vf = P / I). */
export const DriveRating = z
  .object({
    currentA: positive('the drive current in A', 10),
    forwardVoltageV: positive('the forward voltage', 120).optional(),
    powerW: positive('the power', 2000).optional(),
    lumens: positive('the light output in lm', 1_000_000).optional(),
  })
  .refine((r) => r.forwardVoltageV !== undefined || r.powerW !== undefined, {
    message: 'Give the forward voltage or the power at this current.',
    path: ['forwardVoltageV'],
  });
export type DriveRating = z.infer<typeof DriveRating>;

const fittingOptics = {
  lumens: positive('the light output in lm', 1_000_000).optional(),
  beamAngleDeg: positive('the beam angle', 360).optional(),
  colourTemperatureK: z.number('Enter the colour temperature.').int('Use whole kelvin.').min(1000, 'At least 1000 K.').max(20_000, 'At most 20 000 K.').optional(),
  ipCode: IpCodeText,
  /** The fitting's own lead to its connection point. */
  tail: z.object({ lengthM: positive('the tail length in m', 100), conductor: Conductor }).optional(),
};

export const FittingSpec = z.discriminatedUnion(
  'driveMode',
  [
    z.object({
      driveMode: z.literal('constant-current'),
      ratings: z.array(DriveRating).min(1, 'Add the rating at one drive current at least.').max(8, 'At most 8 ratings.'),
      ...fittingOptics,
    }),
    z.object({
      driveMode: z.literal('constant-voltage'),
      nominalVoltageV: positive('the nominal voltage', 60),
      powerW: positive('the power', 2000),
      ...fittingOptics,
    }),
  ],
  'A fitting is constant-current or constant-voltage.',
);
export type FittingSpec = z.infer<typeof FittingSpec>;

export const DIMMING_METHODS = ['none', 'phase-cut', '0-10 V', '1-10 V', 'DALI', 'PWM'] as const;

export const DriverSpec = z
  .object({
    currentA: positive('the output current in A', 10),
    voltageWindowV: z.object({ minV: z.number('Enter the lowest voltage.').min(0, 'Cannot be negative.').max(250), maxV: positive('the highest voltage', 250) }),
    powerWindowW: z.object({ minW: z.number('Enter the lowest power.').min(0, 'Cannot be negative.').max(2000), maxW: positive('the highest power', 2000) }).optional(),
    maxPowerW: positive('the maximum power', 2000),
    efficiencyPct: z.number('Enter the efficiency.').min(1, 'At least 1 %.').max(100, 'At most 100 %.').optional(),
    ipCode: IpCodeText,
    dimming: z.enum(DIMMING_METHODS, `Dimming is one of ${DIMMING_METHODS.join(', ')}.`).default('none'),
  })
  .refine((d) => d.voltageWindowV.minV < d.voltageWindowV.maxV, {
    message: 'The lowest voltage must be below the highest.',
    path: ['voltageWindowV', 'minV'],
  })
  .refine((d) => !d.powerWindowW || d.powerWindowW.minW < d.powerWindowW.maxW, {
    message: 'The lowest power must be below the highest.',
    path: ['powerWindowW', 'minW'],
  });
export type DriverSpec = z.infer<typeof DriverSpec>;

export const CvSupplySpec = z.object({
  outputVoltageV: positive('the output voltage', 60),
  ratedPowerW: positive('the rated power', 5000),
  ipCode: IpCodeText,
});
export type CvSupplySpec = z.infer<typeof CvSupplySpec>;

export const CableSpec = z.object({
  cores: wholeCount('the number of cores', 61),
  conductor: Conductor,
  /** When the supplier states a resistance it overrides the table value. */
  statedOhmPerKm: positive('the stated resistance in Ω/km', 1000).optional(),
  /** Sold cut to this length (a drum or coil), m; absent when cut to order. */
  cutLengthM: positive('the cut length in m', 10_000).optional(),
});
export type CableSpec = z.infer<typeof CableSpec>;

export const ConnectorBlockSpec = z.object({
  terminals: wholeCount('the number of terminals', 48),
  entries: wholeCount('the number of cable entries', 48),
  conductorsPerTerminal: wholeCount('conductors per terminal', 8),
  ipCode: IpCodeText,
});
export type ConnectorBlockSpec = z.infer<typeof ConnectorBlockSpec>;

export const AccessorySpec = z.object({});
export type AccessorySpec = z.infer<typeof AccessorySpec>;

export const LabourSpec = z.object({
  minutes: z.number('Enter the minutes.').int('Use whole minutes.').min(1, 'At least 1 minute.').max(100_000, 'That is too many minutes.'),
  /** Pence per hour; absent means the firm's labour rate. */
  rateMinorPerHour: MinorAmount.optional(),
});
export type LabourSpec = z.infer<typeof LabourSpec>;

const commonFields = {
  supplier: z.string().trim().min(1, 'Enter the supplier.').max(120, 'A supplier is at most 120 characters.'),
  supplierCode: z.string().trim().min(1, 'Enter the supplier’s code.').max(80, 'A code is at most 80 characters.'),
  name: z.string().trim().min(1, 'Enter a name.').max(200, 'A name is at most 200 characters.'),
  description: z.string().trim().max(4000, 'A description is at most 4000 characters.').default(''),
  unit: z.string().trim().min(1, 'Enter the unit (each, m, hour...).').max(16, 'A unit is at most 16 characters.').default('each'),
  costMinor: MinorAmount,
  listPriceMinor: MinorAmount,
  active: z.boolean('Active is true or false.').default(true),
};

/** A product as created or edited: the kind decides the spec's shape. */
export const ProductInput = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('fitting'), ...commonFields, spec: FittingSpec }),
    z.object({ kind: z.literal('driver'), ...commonFields, spec: DriverSpec }),
    z.object({ kind: z.literal('cv-supply'), ...commonFields, spec: CvSupplySpec }),
    z.object({ kind: z.literal('cable'), ...commonFields, spec: CableSpec }),
    z.object({ kind: z.literal('connector-block'), ...commonFields, spec: ConnectorBlockSpec }),
    z.object({ kind: z.literal('accessory'), ...commonFields, spec: AccessorySpec }),
    z.object({ kind: z.literal('labour'), ...commonFields, spec: LabourSpec }),
  ],
  `A product kind is one of ${PRODUCT_KINDS.join(', ')}.`,
);
export type ProductInput = z.input<typeof ProductInput>;
export type ProductInputParsed = z.output<typeof ProductInput>;

/** PUT /api/products/:id: the whole product again, with the version it was based on. */
export const ProductUpdate = z.intersection(ProductInput, z.object({ version: Version }));
export type ProductUpdate = z.input<typeof ProductUpdate>;

// POST /api/products/:id/deactivate
export const DeactivateProductRequest = z.object({ version: Version });
export type DeactivateProductRequest = z.input<typeof DeactivateProductRequest>;

const productOut = {
  id: z.string(),
  supplier: z.string(),
  supplierCode: z.string(),
  name: z.string(),
  description: z.string(),
  unit: z.string(),
  costMinor: z.number().int(),
  listPriceMinor: z.number().int(),
  active: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
  version: z.number().int(),
};

export const Product = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('fitting'), ...productOut, spec: FittingSpec }),
  z.object({ kind: z.literal('driver'), ...productOut, spec: DriverSpec }),
  z.object({ kind: z.literal('cv-supply'), ...productOut, spec: CvSupplySpec }),
  z.object({ kind: z.literal('cable'), ...productOut, spec: CableSpec }),
  z.object({ kind: z.literal('connector-block'), ...productOut, spec: ConnectorBlockSpec }),
  z.object({ kind: z.literal('accessory'), ...productOut, spec: AccessorySpec }),
  z.object({ kind: z.literal('labour'), ...productOut, spec: LabourSpec }),
]);
export type Product = z.infer<typeof Product>;

export const ProductResponse = z.object({ product: Product });
export type ProductResponse = z.infer<typeof ProductResponse>;

export const PRODUCT_SORTS = ['name', 'supplierCode', 'listPriceMinor', 'updatedAt'] as const;

// GET /api/products
export const ProductListQuery = z.object({
  ...PageQuery,
  kind: ProductKind.optional(),
  active: z.enum(['active', 'inactive', 'all'], 'Show active, inactive or all.').default('active'),
  sort: z.enum(PRODUCT_SORTS, `Sort by ${PRODUCT_SORTS.join(', ')}.`).default('name'),
});
export type ProductListQuery = z.input<typeof ProductListQuery>;

export const ProductListResponse = z.object({
  products: z.array(Product),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type ProductListResponse = z.infer<typeof ProductListResponse>;
