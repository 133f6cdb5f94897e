import { z } from 'zod';
import { CableSpec, ConnectorBlockSpec, CvSupplySpec, DriverSpec, FittingSpec, AccessorySpec, LabourSpec } from './catalogue';
import { CircuitDesign, CircuitKind, CodeProfileId, Finding } from './circuits';

/**
 * Jobs: approved quotes as the people who install them see them. Nothing here carries a
 * price, a cost or a margin: installers read these, and the presenters are tested for it.
 * The installer's pack (pick list, diagrams, terminal schedules, expected readings) comes
 * from the approved revision's circuits; what was connected on site (as wired) and the
 * commissioning readings are saved against the job's circuits.
 */

const Id = z.uuid('This id is not valid.');

/** Quote statuses that make a job: approved by the homeowner, deposit paid, or won. */
export const JOB_STATUSES = ['approved', 'deposit-paid', 'won'] as const;
export const JobStatus = z.enum(JOB_STATUSES);
export type JobStatus = z.infer<typeof JobStatus>;

export const JobParams = z.object({ id: Id });
export type JobParams = z.infer<typeof JobParams>;
export const JobCircuitParams = z.object({ id: Id, circuitId: Id });
export type JobCircuitParams = z.infer<typeof JobCircuitParams>;

export const JobSummary = z.object({
  id: z.string(),
  reference: z.string(),
  title: z.string(),
  status: JobStatus,
  customerName: z.string(),
  siteLabel: z.string(),
  siteAddress: z.array(z.string()),
  postcode: z.string(),
  revisionNumber: z.number().int(),
  circuitCount: z.number().int(),
  updatedAt: z.iso.datetime(),
});
export type JobSummary = z.infer<typeof JobSummary>;

// GET /api/jobs
export const JobListResponse = z.object({ jobs: z.array(JobSummary) });
export type JobListResponse = z.infer<typeof JobListResponse>;

/** A catalogue product as the pack shows it: what it is and its data, never what it costs. */
const installerProduct = {
  id: z.string(),
  supplier: z.string(),
  supplierCode: z.string(),
  name: z.string(),
  unit: z.string(),
};
export const InstallerProduct = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('fitting'), ...installerProduct, spec: FittingSpec }),
  z.object({ kind: z.literal('driver'), ...installerProduct, spec: DriverSpec }),
  z.object({ kind: z.literal('cv-supply'), ...installerProduct, spec: CvSupplySpec }),
  z.object({ kind: z.literal('cable'), ...installerProduct, spec: CableSpec }),
  z.object({ kind: z.literal('connector-block'), ...installerProduct, spec: ConnectorBlockSpec }),
  z.object({ kind: z.literal('accessory'), ...installerProduct, spec: AccessorySpec }),
  z.object({ kind: z.literal('labour'), ...installerProduct, spec: LabourSpec }),
]);
export type InstallerProduct = z.infer<typeof InstallerProduct>;

export const PICK_PLACES = ['bench', 'van'] as const;
export const PICK_PLACE_LABELS: Record<(typeof PICK_PLACES)[number], string> = {
  bench: 'Bench: cut, label and set up before loading',
  van: 'Van: load as stock',
};

export const PickItem = z.object({
  key: z.string(),
  productId: z.string().nullable(),
  code: z.string(),
  name: z.string(),
  what: z.enum(['fitting', 'driver', 'supply', 'connector-block', 'seal', 'reducer', 'blanking-plug']),
  quantity: z.number(),
  unit: z.string(),
  place: z.enum(PICK_PLACES),
});
export type PickItem = z.infer<typeof PickItem>;

export const CableCut = z.object({
  label: z.string(),
  productId: z.string().nullable(),
  code: z.string(),
  name: z.string(),
  runM: z.number(),
  cutM: z.number(),
});
export type CableCut = z.infer<typeof CableCut>;

export const LoadGroup = z.object({
  place: z.enum(PICK_PLACES),
  items: z.array(PickItem),
  cuts: z.array(CableCut.extend({ circuit: z.string() })),
  cableTotals: z.array(z.object({ productId: z.string().nullable(), code: z.string(), name: z.string(), totalM: z.number() })),
});
export type LoadGroup = z.infer<typeof LoadGroup>;

const TerminalRef = z.object({ block: z.number().int(), terminal: z.number().int() });

export const WiringChange = z.object({
  kind: z.enum(['move', 'swap', 'land', 'remove']),
  subject: z.string(),
  at: TerminalRef,
  conductor: z.string(),
  to: TerminalRef.nullable(),
  other: z.string().nullable(),
  message: z.string(),
});
export type WiringChange = z.infer<typeof WiringChange>;

export const WiringAdvice = z.object({
  safeToPowerUp: z.boolean(),
  check: z.object({ ok: z.boolean(), findings: z.array(Finding) }),
  differences: z.array(z.string()),
  changes: z.array(WiringChange),
  byTerminal: z.record(z.string(), z.array(z.string())),
  findings: z.array(Finding),
});
export type WiringAdvice = z.infer<typeof WiringAdvice>;

