import { z } from 'zod';
import { EstimateContent, RevisionSettings } from './estimate';

/**
 * Quotes: a quote for a customer's site, its revisions (each an estimate document) and its
 * event history. Money is integer minor units; rates basis points.
 */

/** Where a quote stands: the latest status-bearing step of its event history. */
export const QUOTE_STATUSES = [
  'draft',
  'sent',
  'viewed',
  'approved',
  'declined',
  'expired',
  'deposit-paid',
  'won',
  'lost',
] as const;
export const QuoteStatus = z.enum(QUOTE_STATUSES);
export type QuoteStatus = z.infer<typeof QuoteStatus>;

export const QUOTE_STATUS_LABELS: Record<QuoteStatus, string> = {
  draft: 'Draft',
  sent: 'Sent',
  viewed: 'Viewed',
  approved: 'Approved',
  declined: 'Declined',
  expired: 'Expired',
  'deposit-paid': 'Deposit paid',
  won: 'Won',
  lost: 'Lost',
};

export const REVISION_STATES = ['draft', 'sent', 'superseded'] as const;
export const RevisionState = z.enum(REVISION_STATES);
export type RevisionState = z.infer<typeof RevisionState>;

/**
 * Event types in a quote's history. `created` and `revised` come from the quotes module; the
 * others are appended by sending, the portal and payments. Saving the grid is not an event.
 */
export const QUOTE_EVENT_TYPES = [
  'created',
  'revised',
  'sent',
  'resent',
  'link-revoked',
  'viewed',
  'approved',
  'declined',
  'expired',
  'deposit-paid',
  'refunded',
  'question',
  'reply',
  'deposit-failed',
  'won',
  'lost',
  'finding-accepted',
  'finding-withdrawn',
] as const;
export const QuoteEventType = z.enum(QUOTE_EVENT_TYPES);
export type QuoteEventType = z.infer<typeof QuoteEventType>;

/**
 * How each event reads in a quote's history. `finding-accepted` / `finding-withdrawn` record an
 * estimator accepting (or taking back) a circuit's error with a reason; they do not move the status.
 */
export const QUOTE_EVENT_LABELS: Record<QuoteEventType, string> = {
  created: 'Created',
  revised: 'Revised',
  sent: 'Sent',
  resent: 'Sent again',
  'link-revoked': 'Links revoked',
  viewed: 'Viewed by the customer',
  approved: 'Approved',
  declined: 'Declined',
  expired: 'Expired',
  'deposit-paid': 'Deposit paid',
  refunded: 'Refunded',
  question: 'Question from the customer',
  reply: 'Reply sent',
  'deposit-failed': 'Deposit payment failed',
  won: 'Won',
  lost: 'Lost',
  'finding-accepted': 'Circuit error accepted',
  'finding-withdrawn': 'Circuit error acceptance withdrawn',
};

/** What a `finding-accepted` / `finding-withdrawn` event records in its data. */
export const FindingAcceptanceEventData = z.object({
  circuitId: z.string(),
  circuitName: z.string(),
  area: z.string(),
  code: z.string(),
  subject: z.string().nullable(),
  reason: z.string(),
});
export type FindingAcceptanceEventData = z.infer<typeof FindingAcceptanceEventData>;

/** Q-0042: the per-firm sequence number as people say it. */
export function formatQuoteNumber(n: number): string {
  return `Q-${String(n).padStart(4, '0')}`;
}

const Id = z.uuid('This id is not valid.');

// GET /api/quotes
export const QUOTE_PAGE_SIZES = [10, 25, 50, 100] as const;
export const QuoteListQuery = z.object({
  status: QuoteStatus.optional(),
  estimatorId: Id.optional(),
  /** Matches the number (Q-0042 or 42), title, customer name, site address or postcode. */
  q: z.string().trim().max(200, 'Search for at most 200 characters.').optional(),
  page: z.coerce.number().int('Pages are whole numbers.').min(1, 'Pages start at 1.').max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'At most 100 quotes a page.').default(25),
});
export type QuoteListQuery = z.infer<typeof QuoteListQuery>;

export const PersonRef = z.object({ id: z.string(), name: z.string() });
export type PersonRef = z.infer<typeof PersonRef>;

export const QuoteSiteRef = z.object({ id: z.string(), label: z.string(), addressLines: z.string(), postcode: z.string() });
export type QuoteSiteRef = z.infer<typeof QuoteSiteRef>;

