import { randomBytes } from 'node:crypto';
import type Stripe from 'stripe';

/**
 * The provider objects the fake keeps, typed with the official SDK's own definitions (a
 * subset of fields via Pick, so every field we return has the provider's name and type).
 * Expandable references are stored as ids and expanded on the way out.
 */
export type CheckoutSession = Omit<
  Pick<
    Stripe.Checkout.Session,
    | 'id'
    | 'object'
    | 'amount_subtotal'
    | 'amount_total'
    | 'cancel_url'
    | 'client_reference_id'
    | 'client_secret'
    | 'created'
    | 'currency'
    | 'customer'
    | 'customer_details'
    | 'customer_email'
    | 'expires_at'
    | 'livemode'
    | 'locale'
    | 'metadata'
    | 'mode'
    | 'payment_intent'
    | 'payment_method_types'
    | 'payment_status'
    | 'status'
    | 'submit_type'
    | 'success_url'
    | 'total_details'
    | 'ui_mode'
    | 'url'
  >,
  'payment_intent' | 'customer'
> & { payment_intent: string | null; customer: null };

export type PaymentIntent = Omit<
  Pick<
    Stripe.PaymentIntent,
    | 'id'
    | 'object'
    | 'amount'
    | 'amount_capturable'
    | 'amount_received'
    | 'canceled_at'
    | 'cancellation_reason'
    | 'capture_method'
    | 'client_secret'
    | 'confirmation_method'
    | 'created'
    | 'currency'
    | 'customer'
    | 'description'
    | 'last_payment_error'
    | 'latest_charge'
    | 'livemode'
    | 'metadata'
    | 'next_action'
    | 'payment_method'
    | 'payment_method_types'
    | 'receipt_email'
    | 'status'
  >,
  'latest_charge' | 'payment_method' | 'customer'
> & { latest_charge: string | null; payment_method: string | null; customer: null };

export type Charge = Omit<
  Pick<
    Stripe.Charge,
    | 'id'
    | 'object'
    | 'amount'
    | 'amount_captured'
    | 'amount_refunded'
    | 'balance_transaction'
    | 'billing_details'
    | 'captured'
    | 'created'
    | 'currency'
    | 'customer'
    | 'description'
    | 'disputed'
    | 'failure_code'
    | 'failure_message'
    | 'livemode'
    | 'metadata'
    | 'outcome'
    | 'paid'
    | 'payment_intent'
    | 'payment_method'
    | 'receipt_email'
    | 'receipt_url'
    | 'refunded'
    | 'status'
  >,
  'payment_intent' | 'customer' | 'balance_transaction'
> & { payment_intent: string; customer: null; balance_transaction: null };

export type Refund = Omit<
  Pick<
    Stripe.Refund,
    | 'id'
    | 'object'
    | 'amount'
    | 'balance_transaction'
    | 'charge'
    | 'created'
    | 'currency'
    | 'customer'
    | 'metadata'
    | 'payment_intent'
    | 'reason'
    | 'receipt_number'
    | 'status'
  >,
  'charge' | 'payment_intent' | 'customer' | 'balance_transaction'
> & { charge: string; payment_intent: string; customer: null; balance_transaction: null };

export type ProviderObject = CheckoutSession | PaymentIntent | Charge | Refund;

/** The event types the fake emits (all from the provider's published list). */
export type EventType = Extract<
  Stripe.Event.Type,
  | 'checkout.session.completed'
  | 'checkout.session.expired'
  | 'payment_intent.created'
  | 'payment_intent.succeeded'
  | 'payment_intent.payment_failed'
  | 'charge.succeeded'
  | 'charge.failed'
  | 'charge.refunded'
  | 'refund.created'
>;

export interface ProviderEvent {
  id: string;
  object: 'event';
  api_version: string | null;
  created: number;
  data: { object: ProviderObject; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: EventType;
}

export interface ListObject<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

/** Test-mode ids in the provider's style: a type prefix and random base62 text. */
export function newId(prefix: string, length = 24): string {
  const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += alphabet[b % alphabet.length];
  return `${prefix}_${out}`;
}
