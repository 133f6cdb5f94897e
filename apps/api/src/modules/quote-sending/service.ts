import {
  type Blocker,
  estimateQuoteInput,
  formatQuoteNumber,
  portalQuotePath,
  type RevisionSendingState,
  type SendQuoteRequest,
} from '@gloaming/contracts';
import {
  Customer,
  Organization,
  PortalToken,
  type User,
  newSecretToken,
  type EntityManager,
  type Quote,
  type QuoteRevision,
} from '@gloaming/db';
import { computeQuoteTotals, evaluateCircuit, formatMoney, isEngineInputError } from '@gloaming/engine';
import type { ModuleDeps } from '../../app-deps';
import { hashToken } from '../../auth/tokens';
import { conflict, HttpError } from '../../http/problem';
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

/**
 * E-mail a portal link and the PDF. The new token, the freeze (for a first send) and the
 * event are written in one transaction that commits only once the mail server took the
 * message, so a failed send leaves nothing half done.
 */
async function deliver(
  ctx: SendContext,
  body: SendQuoteRequest,
  kind: 'sent' | 'resent',
  now: Date,
  validUntil: Date,
): Promise<string> {
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

  await em.begin();
  try {
    await em.flush();
    try {
      await deps.mailer.send({
        to,
        subject: mail.subject,
        text: mail.text,
        attachments: [{ filename: mail.attachmentName, content: pdf, contentType: 'application/pdf' }],
      });
    } catch (err) {
      deps.logger.error(`Quote e-mail to ${to} was not accepted by the mail server`, err);
      throw new HttpError(
        502,
        'mail-not-sent',
        'E-mail not sent',
        'The mail server did not accept the message. Nothing was sent and the quote is unchanged; try again in a moment.',
      );
    }
    await em.commit();
  } catch (err) {
    await em.rollback();
    throw err;
  }
  return to;
}

const DAY_MS = 24 * 3600_000;

export async function sendRevision(ctx: SendContext, body: SendQuoteRequest): Promise<string> {
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
export async function resendRevision(ctx: SendContext, body: SendQuoteRequest): Promise<string> {
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
