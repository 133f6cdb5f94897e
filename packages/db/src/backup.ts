import { existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import { dirname } from 'node:path';
import Database from 'better-sqlite3';

/**
 * Consistent copies of a live SQLite database with SQLite's online backup API
 * (sqlite3_backup_init/step/finish, https://www.sqlite.org/backup.html, through better-sqlite3's
 * `backup`, which steps again while the source is busy or locked), and restoring one. Under WAL
 * a writer that keeps going is neither blocked nor torn: the copy is the database as of one
 * commit.
 */

/**
 * better-sqlite3 copies 100 pages a step by default, and a source changed by another
 * connection between steps makes SQLite start again: after the first step, ask for every
 * remaining page at once, so the copy is one step under one read transaction (one commit's
 * state) and a busy writer cannot keep restarting it.
 */
const IN_ONE_STEP = { progress: () => 0x7fffffff };

/** `PRAGMA integrity_check` of a database file: 'ok' or the problems SQLite lists. */
export async function integrityCheck(file: string): Promise<string> {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const rows = db.pragma('integrity_check') as { integrity_check: string }[];
    return rows.map((r) => r.integrity_check).join('\n');
  } finally {
    db.close();
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
  const db = new Database(source, { readonly: true, fileMustExist: true });
  try {
    await db.backup(partial, IN_ONE_STEP);
  } finally {
    db.close();
  }
  // The copy carries the source's WAL journal mode; a backup file should be one
  // self-contained file, so switch it back to a rollback journal (this also checkpoints).
  const copy = new Database(partial, { fileMustExist: true });
  try {
    copy.pragma('journal_mode = DELETE');
  } finally {
    copy.close();
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
  // copy the backup's pages into the target file (the backup API rewrites its WAL coherently)
  const db = new Database(backupFile, { readonly: true, fileMustExist: true });
  try {
    await db.backup(target, IN_ONE_STEP);
  } finally {
    db.close();
  }
  return { file: target, integrity: await integrityCheck(target) };
}
