/**
 * Quotes and their revisions: the small service other modules build on (sending, the PDF, the
 * portal, payments). Every loader is scoped to a firm; another firm's id is a 404.
 *
 * Exported API:
 * - loadQuoteForFirm(em, organizationId, id)     the quote with customer, site and estimator, or 404
 * - loadQuoteWithFirm(em, organizationId, id)    the quote with only its firm, or 404 (lighter)
 * - currentRevision(em, quote)                   the newest revision (there is always one)
 * - loadRevision(em, quote, number)              one revision by number, or 404
 * - readQuoteForFirm(em, organizationId, id)     the quote as a plain row (readQuote), or 404: for reads and saves that change no entity
 * - readRevisionOf(em, quote, number, options)    one revision as a plain row (readRevision), or 404
 * - revisionContent(revision) / revisionSettings(revision)   the JSON parsed with the contracts
 * - priceRevision(content, settings)             the engine's totals for a document
 * - appendQuoteEvent(em, quote, type, actor, data?, revision?)  history + status (persisted, not flushed)
 * - markRevisionSent(em, quote, revision, actor, data?, now?) freeze a draft when it is sent (async; persisted, not flushed)
 */
import {
  EstimateContent,
  RevisionSettings,
  estimateQuoteInput,
  type CreateQuoteRequest,
  type QuoteEventType,
  type QuoteStatus,
  type RevisionTotals,
} from '@gloaming/contracts';
import {
  Circuit,
  Customer,
  Organization,
  Photo,
  Quote,
  QuoteEvent,
  QuoteRevision,
  Site,
  User,
  UniqueConstraintViolationException,
  contentHash,
  newId,
  readQuote,
  readRevision,
  revisionSettingsOf,
  revisionTotalsOf,
  saveRevisionDocument,
  type EntityManager,
  type QuoteRow,
  type RevisionRow,
  type RevisionWithContentRow,
} from '@gloaming/db';
import { computeQuoteTotals, isEngineInputError, type QuoteTotals } from '@gloaming/engine';
import { badRequest, conflict, notFound } from '../../http/problem';

export type Actor = { id: string } | null;

/** The quote (customer, site and estimator loaded) if it belongs to the firm; 404 otherwise. */
export async function loadQuoteForFirm(em: EntityManager, organizationId: string, id: string): Promise<Quote> {
  const quote = await em.findOne(Quote, { id, organization: organizationId }, { populate: ['customer', 'site', 'estimator', 'organization'] });
  if (!quote) throw notFound('That quote');
  return quote;
}

/**
 * The quote with only its firm loaded, or 404: for routes that never show the customer, site
 * or estimator (each populated relation costs a hydrated entity on every request).
 */
export async function loadQuoteWithFirm(em: EntityManager, organizationId: string, id: string): Promise<Quote> {
  const quote = await em.findOne(Quote, { id, organization: organizationId }, { populate: ['organization'] });
  if (!quote) throw notFound('That quote');
  return quote;
}

/** The newest revision of a quote. */
export async function currentRevision(em: EntityManager, quote: Quote): Promise<QuoteRevision> {
  const revision = await em.findOne(QuoteRevision, { quote: quote.id }, { orderBy: { number: 'desc' } });
  if (!revision) throw notFound('That quote revision');
  return revision;
}

export async function loadRevision(em: EntityManager, quote: Quote, number: number): Promise<QuoteRevision> {
  const revision = await em.findOne(QuoteRevision, { quote: quote.id, number });
  if (!revision) throw notFound(`Revision ${number} of this quote`);
  return revision;
}

/** The quote as a plain row if it belongs to the firm; 404 otherwise (see @gloaming/db quote-reads). */
export async function readQuoteForFirm(em: EntityManager, organizationId: string, id: string): Promise<QuoteRow> {
  const quote = await readQuote(em, organizationId, id);
  if (!quote) throw notFound('That quote');
  return quote;
}

