import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { Organization } from './organization';
import { User } from './user';

const p = defineEntity.properties;

/** A signed-in browser. The id is the session cookie value's hash-free identifier (Lucia). */
export const Session = defineEntity({
  name: 'Session',
  tableName: 'sessions',
  properties: {
    id: p.string().primary(),
    user: () => p.manyToOne(User).index().deleteRule('cascade'),
    organization: () => p.manyToOne(Organization).index(),
    expiresAt: p.datetime(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Session = InferEntity<typeof Session>;
