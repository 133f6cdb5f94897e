import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { DatabaseDialect, DatabaseOptions } from '../config';
import { migrate, openDatabase, type Database } from '../database';
import { createScratchDatabase } from '../postgres-scratch';

export * from './factories';

export interface TestDatabaseOptions extends Omit<DatabaseOptions, 'file' | 'url'> {
  /**
   * A PostgreSQL server to test on (any database URL on it; the role needs CREATEDB): the test
   * gets a fresh database of its own there, dropped on close. Unset = a temp SQLite file.
   */
  postgresUrl?: string;
}

export interface TestDatabase {
  orm: Database;
  dialect: DatabaseDialect;
  /** A fresh temp folder (for uploads), deleted on close. */
  dir: string;
  /** The SQLite file in `dir` (SQLite only: on PostgreSQL nothing is written there). */
  file: string;
  /** The test database's URL (PostgreSQL only). */
  url?: string;
  close: () => Promise<void>;
}

/** A migrated database of its own: a temp SQLite file, or a fresh PostgreSQL database. */
export async function openTestDatabase({ postgresUrl, ...options }: TestDatabaseOptions = {}): Promise<TestDatabase> {
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-db-'));
  const file = join(dir, 'test.sqlite');
  const scratch = postgresUrl ? await createScratchDatabase(postgresUrl, 'gloaming_test') : undefined;
  try {
    const orm = await openDatabase(scratch ? { ...options, url: scratch.url } : { ...options, file });
    await migrate(orm);
    return {
      orm,
      dialect: scratch ? 'postgresql' : 'sqlite',
      dir,
      file,
      ...(scratch ? { url: scratch.url } : {}),
      close: async () => {
        await orm.close(true);
        await scratch?.drop();
        rmSync(dir, { recursive: true, force: true });
      },
    };
  } catch (err) {
    await scratch?.drop();
    rmSync(dir, { recursive: true, force: true });
    throw err;
  }
}
