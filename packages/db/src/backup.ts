import { existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import { dirname } from 'node:path';
import sqlite3 from 'sqlite3';

/**
 * Consistent copies of a live SQLite database with SQLite's online backup API
 * (sqlite3_backup_init/step/finish, https://www.sqlite.org/backup.html), and restoring one.
 * The copy is taken in one step under a read transaction, so a writer that keeps going in
 * WAL mode is neither blocked nor torn: the copy is the database as of one commit.
 */

/** The parts of node-sqlite3's Backup object we use (its bundled types leave it out). */
interface SqliteBackup {
  step(pages: number, cb: (err: Error | null) => void): void;
  finish(cb?: (err: Error | null) => void): void;
  readonly completed: boolean;
  readonly failed: boolean;
  retryErrors: number[];
}
type BackupCapable = sqlite3.Database & {
  backup(
    filename: string,
    destName: string,
    sourceName: string,
    filenameIsDest: boolean,
    cb: (err: Error | null) => void,
  ): SqliteBackup;
};

function open(file: string, mode: number): Promise<BackupCapable> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, mode, (err) => (err ? reject(err) : resolve(db as BackupCapable)));
  });
}

function close(db: sqlite3.Database): Promise<void> {
  return new Promise((resolve, reject) => db.close((err) => (err ? reject(err) : resolve())));
}

function all<T>(db: sqlite3.Database, sql: string): Promise<T[]> {
  return new Promise((resolve, reject) => db.all(sql, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
}

/** Copy `from` into `to` page by page; retries while the source is busy or locked. */
async function copyWithBackupApi(db: BackupCapable, otherFile: string, otherIsDestination: boolean): Promise<void> {
  const backup = await new Promise<SqliteBackup>((resolve, reject) => {
    const b = db.backup(otherFile, 'main', 'main', otherIsDestination, (err) => (err ? reject(err) : resolve(b)));
  });
  backup.retryErrors = [sqlite3.BUSY, sqlite3.LOCKED];
  try {
    for (let attempt = 0; !backup.completed; attempt++) {
      if (backup.failed) throw new Error('SQLite backup failed');
      if (attempt > 200) throw new Error('SQLite backup gave up: the database stayed busy');
      await new Promise<void>((resolve, reject) => backup.step(-1, (err) => (err ? reject(err) : resolve())));
      if (!backup.completed) await new Promise((r) => setTimeout(r, 25));
    }
  } finally {
    await new Promise<void>((resolve) => backup.finish(() => resolve()));
  }
}

/** `PRAGMA integrity_check` of a database file: 'ok' or the problems SQLite lists. */
export async function integrityCheck(file: string): Promise<string> {
  const db = await open(file, sqlite3.OPEN_READONLY);
  try {
    const rows = await all<{ integrity_check: string }>(db, 'PRAGMA integrity_check');
    return rows.map((r) => r.integrity_check).join('\n');
  } finally {
    await close(db);
  }
}

/**
 * Write a consistent copy of the database at `source` to `destination` (written beside it
 * under a temporary name, checked, then renamed, so a half-written backup never has the
 * final name). Safe while the api is running and writing.
 */
export async function backupDatabase(source: string, destination: string): Promise<{ file: string; integrity: string }> {
  if (!existsSync(source)) throw new Error(`No database at ${source}`);
  mkdirSync(dirname(destination), { recursive: true });
  const partial = `${destination}.partial`;
  rmSync(partial, { force: true });
  const db = await open(source, sqlite3.OPEN_READONLY);
  try {
    await copyWithBackupApi(db, partial, true);
  } finally {
    await close(db);
  }
  // The copy carries the source's WAL journal mode; a backup file should be one
  // self-contained file, so switch it back to a rollback journal (this also checkpoints).
  const copy = await open(partial, sqlite3.OPEN_READWRITE);
  try {
    await all(copy, 'PRAGMA journal_mode = DELETE');
  } finally {
    await close(copy);
  }
  const integrity = await integrityCheck(partial);
  if (integrity !== 'ok') {
    rmSync(partial, { force: true });
    throw new Error(`The copy failed SQLite's integrity check: ${integrity}`);
  }
  renameSync(partial, destination);
  return { file: destination, integrity };
}

/**
 * Replace the database at `target` with the backup at `backupFile`, through the backup API so
 * the target's WAL stays coherent. The backup is checked first; stop the api before restoring.
 */
export async function restoreDatabase(backupFile: string, target: string): Promise<{ file: string; integrity: string }> {
  if (!existsSync(backupFile)) throw new Error(`No backup at ${backupFile}`);
  const before = await integrityCheck(backupFile);
  if (before !== 'ok') throw new Error(`The backup failed SQLite's integrity check: ${before}`);
  mkdirSync(dirname(target), { recursive: true });
  const db = await open(target, sqlite3.OPEN_READWRITE | sqlite3.OPEN_CREATE);
  try {
    await copyWithBackupApi(db, backupFile, false);
  } finally {
    await close(db);
  }
  return { file: target, integrity: await integrityCheck(target) };
}