const ConductorText = z.string().trim().max(60, 'A conductor end is at most 60 characters.');
export const AsWiredBlock = z.object({
  terminals: z
    .array(z.object({ conductors: z.array(ConductorText).max(12, 'At most 12 conductor ends on one terminal.') }))
    .max(48, 'At most 48 terminals in one block.'),
});
export type AsWiredBlock = z.infer<typeof AsWiredBlock>;

/** Optimistic lock: null for the first record of a circuit, else the version it was based on. */
const RecordVersion = z.number().int().min(1).max(1_000_000_000).nullable();

// PUT /api/jobs/:id/circuits/:circuitId/as-wired
export const SaveAsWiredRequest = z.object({
  version: RecordVersion,
  blocks: z.array(AsWiredBlock).min(1, 'Record at least one block.').max(100, 'At most 100 blocks.'),
});
export type SaveAsWiredRequest = z.input<typeof SaveAsWiredRequest>;

export const AsWiredView = z.object({
  blocks: z.array(AsWiredBlock),
  version: z.number().int(),
  updatedAt: z.iso.datetime(),
  recordedBy: z.string().nullable(),
  advice: WiringAdvice,
});
export type AsWiredView = z.infer<typeof AsWiredView>;

export const ExpectedReading = z.object({
  key: z.string(),
  label: z.string(),
  unit: z.enum(['V', 'A', 'MΩ']),
  expected: z.number().nullable(),
  min: z.number().nullable(),
  max: z.number().nullable(),
  basis: z.string(),
});
export type ExpectedReading = z.infer<typeof ExpectedReading>;

export const JudgedReading = ExpectedReading.extend({
  value: z.number().nullable(),
  status: z.enum(['in-range', 'low', 'high', 'not-entered', 'no-range']),
});
export type JudgedReading = z.infer<typeof JudgedReading>;

export const CommissioningView = z.object({
  readings: z.array(JudgedReading),
  checks: z.array(z.object({ key: z.string(), label: z.string(), done: z.boolean() })),
  note: z.string(),
  flagged: z.number().int(),
  complete: z.boolean(),
  findings: z.array(Finding),
  version: z.number().int().nullable(),
  updatedAt: z.iso.datetime().nullable(),
  recordedBy: z.string().nullable(),
});
export type CommissioningView = z.infer<typeof CommissioningView>;

const ReadingKey = z.string().regex(/^[a-z][a-z-]{0,39}$/, 'A reading key is lower-case words joined by hyphens.');
// PUT /api/jobs/:id/circuits/:circuitId/commissioning
export const SaveCommissioningRequest = z.object({
  version: RecordVersion,
  readings: z.record(
    ReadingKey,
    z
      .number('A reading is a number.')
      .min(0, 'A reading cannot be negative.')
      .max(1_000_000, 'That reading is too large.')
      .nullable(),
  ),
  checks: z.record(ReadingKey, z.boolean()),
  note: z.string().trim().max(2000, 'A note is at most 2000 characters.').default(''),
});
export type SaveCommissioningRequest = z.input<typeof SaveCommissioningRequest>;

export const JobPackCircuit = z.object({
  id: z.string(),
  area: z.string(),
  name: z.string(),
  kind: CircuitKind,
  /** The driver's or supply's name, or "" when none is chosen. */
  powerName: z.string(),
  /** The design as approved: the browser runs the same engine on it for the diagram and schedule. */
  design: CircuitDesign,
  /** The design check passes (no unacknowledged error). */
  designOk: z.boolean(),
  pick: z.object({ items: z.array(PickItem), cuts: z.array(CableCut) }),
  asWired: AsWiredView.nullable(),
  commissioning: CommissioningView,
});
export type JobPackCircuit = z.infer<typeof JobPackCircuit>;

// GET /api/jobs/:id
export const JobPackResponse = z.object({
  job: JobSummary.extend({ customerPhone: z.string(), accessNotes: z.string() }),
  profile: CodeProfileId,
  products: z.array(InstallerProduct),
  circuits: z.array(JobPackCircuit),
  loads: z.array(LoadGroup),
  caution: z.string(),
});
export type JobPackResponse = z.infer<typeof JobPackResponse>;

export const SaveAsWiredResponse = z.object({ asWired: AsWiredView });
export type SaveAsWiredResponse = z.infer<typeof SaveAsWiredResponse>;
export const SaveCommissioningResponse = z.object({ commissioning: CommissioningView });
export type SaveCommissioningResponse = z.infer<typeof SaveCommissioningResponse>;

/** Printed on the pack page and the PDF. */
export const INSTALLER_CAUTION =
  'Design aid only. The low-voltage circuits here follow the approved design and the engine’s checks. Mains work — the ' +
  'supply to each driver, RCD protection, isolation, testing and certification — is for a licensed electrician under the ' +
  'local wiring rules. Isolate before working on any driver, and power up only when the wiring check says it is safe.';
