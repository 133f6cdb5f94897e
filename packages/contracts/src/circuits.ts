import { z } from 'zod';
import { IpCodeText, Product } from './catalogue';
import { Version } from './customers';

/**
 * Circuits of a quote revision: each a constant-current series string on a driver or a
 * constant-voltage set of runs on a supply, designed from catalogue products. The design's
 * field names and shapes are the engine's `CircuitDesign` (packages/engine/src/circuit-design),
 * so the api and the workbench hand a parsed design straight to `evaluateCircuit`.
 */

const Id = z.uuid('This id is not valid.');
/** The design's own ids for placements and runs (made by the client, stable while reordering). */
const LocalId = z.string().trim().min(1, 'An id is needed.').max(64, 'An id is at most 64 characters.');
const Label = z.string().trim().max(80, 'A label is at most 80 characters.').default('');
const LengthM = z
  .number('Enter a length in metres.')
  .min(0, 'A length cannot be negative.')
  .max(1000, 'A run is at most 1000 m.');

/** Where a fitting, driver or supply is installed (the engine's list; each has a minimum IP code). */
export const INSTALLATION_LOCATIONS = [
  'indoor-dry',
  'sheltered-outdoor',
  'exposed-outdoor',
  'under-decking',
  'in-ground-walk-over',
  'buried-connection',
  'submerged',
  'driver-outdoors',
] as const;
export const InstallationLocation = z.enum(INSTALLATION_LOCATIONS, `A location is one of ${INSTALLATION_LOCATIONS.join(', ')}.`);
export type InstallationLocation = z.infer<typeof InstallationLocation>;

export const INSTALLATION_LOCATION_LABELS: Record<InstallationLocation, string> = {
  'indoor-dry': 'Indoors, dry',
  'sheltered-outdoor': 'Sheltered outdoors',
  'exposed-outdoor': 'Exposed outdoors',
  'under-decking': 'Under decking',
  'in-ground-walk-over': 'In ground, walk-over',
  'buried-connection': 'Buried connection',
  submerged: 'Submerged (pond)',
  'driver-outdoors': 'Driver outdoors',
};

export const CABLE_METHODS = ['surface-clipped', 'buried-trench', 'in-duct'] as const;
export const CableMethod = z.enum(CABLE_METHODS, `A cable is ${CABLE_METHODS.join(', ')}.`);
export type CableMethod = z.infer<typeof CableMethod>;
export const CABLE_METHOD_LABELS: Record<CableMethod, string> = {
  'surface-clipped': 'Clipped to a surface',
  'buried-trench': 'Buried in a trench',
  'in-duct': 'In duct',
};

/** Which wiring rules the checks follow (the engine's code profiles). */
export const CODE_PROFILE_IDS = ['uk-iec', 'us-nec'] as const;
export const CodeProfileId = z.enum(CODE_PROFILE_IDS);
export type CodeProfileId = z.infer<typeof CodeProfileId>;

/**
 * What the circuit checks go by, as the engine takes it (its CircuitSettings): the revision's
 * code profile, driver headroom, voltage-drop limit and IP minimums. The api sends the one it
 * checked with, so the browser's live check gives the same answer.
 */
export const CircuitCheckSettings = z.object({
  profile: CodeProfileId,
  headroomMarginPct: z.number().min(0).max(100).optional(),
  dropLimitPct: z.number().min(0).max(100).optional(),
  ipOverrides: z.partialRecord(InstallationLocation, IpCodeText).optional(),
});
export type CircuitCheckSettings = z.infer<typeof CircuitCheckSettings>;

export const CIRCUIT_KINDS = ['constant-current', 'constant-voltage'] as const;
export const CircuitKind = z.enum(CIRCUIT_KINDS, 'A circuit is constant-current or constant-voltage.');
export type CircuitKind = z.infer<typeof CircuitKind>;

export const CableRunDesign = z.object({
  cableProductId: Id.nullable(),
  lengthM: LengthM,
  method: CableMethod.default('buried-trench'),
});
export type CableRunDesign = z.infer<typeof CableRunDesign>;

export const Acknowledgement = z.object({
  code: z.string().trim().min(1).max(80),
  subject: z.string().max(200).nullable(),
  reason: z
    .string()
    .trim()
    .min(3, 'Say why this is acceptable (at least 3 characters).')
    .max(500, 'A reason is at most 500 characters.'),
});
export type Acknowledgement = z.infer<typeof Acknowledgement>;

export const CcFittingPlacement = z.object({
  id: LocalId,
  productId: Id,
  label: Label,
  location: InstallationLocation.default('exposed-outdoor'),
  driveCurrentA: z
    .number('Enter the drive current in A.')
    .positive('The drive current must be more than 0.')
    .max(10, 'At most 10 A.'),
});
export type CcFittingPlacement = z.infer<typeof CcFittingPlacement>;

