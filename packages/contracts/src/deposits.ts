import { z } from 'zod';

/**
 * Deposit payments: after approval the homeowner pays the deposit through the payment
 * provider's hosted checkout; the provider's signed webhook is the only thing that records a
 * payment. Amounts are integer minor units; currencies ISO 4217, upper case (GBP).
 */

export const DEPOSIT_PAYMENT_STATES = ['open', 'paid', 'failed', 'expired', 'refunded', 'partly-refunded'] as const;
export const DepositPaymentState = z.enum(DEPOSIT_PAYMENT_STATES);
export type DepositPaymentState = z.infer<typeof DepositPaymentState>;

export const DEPOSIT_PAYMENT_STATE_LABELS: Record<DepositPaymentState, string> = {
  open: 'Awaiting payment',
  paid: 'Paid',
  failed: 'Card refused',
  expired: 'Checkout expired',
  refunded: 'Refunded',
  'partly-refunded': 'Partly refunded',
};

/** States in which money was taken (and may since have been refunded). */
export const PAID_DEPOSIT_STATES: readonly DepositPaymentState[] = ['paid', 'partly-refunded', 'refunded'];

/**
 * The provider's decline codes in plain words for the homeowner. Unknown codes fall back to a
 * general sentence; the code itself is kept for the firm.
 */
export function depositFailureMessage(code: string | null): string {
  switch (code) {
    case 'card_declined':
    case 'generic_decline':
      return 'Your card was declined. No money was taken. You can try again, perhaps with another card.';
    case 'insufficient_funds':
      return 'Your card was declined for insufficient funds. No money was taken. You can try again with another card.';
    case 'expired_card':
      return 'Your card has expired. No money was taken. You can try again with another card.';
    case 'incorrect_cvc':
      return 'The security code did not match. No money was taken. You can try again.';
    default:
      return 'The payment did not go through. No money was taken. You can try again.';
  }
}

// /api/portal/:token/deposit… (params: PortalTokenParams from portal.ts)
/** GET …/deposit?session=cs_…: the return page asks about the session it came back from. */
export const PortalDepositQuery = z.object({
  session: z.string().trim().min(1).max(255).optional(),
});
export type PortalDepositQuery = z.infer<typeof PortalDepositQuery>;

export const PortalDepositState = z.object({
  /** The deposit the approval asked for, computed on the server from the approved totals. */
  depositMinor: z.number().int(),
  currency: z.string(),
  /** none: no payment started yet. */
  state: z.union([z.literal('none'), DepositPaymentState]),
  failureCode: z.string().nullable(),
  /** Plain words for a failure; null unless failed. */
  failureMessage: z.string().nullable(),
  paidAt: z.iso.datetime().nullable(),
  refundedMinor: z.number().int(),
  /** True when "Pay deposit" may be offered (approved, current, nothing paid yet). */
  canPay: z.boolean(),
});
export type PortalDepositState = z.infer<typeof PortalDepositState>;

export const PortalDepositResponse = z.object({ deposit: PortalDepositState });
export type PortalDepositResponse = z.infer<typeof PortalDepositResponse>;

/** POST …/deposit/checkout takes no amount: whatever a client sends is ignored. */
export const DepositCheckoutResponse = z.object({
  /** The provider's hosted checkout page to send the browser to. */
  url: z.url(),
  paymentId: z.string(),
  depositMinor: z.number().int(),
  currency: z.string(),
});
export type DepositCheckoutResponse = z.infer<typeof DepositCheckoutResponse>;

// /api/quotes/:id/deposits…
export const QuoteDepositsParams = z.object({ id: z.uuid('This id is not valid.') });
export type QuoteDepositsParams = z.infer<typeof QuoteDepositsParams>;

export const DepositPaymentParams = z.object({
  id: z.uuid('This id is not valid.'),
  paymentId: z.uuid('This id is not valid.'),
});
export type DepositPaymentParams = z.infer<typeof DepositPaymentParams>;

export const DepositPaymentView = z.object({
  id: z.string(),
  state: DepositPaymentState,
  amountMinor: z.number().int(),
  currency: z.string(),
  refundedMinor: z.number().int(),
  /** What may still be refunded (0 unless money was taken). */
  refundableMinor: z.number().int(),
  failureCode: z.string().nullable(),
  checkoutSessionId: z.string(),
  paymentIntentId: z.string().nullable(),
  createdAt: z.iso.datetime(),
  paidAt: z.iso.datetime().nullable(),
  version: z.number().int(),
});
export type DepositPaymentView = z.infer<typeof DepositPaymentView>;

export const QuoteDepositsResponse = z.object({
  /** The approved deposit, or null when the quote has no approval yet. */
  approved: z.object({ depositMinor: z.number().int(), currency: z.string(), approvedAt: z.iso.datetime() }).nullable(),
  /** Newest first. */
  payments: z.array(DepositPaymentView),
  paidMinor: z.number().int(),
  refundedMinor: z.number().int(),
});
export type QuoteDepositsResponse = z.infer<typeof QuoteDepositsResponse>;

export const RefundDepositRequest = z.object({
  /** Defaults to everything not yet refunded. */
  amountMinor: z.number().int('Refunds are whole pence.').min(1, 'Refund at least 1p.').optional(),
});
export type RefundDepositRequest = z.infer<typeof RefundDepositRequest>;

export const RefundDepositResponse = z.object({ payment: DepositPaymentView, refundedNowMinor: z.number().int() });
export type RefundDepositResponse = z.infer<typeof RefundDepositResponse>;
