export * from './entities';
export { ormConfig, dialectOf, type DatabaseOptions, type DatabaseDialect } from './config';
export { openDatabase, databaseDialect, migrate, migrationsOutOfDate, seedDemoIfEmpty, databaseStatus, type Database } from './database';
export { isDatabaseBusy } from './database-busy';
export { createScratchDatabase, withDatabaseName, withoutPassword, type ScratchDatabase } from './postgres-scratch';
export { hashPassword, verifyPassword, MIN_PASSWORD_LENGTH } from './passwords';
export { newId, newSecretToken } from './ids';
export { backupDatabase, restoreDatabase, integrityCheck } from './backup';
export { canonicalJson, contentHash } from './content-hash';
export { designSettingsOf, revisionSettingsOf, revisionTotalsOf } from './revision-pricing';
export { findSessionWithUser, type SessionWithUser } from './session-lookup';
export { sqlEm, raw, sqlDialect, jsonValue, jsonNumber, dateParam, dateFromSql, containsIgnoringCase, runPlain } from './sql-query';
export {
  readQuote,
  readRevision,
  readRevisionsWithCurrent,
  readCircuits,
  readProducts,
  saveRevisionDocument,
  type QuoteRow,
  type RevisionRow,
  type RevisionWithContentRow,
  type CircuitRow,
  type ProductRow,
  type RevisionDocumentSave,
  type RevisionDocumentSaved,
} from './quote-reads';
export { DEMO_ACCOUNTS, DEMO_FIRM, type DemoAccount } from './seeders/demo-accounts';
export { DemoSeeder } from './seeders/demo-seeder';
export type { EntityManager } from '@mikro-orm/core';
export { OptimisticLockError, UniqueConstraintViolationException, LockWaitTimeoutException, DeadlockException, RequestContext } from '@mikro-orm/core';
