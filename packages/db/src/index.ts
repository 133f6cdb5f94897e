export * from './entities';
export { ormConfig, type DatabaseOptions } from './config';
export { openDatabase, migrate, migrationsOutOfDate, seedDemoIfEmpty, databaseStatus, type Database } from './database';
export { hashPassword, verifyPassword, MIN_PASSWORD_LENGTH } from './passwords';
export { newId, newSecretToken } from './ids';
export { DEMO_ACCOUNTS, DEMO_FIRM, type DemoAccount } from './seeders/demo-accounts';
export { DemoSeeder } from './seeders/demo-seeder';
export type { EntityManager } from '@mikro-orm/core';
export { OptimisticLockError, UniqueConstraintViolationException, RequestContext } from '@mikro-orm/core';
