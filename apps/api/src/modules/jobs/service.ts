/**
 * Jobs: the firm's approved quotes and the installer's pack for each, built from the job's
 * revision (the one the homeowner approved) and its circuits, re-evaluated with the engine.
 * As-wired schedules and commissioning readings are saved against the job's circuits.
 */
import {
  AsWiredBlock,
  INSTALLER_CAUTION,
  JOB_STATUSES,
  type AsWiredView,
  type CommissioningView,
  type JobPackCircuit,
  type JobPackResponse,
  type Product as ProductView,
  type SaveAsWiredRequest,
  type SaveCommissioningRequest,
} from '@gloaming/contracts';
import {
  Circuit,
  CircuitAsWired,
  CommissioningRecord,
  type Organization,
  Quote,
  QuoteEvent,
  QuoteRevision,
  User,
  type EntityManager,
} from '@gloaming/db';
import {
  adviseWiring,
  asWiredSchedule,
  circuitPickList,
  commissioningPlan,
  evaluateCircuit,
  judgeReadings,
  loadGroups,
  type BlockPlan,
  type CircuitEvaluation,
  type WiringAdvice,
} from '@gloaming/engine';
import { z } from 'zod';
import { conflict, notFound } from '../../http/problem';
import { circuitDesign, circuitSettings, firmProducts, listCircuits, productRefs } from '../circuits/service';
import { presentInstallerProduct, presentJobSummary } from './presenter';

const jobStatuses: readonly string[] = JOB_STATUSES;

/** An approved (deposit-paid, won) quote of this firm; any other quote, or another firm's, is a 404. */
export async function loadJob(em: EntityManager, organizationId: string, id: string): Promise<Quote> {
  const quote = await em.findOne(
    Quote,
    { id, organization: organizationId, status: { $in: [...JOB_STATUSES] } },
    { populate: ['customer', 'site', 'organization'] },
  );
  if (!quote || !jobStatuses.includes(quote.status)) throw notFound('That job');
  return quote;
}

/** The revision the homeowner approved: the newest approval event's, else the newest sent one, else the newest. */
export async function jobRevision(em: EntityManager, quote: Quote): Promise<QuoteRevision> {
  const approved = await em.findOne(
    QuoteEvent,
    { quote: quote.id, type: 'approved', revision: { $ne: null } },
    { orderBy: { at: 'desc' }, populate: ['revision'] },
  );
  if (approved?.revision) return approved.revision as QuoteRevision;
  const revision =
    (await em.findOne(QuoteRevision, { quote: quote.id, state: { $ne: 'draft' } }, { orderBy: { number: 'desc' } })) ??
    (await em.findOne(QuoteRevision, { quote: quote.id }, { orderBy: { number: 'desc' } }));
  if (!revision) throw notFound('That job’s approved revision');
  return revision;
}

export async function listJobs(em: EntityManager, organizationId: string) {
  const quotes = await em.find(
    Quote,
    { organization: organizationId, status: { $in: [...JOB_STATUSES] } },
    { populate: ['customer', 'site'], orderBy: { updatedAt: 'desc', number: 'desc' } },
  );
  const jobs = [];
  for (const quote of quotes) {
    const revision = await jobRevision(em, quote);
    const count = await em.count(Circuit, { revision: revision.id });
    jobs.push(presentJobSummary(quote, revision.number, count));
  }
  return jobs;
}

/** The firm's cable slack from the revision's settings snapshot (10 % when it has none, the engine's default). */
function slackBp(revision: QuoteRevision): number {
  const design = (revision.settings as { design?: unknown }).design;
  const bp = design && typeof design === 'object' ? (design as { cableSlackBp?: unknown }).cableSlackBp : undefined;
  return typeof bp === 'number' && Number.isInteger(bp) && bp >= 0 && bp <= 10_000 ? bp : 1000;
}

const StoredBlocks = z.array(AsWiredBlock);

function presentAdvice(a: WiringAdvice): AsWiredView['advice'] {
  return {
    safeToPowerUp: a.safeToPowerUp,
    check: { ok: a.check.ok, findings: a.check.findings },
    differences: a.differences,
    changes: a.changes,
    byTerminal: a.byTerminal,
    findings: a.findings,
  };
}