/** Revision `number` (or the newest) of a firm-scoped quote as a plain row, or 404. */
export async function readRevisionOf(em: EntityManager, quote: Pick<QuoteRow, 'id'>, number: number | 'current', options: { content: true }): Promise<RevisionWithContentRow>;
export async function readRevisionOf(em: EntityManager, quote: Pick<QuoteRow, 'id'>, number: number | 'current'): Promise<RevisionRow>;
export async function readRevisionOf(
  em: EntityManager,
  quote: Pick<QuoteRow, 'id'>,
  number: number | 'current',
  options?: { content: true },
): Promise<RevisionRow | RevisionWithContentRow> {
  const revision = options ? await readRevision(em, quote.id, number, options) : await readRevision(em, quote.id, number);
  if (!revision) throw notFound(number === 'current' ? 'That quote revision' : `Revision ${number} of this quote`);
  return revision;
}

/** The stored estimate document; stored JSON that no longer parses is a server fault, said plainly. */
export function revisionContent(revision: Pick<QuoteRevision, 'id' | 'content'>): EstimateContent {
  const parsed = EstimateContent.safeParse(revision.content);
  if (!parsed.success) throw new Error(`Revision ${revision.id} holds an estimate that does not match the contract.`);
  return parsed.data;
}

export function revisionSettings(revision: Pick<QuoteRevision, 'id' | 'settings'>): RevisionSettings {
  const parsed = RevisionSettings.safeParse(revision.settings);
  if (!parsed.success) throw new Error(`Revision ${revision.id} holds settings that do not match the contract.`);
  return parsed.data;
}

/** The firm's pricing settings as a revision snapshots them. */
export const settingsFromOrganization = revisionSettingsOf;

/** The engine's totals for an estimate; input the engine refuses is a 400 naming the line. */
export function priceRevision(content: EstimateContent, settings: RevisionSettings): QuoteTotals {
  try {
    return computeQuoteTotals(estimateQuoteInput(content, settings));
  } catch (err) {
    if (isEngineInputError(err)) throw badRequest(err.message, [{ path: `body.content${engineSubject(err.finding.subject, content)}`, message: err.message }]);
    throw err;
  }
}

/** The engine names flat lines (`lines[7]`); turn that into the document's section/line path. */
function engineSubject(subject: string | undefined, content: EstimateContent): string {
  const m = subject ? /^lines\[(\d+)\](.*)$/.exec(subject) : null;
  if (!m) return subject ? `.${subject}` : '';
  let index = Number(m[1]);
  for (let s = 0; s < content.sections.length; s++) {
    const n = content.sections[s]!.lines.length;
    if (index < n) return `.sections.${s}.lines.${index}${m[2]!.replace(/^\./, '.')}`;
    index -= n;
  }
  return `.${subject}`;
}

/** What a revision stores as `totals`: the engine's figures without the per-line amounts. */
export const storedTotals = revisionTotalsOf;

/** The event types that move a quote's status, and to what. */
const STATUS_OF_EVENT: Partial<Record<QuoteEventType, QuoteStatus>> = {
  created: 'draft',
  revised: 'draft',
  sent: 'sent',
  viewed: 'viewed',
  approved: 'approved',
  declined: 'declined',
  expired: 'expired',
  'deposit-paid': 'deposit-paid',
  won: 'won',
  lost: 'lost',
};

/**
 * Append to a quote's history and move its status to the step the event names. A `viewed`
 * only moves a sent quote (a homeowner reopening an approved quote does not undo approval);
 * events without a status (resent, link-revoked, refunded) leave it. Persisted, not flushed:
 * the caller flushes with its own changes so both land together.
 */
export function appendQuoteEvent(
  em: EntityManager,
  quote: Quote,
  type: QuoteEventType,
  actor: Actor,
  data: Record<string, unknown> = {},
  revision: QuoteRevision | null = null,
): QuoteEvent {
  const event = em.create(QuoteEvent, {
    organization: quote.organization,
    quote,
    revision,
    type,
    actor: actor ? em.getReference(User, actor.id) : null,
    data,
    at: new Date(),
  });
  const next = STATUS_OF_EVENT[type];
  if (next && (type !== 'viewed' || quote.status === 'sent')) quote.status = next;
  return event;
}

