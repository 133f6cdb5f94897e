/**
 * The payment provider's webhook: the only way a deposit becomes paid. Verified by the SDK
 * over the raw body (see router.ts); processed here inside one transaction, idempotent on the
 * provider's event id (payment_webhook_events) and on the checkout session (one deposit_payments
 * row per session, whose state only moves forward), with the amount and currency checked
 * against the approval.
 */
import type Stripe from 'stripe';
import { formatQuoteNumber } from '@gloaming/contracts';
import {
  Customer,
  DepositPayment,
  OptimisticLockError,
  Organization,
  PaymentWebhookEvent,
  Quote,
  QuoteApproval,
  QuoteRevision,
  UniqueConstraintViolationException,
  User,
  type EntityManager,
} from '@gloaming/db';
import { formatMoney } from '@gloaming/engine';
import { senderNameOf } from '../../mail/sender-name';
import { appendQuoteEvent, revisionSettings } from '../quotes/service';
import { depositReceiptMail, estimatorDepositNote } from './deposit-mail';
import { intentId, isPaidState, type DepositDeps, type DepositMetadata } from './service';

/**
 * What processing did. `unknown`: the event names nothing of ours, so nothing is recorded
 * (not even the event id) but it is acknowledged; `duplicate`: the event id was seen before.
 */
export type WebhookOutcome =
  | { kind: 'recorded'; detail: string }
  | { kind: 'ignored'; detail: string }
  | { kind: 'unknown'; detail: string }
  | { kind: 'duplicate'; detail: string };

interface Handled {
  outcome: WebhookOutcome;
  organizationId: string | null;
  /** A payment that has just become paid: its receipt goes out after the commit. */
  paidPaymentId?: string;
}

const recorded = (organizationId: string, detail: string, paidPaymentId?: string): Handled => ({
  outcome: { kind: 'recorded', detail },
  organizationId,
  ...(paidPaymentId ? { paidPaymentId } : {}),
});
const ignored = (organizationId: string | null, detail: string): Handled => ({ outcome: { kind: 'ignored', detail }, organizationId });
const unknown = (detail: string): Handled => ({ outcome: { kind: 'unknown', detail }, organizationId: null });

function metadataOf(meta: Stripe.Metadata | null | undefined): Partial<DepositMetadata> {
  if (!meta) return {};
  return {
    ...(meta.organizationId ? { organizationId: meta.organizationId } : {}),
    ...(meta.quoteId ? { quoteId: meta.quoteId } : {}),
    ...(meta.approvalId ? { approvalId: meta.approvalId } : {}),
    ...(meta.paymentId ? { paymentId: meta.paymentId } : {}),
  };
}

/** Another firm's metadata on our row (or a row of another firm's) is never applied. */
function firmMismatch(payment: DepositPayment, meta: Partial<DepositMetadata>): boolean {
  return meta.organizationId !== undefined && meta.organizationId !== payment.organization.id;
}

/**
 * The row for a checkout session. When the completed event arrives before the checkout
 * request has committed its row, the row is made here from the session's signed metadata,
 * provided it names an approval of the firm it claims; the checkout request then finds it.
 */
async function paymentForSession(em: EntityManager, session: Stripe.Checkout.Session): Promise<DepositPayment | null> {
  const existing = await em.findOne(DepositPayment, { checkoutSessionId: session.id });
  if (existing) return existing;
  const meta = metadataOf(session.metadata);
  if (!meta.organizationId || !meta.quoteId || !meta.approvalId || !meta.paymentId) return null;
  const approval = await em.findOne(QuoteApproval, { id: meta.approvalId, organization: meta.organizationId, quote: meta.quoteId });
  if (!approval) return null;
  if (await em.findOne(DepositPayment, { id: meta.paymentId })) return null; // that id belongs to another session
  return em.create(DepositPayment, {
    id: meta.paymentId,
    organization: approval.organization,
    quote: approval.quote,
    approval,
    checkoutSessionId: session.id,
    paymentIntentId: intentId(session.payment_intent),
    amountMinor: approval.depositMinor,
    currency: approval.currency,
    state: 'open',
    failureCode: null,
    paidAt: null,
  });
}

async function paymentForIntent(em: EntityManager, intent: string, meta: Partial<DepositMetadata>): Promise<DepositPayment | null> {
  const byIntent = await em.findOne(DepositPayment, { paymentIntentId: intent });
  if (byIntent) return byIntent;
  if (!meta.paymentId || !meta.organizationId) return null;
  return em.findOne(DepositPayment, { id: meta.paymentId, organization: meta.organizationId });
}

