import { ApiError, invalidParam, missingParam, noSuch } from './api-error';
import { metadata, optInt, optList, optObject, optString, rejectUnknown, reqString, type Params } from './form-params';
import {
  newId,
  type Charge,
  type CheckoutSession,
  type EventType,
  type ListObject,
  type PaymentIntent,
  type ProviderEvent,
  type ProviderObject,
  type Refund,
} from './objects';
import { formatAmount, isCurrency } from './money';
import { outcomeForCard } from './test-cards';

/** Who asked: fills the event's `request` field and its `api_version`. */
export interface RequestContext {
  requestId: string | null;
  idempotencyKey: string | null;
  apiVersion: string | null;
}
const NO_REQUEST: RequestContext = { requestId: null, idempotencyKey: null, apiVersion: null };

export interface LineItemRecord {
  name: string;
  description: string | null;
  unitAmount: number;
  quantity: number;
}

export interface SessionRecord {
  session: CheckoutSession;
  lineItems: LineItemRecord[];
  intentMetadata: Record<string, string>;
  intentDescription: string | null;
  apiVersion: string | null;
}

export interface CardDetails {
  /** Digits only. */
  number: string;
  expMonth: number;
  expYear: number;
  name: string;
}

export type PaymentAttempt =
  | { kind: 'succeeded'; session: CheckoutSession }
  | { kind: 'declined'; message: string; code: string; session: CheckoutSession }
  | { kind: 'not_open'; session: CheckoutSession };

export interface StoreOptions {
  /** Milliseconds since the epoch (tests may pass a movable clock). */
  now: () => number;
  hostedPageUrl: (sessionId: string) => string;
  /** Called for every event; `orderingKey` is the checkout session it belongs to. */
  onEvent: (event: ProviderEvent, orderingKey: string) => void;
  /** How many webhook endpoints will be sent an event created now (0 or 1). */
  pendingWebhooks: () => number;
}

/** Provider limits for expires_at: 30 minutes to 24 hours after creation (from memory). */
const MIN_EXPIRY_S = 30 * 60;
const MAX_EXPIRY_S = 24 * 60 * 60;
/** GBP minimum charge £0.30 (REFERENCES.md, provider's minimums table [memory]). */
const MINIMUM_AMOUNT: Readonly<Record<string, number>> = { gbp: 30 };
const REFUND_REASONS = ['duplicate', 'fraudulent', 'requested_by_customer'] as const;

function validUrl(value: string, param: string): string {
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    throw invalidParam(param, `Not a valid URL: ${param}`, 'url_invalid');
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:')
    throw invalidParam(param, `Not a valid URL: ${param}`, 'url_invalid');
  return value;
}

export class PaymentStore {
  private readonly sessions = new Map<string, SessionRecord>();
  private readonly intents = new Map<string, PaymentIntent>();
  private readonly charges = new Map<string, Charge>();
  private readonly refunds = new Map<string, Refund>();
  private readonly events: ProviderEvent[] = [];
  private readonly sessionOfIntent = new Map<string, string>();

  constructor(private readonly options: StoreOptions) {}

  private nowS(): number {
    return Math.floor(this.options.now() / 1000);
  }

  private emit(
    type: EventType,
    object: ProviderObject,
    orderingKey: string,
    ctx: RequestContext,
    previous?: Record<string, unknown>,
  ): void {
    const record = this.sessions.get(orderingKey);
    const event: ProviderEvent = {
      id: newId('evt_test'),
      object: 'event',
      api_version: ctx.apiVersion ?? record?.apiVersion ?? null,
      created: this.nowS(),
      data: { object: structuredClone(object), ...(previous ? { previous_attributes: previous } : {}) },
      livemode: false,
      pending_webhooks: this.options.pendingWebhooks(),
      request: { id: ctx.requestId, idempotency_key: ctx.idempotencyKey },
      type,
    };
    this.events.push(event);
    this.options.onEvent(event, orderingKey);
  }

  // ---- checkout sessions -------------------------------------------------------------

