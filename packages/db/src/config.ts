import { defineConfig, type Options } from '@mikro-orm/sqlite';
import { Migrator } from '@mikro-orm/migrations';
import { SeedManager } from '@mikro-orm/seeder';
import { entities } from './entities';
import { migrationsList } from './migrations';

export interface DatabaseOptions {
  /** Path of the SQLite file, or ':memory:'. */
  file: string;
  /** Log SQL to the console. */
  debug?: boolean;
  /** How long a statement waits for another connection's write lock before failing (ms). */
  busyTimeoutMs?: number;
}

/** Directory of the TypeScript migration sources (for `migration:create`). */
export const MIGRATIONS_SOURCE_DIR = new URL('./migrations/', import.meta.url).pathname;

interface SqliteHandle {
  exec(sql: string, cb: (err: Error | null) => void): void;
}

/**
 * The one MikroORM configuration. WAL journal, foreign keys and a busy timeout are set on
 * every pooled connection. Migrations are listed explicitly so a bundled api finds them.
 */
export function ormConfig({ file, debug = false, busyTimeoutMs = 5000 }: DatabaseOptions): Options {
  return defineConfig({
    dbName: file,
    entities,
    debug,
    allowGlobalContext: false,
    forceUtcTimezone: true,
    extensions: [Migrator, SeedManager],
    pool: {
      afterCreate: (conn: SqliteHandle, done: (err: Error | null, conn: SqliteHandle) => void) => {
        const wal = file === ':memory:' ? '' : 'PRAGMA journal_mode = WAL;';
        conn.exec(`${wal} PRAGMA foreign_keys = ON; PRAGMA busy_timeout = ${Math.max(0, Math.trunc(busyTimeoutMs))}; PRAGMA synchronous = NORMAL;`, (err) =>
          done(err, conn),
        );
      },
    },
    migrations: {
      tableName: 'mikro_orm_migrations',
      migrationsList,
      pathTs: MIGRATIONS_SOURCE_DIR,
      path: MIGRATIONS_SOURCE_DIR,
      emit: 'ts',
      snapshot: false,
      transactional: true,
      allOrNothing: true,
      silent: true,
    },
  });
}