async function onSessionCompleted(em: EntityManager, session: Stripe.Checkout.Session): Promise<Handled> {
  const payment = await paymentForSession(em, session);
  if (!payment) return unknown(`no deposit for checkout session ${session.id}`);
  const org = payment.organization.id;
  if (firmMismatch(payment, metadataOf(session.metadata))) return ignored(org, 'ignored: the session names another firm');
  if (session.payment_status !== 'paid') return ignored(org, `ignored: payment_status ${session.payment_status}`);
  const approval = await em.findOneOrFail(QuoteApproval, payment.approval.id);
  if (session.amount_total !== approval.depositMinor || (session.currency ?? '').toUpperCase() !== approval.currency.toUpperCase())
    return ignored(
      org,
      `ignored: amount mismatch (paid ${session.amount_total ?? 'none'} ${session.currency ?? '?'}, approved deposit ${approval.depositMinor} ${approval.currency})`,
    );
  if (isPaidState(payment.state)) return ignored(org, 'ignored: already recorded as paid');
  payment.state = 'paid';
  payment.paidAt = new Date();
  payment.failureCode = null;
  payment.paymentIntentId = intentId(session.payment_intent) ?? payment.paymentIntentId ?? null;
  const quote = await em.findOneOrFail(Quote, payment.quote.id);
  const revision = await em.findOneOrFail(QuoteRevision, approval.revision.id);
  appendQuoteEvent(em, quote, 'deposit-paid', null, { amountMinor: payment.amountMinor, currency: payment.currency, paymentId: payment.id }, revision);
  return recorded(org, 'recorded: deposit paid', payment.id);
}

async function onPaymentFailed(em: EntityManager, intent: Stripe.PaymentIntent): Promise<Handled> {
  const meta = metadataOf(intent.metadata);
  const payment = await paymentForIntent(em, intent.id, meta);
  if (!payment) return unknown(`no deposit for payment intent ${intent.id}`);
  const org = payment.organization.id;
  if (firmMismatch(payment, meta)) return ignored(org, 'ignored: the payment intent names another firm');
  // a late failure (an earlier attempt on the same checkout) never un-pays a paid deposit
  if (isPaidState(payment.state)) return ignored(org, 'ignored: the deposit is already paid');
  const code = intent.last_payment_error?.decline_code ?? intent.last_payment_error?.code ?? 'payment_failed';
  payment.state = 'failed';
  payment.failureCode = code;
  payment.paymentIntentId = intent.id;
  const quote = await em.findOneOrFail(Quote, payment.quote.id);
  appendQuoteEvent(em, quote, 'deposit-failed', null, { code, amountMinor: payment.amountMinor, currency: payment.currency, paymentId: payment.id });
  return recorded(org, `recorded: card refused (${code})`);
}

async function onSessionExpired(em: EntityManager, session: Stripe.Checkout.Session): Promise<Handled> {
  const payment = await em.findOne(DepositPayment, { checkoutSessionId: session.id });
  if (!payment) return unknown(`no deposit for checkout session ${session.id}`);
  const org = payment.organization.id;
  if (firmMismatch(payment, metadataOf(session.metadata))) return ignored(org, 'ignored: the session names another firm');
  if (payment.state !== 'open' && payment.state !== 'failed') return ignored(org, `ignored: the payment is ${payment.state}`);
  payment.state = 'expired';
  return recorded(org, 'recorded: checkout expired');
}

async function onChargeRefunded(em: EntityManager, charge: Stripe.Charge): Promise<Handled> {
  const intent = intentId(charge.payment_intent);
  const payment = intent ? await paymentForIntent(em, intent, metadataOf(charge.metadata)) : null;
  if (!payment) return unknown(`no deposit for charge ${charge.id}`);
  const org = payment.organization.id;
  if (!isPaidState(payment.state)) return ignored(org, `ignored: the payment is ${payment.state}`);
  if ((charge.currency ?? '').toUpperCase() !== payment.currency.toUpperCase()) return ignored(org, 'ignored: currency mismatch');
  // amount_refunded is the charge's running total, so a replay or an earlier event changes nothing
  const total = Math.min(charge.amount_refunded, payment.amountMinor);
  if (total <= payment.refundedMinor) return ignored(org, 'ignored: refund already recorded');
  const delta = total - payment.refundedMinor;
  payment.refundedMinor = total;
  payment.state = total >= payment.amountMinor ? 'refunded' : 'partly-refunded';
  const quote = await em.findOneOrFail(Quote, payment.quote.id);
  appendQuoteEvent(em, quote, 'refunded', null, { amountMinor: delta, currency: payment.currency, paymentId: payment.id, source: 'provider' });
  return recorded(org, 'recorded: refund made at the provider');
}

