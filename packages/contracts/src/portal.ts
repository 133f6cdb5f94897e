import { z } from 'zod';
import { Discount, VatRounding } from './estimate';
import { Problem } from './problem';
import { QuoteStatus } from './quotes';

/**
 * The homeowner's portal: what a personal quote link shows and what it accepts. The view
 * carries sell prices only — never a cost, markup or margin — and enough of each line for
 * the browser to add the totals up instantly with the engine's money functions; the server
 * recomputes them on every request and its figures are the truth.
 */

/** The raw token from the link. Anything else is simply an unknown link (404), never a field error. */
export const PortalTokenParams = z.object({ token: z.string().max(200) });
export type PortalTokenParams = z.infer<typeof PortalTokenParams>;

export const PortalPhotoParams = PortalTokenParams.extend({ photoId: z.string().max(64) });
export type PortalPhotoParams = z.infer<typeof PortalPhotoParams>;

/** Who to talk to at the firm: on the quote page and on every "this link no longer works" page. */
export const PortalFirmContact = z.object({
  name: z.string(),
  addressLines: z.array(z.string()),
  /** The estimator who prepared the quote. */
  contactName: z.string(),
  contactEmail: z.string(),
});
export type PortalFirmContact = z.infer<typeof PortalFirmContact>;

export const PortalFirm = PortalFirmContact.extend({
  vatNumber: z.string(),
  /** The firm has uploaded a logo: GET /api/portal/:token/logo serves it. */
  hasLogo: z.boolean(),
});
export type PortalFirm = z.infer<typeof PortalFirm>;

export const PORTAL_LINE_KINDS = ['standard', 'optional', 'alternative'] as const;
export const PortalLineKind = z.enum(PORTAL_LINE_KINDS);
export type PortalLineKind = z.infer<typeof PortalLineKind>;

export const PortalLine = z.object({
  id: z.string(),
  description: z.string(),
  note: z.string(),
  quantityMilli: z.number().int(),
  unit: z.string(),
  /** Sell price per unit ex VAT. */
  unitPriceMinor: z.number().int(),
  vatRateBp: z.number().int(),
  discount: Discount.nullable(),
  /** This line's own amount ex VAT after its discount (shown whether or not it is chosen). */
  amountMinor: z.number().int(),
  kind: PortalLineKind,
  /** The pick-one group's name for alternatives; null otherwise. */
  group: z.string().nullable(),
  /** Chosen in the selection the view was priced with (always true for standard lines). */
  selected: z.boolean(),
});
export type PortalLine = z.infer<typeof PortalLine>;

export const PortalSection = z.object({ id: z.string(), name: z.string(), lines: z.array(PortalLine) });
export type PortalSection = z.infer<typeof PortalSection>;

export const PortalPhoto = z.object({
  id: z.string(),
  caption: z.string(),
  /** Same-origin api path of the JPEG, reachable with the link's token. */
  url: z.string(),
  width: z.number().int(),
  height: z.number().int(),
});
export type PortalPhoto = z.infer<typeof PortalPhoto>;

/** The totals a homeowner sees: no cost, no margin. */
export const PortalTotals = z.object({
  grossMinor: z.number().int(),
  lineDiscountMinor: z.number().int(),
  quoteDiscountMinor: z.number().int(),
  netMinor: z.number().int(),
  vatByRate: z.array(z.object({ rateBp: z.number().int(), netMinor: z.number().int(), vatMinor: z.number().int() })),
  vatMinor: z.number().int(),
  totalMinor: z.number().int(),
  deposit: z.object({ depositMinor: z.number().int(), balanceMinor: z.number().int() }).nullable(),
});
export type PortalTotals = z.infer<typeof PortalTotals>;

/**
 * Line id -> chosen, for optional lines and pick-one alternatives. Lines left out keep the
 * firm's suggested choice; choosing one alternative of a group un-chooses the others.
 */
export const PortalSelection = z.record(z.string().max(64), z.boolean());
export type PortalSelection = z.infer<typeof PortalSelection>;

export const PORTAL_QUOTE_STATES = ['open', 'approved', 'declined', 'expired', 'superseded'] as const;
export const PortalQuoteState = z.enum(PORTAL_QUOTE_STATES);
export type PortalQuoteState = z.infer<typeof PortalQuoteState>;

export const PortalApprovalSummary = z.object({
  signedName: z.string(),
  approvedAt: z.iso.datetime(),
  /** The choice frozen at approval, every optional line and alternative named. */
  selection: PortalSelection,
  totals: PortalTotals,
  totalMinor: z.number().int(),
  depositMinor: z.number().int(),
  currency: z.string(),
});
export type PortalApprovalSummary = z.infer<typeof PortalApprovalSummary>;

export const PortalMessage = z.object({
  id: z.string(),
  from: z.enum(['homeowner', 'staff']),
  /** The homeowner's own name, or the staff member who replied. */
  authorName: z.string(),
  body: z.string(),
  at: z.iso.datetime(),
});
export type PortalMessage = z.infer<typeof PortalMessage>;

