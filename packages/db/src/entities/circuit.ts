import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { QuoteRevision } from './quote-revision';

const p = defineEntity.properties;

export const CIRCUIT_KINDS = ['constant-current', 'constant-voltage'] as const;
export type CircuitKind = (typeof CIRCUIT_KINDS)[number];

/**
 * One circuit of a quote revision: a constant-current string on a driver or constant-voltage
 * runs on a supply, in an area of the garden. The design (products, placements, cable runs,
 * acknowledged findings) is JSON validated by the contracts; `result` is the engine's check of
 * it, recomputed and stored on every save. `version` is the optimistic lock.
 */
export const Circuit = defineEntity({
  name: 'Circuit',
  tableName: 'circuits',
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    revision: () => p.manyToOne(QuoteRevision).index().deleteRule('cascade'),
    area: p.string(),
    name: p.string().default(''),
    kind: p.string().$type<CircuitKind>(),
    position: p.integer(),
    design: p.json<Record<string, unknown>>(),
    result: p.json<Record<string, unknown>>(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Circuit = InferEntity<typeof Circuit>;
