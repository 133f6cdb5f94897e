/**
 * Database commands: migrate, seed, reset, create-migration, check, backup [file], restore <file>.
 * The database file is $DATA_DIR/gloaming.sqlite (DATA_DIR defaults to ./data at the repo root).
 */
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { backupDatabase, restoreDatabase } from './backup';
import { migrate, migrationsOutOfDate, openDatabase, seedDemoIfEmpty } from './database';

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');
const dataDir = resolve(repoRoot, process.env.DATA_DIR ?? 'data');
const file = process.env.GLOAMING_DB_FILE ?? join(dataDir, 'gloaming.sqlite');

/** A path the person typed, relative to where they ran npm (npm sets INIT_CWD). */
const fromCaller = (path: string) => resolve(process.env.INIT_CWD ?? process.cwd(), path);

/** Append a newly written migration to the explicit list in src/migrations/index.ts. */
function registerMigration(fileName: string): void {
  const name = fileName.replace(/\.ts$/, '');
  const indexFile = join(dirname(fileURLToPath(import.meta.url)), 'migrations', 'index.ts');
  let text = readFileSync(indexFile, 'utf8');
  text = text.replace(
    /(import type \{ MigrationObject \} from '@mikro-orm\/core';\n)/,
    `$1import { ${name} } from './${name}';\n`,
  );
  text = text.replace('  // next migration', `  { name: '${name}', class: ${name} },\n  // next migration`);
  writeFileSync(indexFile, text);
}

async function main(command: string | undefined): Promise<void> {
  switch (command) {
    case 'migrate': {
      const orm = await openDatabase({ file });
      const applied = await migrate(orm);
      console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Database is up to date.');
      await orm.close();
      return;
    }
    case 'seed': {
      const orm = await openDatabase({ file });
      await migrate(orm);
      console.log((await seedDemoIfEmpty(orm)) ? 'Seeded the demo firm.' : 'A firm exists already; nothing seeded.');
      await orm.close();
      return;
    }
    case 'reset': {
      for (const f of [file, `${file}-wal`, `${file}-shm`]) if (existsSync(f)) rmSync(f);
      const orm = await openDatabase({ file });
      await migrate(orm);
      await seedDemoIfEmpty(orm);
      console.log(`Reset ${file} and seeded the demo firm.`);
      await orm.close();
      return;
    }
    case 'create-migration': {
      const orm = await openDatabase({ file: ':memory:' });
      await migrate(orm);
      const name = process.argv[3]?.replace(/\W+/g, '_');
      const result = await orm.getMigrator().createMigration(undefined, false, false, name);
      if (result.fileName) registerMigration(result.fileName);
      console.log(result.fileName ? `Wrote and registered ${result.fileName}.` : 'No changes.');
      await orm.close();
      return;
    }
    case 'check': {
      const orm = await openDatabase({ file: ':memory:' });
      await migrate(orm);
      const stale = await migrationsOutOfDate(orm);
      await orm.close();
      if (stale) {
        console.error('Entities and migrations disagree: run `npm run migration:create -w @gloaming/db`.');
        process.exit(1);
      }
      console.log('Migrations match the entities.');
      return;
    }
    case 'backup': {
      const stamp = new Date().toISOString().replace(/[:.]/g, '-');
      const target = process.argv[3] ? fromCaller(process.argv[3]) : join(dataDir, 'backups', `gloaming-${stamp}.sqlite`);
      const { file: written } = await backupDatabase(file, target);
      console.log(`Backed up ${file} to ${written} (integrity ok).`);
      return;
    }
    case 'restore': {
      const from = process.argv[3];
      if (!from) {
        console.error('usage: npm run restore -- <backup file>   (stop the api first)');
        process.exit(2);
      }
      const { integrity } = await restoreDatabase(fromCaller(from), file);
      if (integrity !== 'ok') {
        console.error(`Restored, but the integrity check says: ${integrity}`);
        process.exit(1);
      }
      console.log(`Restored ${file} from ${fromCaller(from)} (integrity ok).`);
      return;
    }
    default:
      console.error('usage: cli.ts migrate | seed | reset | create-migration [name] | check | backup [file] | restore <file>');
      process.exit(2);
  }
}

try {
  await main(process.argv[2]);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
}