  createCheckoutSession(params: Params, ctx: RequestContext): CheckoutSession {
    rejectUnknown(params, [
      'mode',
      'line_items',
      'success_url',
      'cancel_url',
      'client_reference_id',
      'customer_email',
      'metadata',
      'payment_intent_data',
      'expires_at',
      'payment_method_types',
      'locale',
      'expand',
    ]);
    const mode = reqString(params, 'mode');
    if (mode !== 'payment') {
      throw invalidParam(
        'mode',
        `Invalid mode: the local payment fake implements mode=payment only (got '${mode}').`,
        'parameter_invalid_string',
      );
    }
    const items = optList(params, 'line_items');
    if (!items || items.length === 0) throw missingParam('line_items');
    let currency: string | undefined;
    const lineItems: LineItemRecord[] = items.map((item, i) => {
      const at = `line_items[${i}]`;
      rejectUnknown(item, ['price_data', 'quantity', 'price'], at);
      if (item.price !== undefined) {
        throw invalidParam(
          `${at}[price]`,
          'Stored prices are not implemented by the local payment fake: send price_data.',
          'parameter_unknown',
        );
      }
      const priceData = optObject(item, 'price_data', `${at}[price_data]`);
      if (!priceData) throw missingParam(`${at}[price_data]`);
      rejectUnknown(priceData, ['currency', 'unit_amount', 'product_data'], `${at}[price_data]`);
      const itemCurrency = reqString(priceData, 'currency', `${at}[price_data][currency]`).toLowerCase();
      if (!isCurrency(itemCurrency)) {
        throw invalidParam(`${at}[price_data][currency]`, `Invalid currency: ${itemCurrency}.`, 'parameter_invalid_string');
      }
      if (currency && itemCurrency !== currency) {
        throw invalidParam(
          `${at}[price_data][currency]`,
          'All line items must use the same currency.',
          'parameter_invalid_string',
        );
      }
      currency = itemCurrency;
      const unitAmount = optInt(priceData, 'unit_amount', `${at}[price_data][unit_amount]`, 0, 99_999_999);
      if (unitAmount === undefined) throw missingParam(`${at}[price_data][unit_amount]`);
      const product = optObject(priceData, 'product_data', `${at}[price_data][product_data]`);
      if (!product) throw missingParam(`${at}[price_data][product_data]`);
      rejectUnknown(product, ['name', 'description'], `${at}[price_data][product_data]`);
      const name = reqString(product, 'name', `${at}[price_data][product_data][name]`);
      const description = optString(product, 'description', `${at}[price_data][product_data][description]`) ?? null;
      const quantity = optInt(item, 'quantity', `${at}[quantity]`, 1, 999_999);
      if (quantity === undefined) throw missingParam(`${at}[quantity]`);
      return { name, description, unitAmount, quantity };
    });
    const cur = currency as string;
    const amount = lineItems.reduce((sum, li) => sum + li.unitAmount * li.quantity, 0);
    const minimum = MINIMUM_AMOUNT[cur] ?? 1;
    if (amount < minimum) {
      throw invalidParam(
        'line_items',
        `The Checkout Session's total amount due must add up to at least ${formatAmount(minimum, cur)}.`,
        'amount_too_small',
      );
    }
    const methods = params.payment_method_types;
    if (methods !== undefined && !(Array.isArray(methods) && methods.every((m) => m === 'card'))) {
      throw invalidParam('payment_method_types', 'The local payment fake takes cards only: payment_method_types[0]=card.');
    }
    const successUrl = optString(params, 'success_url');
    const cancelUrl = optString(params, 'cancel_url');
    const clientReferenceId = optString(params, 'client_reference_id') ?? null;
    if (clientReferenceId && clientReferenceId.length > 200) {
      throw invalidParam(
        'client_reference_id',
        'client_reference_id can be at most 200 characters long.',
        'string_length_exceeds_maximum',
      );
    }
    const customerEmail = optString(params, 'customer_email') ?? null;
    if (customerEmail !== null && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(customerEmail)) {
      throw invalidParam('customer_email', `Invalid email address: ${customerEmail}`, 'email_invalid');
    }
    const intentData = optObject(params, 'payment_intent_data') ?? {};
    rejectUnknown(intentData, ['metadata', 'description'], 'payment_intent_data');
    const created = this.nowS();
    const expiresAt = optInt(params, 'expires_at') ?? created + MAX_EXPIRY_S;
    if (expiresAt < created + MIN_EXPIRY_S) {
      throw invalidParam(
        'expires_at',
        'The `expires_at` timestamp must be at least 30 minutes from Checkout Session creation.',
        'parameter_invalid_integer',
      );
    }
    if (expiresAt > created + MAX_EXPIRY_S) {
      throw invalidParam(
        'expires_at',
        'The `expires_at` timestamp must be less than 24 hours from Checkout Session creation.',
        'parameter_invalid_integer',
      );
    }
    const locale = optString(params, 'locale');
    const id = newId('cs_test', 58);
    const session: CheckoutSession = {
      id,
      object: 'checkout.session',
      amount_subtotal: amount,
      amount_total: amount,
      cancel_url: cancelUrl ? validUrl(cancelUrl, 'cancel_url') : null,
      client_reference_id: clientReferenceId,
      client_secret: null,
      created,
      currency: cur,
      customer: null,
      customer_details: null,
      customer_email: customerEmail,
      expires_at: expiresAt,
      livemode: false,
      locale: (locale ?? null) as CheckoutSession['locale'],
      metadata: metadata(params),
      mode: 'payment',
      // Since API version 2022-08-01 the payment intent is created when the customer pays.
      payment_intent: null,
      payment_method_types: ['card'],
      payment_status: 'unpaid',
      status: 'open',
      submit_type: null,
      success_url: successUrl ? validUrl(successUrl, 'success_url') : null,
      total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
      ui_mode: 'hosted',
      url: this.options.hostedPageUrl(id),
    };
    this.sessions.set(id, {
      session,
      lineItems,
      intentMetadata: metadata(intentData, 'metadata', 'payment_intent_data[metadata]'),
      intentDescription: optString(intentData, 'description', 'payment_intent_data[description]') ?? null,
      apiVersion: ctx.apiVersion,
    });
    return session;
  }