export const PortalQuoteView = z.object({
  reference: z.string(),
  title: z.string(),
  revisionNumber: z.number().int(),
  state: PortalQuoteState,
  issuedOn: z.iso.datetime(),
  validUntil: z.iso.datetime(),
  currency: z.string(),
  locale: z.string(),
  vatRounding: VatRounding,
  firm: PortalFirm,
  customer: z.object({ name: z.string() }),
  site: z.object({ label: z.string(), addressLines: z.array(z.string()) }).nullable(),
  introduction: z.string(),
  sections: z.array(PortalSection),
  photos: z.array(PortalPhoto),
  /** The quote-wide discount and the deposit rule, for the browser's own sums. */
  discount: Discount.nullable(),
  deposit: Discount.nullable(),
  /** Server totals for `selection`: the approved choice once approved, else the firm's suggestion. */
  selection: PortalSelection,
  totals: PortalTotals,
  terms: z.string(),
  safetyNote: z.string(),
  /** Same-origin api path of the quote PDF. */
  pdfUrl: z.string(),
  approval: PortalApprovalSummary.nullable(),
  declined: z.object({ at: z.iso.datetime(), reason: z.string().nullable() }).nullable(),
  messages: z.array(PortalMessage),
});
export type PortalQuoteView = z.infer<typeof PortalQuoteView>;

export const PortalQuoteResponse = z.object({ quote: PortalQuoteView });
export type PortalQuoteResponse = z.infer<typeof PortalQuoteResponse>;

// POST /api/portal/:token/totals
export const PortalTotalsRequest = z.object({ selection: PortalSelection });
export type PortalTotalsRequest = z.infer<typeof PortalTotalsRequest>;

export const PortalTotalsResponse = z.object({
  /** The full choice the server priced (every optional line and alternative). */
  selection: PortalSelection,
  totals: PortalTotals,
});
export type PortalTotalsResponse = z.infer<typeof PortalTotalsResponse>;

// POST /api/portal/:token/questions
export const PortalQuestionRequest = z.object({
  body: z.string().trim().min(1, 'Write your question first.').max(4000, 'At most 4,000 characters.'),
});
export type PortalQuestionRequest = z.infer<typeof PortalQuestionRequest>;

export const PortalQuestionResponse = z.object({ message: PortalMessage });
export type PortalQuestionResponse = z.infer<typeof PortalQuestionResponse>;

// POST /api/portal/:token/approval
export const PortalApprovalRequest = z.object({
  selection: PortalSelection,
  signedName: z
    .string()
    .trim()
    .max(200, 'At most 200 characters.')
    .refine((name) => name.length >= 2 && /\p{L}/u.test(name), 'Type your full name to approve.'),
  termsAccepted: z.literal(true, 'Tick the box to accept the terms.'),
});
export type PortalApprovalRequest = z.infer<typeof PortalApprovalRequest>;

export const PortalApprovalResponse = z.object({ approval: PortalApprovalSummary });
export type PortalApprovalResponse = z.infer<typeof PortalApprovalResponse>;

// POST /api/portal/:token/decline
export const PortalDeclineRequest = z.object({
  reason: z.string().trim().max(2000, 'At most 2,000 characters.').optional(),
});
export type PortalDeclineRequest = z.infer<typeof PortalDeclineRequest>;

export const PortalDeclineResponse = z.object({ declined: z.object({ at: z.iso.datetime(), reason: z.string().nullable() }) });
export type PortalDeclineResponse = z.infer<typeof PortalDeclineResponse>;

/**
 * Why a link does not open a quote. `unknown` carries nothing about any firm (no help to
 * anyone guessing links); the others name the firm to contact. `superseded` carries the
 * newer revision's link when one is live.
 */
export const PORTAL_LINK_STATES = ['unknown', 'revoked', 'expired', 'superseded'] as const;
export const PortalLinkState = z.enum(PORTAL_LINK_STATES);
export type PortalLinkState = z.infer<typeof PortalLinkState>;

export const PortalLinkProblem = Problem.extend({
  linkState: PortalLinkState,
  firm: PortalFirmContact.optional(),
  /** Path of the newer revision's live link (`/portal/q/...`). */
  currentLink: z.string().optional(),
});
export type PortalLinkProblem = z.infer<typeof PortalLinkProblem>;

// Workbench: the quote's conversation and the homeowner's decision
export const QuoteMessageView = PortalMessage.extend({ revisionNumber: z.number().int().nullable() });
export type QuoteMessageView = z.infer<typeof QuoteMessageView>;

export const QuoteMessagesResponse = z.object({ messages: z.array(QuoteMessageView) });
export type QuoteMessagesResponse = z.infer<typeof QuoteMessagesResponse>;

export const QuoteReplyRequest = z.object({
  body: z.string().trim().min(1, 'Write your reply first.').max(4000, 'At most 4,000 characters.'),
});
export type QuoteReplyRequest = z.infer<typeof QuoteReplyRequest>;

export const QuoteReplyResponse = z.object({ message: QuoteMessageView, sentTo: z.string() });
export type QuoteReplyResponse = z.infer<typeof QuoteReplyResponse>;

export const QuoteDecisionResponse = z.object({
  /** The quote's status now (it follows the homeowner's steps). */
  status: QuoteStatus,
  approval: PortalApprovalSummary.extend({
    revisionNumber: z.number().int(),
    ipAddress: z.string(),
    userAgent: z.string(),
    contentHash: z.string(),
  }).nullable(),
  declined: z
    .object({ at: z.iso.datetime(), reason: z.string().nullable(), revisionNumber: z.number().int().nullable() })
    .nullable(),
});
export type QuoteDecisionResponse = z.infer<typeof QuoteDecisionResponse>;
