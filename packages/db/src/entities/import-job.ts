import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { User } from './user';

const p = defineEntity.properties;

export const IMPORT_JOB_STATES = ['uploaded', 'running', 'done', 'failed'] as const;
export type ImportJobState = (typeof IMPORT_JOB_STATES)[number];

/** One price-list upload: its file, progress and outcome (created / updated / rejected). */
export const ImportJob = defineEntity({
  name: 'ImportJob',
  tableName: 'import_jobs',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    user: () => p.manyToOne(User),
    supplier: p.string().default(''),
    fileName: p.string(),
    /** Where the uploaded file is kept (storage key under DATA_DIR). */
    storageKey: p.string(),
    state: p.string().$type<ImportJobState>(),
    totalRows: p.integer().default(0),
    processedRows: p.integer().default(0),
    createdCount: p.integer().default(0),
    updatedCount: p.integer().default(0),
    rejectedCount: p.integer().default(0),
    /**
     * Rejected rows with reasons, for the CSV download. Plain `json`, not PostgreSQL's jsonb:
     * each row's `values` keeps the file's column order, which jsonb would re-sort.
     */
    rejections: p
      .json<{ row: number; reason: string; values: Record<string, string> }[]>()
      .columnType('json')
      .onCreate(() => []),
    error: p.text().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    finishedAt: p.datetime().nullable(),
  },
});
export type ImportJob = InferEntity<typeof ImportJob>;
