import {
  RevisionTotals,
  formatQuoteNumber,
  type QuoteEventView,
  type QuoteRevisionView,
  type QuoteSummary,
  type RevisionSummary,
} from '@gloaming/contracts';
import type { Quote, QuoteEvent, QuoteRevision } from '@gloaming/db';
import { revisionContent, revisionSettings } from './service';

const iso = (d: Date) => d.toISOString();
const isoOrNull = (d: Date | null | undefined) => (d ? d.toISOString() : null);

/** Needs customer, site, estimator and organization loaded (loadQuoteForFirm does that). */
export function presentQuoteSummary(quote: Quote): QuoteSummary {
  return {
    id: quote.id,
    number: quote.number,
    reference: formatQuoteNumber(quote.number),
    title: quote.title,
    customer: { id: quote.customer.id, name: quote.customer.name },
    site: quote.site
      ? { id: quote.site.id, label: quote.site.label, addressLines: quote.site.addressLines, postcode: quote.site.postcode }
      : null,
    estimator: { id: quote.estimator.id, name: quote.estimator.name },
    status: quote.status,
    valueMinor: quote.valueMinor,
    currency: quote.organization.currency,
    createdAt: iso(quote.createdAt),
    updatedAt: iso(quote.updatedAt),
    sentAt: isoOrNull(quote.sentAt),
    validUntil: isoOrNull(quote.validUntil),
  };
}

function totalsOf(revision: Pick<QuoteRevision, 'totals'>): RevisionTotals | null {
  const parsed = RevisionTotals.safeParse(revision.totals);
  return parsed.success ? parsed.data : null;
}

/** What a revision summary reads: never the estimate document (see listRevisionSummaries). */
type RevisionSummarySource = Pick<QuoteRevision, 'id' | 'number' | 'state' | 'totals' | 'createdAt' | 'updatedAt' | 'sentAt'>;

export function presentRevisionSummary(revision: RevisionSummarySource): RevisionSummary {
  return {
    id: revision.id,
    number: revision.number,
    state: revision.state,
    totalMinor: totalsOf(revision)?.totalMinor ?? null,
    createdAt: iso(revision.createdAt),
    updatedAt: iso(revision.updatedAt),
    sentAt: isoOrNull(revision.sentAt),
  };
}

export function presentRevision(revision: QuoteRevision): QuoteRevisionView {
  return {
    id: revision.id,
    number: revision.number,
    state: revision.state,
    content: revisionContent(revision),
    settings: revisionSettings(revision),
    totals: totalsOf(revision),
    version: revision.version,
    createdAt: iso(revision.createdAt),
    updatedAt: iso(revision.updatedAt),
    sentAt: isoOrNull(revision.sentAt),
  };
}

/** Needs actor and revision loaded (listQuoteEvents does that). */
export function presentQuoteEvent(event: QuoteEvent): QuoteEventView {
  return {
    id: event.id,
    type: event.type,
    at: iso(event.at),
    actor: event.actor ? { id: event.actor.id, name: event.actor.name } : null,
    revisionNumber: event.revision ? event.revision.number : null,
    data: event.data,
  };
}
