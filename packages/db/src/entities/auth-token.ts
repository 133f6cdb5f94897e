import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { User } from './user';

const p = defineEntity.properties;

export const AUTH_TOKEN_PURPOSES = ['invite', 'password-reset'] as const;
export type AuthTokenPurpose = (typeof AUTH_TOKEN_PURPOSES)[number];

/**
 * A single-use, expiring token sent by e-mail (invite or password reset). Only the SHA-256
 * of the token is stored; the token itself exists only in the e-mail.
 */
export const AuthToken = defineEntity({
  name: 'AuthToken',
  tableName: 'auth_tokens',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    user: () => p.manyToOne(User).index().deleteRule('cascade'),
    purpose: p.string().$type<AuthTokenPurpose>(),
    tokenHash: p.string().unique(),
    expiresAt: p.datetime(),
    usedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type AuthToken = InferEntity<typeof AuthToken>;
