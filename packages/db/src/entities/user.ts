import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';

const p = defineEntity.properties;

export const ROLES = ['owner', 'estimator', 'installer'] as const;
export type Role = (typeof ROLES)[number];

/** A person at the firm who signs in. Invited users have no password until they accept. */
export const User = defineEntity({
  name: 'User',
  tableName: 'users',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    email: p.string().unique(),
    name: p.string(),
    passwordHash: p.string().nullable(),
    // A plain string column: MikroORM 6.6.16's SQLite schema reader misparses check constraints of
    // three or more enum items, so enums live in the type and in the contracts' validation.
    role: p.string().$type<Role>(),
    active: p.boolean().default(true),
    createdAt: p.datetime().onCreate(() => new Date()),
    lastSignInAt: p.datetime().nullable(),
    version: p.integer().version(),
  },
});
export type User = InferEntity<typeof User>;
