import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { Customer, openDatabase, type Database } from '../src';
import { backupDatabase, integrityCheck, restoreDatabase } from '../src/backup';
import { createFirm, openTestDatabase } from '../src/testing';

/**
 * `npm run backup` / `npm run restore`: a copy taken with SQLite's online backup API while
 * another connection keeps writing opens, passes integrity_check, and holds a consistent
 * state (every row in the copy exists in the live database and nothing is torn); a copy taken
 * at rest matches the live database row for row; a restore brings exactly that back.
 */
const cleanups: Array<() => Promise<void>> = [];
afterEach(async () => {
  while (cleanups.length) await cleanups.pop()!();
});

async function customerIds(orm: Database): Promise<string[]> {
  const rows = await orm.em.fork().getConnection().execute<{ id: string }[]>('select id from customers order by id');
  return rows.map((r) => r.id);
}

async function openFile(file: string): Promise<Database> {
  const orm = await openDatabase({ file });
  cleanups.push(() => orm.close(true));
  return orm;
}

describe('online backup and restore', () => {
  it('copies a database that is being written to, consistently, and restores it', async () => {
    const live = await openTestDatabase();
    cleanups.push(live.close);
    const firm = await createFirm(live.orm.em.fork(), 'Backup Test Lighting');

    let writing = true;
    let written = 0;
    let failure: unknown;
    const until = async (n: number) => {
      while (written < n) {
        if (failure) throw failure;
        await new Promise((r) => setTimeout(r, 5));
      }
    };
    const writer = (async () => {
      while (writing) {
        const em = live.orm.em.fork();
        for (let i = 0; i < 5; i++) em.create(Customer, { organization: firm.firm.id, name: `Customer ${written}-${i}` });
        await em.flush();
        written += 5;
      }
    })().catch((err: unknown) => {
      failure = err;
    });

    await until(50);
    const during = await backupDatabase(live.file, join(live.dir, 'during.sqlite'));
    const writtenAtCopy = written;
    await until(writtenAtCopy + 50);
    writing = false;
    await writer;
    expect(failure).toBeUndefined();

    expect(during.integrity).toBe('ok');
    const copy = await openFile(during.file);
    const copied = await customerIds(copy);
    const liveIds = await customerIds(live.orm);
    // The writer flushed in batches of five inside one transaction each: a consistent copy
    // holds whole batches only, and only rows the live database has.
    expect(copied.length % 5).toBe(0);
    expect(copied.length).toBeGreaterThan(0);
    expect(copied.length).toBeLessThan(liveIds.length);
    expect(copied.every((id) => liveIds.includes(id))).toBe(true);

    const atRest = await backupDatabase(live.file, join(live.dir, 'at-rest.sqlite'));
    expect(await customerIds(await openFile(atRest.file))).toEqual(liveIds);

    const restoredFile = join(live.dir, 'restored.sqlite');
    const restored = await restoreDatabase(atRest.file, restoredFile);
    expect(restored.integrity).toBe('ok');
    expect(await customerIds(await openFile(restoredFile))).toEqual(liveIds);
  });

  it('refuses to restore a file that is not a sound database', async () => {
    const live = await openTestDatabase();
    cleanups.push(live.close);
    const { writeFileSync } = await import('node:fs');
    const junk = join(live.dir, 'junk.sqlite');
    writeFileSync(junk, 'this is not a database');
    await expect(integrityCheck(junk)).rejects.toThrow();
    await expect(restoreDatabase(junk, join(live.dir, 'target.sqlite'))).rejects.toThrow();
    await expect(restoreDatabase(join(live.dir, 'missing.sqlite'), join(live.dir, 'target.sqlite'))).rejects.toThrow(/No backup/);
  });
});
