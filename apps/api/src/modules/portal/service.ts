/**
 * What a homeowner does through their link, and the firm's side of the conversation:
 * - recordView(ctx)                       a `viewed` event each time; the first view of a revision e-mails the estimator
 * - askQuestion(ctx, body)                a message, a `question` event and an e-mail to the estimator
 * - approveQuote(ctx, request, client)    freeze the choice and totals into QuoteApproval; e-mails both sides
 * - declineQuote(ctx, reason)             a `declined` event (the owner's lost-reason figures read its reason)
 * - replyToHomeowner(deps, em, quote, author, body)  a staff message, a `reply` event and an e-mail with a link
 * - expireOverdueQuotes(em, now)          `expired` once for every undecided sent quote past its date
 * - quoteDecision(em, quote)              the approval or decline on a quote, for the workbench
 */
import {
  formatQuoteNumber,
  portalQuotePath,
  type PortalApprovalRequest,
  type PortalSelection,
  type QuoteDecisionResponse,
} from '@gloaming/contracts';
import {
  Customer,
  OptimisticLockError,
  Organization,
  PortalToken,
  Quote,
  QuoteApproval,
  QuoteEvent,
  QuoteMessage,
  QuoteRevision,
  UniqueConstraintViolationException,
  User,
  contentHash,
  newSecretToken,
  type EntityManager,
} from '@gloaming/db';
import { formatMoney } from '@gloaming/engine';
import type { ModuleDeps } from '../../app-deps';
import { hashToken } from '../../auth/tokens';
import { conflict, HttpError } from '../../http/problem';
import { senderNameOf } from '../../mail/sender-name';
import { appendQuoteEvent, revisionContent, revisionSettings, storedTotals } from '../quotes/service';
import { isPastValidity, PortalAccessError, firmContact, recordExpiryOnce, type PortalAccess } from './portal-access';
import { priceChoice } from './homeowner-choice';
import {
  approvalConfirmationMail,
  approvedNoticeMail,
  declinedNoticeMail,
  firstViewMail,
  questionMail,
  replyMail,
} from './portal-mail';
import { presentApproval } from './presenter';

export interface PortalContext {
  deps: ModuleDeps;
  em: EntityManager;
  access: PortalAccess;
  /** The raw token from the link (for links in e-mails back to the homeowner). */
  rawToken: string;
}

const workbenchLink = (deps: ModuleDeps, quoteId: string) => `${deps.config.publicUrl}/quotes/${quoteId}`;

async function people(em: EntityManager, access: PortalAccess) {
  const customer = await em.findOneOrFail(Customer, access.quote.customer.id);
  const estimator = await em.findOneOrFail(User, access.quote.estimator.id);
  return { customer, estimator };
}

function ref(access: PortalAccess, customerName: string) {
  return { reference: formatQuoteNumber(access.quote.number), customerName, firmName: access.organization.name };
}

/**
 * Mail that tells someone of a change: put into the change's own unit of work before its
 * flush, so the outbox row is written in the same transaction as the change (the mail exists
 * exactly when the change does; the outbox then retries while the mail server is down).
 */
async function notify(ctx: PortalContext, kind: string, mail: { to: string; fromName?: string; subject: string; text: string }): Promise<void> {
  if (!mail.to) return;
  await ctx.deps.mailer.send(mail, { em: ctx.em, kind, organizationId: ctx.access.organization.id });
}

export async function recordView(ctx: PortalContext): Promise<void> {
  const { deps, em, access } = ctx;
  const first = (await em.count(QuoteEvent, { revision: access.revision.id, type: 'viewed' })) === 0;
  appendQuoteEvent(em, access.quote, 'viewed', null, { revisionNumber: access.revision.number }, access.revision);
  if (first) {
    const { customer, estimator } = await people(em, access);
    await notify(ctx, 'first-view', {
      to: estimator.email,
      ...firstViewMail({
        ...ref(access, customer.name),
        estimatorName: estimator.name,
        workbenchLink: workbenchLink(deps, access.quote.id),
      }),
    });
  }
  await em.flush();
}

export async function askQuestion(ctx: PortalContext, body: string): Promise<QuoteMessage> {
  const { deps, em, access } = ctx;
  const message = em.create(QuoteMessage, {
    organization: access.organization,
    quote: access.quote,
    revision: access.revision,
    from: 'homeowner',
    author: null,
    body,
  });
  appendQuoteEvent(
    em,
    access.quote,
    'question',
    null,
    { revisionNumber: access.revision.number, messageId: message.id },
    access.revision,
  );
  const { customer, estimator } = await people(em, access);
  await notify(ctx, 'question', {
    to: estimator.email,
    ...questionMail({
      ...ref(access, customer.name),
      estimatorName: estimator.name,
      question: body,
      workbenchLink: workbenchLink(deps, access.quote.id),
    }),
  });
  await em.flush();
  return message;
}

/** The decision this revision already has, if any. */
async function decisionOf(em: EntityManager, access: PortalAccess) {
  const approval = await em.findOne(QuoteApproval, { revision: access.revision.id });
  const declined = approval ? null : await em.findOne(QuoteEvent, { revision: access.revision.id, type: 'declined' });
  return { approval, declined };
}

