import {
  type Blocker,
  estimateQuoteInput,
  formatQuoteNumber,
  portalQuotePath,
  type RevisionSendingState,
  type SendQuoteRequest,
  type SendQuoteResponse,
} from '@gloaming/contracts';
import {
  Customer,
  Organization,
  OutboxMessage,
  PortalToken,
  type User,
  newId,
  newSecretToken,
  type EntityManager,
  type Quote,
  type QuoteRevision,
} from '@gloaming/db';
import { computeQuoteTotals, evaluateCircuit, formatMoney, isEngineInputError } from '@gloaming/engine';
import type { ModuleDeps } from '../../app-deps';
import { hashToken } from '../../auth/tokens';
import { conflict, HttpError } from '../../http/problem';
import { deliveryOf } from '../../mail/outbox';
import { senderNameOf } from '../../mail/sender-name';
import { circuitDesign, circuitSettings, firmProducts, listCircuits, productRefs } from '../circuits/service';
import { buildQuotePdfModel, priceForCustomer, validUntilFor } from '../quote-pdf/build-pdf-model';
import { sharedPdfRenderer } from '../quote-pdf/pdf-renderer';
import { appendQuoteEvent, markRevisionSent, revisionContent, revisionSettings, type Actor } from '../quotes/service';
import { quoteMail, quotePdfFileName } from './quote-mail';

export type SendBlocker = Blocker;

/**
 * Every error-severity finding of the revision's circuits that has not been accepted with a
 * reason. Each circuit is checked again with the engine against today's catalogue (the same
 * `evaluateCircuit` as on save), so a product changed since the last save counts too.
 */
export async function circuitBlockers(em: EntityManager, quote: Quote, revision: QuoteRevision): Promise<SendBlocker[]> {
  const circuits = await listCircuits(em, revision);
  if (circuits.length === 0) return [];
  const designs = circuits.map((c) => ({ circuit: c, design: circuitDesign(c) }));
  const products = await firmProducts(
    em,
    quote.organization.id,
    designs.flatMap((d) => productRefs(d.design).map((r) => r.id)),
  );
  const firm = await em.findOneOrFail(Organization, quote.organization.id);
  const settings = circuitSettings(revision, firm);
  const blockers: SendBlocker[] = [];
  for (const { circuit, design } of designs) {
    const evaluation = evaluateCircuit(design, products, settings);
    const title = `${circuit.area}${circuit.name ? `: ${circuit.name}` : ''}`;
    for (const f of evaluation.findings) {
      if (f.severity !== 'error' || f.acknowledged !== null) continue;
      blockers.push({
        code: 'circuit-error',
        message: `Circuit “${title}”: ${f.message}`,
        pointer: `/api/quotes/${quote.id}/revisions/${revision.number}/circuits/${circuit.id}`,
        circuit: { id: circuit.id, name: circuit.name, area: circuit.area, findingCode: f.code, subject: f.subject ?? null },
      });
    }
  }
  return blockers;
}

/** Why a draft revision cannot go out yet. Empty when it can. */
export async function sendBlockers(
  em: EntityManager,
  quote: Quote,
  revision: QuoteRevision,
  acknowledged: readonly string[] = [],
): Promise<SendBlocker[]> {
  const content = revisionContent(revision);
  const settings = revisionSettings(revision);
  const blockers: SendBlocker[] = [];
  if (content.sections.every((s) => s.lines.length === 0))
    blockers.push({ code: 'no-lines', message: 'This quote has no lines yet. Add what you are quoting for before sending it.' });
  const customer = await em.findOneOrFail(Customer, quote.customer.id);
  if (!customer.email?.trim())
    blockers.push({
      code: 'customer-without-email',
      message: `${customer.name} has no e-mail address. Add one to the customer before sending.`,
    });
  blockers.push(...(await circuitBlockers(em, quote, revision)));
  if (blockers.length === 0) {
    // the engine's own findings of severity "error" must be acknowledged
    try {
      const totals = computeQuoteTotals(estimateQuoteInput(content, settings));
      for (const f of totals.findings)
        if (f.severity === 'error' && !acknowledged.includes(f.code)) blockers.push({ code: f.code, message: f.message });
    } catch (err) {
      if (!isEngineInputError(err)) throw err;
      blockers.push({ code: err.finding.code, message: `${err.message} Fix it in the estimate first.` });
    }
  }
  return blockers;
}

