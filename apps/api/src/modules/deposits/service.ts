/**
 * Deposits: starting a checkout for an approved quote, the state the portal's return page
 * polls, the staff list and refunds. Only the provider's signed webhook (webhook.ts) marks a
 * payment paid; nothing here trusts the browser about money.
 */
import {
  PAID_DEPOSIT_STATES,
  depositFailureMessage,
  formatQuoteNumber,
  portalQuotePath,
  type DepositCheckoutResponse,
  type DepositPaymentState,
  type PortalDepositState,
  type QuoteDepositsResponse,
} from '@gloaming/contracts';
import {
  Customer,
  DepositPayment,
  QuoteApproval,
  UniqueConstraintViolationException,
  newId,
  type EntityManager,
  type Quote,
  type QuoteRevision,
} from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { badRequest, conflict, HttpError, notFound } from '../../http/problem';
import { type PortalAccess as FullPortalAccess } from '../portal/portal-access';
import { appendQuoteEvent, type Actor } from '../quotes/service';
import { callProvider, isProviderError, providerUnavailable, type PaymentClient } from './payment-client';
import { presentDepositPayment, refundableMinor } from './presenter';

export interface DepositDeps {
  deps: ModuleDeps;
  stripe: PaymentClient;
}

/** What the portal's token check gives us (resolvePortalAccess); only these parts are used here. */
export type PortalAccess = Pick<FullPortalAccess, 'quote' | 'revision' | 'organization'>;

/** The provider writes currencies in lower case; we keep ISO 4217 upper case. */
export const providerCurrency = (currency: string) => currency.toLowerCase();
const sameCurrency = (a: string | null | undefined, b: string) => (a ?? '').toUpperCase() === b.toUpperCase();

export const isPaidState = (state: DepositPaymentState) => PAID_DEPOSIT_STATES.includes(state);

/** The metadata every checkout session carries, so a webhook can be tied back to our rows. */
export interface DepositMetadata {
  organizationId: string;
  quoteId: string;
  approvalId: string;
  paymentId: string;
}

async function approvalOf(em: EntityManager, revision: QuoteRevision): Promise<QuoteApproval | null> {
  return em.findOne(QuoteApproval, { revision: revision.id, organization: revision.organization.id });
}

async function paymentsOf(em: EntityManager, approval: QuoteApproval): Promise<DepositPayment[]> {
  return em.find(DepositPayment, { approval: approval.id }, { orderBy: { createdAt: 'desc', id: 'desc' } });
}

/**
 * The approved revision is still the one that stands: no later revision has been sent (a
 * sent one supersedes it). A draft the estimator starts afterwards does not change that.
 */
function isCurrentRevision(access: PortalAccess): boolean {
  return access.revision.state === 'sent';
}

/** GET /api/portal/:token/deposit: what the approved view and the return page show. */
export async function portalDepositState(em: EntityManager, access: PortalAccess, sessionId?: string): Promise<PortalDepositState> {
  const approval = await approvalOf(em, access.revision);
  if (!approval) throw conflict('This quote has not been approved yet, so there is no deposit to pay.');
  const payments = await paymentsOf(em, approval);
  const paid = payments.find((p) => isPaidState(p.state));
  let shown: DepositPayment | undefined;
  if (sessionId) {
    shown = payments.find((p) => p.checkoutSessionId === sessionId);
    if (!shown) throw notFound('That payment');
  } else {
    shown = paid ?? payments[0];
  }
  const current = isCurrentRevision(access);
  return {
    depositMinor: approval.depositMinor,
    currency: approval.currency,
    state: shown?.state ?? 'none',
    failureCode: shown?.state === 'failed' ? (shown.failureCode ?? null) : null,
    failureMessage: shown?.state === 'failed' ? depositFailureMessage(shown.failureCode ?? null) : null,
    paidAt: shown?.paidAt?.toISOString() ?? null,
    refundedMinor: shown?.refundedMinor ?? 0,
    canPay: !paid && current && approval.depositMinor > 0,
  };
}

/**
 * POST /api/portal/:token/deposit/checkout: a checkout session for the approved deposit. The
 * amount is the approval's, computed on the server from the approved totals; the client sends
 * nothing. A still-open session is reused; a provider that cannot be reached is a 503 with
 * nothing recorded (the row is written only after the provider has made the session).
 */