/**
 * Freeze a draft revision when it is sent: state `sent`, the SHA-256 of its canonical JSON
 * content, the photos it shows (ids, order and captions, kept in its settings so the PDF of a
 * sent revision always shows what was sent), the quote's sent date and validity from the
 * revision's settings, and a `sent` event; an earlier sent revision becomes `superseded`.
 * Refuses anything but a draft. Persisted, not flushed.
 */
export async function markRevisionSent(
  em: EntityManager,
  quote: Quote,
  revision: QuoteRevision,
  actor: Actor,
  data: Record<string, unknown> = {},
  now: Date = new Date(),
): Promise<QuoteEvent> {
  if (revision.state !== 'draft') throw conflict(`Revision ${revision.number} has already been sent; revise the quote to change it.`);
  for (const earlier of await em.find(QuoteRevision, { quote: quote.id, state: 'sent' })) earlier.state = 'superseded';
  const settings = revisionSettings(revision);
  const shown = await em.find(
    Photo,
    { quote: quote.id, organization: quote.organization.id, onQuote: true },
    { orderBy: { position: 'asc', createdAt: 'asc' } },
  );
  const frozen: RevisionSettings = { ...settings, sentPhotos: shown.map((p) => ({ photoId: p.id, caption: p.caption })) };
  revision.settings = frozen;
  revision.state = 'sent';
  revision.sentAt = now;
  revision.contentHash = contentHash(revision.content);
  quote.sentAt = now;
  quote.validUntil = new Date(now.getTime() + settings.quoteValidityDays * 24 * 3600_000);
  return appendQuoteEvent(em, quote, 'sent', actor, { revisionNumber: revision.number, ...data }, revision);
}

function emptyContent(settings: RevisionSettings): EstimateContent {
  return {
    sections: [{ id: newId(), name: 'Whole garden', lines: [] }],
    discount: null,
    deposit: settings.depositPercentBp > 0 ? { kind: 'percent', bp: settings.depositPercentBp } : null,
    introduction: '',
  };
}

/** A new quote with its first draft revision, numbered next in the firm's sequence. */
export async function createQuote(em: EntityManager, organizationId: string, estimatorId: string, input: CreateQuoteRequest): Promise<Quote> {
  const customer = await em.findOne(Customer, { id: input.customerId, organization: organizationId });
  if (!customer) throw notFound('That customer');
  let site: Site | null = null;
  if (input.siteId) {
    site = await em.findOne(Site, { id: input.siteId, organization: organizationId, customer: customer.id });
    if (!site) throw notFound('That site of this customer');
  }
  const firm = await em.findOneOrFail(Organization, organizationId);
  const settings = settingsFromOrganization(firm);
  const content = emptyContent(settings);
  const totals = storedTotals(priceRevision(content, settings));

  for (let attempt = 0; ; attempt++) {
    const fork = em.fork();
    const last = await fork.findOne(Quote, { organization: organizationId }, { orderBy: { number: 'desc' }, fields: ['number'] });
    const quote = fork.create(Quote, {
      organization: fork.getReference(Organization, organizationId),
      number: (last?.number ?? 0) + 1,
      title: input.title ?? '',
      customer: fork.getReference(Customer, customer.id),
      site: site ? fork.getReference(Site, site.id) : null,
      estimator: fork.getReference(User, estimatorId),
      status: 'draft',
      valueMinor: totals.totalMinor,
    });
    const revision = fork.create(QuoteRevision, {
      organization: quote.organization,
      quote,
      number: 1,
      state: 'draft',
      content,
      settings,
      totals,
    });
    appendQuoteEvent(fork, quote, 'created', { id: estimatorId }, { revisionNumber: 1 }, revision);
    try {
      await fork.flush();
      return loadQuoteForFirm(em, organizationId, quote.id);
    } catch (err) {
      // Two people creating at once took the same number: take the next one.
      if (err instanceof UniqueConstraintViolationException && attempt < 3) continue;
      throw err;
    }
  }
}

