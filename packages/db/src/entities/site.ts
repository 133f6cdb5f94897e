import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Customer } from './customer';
import { Organization } from './organization';

const p = defineEntity.properties;

/** A property where the work happens: the address and how to get in. */
export const Site = defineEntity({
  name: 'Site',
  tableName: 'sites',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    customer: () => p.manyToOne(Customer).index().deleteRule('cascade'),
    label: p.string().default(''),
    addressLines: p.text(),
    postcode: p.string().default(''),
    accessNotes: p.text().default(''),
    createdAt: p.datetime().onCreate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Site = InferEntity<typeof Site>;
