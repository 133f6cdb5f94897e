import { MikroORM } from '@mikro-orm/core';
import type { AbstractSqlDriver, SqlEntityManager } from '@mikro-orm/knex';
import { ormConfig, type DatabaseDialect, type DatabaseOptions } from './config';
import { Organization } from './entities';
import { DemoSeeder } from './seeders/demo-seeder';
import { sqlDialect } from './sql-query';

export type Database = MikroORM<AbstractSqlDriver, SqlEntityManager>;

/**
 * Open the database: the SQLite file (creating it and its folder if missing) or, given a
 * postgres:// URL, the PostgreSQL database (creating the database if the server has none of
 * that name). Does not migrate.
 */
export async function openDatabase(options: DatabaseOptions): Promise<Database> {
  return MikroORM.init(ormConfig(options));
}

/** Which database an open ORM talks to. */
export function databaseDialect(orm: Database): DatabaseDialect {
  return sqlDialect(orm.em);
}

/** Any fixed number: the PostgreSQL advisory lock key that api processes migrate under. */
const MIGRATION_LOCK_KEY = 7_140_215;

/**
 * Apply every pending migration. Returns the names applied. On PostgreSQL, several api
 * processes may start at once against one database: each waits for a transaction-scoped
 * advisory lock, so one migrates while the others wait and then find nothing pending.
 */
export async function migrate(orm: Database): Promise<string[]> {
  const up = async () => (await orm.getMigrator().up()).map((m) => m.name);
  if (databaseDialect(orm) !== 'postgresql') return up();
  return orm.em
    .getConnection()
    .getKnex()
    .transaction(async (trx) => {
      await trx.raw('select pg_advisory_xact_lock(?)', [MIGRATION_LOCK_KEY]);
      return up();
    });
}

/** True when the entities describe a schema the migrations do not create. */
export async function migrationsOutOfDate(orm: Database): Promise<boolean> {
  const diff = await orm.getSchemaGenerator().getUpdateSchemaSQL({ wrap: false, safe: false });
  return diff.trim().length > 0;
}

/**
 * Seed the demo firm unless any firm exists already: an existing database is never
 * overwritten. Returns true when it seeded.
 */
export async function seedDemoIfEmpty(orm: Database): Promise<boolean> {
  const em = orm.em.fork();
  const firms = await em.count(Organization, {});
  if (firms > 0) return false;
  await orm.getSeeder().seed(DemoSeeder);
  return true;
}

/**
 * Migrations are only ever applied at start-up (and none can appear in a running process's
 * code), so once a database is known to have none pending that answer is kept: the health
 * check then costs one trivial query, not a read of the migrations table and the list.
 */
const upToDate = new WeakSet<Database>();

/** Database health for /api/health: a trivial query and the pending-migration count. */
export async function databaseStatus(orm: Database): Promise<{ ok: boolean; pendingMigrations: number; detail?: string }> {
  try {
    await orm.em.fork().getConnection().execute('select 1 as ok');
    if (upToDate.has(orm)) return { ok: true, pendingMigrations: 0 };
    const pending = await orm.getMigrator().getPendingMigrations();
    if (pending.length === 0) upToDate.add(orm);
    return { ok: true, pendingMigrations: pending.length };
  } catch (err) {
    return { ok: false, pendingMigrations: -1, detail: err instanceof Error ? err.message : String(err) };
  }
}