async function dispatch(em: EntityManager, event: Stripe.Event): Promise<Handled> {
  switch (event.type) {
    case 'checkout.session.completed':
      return onSessionCompleted(em, event.data.object);
    case 'payment_intent.payment_failed':
      return onPaymentFailed(em, event.data.object);
    case 'checkout.session.expired':
      return onSessionExpired(em, event.data.object);
    case 'charge.refunded':
      return onChargeRefunded(em, event.data.object);
    default:
      return ignored(null, `ignored: ${event.type} is not used`);
  }
}

/** Process one verified event. Safe to call any number of times, in any order, in parallel. */
export async function processPaymentEvent(ctx: DepositDeps, em: EntityManager, event: Stripe.Event): Promise<WebhookOutcome> {
  let handled: Handled;
  for (let attempt = 1; ; attempt++) {
    try {
      handled = await em.fork().transactional(async (tx) => {
        if (await tx.findOne(PaymentWebhookEvent, event.id)) return { outcome: { kind: 'duplicate', detail: 'already processed' }, organizationId: null } satisfies Handled;
        const result = await dispatch(tx, event);
        if (result.outcome.kind === 'unknown') {
          tx.clear(); // nothing of an unknown event is written
          return result;
        }
        // the receipts go into the same transaction as the payment: they exist exactly when it does
        if (result.paidPaymentId) await queueReceipts(ctx, tx, result.paidPaymentId);
        tx.create(PaymentWebhookEvent, {
          id: event.id,
          organization: result.organizationId ? tx.getReference(Organization, result.organizationId) : null,
          type: event.type,
          outcome: result.outcome.detail,
        });
        return result;
      });
      break;
    } catch (err) {
      // a parallel delivery of the same event committed first
      if (err instanceof UniqueConstraintViolationException) return { kind: 'duplicate', detail: 'already processed' };
      // a parallel delivery of another event for the same payment committed first (PostgreSQL runs
      // them side by side; SQLite one after the other): handle this one again, against what it wrote
      if (err instanceof OptimisticLockError && attempt < 3) continue;
      throw err;
    }
  }
  if (handled.outcome.kind === 'ignored' && handled.outcome.detail.startsWith('ignored: amount mismatch'))
    ctx.deps.logger.error(`payment webhook ${event.id}: ${handled.outcome.detail}`);
  return handled.outcome;
}

/**
 * The homeowner's receipt and the estimator's note, put into the payment's transaction `em`
 * (the outbox delivers them once it commits). A receipt that cannot be written is logged; the
 * payment stands.
 */
async function queueReceipts(ctx: DepositDeps, em: EntityManager, paymentId: string): Promise<void> {
  const { deps } = ctx;
  try {
    const payment = await em.findOneOrFail(DepositPayment, paymentId);
    const quote = await em.findOneOrFail(Quote, payment.quote.id, { populate: ['organization', 'estimator'] });
    const approval = await em.findOneOrFail(QuoteApproval, payment.approval.id);
    const revision = await em.findOneOrFail(QuoteRevision, approval.revision.id);
    const customer = await em.findOneOrFail(Customer, quote.customer.id);
    const estimator = await em.findOneOrFail(User, quote.estimator.id);
    const { locale } = revisionSettings(revision);
    const amount = formatMoney(payment.amountMinor, payment.currency, locale);
    const reference = formatQuoteNumber(quote.number);
    const paidOn = new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'long', year: 'numeric' }).format(payment.paidAt ?? new Date());
    if (customer.email) {
      const mail = depositReceiptMail({
        customerName: customer.name,
        firmName: quote.organization.name,
        reference,
        amount,
        paidOn,
        paymentReference: payment.paymentIntentId ?? payment.checkoutSessionId,
        portalLink: null,
      });
      await deps.mailer.send(
        { to: customer.email, fromName: senderNameOf(quote.organization as Organization), ...mail },
        { em, kind: 'deposit-receipt', organizationId: quote.organization.id },
      );
    }
    const note = estimatorDepositNote({
      estimatorName: estimator.name,
      customerName: customer.name,
      reference,
      amount,
      quoteLink: `${deps.config.publicUrl}/quotes/${quote.id}`,
    });
    await deps.mailer.send({ to: estimator.email, ...note }, { em, kind: 'deposit-note', organizationId: quote.organization.id });
  } catch (err) {
    deps.logger.error(`deposit ${paymentId}: the receipt e-mail could not be queued`, err);
  }
}