const MAX_FITTINGS = 100;

export const CcCircuitDesign = z
  .object({
    kind: z.literal('constant-current'),
    driverProductId: Id.nullable(),
    driverLocation: InstallationLocation.default('driver-outdoors'),
    fittings: z.array(CcFittingPlacement).max(MAX_FITTINGS, `A string has at most ${MAX_FITTINGS} fittings.`),
    driverLead: CableRunDesign.nullable(),
    links: z.array(CableRunDesign).max(MAX_FITTINGS),
    extensions: z.array(CableRunDesign.extend({ label: Label })).max(20, 'At most 20 extensions.'),
    connectorBlockProductId: Id.nullable(),
    assignment: z.array(z.array(LocalId).max(MAX_FITTINGS)).max(MAX_FITTINGS).nullable(),
    acknowledgements: z.array(Acknowledgement).max(200),
  })
  .superRefine((d, ctx) => {
    const ids = new Set<string>();
    d.fittings.forEach((f, i) => {
      if (ids.has(f.id)) ctx.addIssue({ code: 'custom', path: ['fittings', i, 'id'], message: 'Each fitting needs its own id.' });
      ids.add(f.id);
    });
    d.assignment?.forEach((block, b) =>
      block.forEach((id, k) => {
        if (!ids.has(id))
          ctx.addIssue({ code: 'custom', path: ['assignment', b, k], message: 'This fitting is not on the circuit.' });
      }),
    );
  });
export type CcCircuitDesign = z.infer<typeof CcCircuitDesign>;

export const CV_LAYOUTS = ['daisy-chain', 'home-run', 'hub'] as const;
export const CV_LAYOUT_LABELS: Record<(typeof CV_LAYOUTS)[number], string> = {
  'daisy-chain': 'Daisy chain',
  'home-run': 'Home run to each',
  hub: 'Hub and spokes',
};

export const CvFittingPlacement = z.object({
  id: LocalId,
  productId: Id,
  label: Label,
  location: InstallationLocation.default('exposed-outdoor'),
  spanLengthM: LengthM,
});
export type CvFittingPlacement = z.infer<typeof CvFittingPlacement>;

export const CvRunDesign = z.object({
  id: LocalId,
  label: Label,
  layout: z.enum(CV_LAYOUTS, `A run is ${CV_LAYOUTS.join(', ')}.`),
  cableProductId: Id.nullable(),
  method: CableMethod.default('buried-trench'),
  feederLengthM: LengthM.default(0),
  fittings: z.array(CvFittingPlacement).max(MAX_FITTINGS),
});
export type CvRunDesign = z.infer<typeof CvRunDesign>;

export const CvCircuitDesign = z
  .object({
    kind: z.literal('constant-voltage'),
    supplyProductId: Id.nullable(),
    supplyLocation: InstallationLocation.default('driver-outdoors'),
    runs: z.array(CvRunDesign).max(20, 'At most 20 runs on one supply.'),
    acknowledgements: z.array(Acknowledgement).max(200),
  })
  .superRefine((d, ctx) => {
    const ids = new Set<string>();
    d.runs.forEach((r, i) => {
      if (ids.has(r.id)) ctx.addIssue({ code: 'custom', path: ['runs', i, 'id'], message: 'Each run needs its own id.' });
      ids.add(r.id);
    });
  });
export type CvCircuitDesign = z.infer<typeof CvCircuitDesign>;

export const CircuitDesign = z.discriminatedUnion(
  'kind',
  [CcCircuitDesign, CvCircuitDesign],
  'A circuit is constant-current or constant-voltage.',
);
export type CircuitDesign = z.infer<typeof CircuitDesign>;

/** A new, empty design of each kind. */
export function emptyCircuitDesign(kind: CircuitKind): CircuitDesign {
  return kind === 'constant-current'
    ? {
        kind,
        driverProductId: null,
        driverLocation: 'driver-outdoors',
        fittings: [],
        driverLead: null,
        links: [],
        extensions: [],
        connectorBlockProductId: null,
        assignment: null,
        acknowledgements: [],
      }
    : { kind, supplyProductId: null, supplyLocation: 'driver-outdoors', runs: [], acknowledgements: [] };
}

export const Finding = z.object({
  code: z.string(),
  severity: z.enum(['error', 'warning', 'info']),
  message: z.string(),
  subject: z.string().optional(),
  values: z.record(z.string(), z.union([z.number(), z.string()])).optional(),
});
export type Finding = z.infer<typeof Finding>;

