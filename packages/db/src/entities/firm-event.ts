import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { User } from './user';

const p = defineEntity.properties;

/**
 * The firm's own history beside its quotes' (QuoteEvent): settings changed, logo replaced,
 * people invited, roles changed, people deactivated or reactivated. Append-only; the owner's
 * activity log reads both.
 */
export const FirmEvent = defineEntity({
  name: 'FirmEvent',
  tableName: 'firm_events',
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    type: p.string(),
    /** Who did it; null for the system. */
    actor: () => p.manyToOne(User).nullable(),
    /** The person it was done to, for team events. */
    subject: () => p.manyToOne(User).nullable(),
    data: p.json<Record<string, unknown>>().onCreate(() => ({})),
    at: p
      .datetime()
      .onCreate(() => new Date())
      .index(),
  },
});
export type FirmEvent = InferEntity<typeof FirmEvent>;