function refuse(blockers: SendBlocker[]): HttpError {
  const circuitErrors = blockers.filter((b) => b.circuit).length;
  const detail =
    circuitErrors > 0 && circuitErrors === blockers.length
      ? `${circuitErrors} circuit error${circuitErrors === 1 ? '' : 's'} not accepted yet. Fix each one in the circuit designer, or accept it there with a reason. ${blockers.map((b) => b.message).join(' ')}`
      : blockers.map((b) => b.message).join(' ');
  return new HttpError(422, 'quote-not-ready', 'This quote cannot be sent yet', detail, {
    errors: blockers.map((b) => ({
      path: b.circuit ? `circuits.${b.circuit.id}.${b.circuit.subject ?? 'circuit'}.${b.circuit.findingCode}` : `quote.${b.code}`,
      message: b.message,
    })),
    blockers,
  });
}

export async function sendingState(
  em: EntityManager,
  quote: Quote,
  revision: QuoteRevision,
  now = new Date(),
): Promise<RevisionSendingState> {
  const tokens = await em.find(
    PortalToken,
    { revision: revision.id, organization: quote.organization.id },
    { orderBy: { createdAt: 'desc' } },
  );
  const mails = tokens.length
    ? await em.fork().find(
        OutboxMessage,
        { reference: { $in: tokens.map((t) => t.id) }, organization: quote.organization.id },
        { fields: ['reference', 'status', 'attempts'] },
      )
    : [];
  // (a fork of its own: the worker updates these rows from other entity managers)
  const mailOf = new Map(mails.map((m) => [m.reference, m]));
  return {
    revisionId: revision.id,
    state: revision.state,
    sentAt: revision.sentAt?.toISOString() ?? null,
    contentHash: revision.contentHash ?? null,
    validUntil: revision.state === 'draft' ? null : (quote.validUntil?.toISOString() ?? null),
    links: tokens.map((t) => ({
      id: t.id,
      sentTo: t.sentTo,
      createdAt: t.createdAt.toISOString(),
      expiresAt: t.expiresAt.toISOString(),
      revokedAt: t.revokedAt?.toISOString() ?? null,
      active: !t.revokedAt && t.expiresAt > now,
      // links from before the outbox went out while the request waited: they were sent
      delivery: deliveryOf(mailOf.get(t.id)?.status ?? 'sent'),
      deliveryAttempts: mailOf.get(t.id)?.attempts ?? 1,
    })),
  };
}

/** The e-mail as it will go out (with a placeholder link), for the send dialog's preview. */
export async function composeQuoteMail(
  em: EntityManager,
  quote: Quote,
  revision: QuoteRevision,
  p: { senderName: string; link: string; message?: string; issuedOn: Date; validUntil?: Date },
) {
  const settings = revisionSettings(revision);
  const content = revisionContent(revision);
  const customer = await em.findOneOrFail(Customer, quote.customer.id);
  const totals = priceForCustomer(content, settings);
  const validUntil = p.validUntil ?? validUntilFor(quote, revision, settings, p.issuedOn);
  const reference = formatQuoteNumber(quote.number);
  await em.populate(quote, ['organization']);
  const firm = quote.organization;
  const mail = quoteMail({
    customerName: customer.name,
    firmName: firm.name,
    senderName: p.senderName,
    reference,
    total: formatMoney(totals.totalMinor, settings.currency, settings.locale),
    validUntil: new Intl.DateTimeFormat(settings.locale, {
      day: 'numeric',
      month: 'long',
      year: 'numeric',
      timeZone: 'UTC',
    }).format(validUntil),
    link: p.link,
    ...(p.message ? { message: p.message } : {}),
  });
  return {
    ...mail,
    to: customer.email,
    attachmentName: quotePdfFileName(reference, revision.number),
    totalMinor: totals.totalMinor,
  };
}

interface SendContext {
  deps: ModuleDeps;
  em: EntityManager;
  quote: Quote;
  revision: QuoteRevision;
  actor: User;
}

/** What a send recorded: the address, and the outbox message carrying the link. */
export interface SendOutcome {
  to: string;
  mailId: string;
}

/**
 * E-mail a portal link and the PDF. The new token, the freeze (for a first send), the event
 * and the outbox message are written in one transaction; the outbox hands the message to the
 * mail server after the commit and retries while the server is down, so nothing is half done
 * and nothing is lost.
 */
