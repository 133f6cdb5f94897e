import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Customer } from './customer';
import { Organization } from './organization';
import { Site } from './site';
import { User } from './user';

const p = defineEntity.properties;

export const QUOTE_STATUSES = ['draft', 'sent', 'viewed', 'approved', 'declined', 'expired', 'deposit-paid', 'won', 'lost'] as const;
export type QuoteStatus = (typeof QUOTE_STATUSES)[number];

/**
 * A quote for a customer's site. Its content lives in revisions; `status` is the latest
 * step of its event history (QuoteEvent), kept here for listing and filtering.
 */
export const Quote = defineEntity({
  name: 'Quote',
  tableName: 'quotes',
  uniques: [{ properties: ['organization', 'number'] }],
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    /** Per-firm sequence: shown as Q-0042. */
    number: p.integer(),
    title: p.string().default(''),
    customer: () => p.manyToOne(Customer).index(),
    site: () => p.manyToOne(Site).nullable(),
    estimator: () => p.manyToOne(User).index(),
    status: p.string().$type<QuoteStatus>().index(),
    /** Total incl. VAT of the current revision, minor units, for lists and figures. */
    valueMinor: p.integer().default(0),
    validUntil: p.datetime().nullable(),
    sentAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Quote = InferEntity<typeof Quote>;