export const CircuitFinding = Finding.extend({ acknowledged: z.string().nullable() });
export type CircuitFinding = z.infer<typeof CircuitFinding>;

/**
 * The engine's result as stored on save: the verdict and findings typed, the full evaluation
 * (series figures, block plan, wiring check or CV run voltages) as the engine's JSON.
 */
export const CircuitResult = z.object({
  ok: z.boolean(),
  blockingCount: z.number().int(),
  findings: z.array(CircuitFinding),
  evaluation: z.json(),
});
export type CircuitResult = z.infer<typeof CircuitResult>;

const AreaName = z
  .string()
  .trim()
  .min(1, 'Name the area of the garden (e.g. Front path).')
  .max(200, 'An area name is at most 200 characters.');
const CircuitName = z.string().trim().max(120, 'A circuit name is at most 120 characters.').default('');

export const CircuitView = z.object({
  id: z.string(),
  revisionId: z.string(),
  area: z.string(),
  name: z.string(),
  kind: CircuitKind,
  position: z.number().int(),
  design: CircuitDesign,
  result: CircuitResult,
  version: z.number().int(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
});
export type CircuitView = z.infer<typeof CircuitView>;

/** The revision's lock after a circuit save: circuits rewrite its derived lines. */
export const CircuitRevisionState = z.object({
  id: z.string(),
  number: z.number().int(),
  state: z.string(),
  version: z.number().int(),
});

// GET /api/quotes/:id/revisions/:revisionNumber/circuits
export const CircuitListResponse = z.object({
  circuits: z.array(CircuitView),
  /** Every product the circuits name, for the live checks in the browser. */
  products: z.array(Product),
  revision: CircuitRevisionState,
  /** The code profile the checks use for this revision (the same as checkSettings.profile). */
  profile: CodeProfileId,
  /** Everything the checks of this revision go by (its design settings). */
  checkSettings: CircuitCheckSettings,
});
export type CircuitListResponse = z.infer<typeof CircuitListResponse>;

// POST /api/quotes/:id/revisions/:revisionNumber/circuits
export const CreateCircuitRequest = z.object({
  area: AreaName,
  name: CircuitName,
  design: CircuitDesign,
});
export type CreateCircuitRequest = z.input<typeof CreateCircuitRequest>;

export const CircuitParams = z.object({
  id: Id,
  revisionNumber: z.coerce.number().int('A revision number is a whole number.').min(1).max(100_000),
  circuitId: Id,
});
export type CircuitParams = z.infer<typeof CircuitParams>;

// PUT /api/quotes/:id/revisions/:revisionNumber/circuits/:circuitId
export const UpdateCircuitRequest = z.object({
  version: Version,
  area: AreaName,
  name: CircuitName,
  position: z.number().int().min(0).max(10_000).optional(),
  design: CircuitDesign,
});
export type UpdateCircuitRequest = z.input<typeof UpdateCircuitRequest>;

export const CircuitSaveResponse = z.object({
  circuit: CircuitView,
  products: z.array(Product),
  revision: CircuitRevisionState,
});
export type CircuitSaveResponse = z.infer<typeof CircuitSaveResponse>;

export const CircuitDeleteResponse = z.object({ revision: CircuitRevisionState });
export type CircuitDeleteResponse = z.infer<typeof CircuitDeleteResponse>;

// POST /api/quotes/:id/revisions/:revisionNumber/circuit-suggestions
export const CircuitSuggestionsRequest = z.object({ design: CcCircuitDesign });
export type CircuitSuggestionsRequest = z.input<typeof CircuitSuggestionsRequest>;

export const CircuitSuggestionsResponse = z.object({
  driveCurrentA: z.number().nullable(),
  drivers: z.array(
    z.object({
      productId: z.string(),
      name: z.string(),
      costMinor: z.number().int().nullable(),
      headroomPct: z.number(),
      complianceVoltageV: z.number(),
      reasons: z.array(z.string()),
    }),
  ),
  rejected: z.array(z.object({ productId: z.string(), name: z.string(), reasons: z.array(Finding) })),
  split: z
    .object({
      ok: z.boolean(),
      strings: z.array(
        z.object({
          firstFitting: z.number().int(),
          lastFitting: z.number().int(),
          productId: z.string(),
          name: z.string(),
          costMinor: z.number().int(),
          complianceVoltageV: z.number(),
        }),
      ),
      totalCostMinor: z.number().int().nullable(),
      findings: z.array(Finding),
    })
    .nullable(),
  findings: z.array(Finding),
  /** The drivers named, for showing them without another lookup. */
  products: z.array(Product),
});
export type CircuitSuggestionsResponse = z.infer<typeof CircuitSuggestionsResponse>;