function userName(u: User | null | undefined): string | null {
  return u ? u.name || u.email : null;
}

export function presentAsWired(record: CircuitAsWired, plan: BlockPlan): AsWiredView {
  const blocks = StoredBlocks.parse(record.blocks);
  return {
    blocks,
    version: record.version,
    updatedAt: record.updatedAt.toISOString(),
    recordedBy: userName(record.recordedBy as User | null),
    advice: presentAdvice(adviseWiring(plan, asWiredSchedule(plan, blocks))),
  };
}

export function presentCommissioning(evaluation: CircuitEvaluation, record: CommissioningRecord | null): CommissioningView {
  const plan = commissioningPlan(evaluation);
  const judged = judgeReadings(plan, { readings: record?.readings ?? {}, checks: record?.checks ?? {} });
  return {
    readings: judged.readings,
    checks: judged.checks,
    note: record?.note ?? '',
    flagged: judged.flagged,
    complete: judged.complete,
    findings: [...plan.findings, ...judged.findings],
    version: record?.version ?? null,
    updatedAt: record?.updatedAt.toISOString() ?? null,
    recordedBy: userName(record?.recordedBy as User | null | undefined),
  };
}

export interface JobCircuitContext {
  circuit: Circuit;
  evaluation: CircuitEvaluation;
  products: ProductView[];
}

/** The job's circuits with their fresh engine evaluations and the products they name. */
export async function jobCircuits(em: EntityManager, quote: Quote, revision: QuoteRevision) {
  const firm = quote.organization as Organization;
  const circuits = await listCircuits(em, revision);
  const products = await firmProducts(
    em,
    firm.id,
    circuits.flatMap((c) => productRefs(circuitDesign(c)).map((r) => r.id)),
  );
  const settings = circuitSettings(revision, firm);
  return {
    products,
    circuits: circuits.map((circuit) => ({ circuit, evaluation: evaluateCircuit(circuitDesign(circuit), products, settings) })),
  };
}

/** One circuit of the job (404 when it is not on the job's revision). */
export async function jobCircuit(em: EntityManager, quote: Quote, circuitId: string) {
  const revision = await jobRevision(em, quote);
  const { circuits, products } = await jobCircuits(em, quote, revision);
  const found = circuits.find((c) => c.circuit.id === circuitId);
  if (!found) throw notFound('That circuit of the job');
  return { ...found, products, revision };
}

function powerName(c: Circuit, products: readonly ProductView[]): string {
  const design = circuitDesign(c);
  const id = design.kind === 'constant-current' ? design.driverProductId : design.supplyProductId;
  return products.find((p) => p.id === id)?.name ?? '';
}

export async function buildJobPack(em: EntityManager, quote: Quote): Promise<JobPackResponse> {
  return (await jobPackData(em, quote)).pack;
}

/** The pack, and each circuit's evaluation by circuit id (the PDF draws the block plans from them). */
export async function jobPackData(
  em: EntityManager,
  quote: Quote,
): Promise<{ pack: JobPackResponse; evaluations: Map<string, CircuitEvaluation> }> {
  const revision = await jobRevision(em, quote);
  const { circuits, products } = await jobCircuits(em, quote, revision);
  const ids = circuits.map((c) => c.circuit.id);
  const asWired = ids.length ? await em.find(CircuitAsWired, { circuit: { $in: ids } }, { populate: ['recordedBy'] }) : [];
  const records = ids.length
    ? await em.find(CommissioningRecord, { circuit: { $in: ids }, quote: quote.id }, { populate: ['recordedBy'] })
    : [];
  const slack = slackBp(revision);
  const picks: { circuit: string; list: ReturnType<typeof circuitPickList> }[] = [];
  const out: JobPackCircuit[] = circuits.map(({ circuit, evaluation }) => {
    const design = circuitDesign(circuit);
    const list = circuitPickList(design, evaluation, products, { cableSlackBp: slack });
    const label = circuit.name ? `${circuit.area}: ${circuit.name}` : circuit.area;
    picks.push({ circuit: label, list });
    const wired = asWired.find((w) => w.circuit.id === circuit.id);
    return {
      id: circuit.id,
      area: circuit.area,
      name: circuit.name,
      kind: circuit.kind,
      powerName: powerName(circuit, products),
      design,
      designOk: evaluation.ok,
      pick: { items: list.items, cuts: list.cuts },
      asWired: wired && evaluation.blocks ? presentAsWired(wired, evaluation.blocks) : null,
      commissioning: presentCommissioning(evaluation, records.find((r) => r.circuit.id === circuit.id) ?? null),
    };
  });
  const customer = quote.customer;
  const pack: JobPackResponse = {
    job: {
      ...presentJobSummary(quote, revision.number, circuits.length),
      customerPhone: customer.phone ?? '',
      accessNotes: quote.site?.accessNotes ?? '',
    },
    profile: circuitSettings(revision, quote.organization as Organization).profile,
    products: products.map(presentInstallerProduct),
    circuits: out,
    loads: loadGroups(picks),
    caution: INSTALLER_CAUTION,
  };
  return { pack, evaluations: new Map(circuits.map((c) => [c.circuit.id, c.evaluation])) };
}

