import { DeadlockException, DriverException, LockWaitTimeoutException } from '@mikro-orm/core';

/** PostgreSQL SQLSTATEs for "another transaction holds what you need": lock_not_available, query_canceled by lock_timeout. */
const POSTGRES_LOCK_STATES = new Set(['55P03']);

/**
 * True when a statement failed only because another connection held a lock, so nothing was
 * written and trying again shortly will very likely work: SQLite's "database is locked" after
 * its busy timeout, PostgreSQL's lock timeout, a deadlock or a serialization failure.
 */
export function isDatabaseBusy(err: unknown): boolean {
  if (err instanceof LockWaitTimeoutException || err instanceof DeadlockException) return true;
  return err instanceof DriverException && err.code !== undefined && POSTGRES_LOCK_STATES.has(err.code);
}
