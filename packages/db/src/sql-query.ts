import type { EntityManager } from '@mikro-orm/core';
import { SqlEntityManager } from '@mikro-orm/sqlite';

/**
 * The SQL side of an entity manager, for queries worth writing with the query builder
 * (aggregates over the event history). Every Gloaming em is one; anything else is a bug.
 */
export function sqlEm(em: EntityManager): SqlEntityManager {
  if (!(em instanceof SqlEntityManager)) throw new Error('Expected a SQL entity manager.');
  return em;
}

export { raw } from '@mikro-orm/sqlite';
