import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { Organization } from './organization';

const p = defineEntity.properties;

/**
 * A payment-provider event the api has processed, keyed by the provider's event id: a
 * replayed or retried delivery finds its row and records nothing twice.
 */
export const PaymentWebhookEvent = defineEntity({
  name: 'PaymentWebhookEvent',
  tableName: 'payment_webhook_events',
  properties: {
    /** The provider's event id (evt_...). */
    id: p.string().primary(),
    organization: () => p.manyToOne(Organization).nullable().index(),
    type: p.string(),
    /** What processing did: recorded, ignored (and why). */
    outcome: p.string(),
    receivedAt: p.datetime().onCreate(() => new Date()),
  },
});
export type PaymentWebhookEvent = InferEntity<typeof PaymentWebhookEvent>;