  /** The session record, after applying any expiry that has come due. */
  sessionRecord(id: string): SessionRecord {
    this.sweepExpired();
    const record = this.sessions.get(id);
    if (!record) throw noSuch('checkout.session', id, 'session');
    return record;
  }

  expireSession(id: string, ctx: RequestContext): CheckoutSession {
    const record = this.sessionRecord(id);
    if (record.session.status !== 'open') {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${record.session.status}".`,
        'checkout_session_unexpected_state',
      );
    }
    this.markExpired(record, ctx);
    return record.session;
  }

  /** Open sessions whose expires_at has passed become expired (and emit checkout.session.expired). */
  sweepExpired(): void {
    const now = this.nowS();
    for (const record of this.sessions.values()) {
      if (record.session.status === 'open' && record.session.expires_at <= now) this.markExpired(record, NO_REQUEST);
    }
  }

  private markExpired(record: SessionRecord, ctx: RequestContext): void {
    const s = record.session;
    s.status = 'expired';
    s.url = null;
    // An abandoned attempt's payment intent is cancelled with the session (from memory).
    const intent = s.payment_intent ? this.intents.get(s.payment_intent) : undefined;
    if (intent && intent.status === 'requires_payment_method') {
      intent.status = 'canceled';
      intent.canceled_at = this.nowS();
      intent.cancellation_reason = 'abandoned';
    }
    this.emit('checkout.session.expired', s, s.id, ctx);
  }

  // ---- paying on the hosted page -------------------------------------------------------

  pay(sessionId: string, card: CardDetails): PaymentAttempt {
    const record = this.sessionRecord(sessionId);
    const s = record.session;
    if (s.status !== 'open') return { kind: 'not_open', session: s };
    const now = this.nowS();
    let intent = s.payment_intent ? this.intents.get(s.payment_intent) : undefined;
    if (!intent) {
      const id = newId('pi_test');
      intent = {
        id,
        object: 'payment_intent',
        amount: s.amount_total ?? 0,
        amount_capturable: 0,
        amount_received: 0,
        canceled_at: null,
        cancellation_reason: null,
        capture_method: 'automatic_async',
        client_secret: `${id}_secret_${newId('x', 24).slice(2)}`,
        confirmation_method: 'automatic',
        created: now,
        currency: s.currency ?? 'gbp',
        customer: null,
        description: record.intentDescription,
        last_payment_error: null,
        latest_charge: null,
        livemode: false,
        metadata: { ...record.intentMetadata },
        next_action: null,
        payment_method: null,
        payment_method_types: ['card'],
        receipt_email: null,
        status: 'requires_payment_method',
      };
      this.intents.set(id, intent);
      this.sessionOfIntent.set(id, s.id);
      s.payment_intent = id;
      this.emit('payment_intent.created', intent, s.id, NO_REQUEST);
    }
    const outcome = outcomeForCard(card.number);
    const paymentMethod = newId('pm_test');
    const approved = outcome.kind === 'succeed';
    const charge: Charge = {
      id: newId('ch_test'),
      object: 'charge',
      amount: intent.amount,
      amount_captured: approved ? intent.amount : 0,
      amount_refunded: 0,
      balance_transaction: null,
      billing_details: { address: null, email: s.customer_email, name: card.name, phone: null, tax_id: null },
      captured: approved,
      created: now,
      currency: intent.currency,
      customer: null,
      description: intent.description,
      disputed: false,
      failure_code: approved ? null : outcome.code,
      failure_message: approved ? null : outcome.message,
      livemode: false,
      metadata: { ...intent.metadata },
      outcome: approved
        ? {
            advice_code: null,
            network_advice_code: null,
            network_decline_code: null,
            network_status: 'approved_by_network',
            reason: null,
            risk_level: 'normal',
            seller_message: 'Payment complete.',
            type: 'authorized',
          }
        : {
            advice_code: null,
            network_advice_code: null,
            network_decline_code: null,
            network_status: 'declined_by_network',
            reason: outcome.declineCode ?? outcome.code,
            risk_level: 'normal',
            seller_message: 'The bank did not return any further details with this decline.',
            type: 'issuer_declined',
          },
      paid: approved,
      payment_intent: intent.id,
      payment_method: paymentMethod,
      receipt_email: null,
      receipt_url: null,
      refunded: false,
      status: approved ? 'succeeded' : 'failed',
    };
    this.charges.set(charge.id, charge);
    intent.latest_charge = charge.id;
    if (outcome.kind === 'succeed') {
      intent.status = 'succeeded';
      intent.amount_received = intent.amount;
      intent.payment_method = paymentMethod;
      intent.last_payment_error = null;
      s.status = 'complete';
      s.payment_status = 'paid';
      s.url = null;
      s.customer_details = {
        address: null,
        business_name: null,
        email: s.customer_email,
        individual_name: null,
        name: card.name,
        phone: null,
        tax_exempt: 'none',
        tax_ids: [],
      };
      this.emit('charge.succeeded', charge, s.id, NO_REQUEST);
      this.emit('payment_intent.succeeded', intent, s.id, NO_REQUEST);
      this.emit('checkout.session.completed', s, s.id, NO_REQUEST);
      return { kind: 'succeeded', session: s };
    }
    intent.status = 'requires_payment_method';
    intent.payment_method = null;
    intent.last_payment_error = {
      type: 'card_error',
      code: outcome.code,
      ...(outcome.declineCode ? { decline_code: outcome.declineCode } : {}),
      message: outcome.message,
      charge: charge.id,
      payment_method_type: 'card',
    };
    this.emit('charge.failed', charge, s.id, NO_REQUEST);
    this.emit('payment_intent.payment_failed', intent, s.id, NO_REQUEST);
    return { kind: 'declined', message: outcome.message, code: outcome.code, session: s };
  }

  // ---- payment intents, charges, refunds, events ---------------------------------------

  paymentIntent(id: string, param = 'intent'): PaymentIntent {
    const intent = this.intents.get(id);
    if (!intent) throw noSuch('payment_intent', id, param);
    return intent;
  }

  charge(id: string, param = 'charge'): Charge {
    const charge = this.charges.get(id);
    if (!charge) throw noSuch('charge', id, param);
    return charge;
  }

  refund(id: string): Refund {
    const refund = this.refunds.get(id);
    if (!refund) throw noSuch('refund', id, 'refund');
    return refund;
  }

  createRefund(params: Params, ctx: RequestContext): Refund {
    rejectUnknown(params, ['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'expand']);
    const intentId = optString(params, 'payment_intent');
    const chargeId = optString(params, 'charge');
    if (!intentId && !chargeId) throw missingParam('payment_intent');
    let charge: Charge;
    let intent: PaymentIntent;
    if (intentId) {
      intent = this.paymentIntent(intentId, 'payment_intent');
      const latest = intent.latest_charge ? this.charges.get(intent.latest_charge) : undefined;
      if (intent.status !== 'succeeded' || !latest || latest.status !== 'succeeded') {
        throw new ApiError(
          400,
          'invalid_request_error',
          `This PaymentIntent (${intent.id}) does not have a successful charge to refund.`,
          'payment_intent_unexpected_state',
          'payment_intent',
        );
      }
      if (chargeId && chargeId !== latest.id)
        throw invalidParam('charge', `Charge ${chargeId} does not belong to PaymentIntent ${intent.id}.`);
      charge = latest;
    } else {
      charge = this.charge(chargeId as string);
      intent = this.paymentIntent(charge.payment_intent);
      if (charge.status !== 'succeeded') {
        throw new ApiError(
          400,
          'invalid_request_error',
          `Charge ${charge.id} has not succeeded and cannot be refunded.`,
          'charge_not_refundable',
          'charge',
        );
      }
    }
    const remaining = charge.amount - charge.amount_refunded;
    if (remaining <= 0) {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Charge ${charge.id} has already been refunded.`,
        'charge_already_refunded',
      );
    }
    const amount = optInt(params, 'amount', 'amount', 1) ?? remaining;
    if (amount > remaining) {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Refund amount (${formatAmount(amount, charge.currency)}) is greater than unrefunded amount on charge (${formatAmount(remaining, charge.currency)})`,
        'amount_too_large',
        'amount',
      );
    }
    const reason = optString(params, 'reason') ?? null;
    if (reason !== null && !(REFUND_REASONS as readonly string[]).includes(reason)) {
      throw invalidParam('reason', `Invalid reason: must be one of ${REFUND_REASONS.join(', ')}`, 'parameter_invalid_string');
    }
    const refund: Refund = {
      id: newId('re_test'),
      object: 'refund',
      amount,
      balance_transaction: null,
      charge: charge.id,
      created: this.nowS(),
      currency: charge.currency,
      customer: null,
      metadata: metadata(params),
      payment_intent: intent.id,
      reason: reason as Refund['reason'],
      receipt_number: null,
      status: 'succeeded',
    };
    this.refunds.set(refund.id, refund);
    const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded === charge.amount;
    const key = this.sessionOfIntent.get(intent.id) ?? intent.id;
    this.emit('charge.refunded', charge, key, ctx, previous);
    this.emit('refund.created', refund, key, ctx);
    return refund;
  }

  event(id: string): ProviderEvent {
    const event = this.events.find((e) => e.id === id);
    if (!event) throw noSuch('event', id, 'id');
    return event;
  }

  /** Newest first; `limit` 1-100 (default 10), `starting_after`, `ending_before`, `type`. */
  listEvents(params: Params): ListObject<ProviderEvent> {
    this.sweepExpired();
    rejectUnknown(params, ['limit', 'starting_after', 'ending_before', 'type', 'expand']);
    const limit = optInt(params, 'limit', 'limit', 1, 100) ?? 10;
    const type = optString(params, 'type');
    const startingAfter = optString(params, 'starting_after');
    const endingBefore = optString(params, 'ending_before');
    let list = [...this.events].reverse();
    if (type) {
      const pattern = new RegExp(`^${type.replace(/[.+?^${}()|[\]\\]/g, '\\$&').replace(/\*/g, '[^.]+')}$`);
      list = list.filter((e) => pattern.test(e.type));
    }
    if (startingAfter) {
      const at = list.findIndex((e) => e.id === startingAfter);
      if (at < 0) throw noSuch('event', startingAfter, 'starting_after');
      list = list.slice(at + 1);
    }
    if (endingBefore) {
      const at = list.findIndex((e) => e.id === endingBefore);
      if (at < 0) throw noSuch('event', endingBefore, 'ending_before');
      list = list.slice(Math.max(0, at - limit), at);
    }
    return { object: 'list', data: list.slice(0, limit), has_more: list.length > limit, url: '/v1/events' };
  }

  /** Any stored object by id, for `expand[]`. */
  byId(id: string): ProviderObject | undefined {
    return this.sessions.get(id)?.session ?? this.intents.get(id) ?? this.charges.get(id) ?? this.refunds.get(id);
  }
}
