import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { Quote } from './quote';
import { QuoteApproval } from './quote-approval';

const p = defineEntity.properties;

export const DEPOSIT_PAYMENT_STATES = ['open', 'paid', 'failed', 'expired', 'refunded', 'partly-refunded'] as const;
export type DepositPaymentState = (typeof DEPOSIT_PAYMENT_STATES)[number];

/**
 * One attempt to collect an approved quote's deposit through the payment provider: the
 * provider's checkout session (unique, so a webhook can record it at most once), the amount
 * and currency the server asked for (from the approval, never from the client), and what
 * became of it. Refunds add to refundedMinor.
 */
export const DepositPayment = defineEntity({
  name: 'DepositPayment',
  tableName: 'deposit_payments',
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    quote: () => p.manyToOne(Quote).index().deleteRule('cascade'),
    approval: () => p.manyToOne(QuoteApproval).index().deleteRule('cascade'),
    provider: p.string().default('stripe'),
    checkoutSessionId: p.string().unique(),
    paymentIntentId: p.string().nullable().index(),
    amountMinor: p.integer(),
    currency: p.string(),
    state: p.string().$type<DepositPaymentState>().index(),
    /** The provider's reason when a card was refused (e.g. card_declined). */
    failureCode: p.string().nullable(),
    paidAt: p.datetime().nullable(),
    refundedMinor: p.integer().default(0),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type DepositPayment = InferEntity<typeof DepositPayment>;