export async function startCheckout(
  ctx: DepositDeps,
  em: EntityManager,
  access: PortalAccess,
  rawToken: string,
): Promise<DepositCheckoutResponse> {
  const { quote, revision } = access;
  if (!isCurrentRevision(access))
    throw conflict('This version of the quote has been replaced by a newer one. Open the latest version to pay its deposit.');
  const approval = await approvalOf(em, revision);
  if (!approval) throw conflict('Approve the quote first; the deposit is asked for once it is approved.');
  if (approval.depositMinor <= 0) throw conflict('This quote asks for no deposit, so there is nothing to pay now.');
  const payments = await paymentsOf(em, approval);
  if (payments.some((p) => isPaidState(p.state))) throw conflict('The deposit for this quote has already been paid.');

  const log = ctx.deps.logger.error;
  const reusable = payments.find((p) => p.state === 'open' || p.state === 'failed');
  if (reusable) {
    const session = await callProvider('retrieve checkout session', log, () =>
      ctx.stripe.checkout.sessions.retrieve(reusable.checkoutSessionId),
    );
    if (
      session.status === 'open' &&
      session.url &&
      session.amount_total === approval.depositMinor &&
      sameCurrency(session.currency, approval.currency)
    )
      return checkoutResponse(reusable.id, session.url, approval);
    if (session.status === 'complete')
      throw new HttpError(
        409,
        'payment-confirming',
        'Your payment is being confirmed',
        'The card payment service has taken this payment and is confirming it with us. This page will show it as paid within a minute.',
      );
    if (session.status === 'expired' && reusable.state === 'open') {
      reusable.state = 'expired';
      await em.flush();
    }
  }

  const customer = await em.findOneOrFail(Customer, quote.customer.id);
  const paymentId = newId();
  const metadata: DepositMetadata = { organizationId: access.organization.id, quoteId: quote.id, approvalId: approval.id, paymentId };
  const reference = formatQuoteNumber(quote.number);
  const portalBase = `${ctx.deps.config.publicUrl}${portalQuotePath(rawToken)}`;
  const session = await callProvider('create checkout session', log, () =>
    ctx.stripe.checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: {
              currency: providerCurrency(approval.currency),
              unit_amount: approval.depositMinor,
              product_data: { name: `Deposit for quotation ${reference}`, description: access.organization.name },
            },
          },
        ],
        client_reference_id: paymentId,
        metadata: { ...metadata },
        payment_intent_data: { metadata: { ...metadata }, description: `Deposit for quotation ${reference}` },
        ...(customer.email ? { customer_email: customer.email } : {}),
        success_url: `${portalBase}/deposit/return?session_id={CHECKOUT_SESSION_ID}`,
        cancel_url: portalBase,
      },
      // a double click sends the same key: the provider answers both with one session
      { idempotencyKey: `gloaming-deposit-${approval.id}-${payments.length + 1}` },
    ),
  );
  if (!session.url) {
    log(`payment provider: checkout session ${session.id} came back without a url`);
    throw providerUnavailable();
  }
  const row = await recordOpenSession(em, access, approval, paymentId, session);
  return checkoutResponse(row.id, session.url, approval);
}

function checkoutResponse(paymentId: string, url: string, approval: QuoteApproval): DepositCheckoutResponse {
  return { url, paymentId, depositMinor: approval.depositMinor, currency: approval.currency };
}

/**
 * Store the session as an open payment. If a row for it exists already (the provider's
 * completed webhook arrived before this commit and recorded it from the session's metadata, or
 * a parallel click stored the same session), that row stands.
 */
export async function recordOpenSession(
  em: EntityManager,
  access: PortalAccess,
  approval: QuoteApproval,
  paymentId: string,
  session: { id: string; payment_intent?: string | { id: string } | null },
): Promise<DepositPayment> {
  const tx = em.fork();
  try {
    const row = tx.create(DepositPayment, {
      id: paymentId,
      organization: access.organization.id,
      quote: access.quote.id,
      approval: approval.id,
      checkoutSessionId: session.id,
      paymentIntentId: intentId(session.payment_intent),
      amountMinor: approval.depositMinor,
      currency: approval.currency,
      state: 'open',
      failureCode: null,
      paidAt: null,
    });
    await tx.flush();
    return row;
  } catch (err) {
    if (!(err instanceof UniqueConstraintViolationException)) throw err;
    const existing = await em.fork().findOne(DepositPayment, { checkoutSessionId: session.id });
    if (!existing) throw err;
    return existing;
  }
}

