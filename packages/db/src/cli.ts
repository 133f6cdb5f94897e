/**
 * Database commands: migrate, seed, reset, create-migration [name], check, backup [file], restore <file>.
 * With DATABASE_URL=postgres://... migrate, seed and reset work on that PostgreSQL database;
 * otherwise on the SQLite file $DATA_DIR/gloaming.sqlite (DATA_DIR defaults to ./data at the
 * repo root). create-migration and check cover both databases (`--only=sqlite` or
 * `--only=postgresql` for one): the PostgreSQL side runs in a scratch database on the
 * DATABASE_URL server, or on a throwaway server started by scripts/with-postgres.mjs.
 */
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { backupDatabase, restoreDatabase } from './backup';
import type { DatabaseDialect, DatabaseOptions } from './config';
import { migrate, migrationsOutOfDate, openDatabase, seedDemoIfEmpty, type Database } from './database';
import { createScratchDatabase, withoutPassword } from './postgres-scratch';

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');
const dataDir = resolve(repoRoot, process.env.DATA_DIR ?? 'data');
const file = process.env.GLOAMING_DB_FILE ?? join(dataDir, 'gloaming.sqlite');
const databaseUrl = process.env.DATABASE_URL || undefined;
const target: DatabaseOptions = databaseUrl ? { url: databaseUrl } : { file };
const shownTarget = databaseUrl ? withoutPassword(databaseUrl) : file;

/** A path the person typed, relative to where they ran npm (npm sets INIT_CWD). */
const fromCaller = (path: string) => resolve(process.env.INIT_CWD ?? process.cwd(), path);

const args = process.argv.slice(3);
const only = args.find((a) => a.startsWith('--only='))?.slice('--only='.length);
if (only !== undefined && only !== 'sqlite' && only !== 'postgresql') {
  console.error('--only takes sqlite or postgresql');
  process.exit(2);
}
const dialects: DatabaseDialect[] = only ? [only] : ['sqlite', 'postgresql'];
const positional = args.filter((a) => !a.startsWith('--'));

const MIGRATION_FOLDERS: Record<DatabaseDialect, string> = { sqlite: 'migrations', postgresql: 'migrations-postgres' };

/** Append a newly written migration to the explicit list in src/<folder>/index.ts. */
function registerMigration(dialect: DatabaseDialect, fileName: string): void {
  const name = fileName.replace(/\.ts$/, '');
  const indexFile = join(dirname(fileURLToPath(import.meta.url)), MIGRATION_FOLDERS[dialect], 'index.ts');
  let text = readFileSync(indexFile, 'utf8');
  text = text.replace(
    /(import type \{ MigrationObject \} from '@mikro-orm\/core';\n)/,
    `$1import { ${name} } from './${name}';\n`,
  );
  text = text.replace('  // next migration', `  { name: '${name}', class: ${name} },\n  // next migration`);
  writeFileSync(indexFile, text);
}

interface ThrowawayPostgres {
  url: string;
  stop(): void;
}
interface WithPostgresModule {
  startThrowawayPostgres(options: { log: (msg: string) => void }): Promise<ThrowawayPostgres>;
}

/**
 * A migrated database of `dialect` with nothing else in it, for comparing the entities with
 * the migrations: SQLite in memory; PostgreSQL in a scratch database, dropped afterwards.
 */
async function withMigratedScratch<T>(dialect: DatabaseDialect, work: (orm: Database) => Promise<T>): Promise<T> {
  if (dialect === 'sqlite') {
    const orm = await openDatabase({ file: ':memory:' });
    try {
      await migrate(orm);
      return await work(orm);
    } finally {
      await orm.close(true);
    }
  }
  let server: ThrowawayPostgres | undefined;
  if (!databaseUrl) {
    const script = pathToFileURL(join(repoRoot, 'scripts', 'with-postgres.mjs')).href;
    const { startThrowawayPostgres } = (await import(script)) as WithPostgresModule;
    server = await startThrowawayPostgres({ log: (msg) => console.log(msg) });
  }
  try {
    const scratch = await createScratchDatabase(databaseUrl ?? server!.url, 'gloaming_migrations');
    try {
      const orm = await openDatabase({ url: scratch.url });
      try {
        await migrate(orm);
        return await work(orm);
      } finally {
        await orm.close(true);
      }
    } finally {
      await scratch.drop();
    }
  } finally {
    server?.stop();
  }
}

function pgDumpInstead(): never {
  console.error('DATABASE_URL is set: back up PostgreSQL with pg_dump and restore with pg_restore (see docs/deployment.md).');
  process.exit(2);
}

async function main(command: string | undefined): Promise<void> {
  switch (command) {
    case 'migrate': {
      const orm = await openDatabase(target);
      const applied = await migrate(orm);
      console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Database is up to date.');
      await orm.close();
      return;
    }
    case 'seed': {
      const orm = await openDatabase(target);
      await migrate(orm);
      console.log((await seedDemoIfEmpty(orm)) ? 'Seeded the demo firm.' : 'A firm exists already; nothing seeded.');
      await orm.close();
      return;
    }
    case 'reset': {
      if (!databaseUrl) for (const f of [file, `${file}-wal`, `${file}-shm`]) if (existsSync(f)) rmSync(f);
      const orm = await openDatabase(target);
      if (databaseUrl) await orm.getSchemaGenerator().dropSchema({ dropMigrationsTable: true });
      await migrate(orm);
      await seedDemoIfEmpty(orm);
      console.log(`Reset ${shownTarget} and seeded the demo firm.`);
      await orm.close();
      return;
    }
    case 'create-migration': {
      const name = positional[0]?.replace(/\W+/g, '_');
      for (const dialect of dialects) {
        const written = await withMigratedScratch(dialect, async (orm) => {
          const result = await orm.getMigrator().createMigration(undefined, false, false, name);
          return result.fileName;
        });
        if (written) registerMigration(dialect, written);
        console.log(written ? `${dialect}: wrote and registered ${MIGRATION_FOLDERS[dialect]}/${written}.` : `${dialect}: no changes.`);
      }
      return;
    }
    case 'check': {
      let stale = false;
      for (const dialect of dialects) {
        const out = await withMigratedScratch(dialect, (orm) => migrationsOutOfDate(orm));
        console.log(out ? `${dialect}: entities and migrations disagree.` : `${dialect}: migrations match the entities.`);
        stale ||= out;
      }
      if (stale) {
        console.error('Run `npm run migration:create -- <name>` (it writes the SQLite and the PostgreSQL migration).');
        process.exit(1);
      }
      return;
    }
    case 'backup': {
      if (databaseUrl) pgDumpInstead();
      const stamp = new Date().toISOString().replace(/[:.]/g, '-');
      const to = positional[0] ? fromCaller(positional[0]) : join(dataDir, 'backups', `gloaming-${stamp}.sqlite`);
      const { file: written } = await backupDatabase(file, to);
      console.log(`Backed up ${file} to ${written} (integrity ok).`);
      return;
    }
    case 'restore': {
      if (databaseUrl) pgDumpInstead();
      const from = positional[0];
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
      console.error('usage: cli.ts migrate | seed | reset | create-migration [name] [--only=sqlite|postgresql] | check [--only=sqlite|postgresql] | backup [file] | restore <file>');
      process.exit(2);
  }
}

try {
  await main(process.argv[2]);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
}