const alreadyApproved = () =>
  new HttpError(
    409,
    'quote-already-approved',
    'Already approved',
    'This quote has already been approved; the approval on record stands.',
  );
const alreadyDeclined = () =>
  new HttpError(
    409,
    'quote-already-declined',
    'Already declined',
    'You declined this quote. If you have changed your mind, contact the firm and they can send it again.',
  );

/** Approving or declining needs a revision that is current and within its date, and not yet decided. */
async function mustBeOpen(ctx: PortalContext, now: Date) {
  const { em, access } = ctx;
  const { approval, declined } = await decisionOf(em, access);
  if (approval) throw alreadyApproved();
  if (declined) throw alreadyDeclined();
  if (access.revision.state !== 'sent') throw new PortalAccessError('superseded', await firmContact(em, access.quote));
  if (isPastValidity(access.token, access.quote, now)) {
    await recordExpiryOnce(em, access.quote, access.revision);
    throw new PortalAccessError('expired', await firmContact(em, access.quote));
  }
}

function choiceLines(access: PortalAccess, selection: PortalSelection): string[] {
  const content = revisionContent(access.revision);
  const out: string[] = [];
  for (const s of content.sections)
    for (const l of s.lines) {
      if (!(l.id in selection)) continue;
      if (l.alternativeGroup) {
        if (selection[l.id]) out.push(`${l.alternativeGroup}: ${l.description}`);
      } else out.push(`${l.description}: ${selection[l.id] ? 'included' : 'not included'}`);
    }
  return out;
}

