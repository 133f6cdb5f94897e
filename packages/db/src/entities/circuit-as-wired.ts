import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Circuit } from './circuit';
import { Organization } from './organization';
import { User } from './user';

const p = defineEntity.properties;

/**
 * What was actually connected on site for one circuit of a quote revision: the terminal
 * schedule as wired, block by block (JSON validated by the contracts, each terminal's
 * conductor ends), started from the designed schedule and edited by an installer or
 * estimator. `safe` is the engine's wiring check of it at the last save. One per circuit;
 * `version` is the optimistic lock.
 */
export const CircuitAsWired = defineEntity({
  name: 'CircuitAsWired',
  tableName: 'circuit_as_wired',
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    circuit: () => p.manyToOne(Circuit).unique().deleteRule('cascade'),
    blocks: p.json<Record<string, unknown>[]>(),
    safe: p.boolean(),
    recordedBy: () => p.manyToOne(User).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type CircuitAsWired = InferEntity<typeof CircuitAsWired>;
