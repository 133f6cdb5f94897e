import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { QuoteRevision } from './quote-revision';

const p = defineEntity.properties;

/**
 * A homeowner's link to one sent revision. Only the SHA-256 of the token is stored; it
 * expires with the quote and can be revoked.
 */
export const PortalToken = defineEntity({
  name: 'PortalToken',
  tableName: 'portal_tokens',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    revision: () => p.manyToOne(QuoteRevision).index().deleteRule('cascade'),
    tokenHash: p.string().unique(),
    sentTo: p.string(),
    expiresAt: p.datetime(),
    revokedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type PortalToken = InferEntity<typeof PortalToken>;
