import {
  RevisionTotals,
  formatQuoteNumber,
  type QuoteEventView,
  type QuoteRevisionView,
  type QuoteSummary,
  type RevisionSummary,
} from '@gloaming/contracts';
import type { QuoteEvent, QuoteRevision, QuoteRow, RevisionWithContentRow } from '@gloaming/db';
import { storedJsonText, withJsonText, type JsonText } from '../../http/json-text';
import { revisionSettings } from './service';

const iso = (d: Date) => d.toISOString();
const isoOrNull = (d: Date | null | undefined) => (d ? d.toISOString() : null);

/**
 * What a quote summary reads: a Quote entity with customer, site, estimator and organization
 * loaded (loadQuoteForFirm), or the plain row of readQuote.
 */
type QuoteSummarySource = Pick<QuoteRow, 'id' | 'number' | 'title' | 'status' | 'valueMinor' | 'createdAt' | 'updatedAt'> & {
  sentAt?: Date | null;
  validUntil?: Date | null;
  customer: QuoteRow['customer'];
  site?: QuoteRow['site'];
  estimator: QuoteRow['estimator'];
  organization: Pick<QuoteRow['organization'], 'currency'>;
};

export function presentQuoteSummary(quote: QuoteSummarySource): QuoteSummary {
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

/** What a revision summary reads: never the estimate document (see readRevisionsWithCurrent). */
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

/** A revision's view as JSON text, the estimate passed through as stored (readRevision with its content). */
export function revisionViewJson(revision: RevisionWithContentRow): JsonText<QuoteRevisionView> {
  const view: Omit<QuoteRevisionView, 'content'> = {
    id: revision.id,
    number: revision.number,
    state: revision.state,
    settings: revisionSettings(revision),
    totals: totalsOf(revision),
    version: revision.version,
    createdAt: iso(revision.createdAt),
    updatedAt: iso(revision.updatedAt),
    sentAt: isoOrNull(revision.sentAt),
  };
  return withJsonText<QuoteRevisionView, 'content'>(view, 'content', storedJsonText(revision.contentJson));
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