export async function saveAsWired(
  em: EntityManager,
  quote: Quote,
  circuitId: string,
  body: z.output<typeof SaveAsWiredRequest>,
  userId: string,
): Promise<AsWiredView> {
  const user = await em.findOneOrFail(User, userId);
  const { circuit, evaluation } = await jobCircuit(em, quote, circuitId);
  const plan = evaluation.blocks;
  if (circuit.kind !== 'constant-current' || !plan || plan.blocks.length === 0)
    throw conflict(
      'This circuit has no terminal schedule to record against (constant-voltage runs, or a string without a block plan). Note what was connected in the commissioning note instead.',
    );
  const record = await em.findOne(CircuitAsWired, { circuit: circuit.id }, { populate: ['recordedBy'] });
  checkVersion(record?.version ?? null, body.version, 'as-wired schedule');
  const advice = adviseWiring(plan, asWiredSchedule(plan, body.blocks));
  const saved =
    record ??
    em.create(CircuitAsWired, {
      organization: quote.organization,
      circuit,
      blocks: body.blocks,
      safe: advice.safeToPowerUp,
      recordedBy: user,
    });
  saved.blocks = body.blocks;
  saved.safe = advice.safeToPowerUp;
  saved.recordedBy = user;
  await em.flush();
  return presentAsWired(saved, plan);
}

export async function saveCommissioning(
  em: EntityManager,
  quote: Quote,
  circuitId: string,
  body: z.output<typeof SaveCommissioningRequest>,
  userId: string,
): Promise<CommissioningView> {
  const user = await em.findOneOrFail(User, userId);
  const { circuit, evaluation } = await jobCircuit(em, quote, circuitId);
  const record = await em.findOne(CommissioningRecord, { circuit: circuit.id, quote: quote.id }, { populate: ['recordedBy'] });
  checkVersion(record?.version ?? null, body.version, 'commissioning sheet');
  const plan = commissioningPlan(evaluation);
  const known = new Set([...plan.readings.map((r) => r.key)]);
  const knownChecks = new Set(plan.checks.map((c) => c.key));
  const readings = Object.fromEntries(Object.entries(body.readings).filter(([k]) => known.has(k)));
  const checks = Object.fromEntries(Object.entries(body.checks).filter(([k]) => knownChecks.has(k)));
  const judged = judgeReadings(plan, { readings, checks });
  const saved =
    record ??
    em.create(CommissioningRecord, {
      organization: quote.organization,
      quote,
      circuit,
      readings,
      checks,
      note: body.note,
      flagged: judged.flagged,
      recordedBy: user,
    });
  saved.readings = readings;
  saved.checks = checks;
  saved.note = body.note;
  saved.flagged = judged.flagged;
  saved.recordedBy = user;
  await em.flush();
  return presentCommissioning(evaluation, saved);
}

function checkVersion(stored: number | null, sent: number | null, what: string): void {
  if (stored === sent) return;
  if (stored === null) throw conflict(`There is no saved ${what} for this circuit yet; send version null to make the first.`);
  throw conflict(
    sent === null
      ? `Someone has already saved a ${what} for this circuit (version ${stored}). Reload to see theirs.`
      : `Someone else saved this ${what} after you opened it (your copy is version ${sent}, the saved one is ${stored}). Reload to see theirs.`,
  );
}