async function deliver(
  ctx: SendContext,
  body: SendQuoteRequest,
  kind: 'sent' | 'resent',
  now: Date,
  validUntil: Date,
): Promise<SendOutcome> {
  const { deps, em, quote, revision, actor } = ctx;
  const token = newSecretToken();
  const link = `${deps.config.publicUrl}${portalQuotePath(token)}`;
  const mail = await composeQuoteMail(em, quote, revision, {
    senderName: actor.name,
    link,
    issuedOn: revision.sentAt ?? now,
    validUntil,
    ...(body.message ? { message: body.message } : {}),
  });
  const to = body.to ?? mail.to;
  if (!to)
    throw refuse([
      { code: 'customer-without-email', message: 'The customer has no e-mail address. Add one, or type the address to send to.' },
    ]);
  // Token, freeze and event are only persisted here; the flush below writes them inside the
  // transaction, so a refused e-mail leaves nothing behind.
  const portalToken = em.create(PortalToken, {
    id: newId(), // known now: the event and the outbox message refer to it
    organization: quote.organization,
    revision,
    tokenHash: hashToken(token),
    sentTo: to,
    expiresAt: validUntil,
    revokedAt: null,
  });
  const who: Actor = { id: actor.id };
  const data = { to, linkId: portalToken.id, expiresAt: validUntil.toISOString() };
  if (kind === 'sent') {
    // freezes the content hash and the photos first, so the attached PDF shows the frozen ones
    await markRevisionSent(em, quote, revision, who, data, now);
    quote.valueMinor = mail.totalMinor;
  } else {
    appendQuoteEvent(em, quote, 'resent', who, { revisionNumber: revision.number, ...data }, revision);
  }
  const model = await buildQuotePdfModel(em, deps.storage, quote, revision, { issuedOn: revision.sentAt ?? now, validUntil });
  const pdf = await sharedPdfRenderer().render(model);

  // The outbox row joins the same flush (one transaction) as the token, the freeze and the
  // event: the mail exists exactly when the send does, and goes out once that commits.
  const firm = await em.findOneOrFail(Organization, quote.organization.id);
  const queued = await deps.mailer.send(
    {
      to,
      fromName: senderNameOf(firm),
      subject: mail.subject,
      text: mail.text,
      attachments: [{ filename: mail.attachmentName, content: pdf, contentType: 'application/pdf' }],
    },
    { em, kind: kind === 'sent' ? 'quote' : 'quote-again', reference: portalToken.id, organizationId: quote.organization.id },
  );
  await em.flush();
  return { to, mailId: queued.id };
}

/** How long a send request waits for the mail server before answering "queued". */
export const SEND_ANSWER_WAIT_MS = 3_000;

/**
 * The answer to a send: "sent" when the mail server took the message within a few seconds,
 * "queued" when it is down or slow (the outbox keeps retrying), "failed" never on a first try.
 */
export async function sendAnswer(
  deps: ModuleDeps,
  em: EntityManager,
  quote: Quote,
  revision: QuoteRevision,
  sent: SendOutcome,
): Promise<SendQuoteResponse> {
  const delivery = await deps.mailer.outcome(sent.mailId, SEND_ANSWER_WAIT_MS);
  return { sentTo: sent.to, delivery, sending: await sendingState(em, quote, revision) };
}

const DAY_MS = 24 * 3600_000;

export async function sendRevision(ctx: SendContext, body: SendQuoteRequest): Promise<SendOutcome> {
  const { em, quote, revision } = ctx;
  if (revision.state === 'sent')
    throw conflict(`Revision ${revision.number} has already been sent. Use "send again" for a new link.`);
  if (revision.state !== 'draft')
    throw conflict(`Revision ${revision.number} has been replaced by a later one; send the current revision.`);
  const blockers = await sendBlockers(em, quote, revision, body.acknowledged ?? []);
  if (blockers.length) throw refuse(blockers);
  const now = new Date();
  const validUntil = new Date(now.getTime() + revisionSettings(revision).quoteValidityDays * DAY_MS);
  return deliver(ctx, body, 'sent', now, validUntil);
}

/** A new link for an already sent revision; earlier links stay valid unless revoked. */
export async function resendRevision(ctx: SendContext, body: SendQuoteRequest): Promise<SendOutcome> {
  const { quote, revision } = ctx;
  if (revision.state !== 'sent')
    throw conflict(
      revision.state === 'draft'
        ? 'This revision has not been sent yet; send it first.'
        : 'A later revision replaced this one; send that instead.',
    );
  const now = new Date();
  if (!quote.validUntil || quote.validUntil <= now)
    throw new HttpError(
      422,
      'quote-expired',
      'This quote has expired',
      'The quote is past its validity date. Revise it to send an up-to-date version.',
    );
  return deliver(ctx, body, 'resent', now, quote.validUntil);
}

/** Revoke every link of the revision; returns how many were still open. */
export async function revokeRevisionLinks(
  em: EntityManager,
  quote: Quote,
  revision: QuoteRevision,
  actor: User,
): Promise<number> {
  const open = await em.find(PortalToken, { revision: revision.id, organization: quote.organization.id, revokedAt: null });
  const now = new Date();
  for (const t of open) t.revokedAt = now;
  appendQuoteEvent(
    em,
    quote,
    'link-revoked',
    { id: actor.id },
    { revisionNumber: revision.number, revoked: open.length },
    revision,
  );
  await em.flush();
  return open.length;
}