export function intentId(ref: string | { id: string } | null | undefined): string | null {
  if (!ref) return null;
  return typeof ref === 'string' ? ref : ref.id;
}

/** GET /api/quotes/:id/deposits. */
export async function quoteDeposits(em: EntityManager, quote: Quote): Promise<QuoteDepositsResponse> {
  const approval = await em.findOne(
    QuoteApproval,
    { quote: quote.id, organization: quote.organization.id },
    { orderBy: { approvedAt: 'desc' } },
  );
  const payments = await em.find(
    DepositPayment,
    { quote: quote.id, organization: quote.organization.id },
    { orderBy: { createdAt: 'desc', id: 'desc' } },
  );
  const taken = payments.filter((p) => isPaidState(p.state));
  return {
    approved: approval
      ? { depositMinor: approval.depositMinor, currency: approval.currency, approvedAt: approval.approvedAt.toISOString() }
      : null,
    payments: payments.map(presentDepositPayment),
    paidMinor: taken.reduce((s, p) => s + p.amountMinor, 0),
    refundedMinor: taken.reduce((s, p) => s + p.refundedMinor, 0),
  };
}

/**
 * POST /api/quotes/:id/deposits/:paymentId/refund (owner). The refund is claimed first with a
 * conditional update on the payment's version, so of two submissions at once exactly one goes
 * on to the provider; the provider call carries an idempotency key from the same version, and
 * a provider failure gives the claim back. Records a `refunded` event.
 */
export async function refundDeposit(
  ctx: DepositDeps,
  em: EntityManager,
  quote: Quote,
  paymentId: string,
  requestedMinor: number | undefined,
  actor: Actor,
): Promise<{ payment: DepositPayment; refundedNowMinor: number }> {
  const payment = await em.findOne(DepositPayment, { id: paymentId, quote: quote.id, organization: quote.organization.id });
  if (!payment) throw notFound('That payment');
  const remaining = refundableMinor(payment);
  if (remaining <= 0)
    throw conflict(isPaidState(payment.state) ? 'This deposit has already been refunded in full.' : 'This payment was never taken, so there is nothing to refund.');
  if (!payment.paymentIntentId) throw conflict('The card payment service has not given this payment a reference yet; try again shortly.');
  const amount = requestedMinor ?? remaining;
  if (amount > remaining)
    throw badRequest(`At most ${remaining} (minor units) of this deposit can still be refunded.`, [
      { path: 'body.amountMinor', message: 'That is more than is left to refund.' },
    ]);

  const before = { version: payment.version, refundedMinor: payment.refundedMinor, state: payment.state };
  const after = before.refundedMinor + amount;
  const nextState: DepositPaymentState = after >= payment.amountMinor ? 'refunded' : 'partly-refunded';
  const claimed = await em.nativeUpdate(
    DepositPayment,
    { id: payment.id, version: before.version },
    { refundedMinor: after, state: nextState, version: before.version + 1, updatedAt: new Date() },
  );
  if (claimed !== 1) throw conflict('Another refund of this deposit was made at the same moment. Reload to see it.');

  let refundId: string;
  try {
    const refund = await ctx.stripe.refunds.create(
      { payment_intent: payment.paymentIntentId, amount, metadata: { paymentId: payment.id, quoteId: quote.id } },
      { idempotencyKey: `gloaming-refund-${payment.id}-${before.version}` },
    );
    refundId = refund.id;
  } catch (err) {
    await em.nativeUpdate(
      DepositPayment,
      { id: payment.id, version: before.version + 1 },
      { refundedMinor: before.refundedMinor, state: before.state, version: before.version + 2, updatedAt: new Date() },
    );
    if (isProviderError(err)) {
      ctx.deps.logger.error(`payment provider: refund of ${payment.id} failed (${err.type}${err.code ? `, ${err.code}` : ''}): ${err.message}`);
      if (err.type === 'StripeInvalidRequestError')
        throw conflict(`The card payment service refused this refund: ${err.message}`);
      throw providerUnavailable();
    }
    throw err;
  }
  appendQuoteEvent(
    em,
    quote,
    'refunded',
    actor,
    { amountMinor: amount, currency: payment.currency, paymentId: payment.id, refundId },
  );
  await em.flush();
  await em.refresh(payment);
  return { payment, refundedNowMinor: amount };
}
