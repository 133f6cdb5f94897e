import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { Quote } from './quote';

const p = defineEntity.properties;

export const REVISION_STATES = ['draft', 'sent', 'superseded'] as const;
export type RevisionState = (typeof REVISION_STATES)[number];

/**
 * One version of a quote's estimate. The estimate document (sections, lines, options) and the
 * firm settings it was priced with are JSON validated by the contracts; totals are recomputed
 * by the engine on every save. Sending freezes a revision; later edits make a new draft.
 * `version` is the optimistic lock the grid's autosave sends back.
 */
export const QuoteRevision = defineEntity({
  name: 'QuoteRevision',
  tableName: 'quote_revisions',
  uniques: [{ properties: ['quote', 'number'] }],
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    quote: () => p.manyToOne(Quote).index().deleteRule('cascade'),
    number: p.integer(),
    state: p.string().$type<RevisionState>(),
    content: p.json<Record<string, unknown>>(),
    settings: p.json<Record<string, unknown>>(),
    totals: p.json<Record<string, unknown>>().nullable(),
    /** SHA-256 of the frozen content, set when sent. */
    contentHash: p.string().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    sentAt: p.datetime().nullable(),
    version: p.integer().version(),
  },
});
export type QuoteRevision = InferEntity<typeof QuoteRevision>;
