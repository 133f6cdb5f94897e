import type { ColumnMapping, ImportRejection, ProductInputParsed } from '@gloaming/contracts';
import { databaseDialect, ImportJob, Organization, Product, openDatabase, type Database, type EntityManager } from '@gloaming/db';
import { readRow } from './price-list-row';
import { rowValues, type PriceListTable } from './price-list-file';

/** Rows checked or written between yields to the event loop. */
export const IMPORT_CHUNK_ROWS = 500;

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

interface PlannedCreate {
  input: ProductInputParsed;
}
interface PlannedUpdate {
  id: string;
  input: ProductInputParsed;
  /** False when the row had no spec columns: the stored spec stays as it is. */
  specFromRow: boolean;
}

export interface ImportPlan {
  creates: PlannedCreate[];
  updates: PlannedUpdate[];
  rejections: ImportRejection[];
}

/** Spreadsheet row number of a data row: the header is row 1. */
const sheetRow = (index: number) => index + 2;

/**
 * Decide each row's fate: create, update (same supplier + supplier code in this firm) or
 * reject with its reasons. Reads only; yields to the event loop between chunks and calls
 * `onProgress` with the rows checked so far.
 */
export async function planImport(
  em: EntityManager,
  organizationId: string,
  supplier: string,
  table: PriceListTable,
  mapping: ColumnMapping,
  onProgress: (checked: number) => Promise<void>,
  limit = table.rows.length,
): Promise<ImportPlan> {
  const plan: ImportPlan = { creates: [], updates: [], rejections: [] };
  const seen = new Map<string, number>();
  const codeHeader = mapping.columns.supplierCode!;
  const decimalComma = table.delimiter === ';';
  const rows = table.rows.slice(0, limit);
  for (let start = 0; start < rows.length; start += IMPORT_CHUNK_ROWS) {
    const chunk = rows.slice(start, start + IMPORT_CHUNK_ROWS).map((row) => rowValues(table.headers, row));
    const codes = [...new Set(chunk.map((v) => v[codeHeader]?.trim() ?? '').filter(Boolean))];
    const existing = await em.find(
      Product,
      { organization: organizationId, supplier, supplierCode: { $in: codes } },
      { fields: ['id', 'kind', 'spec', 'supplierCode'] },
    );
    const byCode = new Map(existing.map((p) => [p.supplierCode, p]));
    em.clear();
    chunk.forEach((values, i) => {
      const row = sheetRow(start + i);
      const code = values[codeHeader]?.trim() ?? '';
      const stored = byCode.get(code);
      const result = readRow(values, { supplier, mapping, decimalComma, existing: stored ? { kind: stored.kind, spec: stored.spec } : undefined });
      if (!result.ok) {
        plan.rejections.push({ row, reason: result.reason, values });
        return;
      }
      const earlier = seen.get(result.input.supplierCode);
      if (earlier !== undefined) {
        plan.rejections.push({ row, reason: `Supplier code ${result.input.supplierCode} appears again: row ${earlier} already has it.`, values });
        return;
      }
      seen.set(result.input.supplierCode, row);
      if (stored) plan.updates.push({ id: stored.id, input: result.input, specFromRow: result.specFromRow });
      else plan.creates.push({ input: result.input });
    });
    await onProgress(Math.min(start + IMPORT_CHUNK_ROWS, rows.length));
    await yieldToEventLoop();
  }
  return plan;
}

/**
 * Write the plan in ONE transaction: every create and update, or none of them. Chunks are
 * flushed inside the transaction with a yield between them so other requests keep being
 * answered; any failure rolls the whole import back.
 */
export async function writePlan(em: EntityManager, organizationId: string, plan: ImportPlan): Promise<void> {
  await em.transactional(async (tx) => {
    const organization = tx.getReference(Organization, organizationId);
    for (let start = 0; start < plan.creates.length; start += IMPORT_CHUNK_ROWS) {
      for (const { input } of plan.creates.slice(start, start + IMPORT_CHUNK_ROWS)) tx.create(Product, { organization, ...input });
      await tx.flush();
      tx.clear();
      await yieldToEventLoop();
    }
    for (let start = 0; start < plan.updates.length; start += IMPORT_CHUNK_ROWS) {
      const chunk = plan.updates.slice(start, start + IMPORT_CHUNK_ROWS);
      const products = await tx.find(Product, { id: { $in: chunk.map((u) => u.id) }, organization: organizationId });
      const byId = new Map(products.map((p) => [p.id, p]));
      for (const update of chunk) {
        const product = byId.get(update.id);
        if (!product) throw new Error(`Product ${update.id} disappeared during the import.`);
        const { spec, ...fields } = update.input;
        tx.assign(product, update.specFromRow ? { ...fields, spec } : fields);
      }
      await tx.flush();
      tx.clear();
      await yieldToEventLoop();
    }
  });
}

/**
 * The write transaction holds its connection until it commits. The app's pool has one SQLite
 * connection, so the import writes through a second one of its own: with WAL, every other
 * request keeps reading on the first while the import writes. (An in-memory database cannot
 * be shared, so it writes on the app's connection.)
 */
async function withWriterConnection(orm: Database, work: (writer: Database) => Promise<void>): Promise<void> {
  // PostgreSQL's pool has several connections already: the import simply takes one of them.
  if (databaseDialect(orm) === 'postgresql') return work(orm);
  const file = orm.config.get('dbName');
  if (!file || file === ':memory:') return work(orm);
  const writer = await openDatabase({ file });
  try {
    await work(writer);
  } finally {
    await writer.close(true);
  }
}

/** Imports running in this process. A job marked running that is not here was cut off by a restart. */
export const runningImports = new Set<string>();

export const INTERRUPTED_IMPORT =
  'The server restarted while this import was running, so it did not complete and nothing was changed. Upload the file again to import it.';

/** Run a whole import for a job whose file is read: plan, write, and record the outcome. */
export async function runImport(
  orm: Database,
  job: { id: string; organizationId: string; supplier: string },
  table: PriceListTable,
  mapping: ColumnMapping,
  log: (msg: string, err?: unknown) => void,
): Promise<void> {
  runningImports.add(job.id);
  const progress = async (checked: number) => {
    await orm.em.fork().nativeUpdate(ImportJob, { id: job.id }, { processedRows: checked });
  };
  try {
    const plan = await planImport(orm.em.fork(), job.organizationId, job.supplier, table, mapping, progress);
    await withWriterConnection(orm, (writer) => writePlan(writer.em.fork(), job.organizationId, plan));
    await orm.em.fork().nativeUpdate(
      ImportJob,
      { id: job.id },
      {
        state: 'done',
        processedRows: table.rows.length,
        createdCount: plan.creates.length,
        updatedCount: plan.updates.length,
        rejectedCount: plan.rejections.length,
        rejections: plan.rejections,
        finishedAt: new Date(),
      },
    );
  } catch (err) {
    log(`Price-list import ${job.id} failed and was rolled back`, err);
    await orm.em
      .fork()
      .nativeUpdate(
        ImportJob,
        { id: job.id },
        {
          state: 'failed',
          createdCount: 0,
          updatedCount: 0,
          error: 'The import stopped part-way and nothing was changed: the catalogue is as it was before. Try again; if it fails again, check the file.',
          finishedAt: new Date(),
        },
      )
      .catch((e: unknown) => log(`Could not record the failure of import ${job.id}`, e));
  } finally {
    runningImports.delete(job.id);
  }
}
