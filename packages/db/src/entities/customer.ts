import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';

const p = defineEntity.properties;

/** A homeowner or client of the firm. One customer may have several sites. */
export const Customer = defineEntity({
  name: 'Customer',
  tableName: 'customers',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    name: p.string(),
    email: p.string().nullable(),
    phone: p.string().nullable(),
    notes: p.text().default(''),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Customer = InferEntity<typeof Customer>;
