import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { Quote } from './quote';
import { QuoteRevision } from './quote-revision';
import { User } from './user';

const p = defineEntity.properties;

/**
 * The history of a quote: created, revised, sent, viewed, approved, declined, expired,
 * deposit-paid, refunded... Append-only; the owner's figures are computed from it.
 */
export const QuoteEvent = defineEntity({
  name: 'QuoteEvent',
  tableName: 'quote_events',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    quote: () => p.manyToOne(Quote).index().deleteRule('cascade'),
    revision: () => p.manyToOne(QuoteRevision).nullable(),
    type: p.string().index(),
    /** Who did it: a staff user, or null for the homeowner / the system. */
    actor: () => p.manyToOne(User).nullable(),
    data: p.json<Record<string, unknown>>().onCreate(() => ({})),
    at: p.datetime().onCreate(() => new Date()).index(),
  },
});
export type QuoteEvent = InferEntity<typeof QuoteEvent>;