/**
 * Save the whole grid. `version` must be the revision's current one (else 409, nothing
 * written); only a draft can be saved; totals are recomputed here with the engine. Written
 * with one UPDATE under the version check (saveRevisionDocument), so a save that raced
 * another is a 409 too. Returns the quote as it now is.
 */
export async function saveRevisionContent(
  em: EntityManager,
  quote: QuoteRow,
  revision: RevisionRow,
  version: number,
  content: EstimateContent,
): Promise<{ version: number; updatedAt: Date; totals: RevisionTotals; quote: QuoteRow }> {
  const frozen = () => conflict(`Revision ${revision.number} was sent and is frozen. Choose “Revise” to make a new draft from it.`);
  const stale = (saved: number) =>
    conflict(
      `Someone else saved this quote after you opened it (your copy is version ${version}, the saved one is ${saved}). Reload theirs, or keep yours and save over it.`,
    );
  if (revision.state !== 'draft') throw frozen();
  if (revision.version !== version) throw stale(revision.version);
  const totals = storedTotals(priceRevision(content, revisionSettings(revision)));
  const now = new Date();
  const saved = await saveRevisionDocument(em, {
    quoteId: quote.id,
    revisionId: revision.id,
    version,
    contentJson: JSON.stringify(content),
    totals,
    valueMinor: totals.totalMinor,
    now,
  });
  if (saved.outcome === 'stale') {
    if (saved.state !== null && saved.state !== 'draft') throw frozen();
    if (saved.version === null) throw notFound(`Revision ${revision.number} of this quote`);
    throw stale(saved.version);
  }
  if (saved.outcome === 'unchanged') return { version, updatedAt: revision.updatedAt, totals, quote };
  return { version: saved.version, updatedAt: now, totals, quote: { ...quote, valueMinor: totals.totalMinor, updatedAt: now } };
}

/**
 * Start a new draft from the current revision (after it was sent). The sent one stays as it
 * is, viewable; a draft that was never sent cannot be revised (edit it instead).
 */
export async function reviseQuote(em: EntityManager, quote: Quote, actor: Actor): Promise<QuoteRevision> {
  const current = await currentRevision(em, quote);
  if (current.state === 'draft') throw conflict(`Revision ${current.number} is still a draft; edit it directly.`);
  const settings = settingsFromOrganization(await em.findOneOrFail(Organization, quote.organization.id));
  const circuits = await em.find(Circuit, { revision: current.id }, { orderBy: { position: 'asc' } });
  // The new draft gets its own copies of the circuits; derived lines follow their circuit's new id.
  const circuitIds = new Map(circuits.map((c) => [c.id, newId()] as const));
  const sent = revisionContent(current);
  const content: EstimateContent = {
    ...sent,
    sections: sent.sections.map((section) => ({
      ...section,
      lines: section.lines.map((line) => (line.circuitId ? { ...line, circuitId: circuitIds.get(line.circuitId) ?? null } : line)),
    })),
  };
  // Keep the sent revision's tax rounding so the new draft prices the same until edited.
  const merged: RevisionSettings = { ...settings, vatRounding: revisionSettings(current).vatRounding };
  const totals = storedTotals(priceRevision(content, merged));
  const revision = em.create(QuoteRevision, {
    organization: quote.organization,
    quote,
    number: current.number + 1,
    state: 'draft',
    content,
    settings: merged,
    totals,
  });
  for (const c of circuits)
    em.create(Circuit, {
      id: circuitIds.get(c.id)!,
      organization: c.organization,
      revision,
      area: c.area,
      name: c.name,
      kind: c.kind,
      position: c.position,
      design: c.design,
      result: c.result,
    });
  quote.valueMinor = totals.totalMinor;
  appendQuoteEvent(em, quote, 'revised', actor, { revisionNumber: revision.number, from: current.number }, revision);
  await em.flush();
  return revision;
}

export async function listQuoteEvents(em: EntityManager, quote: Quote): Promise<QuoteEvent[]> {
  return em.find(QuoteEvent, { quote: quote.id }, { orderBy: { at: 'asc', id: 'asc' }, populate: ['actor', 'revision'] });
}
