import { randomBytes } from 'node:crypto';
import { openDatabase } from './database';

/** The same server and credentials as `url`, naming another database. */
export function withDatabaseName(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${encodeURIComponent(name)}`;
  return u.toString();
}

/** Run one statement on the server's maintenance database (`postgres`). */
async function onMaintenanceDatabase(url: string, sql: string): Promise<void> {
  const orm = await openDatabase({ url: withDatabaseName(url, 'postgres') });
  try {
    await orm.em.getConnection().execute(sql);
  } finally {
    await orm.close(true);
  }
}

export interface ScratchDatabase {
  /** URL of the new, empty database. */
  url: string;
  name: string;
  /** Drop it, ending any connection still open to it. */
  drop(): Promise<void>;
}

/**
 * A new, empty, uniquely named database on the PostgreSQL server `url` points at (the role
 * needs CREATEDB): one per test server, or for checking migrations without touching real data.
 */
export async function createScratchDatabase(url: string, prefix = 'gloaming_scratch'): Promise<ScratchDatabase> {
  if (!/^[a-z_][a-z0-9_]*$/.test(prefix)) throw new Error(`Bad database name prefix: ${prefix}`);
  const name = `${prefix}_${Date.now().toString(36)}_${randomBytes(4).toString('hex')}`;
  await onMaintenanceDatabase(url, `create database "${name}"`);
  return {
    url: withDatabaseName(url, name),
    name,
    drop: () => onMaintenanceDatabase(url, `drop database if exists "${name}" with (force)`),
  };
}

/** A database URL fit for logs: the password replaced by ***. */
export function withoutPassword(url: string): string {
  return url.replace(/\/\/([^:@/]*):[^@/]*@/, '//$1:***@');
}