export async function approveQuote(
  ctx: PortalContext,
  request: PortalApprovalRequest,
  client: { ipAddress: string; userAgent: string },
  now: Date = new Date(),
): Promise<QuoteApproval> {
  const { deps, em, access } = ctx;
  await mustBeOpen(ctx, now);
  const settings = revisionSettings(access.revision);
  const priced = priceChoice(revisionContent(access.revision), settings, request.selection);
  const totals = storedTotals(priced.engineTotals);
  const hash = contentHash(access.revision.content);
  if (access.revision.contentHash && access.revision.contentHash !== hash)
    throw new Error(`Revision ${access.revision.id} no longer matches the content hash it was sent with.`);
  const approval = em.create(QuoteApproval, {
    organization: access.organization,
    quote: access.quote,
    revision: access.revision,
    selection: priced.selection,
    totals,
    totalMinor: totals.totalMinor,
    depositMinor: totals.deposit?.depositMinor ?? 0,
    currency: settings.currency,
    signedName: request.signedName,
    termsAccepted: request.termsAccepted,
    ipAddress: client.ipAddress,
    userAgent: client.userAgent.slice(0, 1000),
    contentHash: hash,
    approvedAt: now,
  });
  appendQuoteEvent(
    em,
    access.quote,
    'approved',
    null,
    {
      revisionNumber: access.revision.number,
      totalMinor: approval.totalMinor,
      depositMinor: approval.depositMinor,
      approvalId: approval.id,
    },
    access.revision,
  );
  const { customer, estimator } = await people(em, access);
  const money = (minor: number) => formatMoney(minor, settings.currency, settings.locale);
  const deposit = approval.depositMinor > 0 ? money(approval.depositMinor) : null;
  const when = new Intl.DateTimeFormat(settings.locale, { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' }).format(now);
  await notify(ctx, 'approval-confirmation', {
    to: access.token.sentTo,
    fromName: senderNameOf(access.organization),
    ...approvalConfirmationMail({
      ...ref(access, customer.name),
      signedName: approval.signedName,
      total: money(approval.totalMinor),
      deposit,
      approvedAt: `${when} UTC`,
      choices: choiceLines(access, priced.selection),
      link: `${deps.config.publicUrl}${portalQuotePath(ctx.rawToken)}`,
    }),
  });
  await notify(ctx, 'approved-notice', {
    to: estimator.email,
    ...approvedNoticeMail({
      ...ref(access, customer.name),
      estimatorName: estimator.name,
      signedName: approval.signedName,
      total: money(approval.totalMinor),
      deposit,
      workbenchLink: workbenchLink(deps, access.quote.id),
    }),
  });
  try {
    await em.flush();
  } catch (err) {
    // Two approvals at once: the unique revision (or the quote's version) lets one through,
    // and only its e-mails are written (they were in the same flush).
    if (err instanceof UniqueConstraintViolationException || err instanceof OptimisticLockError) throw alreadyApproved();
    throw err;
  }
  return approval;
}

export async function declineQuote(ctx: PortalContext, reason: string | undefined, now: Date = new Date()): Promise<QuoteEvent> {
  const { deps, em, access } = ctx;
  await mustBeOpen(ctx, now);
  const given = reason?.trim() ? reason.trim() : undefined;
  const event = appendQuoteEvent(
    em,
    access.quote,
    'declined',
    null,
    { revisionNumber: access.revision.number, ...(given ? { reason: given } : {}) },
    access.revision,
  );
  const { customer, estimator } = await people(em, access);
  await notify(ctx, 'declined-notice', {
    to: estimator.email,
    ...declinedNoticeMail({
      ...ref(access, customer.name),
      estimatorName: estimator.name,
      reason: given ?? null,
      workbenchLink: workbenchLink(deps, access.quote.id),
    }),
  });
  await em.flush();
  return event;
}

const DAY_MS = 24 * 3600_000;

/**
 * The firm's reply: a staff message and a `reply` event, e-mailed to the homeowner with a fresh
 * link to the revision they are dealing with (the approved one, else the newest sent one). Only
 * token hashes are stored, so each reply carries a new link; it expires with the quote (an
 * approved quote's link stays usable for 90 days, for the deposit). The message, the link, the
 * event and the outbox e-mail are written in one transaction; the outbox delivers it.
 */
export async function replyToHomeowner(
  deps: ModuleDeps,
  em: EntityManager,
  quote: Quote,
  author: User,
  body: string,
  now: Date = new Date(),
): Promise<{ message: QuoteMessage; sentTo: string }> {
  const approval = await em.findOne(QuoteApproval, { quote: quote.id }, { populate: ['revision'] });
  const revision =
    approval?.revision ?? (await em.findOne(QuoteRevision, { quote: quote.id, state: 'sent' }, { orderBy: { number: 'desc' } }));
  if (!revision) throw conflict('This quote has not been sent yet, so there is no link to reply with. Send it first.');
  const last = await em.findOne(PortalToken, { revision: revision.id }, { orderBy: { createdAt: 'desc' } });
  const customer = await em.findOneOrFail(Customer, quote.customer.id);
  const to = last?.sentTo ?? customer.email ?? '';
  if (!to) throw conflict(`${customer.name} has no e-mail address to reply to.`);

  const raw = newSecretToken();
  const validUntil = quote.validUntil ?? now;
  const expiresAt = approval ? new Date(Math.max(validUntil.getTime(), now.getTime() + 90 * DAY_MS)) : validUntil;
  em.create(PortalToken, {
    organization: quote.organization,
    revision,
    tokenHash: hashToken(raw),
    sentTo: to,
    expiresAt,
    revokedAt: null,
  });
  const message = em.create(QuoteMessage, { organization: quote.organization, quote, revision, from: 'staff', author, body });
  appendQuoteEvent(
    em,
    quote,
    'reply',
    { id: author.id },
    { revisionNumber: revision.number, messageId: message.id, to },
    revision,
  );
  const mail = replyMail({
    reference: formatQuoteNumber(quote.number),
    customerName: customer.name,
    firmName: (await firmContact(em, quote)).name,
    senderName: author.name,
    reply: body,
    link: `${deps.config.publicUrl}${portalQuotePath(raw)}`,
  });

  // the e-mail joins the same flush (one transaction): it goes out once the reply is recorded
  const firm = await em.findOneOrFail(Organization, quote.organization.id);
  await deps.mailer.send({ to, fromName: senderNameOf(firm), ...mail }, { em, kind: 'reply', organizationId: quote.organization.id });
  await em.flush();
  return { message, sentTo: to };
}

/**
 * Record `expired` (once) for every quote still waiting on the homeowner past its validity.
 * The api runs it at start-up and hourly; links also notice lazily when opened.
 */
export async function expireOverdueQuotes(em: EntityManager, now: Date = new Date()): Promise<number> {
  const overdue = await em.find(Quote, { status: { $in: ['sent', 'viewed'] }, validUntil: { $lte: now } });
  let expired = 0;
  for (const quote of overdue) {
    const revision = await em.findOne(QuoteRevision, { quote: quote.id, state: 'sent' }, { orderBy: { number: 'desc' } });
    if (!revision) continue;
    if ((await em.count(QuoteApproval, { revision: revision.id })) > 0) continue;
    if ((await em.count(QuoteEvent, { revision: revision.id, type: 'declined' })) > 0) continue;
    if (await recordExpiryOnce(em, quote, revision)) expired++;
  }
  return expired;
}

export async function quoteDecision(em: EntityManager, quote: Quote): Promise<QuoteDecisionResponse> {
  const approval = await em.findOne(
    QuoteApproval,
    { quote: quote.id },
    { orderBy: { approvedAt: 'desc' }, populate: ['revision'] },
  );
  const declined = approval
    ? null
    : await em.findOne(QuoteEvent, { quote: quote.id, type: 'declined' }, { orderBy: { at: 'desc' }, populate: ['revision'] });
  const reason = declined?.data.reason;
  return {
    status: quote.status,
    approval: approval
      ? {
          ...presentApproval(approval, approval.revision),
          revisionNumber: approval.revision.number,
          ipAddress: approval.ipAddress,
          userAgent: approval.userAgent,
          contentHash: approval.contentHash,
        }
      : null,
    declined: declined
      ? {
          at: declined.at.toISOString(),
          reason: typeof reason === 'string' && reason ? reason : null,
          revisionNumber: declined.revision?.number ?? null,
        }
      : null,
  };
}