export const QuoteSummary = z.object({
  id: z.string(),
  number: z.number().int(),
  /** formatQuoteNumber(number), e.g. Q-0042. */
  reference: z.string(),
  title: z.string(),
  customer: PersonRef,
  site: QuoteSiteRef.nullable(),
  estimator: PersonRef,
  status: QuoteStatus,
  /** Total incl. VAT of the current revision. */
  valueMinor: z.number().int(),
  currency: z.string(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
  sentAt: z.iso.datetime().nullable(),
  validUntil: z.iso.datetime().nullable(),
});
export type QuoteSummary = z.infer<typeof QuoteSummary>;

export const QuoteListResponse = z.object({
  quotes: z.array(QuoteSummary),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  /** The firm's owners and estimators, for the estimator filter. */
  estimators: z.array(PersonRef),
});
export type QuoteListResponse = z.infer<typeof QuoteListResponse>;

// POST /api/quotes
export const CreateQuoteRequest = z.object({
  customerId: Id,
  siteId: Id.nullable().optional(),
  title: z.string().trim().max(200, 'A title is at most 200 characters.').optional(),
});
export type CreateQuoteRequest = z.infer<typeof CreateQuoteRequest>;

/** What the engine's totals come to, as stored on a revision (per-line amounts left out). */
export const RevisionTotals = z.object({
  grossMinor: z.number().int(),
  lineDiscountMinor: z.number().int(),
  quoteDiscountMinor: z.number().int(),
  netMinor: z.number().int(),
  vatByRate: z.array(z.object({ rateBp: z.number().int(), netMinor: z.number().int(), vatMinor: z.number().int() })),
  vatMinor: z.number().int(),
  totalMinor: z.number().int(),
  costMinor: z.number().int(),
  grossMarginMinor: z.number().int(),
  grossMarginBp: z.number().int().nullable(),
  deposit: z.object({ depositMinor: z.number().int(), balanceMinor: z.number().int() }).nullable(),
  findings: z.array(z.object({ code: z.string(), severity: z.string(), message: z.string() })),
});
export type RevisionTotals = z.infer<typeof RevisionTotals>;

export const RevisionSummary = z.object({
  id: z.string(),
  number: z.number().int(),
  state: RevisionState,
  totalMinor: z.number().int().nullable(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
  sentAt: z.iso.datetime().nullable(),
});
export type RevisionSummary = z.infer<typeof RevisionSummary>;

export const QuoteRevisionView = z.object({
  id: z.string(),
  number: z.number().int(),
  state: RevisionState,
  content: EstimateContent,
  settings: RevisionSettings,
  totals: RevisionTotals.nullable(),
  /** The optimistic lock: send it back with the next save. */
  version: z.number().int(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
  sentAt: z.iso.datetime().nullable(),
});
export type QuoteRevisionView = z.infer<typeof QuoteRevisionView>;

// GET /api/quotes/:id, POST /api/quotes, POST /api/quotes/:id/revisions
export const QuoteDetailResponse = z.object({
  quote: QuoteSummary,
  /** The newest revision. */
  revision: QuoteRevisionView,
  /** Newest first. */
  revisions: z.array(RevisionSummary),
});
export type QuoteDetailResponse = z.infer<typeof QuoteDetailResponse>;

// GET /api/quotes/:id/revisions/:revisionNumber
export const RevisionParams = z.object({
  id: Id,
  revisionNumber: z.coerce.number().int('A revision number is a whole number.').min(1).max(100_000),
});
export type RevisionParams = z.infer<typeof RevisionParams>;

export const RevisionResponse = z.object({ revision: QuoteRevisionView });
export type RevisionResponse = z.infer<typeof RevisionResponse>;

// PUT /api/quotes/:id/revisions/:revisionNumber — save the whole grid
export const SaveRevisionRequest = z.object({
  /** The version this content was based on; a newer one on the server answers 409. */
  version: z.number().int('A version is a whole number.').min(1),
  content: EstimateContent,
});
export type SaveRevisionRequest = z.infer<typeof SaveRevisionRequest>;

export const SaveRevisionResponse = z.object({
  revision: z.object({
    id: z.string(),
    number: z.number().int(),
    version: z.number().int(),
    totals: RevisionTotals,
    updatedAt: z.iso.datetime(),
  }),
  quote: QuoteSummary,
});
export type SaveRevisionResponse = z.infer<typeof SaveRevisionResponse>;

// GET /api/quotes/:id/events
export const QuoteEventView = z.object({
  id: z.string(),
  type: z.string(),
  at: z.iso.datetime(),
  actor: PersonRef.nullable(),
  revisionNumber: z.number().int().nullable(),
  data: z.record(z.string(), z.unknown()),
});
export type QuoteEventView = z.infer<typeof QuoteEventView>;

export const QuoteEventsResponse = z.object({ events: z.array(QuoteEventView) });
export type QuoteEventsResponse = z.infer<typeof QuoteEventsResponse>;
