import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { Quote } from './quote';
import { QuoteRevision } from './quote-revision';

const p = defineEntity.properties;

/**
 * A homeowner's acceptance of one sent revision: the options they chose, the totals the server
 * computed for that choice (frozen here, the deposit included), who typed their name, when and
 * from where, and the SHA-256 of the revision content they saw. One per revision (unique), so
 * approving twice cannot record two acceptances.
 */
export const QuoteApproval = defineEntity({
  name: 'QuoteApproval',
  tableName: 'quote_approvals',
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    quote: () => p.manyToOne(Quote).index().deleteRule('cascade'),
    revision: () => p.manyToOne(QuoteRevision).unique().deleteRule('cascade'),
    /** Line id -> chosen, for every optional line and pick-one alternative of the revision. */
    selection: p.json<Record<string, boolean>>(),
    /** The engine's totals for that selection, as stored on revisions. */
    totals: p.json<Record<string, unknown>>(),
    totalMinor: p.integer(),
    depositMinor: p.integer(),
    currency: p.string(),
    signedName: p.string(),
    termsAccepted: p.boolean(),
    ipAddress: p.string(),
    userAgent: p.string().default(''),
    /** SHA-256 of the revision content at approval (equals the revision's contentHash). */
    contentHash: p.string(),
    approvedAt: p.datetime().onCreate(() => new Date()),
  },
});
export type QuoteApproval = InferEntity<typeof QuoteApproval>;
