import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Circuit } from './circuit';
import { Organization } from './organization';
import { Quote } from './quote';
import { User } from './user';

const p = defineEntity.properties;

/**
 * The commissioning sheet of one circuit of an approved job (the quote): readings measured
 * on site by key (volts, amps, megohms) and the checks ticked, as JSON validated by the
 * contracts, with a note. `flagged` counts readings outside the expected range at the last
 * save. One per circuit; `version` is the optimistic lock.
 */
export const CommissioningRecord = defineEntity({
  name: 'CommissioningRecord',
  tableName: 'commissioning_records',
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    quote: () => p.manyToOne(Quote).index().deleteRule('cascade'),
    circuit: () => p.manyToOne(Circuit).unique().deleteRule('cascade'),
    readings: p.json<Record<string, number | null>>(),
    checks: p.json<Record<string, boolean>>(),
    note: p.string().default(''),
    flagged: p.integer().default(0),
    recordedBy: () => p.manyToOne(User).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type CommissioningRecord = InferEntity<typeof CommissioningRecord>;
