import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { DatabaseOptions } from '../config';
import { migrate, openDatabase, type Database } from '../database';

export * from './factories';

/** A migrated database in a fresh temp folder; `close()` shuts it and deletes the folder. */
export async function openTestDatabase(options: Omit<DatabaseOptions, 'file'> = {}): Promise<{ orm: Database; dir: string; file: string; close: () => Promise<void> }> {
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-db-'));
  const file = join(dir, 'test.sqlite');
  const orm = await openDatabase({ ...options, file });
  await migrate(orm);
  return {
    orm,
    dir,
    file,
    close: async () => {
      await orm.close(true);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
