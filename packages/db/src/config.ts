import type { Options } from '@mikro-orm/core';
import type { AbstractSqlDriver, SqlEntityManager } from '@mikro-orm/knex';
import { Migrator } from '@mikro-orm/migrations';
import { defineConfig as definePostgreSqlConfig } from '@mikro-orm/postgresql';
import { SeedManager } from '@mikro-orm/seeder';
import { defineConfig as defineSqliteConfig } from '@mikro-orm/sqlite';
import { entities } from './entities';
import { migrationsList } from './migrations';
import { migrationsList as postgresMigrationsList } from './migrations-postgres';

/** The two databases Gloaming runs on: the embedded SQLite default, or a PostgreSQL server. */
export type DatabaseDialect = 'sqlite' | 'postgresql';

export interface DatabaseOptions {
  /** Path of the SQLite file, or ':memory:'. Used when `url` is not given. */
  file?: string;
  /** A postgres:// (or postgresql://) connection URL: selects PostgreSQL instead of SQLite. */
  url?: string;
  /** Log SQL to the console. */
  debug?: boolean;
  /**
   * How long a statement waits for another connection's lock before failing (ms): SQLite's
   * busy_timeout, PostgreSQL's lock_timeout. Either way the api answers 503 "busy".
   */
  busyTimeoutMs?: number;
}

/** The configuration both drivers share: one entity set, one MikroORM option set. */
export type DatabaseConfig = Options<AbstractSqlDriver, SqlEntityManager>;

/** Directories of the TypeScript migration sources (for `migration:create`). */
export const MIGRATIONS_SOURCE_DIR = new URL('./migrations/', import.meta.url).pathname;
export const POSTGRES_MIGRATIONS_SOURCE_DIR = new URL('./migrations-postgres/', import.meta.url).pathname;

const POSTGRES_URL = /^postgres(ql)?:\/\//i;

/** Which database the options select. */
export function dialectOf(options: DatabaseOptions): DatabaseDialect {
  if (options.url !== undefined) {
    if (!POSTGRES_URL.test(options.url)) throw new Error('A database URL must start with postgres:// or postgresql://.');
    return 'postgresql';
  }
  if (!options.file) throw new Error('Give either a SQLite file or a PostgreSQL URL.');
  return 'sqlite';
}

interface SqliteHandle {
  exec(sql: string, cb: (err: Error | null) => void): void;
}
interface PgClientHandle {
  query(sql: string, cb: (err: Error | null) => void): void;
}

function migrationsFor(dialect: DatabaseDialect): NonNullable<DatabaseConfig['migrations']> {
  const dir = dialect === 'sqlite' ? MIGRATIONS_SOURCE_DIR : POSTGRES_MIGRATIONS_SOURCE_DIR;
  return {
    tableName: 'mikro_orm_migrations',
    migrationsList: dialect === 'sqlite' ? migrationsList : postgresMigrationsList,
    pathTs: dir,
    path: dir,
    emit: 'ts',
    snapshot: false,
    transactional: true,
    allOrNothing: true,
    silent: true,
  };
}

/**
 * The one MikroORM configuration, for either database. SQLite: WAL journal, foreign keys and
 * a busy timeout on every pooled connection. PostgreSQL: a lock timeout on every pooled
 * connection. Migrations are listed explicitly (one list per database) so a bundled api
 * finds them.
 */
export function ormConfig(options: DatabaseOptions): DatabaseConfig {
  const { debug = false, busyTimeoutMs = 5000 } = options;
  const timeout = Math.max(0, Math.trunc(busyTimeoutMs));
  const common = {
    entities,
    debug,
    allowGlobalContext: false,
    forceUtcTimezone: true,
    extensions: [Migrator, SeedManager],
  };
  if (dialectOf(options) === 'postgresql') {
    return definePostgreSqlConfig({
      ...common,
      clientUrl: options.url,
      pool: {
        afterCreate: (conn: PgClientHandle, done: (err: Error | null, conn: PgClientHandle) => void) => {
          conn.query(`SET lock_timeout = ${timeout}`, (err) => done(err, conn));
        },
      },
      migrations: migrationsFor('postgresql'),
    }) as DatabaseConfig;
  }
  const file = options.file!;
  return defineSqliteConfig({
    ...common,
    dbName: file,
    pool: {
      afterCreate: (conn: SqliteHandle, done: (err: Error | null, conn: SqliteHandle) => void) => {
        const wal = file === ':memory:' ? '' : 'PRAGMA journal_mode = WAL;';
        // the busy timeout first, so that even the journal-mode pragma waits for a lock instead of failing at once
        conn.exec(`PRAGMA busy_timeout = ${timeout}; ${wal} PRAGMA foreign_keys = ON; PRAGMA synchronous = NORMAL;`, (err) =>
          done(err, conn),
        );
      },
    },
    migrations: migrationsFor('sqlite'),
  }) as DatabaseConfig;
}
