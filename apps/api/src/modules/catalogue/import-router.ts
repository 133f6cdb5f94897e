import {
  ColumnMapping,
  IdParams,
  MAX_PRICE_LIST_BYTES,
  MAX_PRICE_LIST_ROWS,
  PREVIEW_ROWS,
  PriceListUploadFields,
  type ImportJob as ImportJobView,
  type PreviewRow,
} from '@gloaming/contracts';
import { ImportJob, Organization, User, type EntityManager } from '@gloaming/db';
import type { Request, Response } from 'express';
import multer from 'multer';
import type { ModuleDeps } from '../../app-deps';
import { HttpError, badRequest, conflict, gone, notFound } from '../../http/problem';
import { parseBody } from '../../http/parse-body';
import { moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { newStorageKey } from '../../storage/storage';
import { guessMapping, rememberMapping, rememberedMapping } from './column-mapping';
import { PriceListFileError, readPriceList, rejectionsCsv, rowValues } from './price-list-file';
import { INTERRUPTED_IMPORT, planImport, runImport, runningImports } from './price-list-import';
import { catalogueStaff } from './router';

const REJECTIONS_SHOWN = 100;

export function presentImportJob(job: ImportJob): ImportJobView {
  return {
    id: job.id,
    supplier: job.supplier,
    fileName: job.fileName,
    state: job.state,
    totalRows: job.totalRows,
    processedRows: job.processedRows,
    createdCount: job.createdCount,
    updatedCount: job.updatedCount,
    rejectedCount: job.rejectedCount,
    rejections: job.rejections.slice(0, REJECTIONS_SHOWN),
    error: job.error ?? null,
    createdAt: job.createdAt.toISOString(),
    finishedAt: job.finishedAt ? job.finishedAt.toISOString() : null,
  };
}

async function findFirmJob(em: EntityManager, organizationId: string, id: string): Promise<ImportJob> {
  const job = await em.findOne(ImportJob, { id, organization: organizationId });
  if (!job) throw notFound('That import');
  return job;
}

const upload = multer({
  storage: multer.memoryStorage(),
  // browsers send file names as UTF-8 without saying so; busboy's latin1 default garbles them
  defParamCharset: 'utf8',
  limits: { fileSize: MAX_PRICE_LIST_BYTES, files: 1, fields: 10, fieldSize: 10_000 },
}).single('file');

/** Multipart parsing, run after the role check so nobody signed out can make us buffer a file. */
function receiveFile(req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (!err) return resolve();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return reject(new HttpError(413, 'payload-too-large', 'File too large', `A price list can be at most ${MAX_PRICE_LIST_BYTES / 1024 / 1024} MB. Split it into smaller files.`));
        return reject(badRequest(`The upload could not be read (${err.message}). Send one CSV file in the field “file”.`, [{ path: `body.${err.field ?? 'file'}`, message: err.message }]));
      }
      reject(badRequest('The upload could not be read. Send one CSV file in the field “file”.', [{ path: 'body.file', message: 'The upload could not be read.' }]));
    });
  });
}

export function productImportsRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  const { storage, orm, logger } = deps;

  async function tableOf(job: ImportJob) {
    const bytes = await storage.get(job.storageKey).catch((err: unknown) => {
      if ((err as { code?: string }).code === 'ENOENT') throw gone('The uploaded price list is no longer kept. Upload it again.');
      throw err;
    });
    try {
      return readPriceList(bytes, MAX_PRICE_LIST_ROWS);
    } catch (err) {
      if (err instanceof PriceListFileError) throw badRequest(err.message, [{ path: 'body.file', message: err.message }]);
      throw err;
    }
  }

  return moduleRouter('/api/product-imports', registry, [
    route({
      method: 'post',
      path: '/',
      summary: 'Upload a supplier price list (CSV); answers its columns and a suggested mapping',
      policy: catalogueStaff,
      handler: async ({ req, res, em, auth }) => {
        await receiveFile(req, res);
        const fields = PriceListUploadFields.safeParse(req.body ?? {});
        if (!fields.success)
          throw badRequest(fields.error.issues[0]!.message, fields.error.issues.map((i) => ({ path: ['body', ...i.path.map(String)].join('.'), message: i.message })));
        const file = req.file;
        if (!file || file.size === 0) throw badRequest('Choose a CSV price list to upload.', [{ path: 'body.file', message: 'Choose a CSV file.' }]);
        let table;
        try {
          table = readPriceList(file.buffer, MAX_PRICE_LIST_ROWS);
        } catch (err) {
          if (err instanceof PriceListFileError) throw badRequest(err.message, [{ path: 'body.file', message: err.message }]);
          throw err;
        }
        const supplier = fields.data.supplier;
        const storageKey = newStorageKey(`org/${auth.organizationId}/price-lists`, 'csv');
        await storage.put(storageKey, file.buffer);
        const job = em.create(ImportJob, {
          organization: em.getReference(Organization, auth.organizationId),
          user: em.getReference(User, auth.user.id),
          supplier,
          fileName: file.originalname.slice(0, 200),
          storageKey,
          state: 'uploaded',
          totalRows: table.rows.length,
        });
        await em.flush();
        const remembered = await rememberedMapping(em, auth.organizationId, supplier, table.headers);
        res.status(201).json({
          job: presentImportJob(job),
          headers: table.headers,
          sampleRows: table.rows.slice(0, 5),
          encoding: table.encoding,
          delimiter: table.delimiter,
          suggestedMapping: remembered ?? { columns: guessMapping(table.headers), defaultKind: 'fitting' },
          mappingRemembered: remembered !== null,
        });
      },
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'An import: its progress and outcome',
      policy: catalogueStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const job = await findFirmJob(em, auth.organizationId, input.params.id);
        if (job.state === 'running' && !runningImports.has(job.id)) {
          // its transaction never committed: say so instead of showing it running for ever
          job.state = 'failed';
          job.error = INTERRUPTED_IMPORT;
          job.finishedAt = new Date();
          await em.flush();
        }
        res.json({ job: presentImportJob(job) });
      },
    }),
    route({
      method: 'post',
      path: '/:id/preview',
      summary: 'Check the first rows against a column mapping',
      policy: catalogueStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const job = await findFirmJob(em, auth.organizationId, input.params.id);
        const mapping = parseBody(req, ColumnMapping);
        const table = await tableOf(job);
        const unknown = Object.entries(mapping.columns).filter(([, header]) => header && !table.headers.includes(header));
        if (unknown.length)
          throw badRequest('Some chosen columns are not in this file.', unknown.map(([field, header]) => ({ path: `body.columns.${field}`, message: `The file has no column “${header}”.` })));
        const plan = await planImport(em, auth.organizationId, job.supplier, table, mapping, async () => {}, PREVIEW_ROWS);
        const rows: PreviewRow[] = [];
        const codeHeader = mapping.columns.supplierCode!;
        const nameHeader = mapping.columns.name!;
        // creates and updates keep the rows' order, so walk them alongside the rows
        let c = 0;
        let u = 0;
        table.rows.slice(0, PREVIEW_ROWS).forEach((raw, index) => {
          const row = index + 2;
          const rejected = plan.rejections.find((r) => r.row === row);
          const values = rowValues(table.headers, raw);
          if (rejected) {
            rows.push({ row, outcome: 'reject', supplierCode: values[codeHeader] ?? '', name: values[nameHeader] ?? '', kind: '', errors: [{ path: 'row', message: rejected.reason }] });
            return;
          }
          const code = values[codeHeader]?.trim() ?? '';
          const created = plan.creates[c]?.input.supplierCode === code ? plan.creates[c++] : undefined;
          const updated = !created && plan.updates[u]?.input.supplierCode === code ? plan.updates[u++] : undefined;
          const entry = created ?? updated;
          rows.push({ row, outcome: created ? 'create' : 'update', supplierCode: code, name: entry?.input.name ?? '', kind: entry?.input.kind ?? '', errors: [] });
        });
        res.json({ rows, totalRows: table.rows.length });
      },
    }),
    route({
      method: 'post',
      path: '/:id/run',
      summary: 'Import every row in one transaction (runs in the background; poll the job)',
      policy: catalogueStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const job = await findFirmJob(em, auth.organizationId, input.params.id);
        const mapping = parseBody(req, ColumnMapping);
        if (job.state !== 'uploaded') throw conflict('This price list has already been imported. Upload it again to import it once more.');
        const table = await tableOf(job);
        const unknown = Object.entries(mapping.columns).filter(([, header]) => header && !table.headers.includes(header));
        if (unknown.length)
          throw badRequest('Some chosen columns are not in this file.', unknown.map(([field, header]) => ({ path: `body.columns.${field}`, message: `The file has no column “${header}”.` })));
        await rememberMapping(em, auth.organizationId, job.supplier, mapping);
        job.state = 'running';
        job.processedRows = 0;
        runningImports.add(job.id);
        await em.flush();
        void runImport(orm, { id: job.id, organizationId: auth.organizationId, supplier: job.supplier }, table, mapping, logger.error);
        res.status(202).json({ job: presentImportJob(job) });
      },
    }),
    route({
      method: 'get',
      path: '/:id/rejections.csv',
      summary: 'The rejected rows with their reasons, as CSV',
      policy: catalogueStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const job = await findFirmJob(em, auth.organizationId, input.params.id);
        // every rejection carries the row's cells keyed by header, in the file's column order
        const headers = Object.keys(job.rejections[0]?.values ?? {});
        const name = `rejected-rows-${job.supplier.replace(/[^A-Za-z0-9-]+/g, '-').toLowerCase()}-${job.id.slice(0, 8)}.csv`;
        res
          .status(200)
          .type('text/csv; charset=utf-8')
          .setHeader('Content-Disposition', `attachment; filename="${name}"`)
          .send(rejectionsCsv(headers, job.rejections));
      },
    }),
  ]);
}
