import { z } from 'zod';
import { Blocker } from './problem';

/**
 * Sending a quote revision to the homeowner: an e-mail with the PDF attached and a portal
 * link. The link carries a fresh 32-byte token; only its SHA-256 is stored. It expires with
 * the quote's validity, is scoped to one revision, and can be revoked.
 */
export const QuoteRevisionParams = z.object({
  id: z.uuid('This id is not valid.'),
  revisionId: z.uuid('This id is not valid.'),
});
export type QuoteRevisionParams = z.infer<typeof QuoteRevisionParams>;

const Message = z.string().trim().max(4000, 'At most 4,000 characters.');

export const SendQuoteRequest = z.object({
  /** Defaults to the customer's e-mail address. */
  to: z.email('Enter a valid e-mail address.').max(254).optional(),
  /** A personal note above the standard text. */
  message: Message.optional(),
  /** Codes of warnings the estimator has read and accepts (circuit findings, later). */
  acknowledged: z.array(z.string().max(80)).max(200).optional(),
});
export type SendQuoteRequest = z.infer<typeof SendQuoteRequest>;

export const SendPreviewQuery = z.object({ message: Message.optional() });
export type SendPreviewQuery = z.infer<typeof SendPreviewQuery>;

export const SendPreviewResponse = z.object({
  to: z.string().nullable(),
  subject: z.string(),
  text: z.string(),
  attachmentName: z.string(),
  /** Why it cannot be sent yet; empty when it can. */
  blockers: z.array(Blocker),
});
export type SendPreviewResponse = z.infer<typeof SendPreviewResponse>;

/**
 * Where the e-mail carrying something stands: `sent` once the mail server took it, `queued`
 * while it waits for the server (retried with back-off), `failed` after the last attempt.
 */
export const MAIL_DELIVERIES = ['sent', 'queued', 'failed'] as const;
export const MailDelivery = z.enum(MAIL_DELIVERIES);
export type MailDelivery = z.infer<typeof MailDelivery>;
export const MAIL_DELIVERY_LABELS: Record<MailDelivery, string> = {
  sent: 'E-mail sent',
  queued: 'E-mail queued',
  failed: 'E-mail failed',
};

export const PortalLinkSummary = z.object({
  id: z.string(),
  sentTo: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
  revokedAt: z.string().nullable(),
  /** Not revoked and not expired. */
  active: z.boolean(),
  /** The e-mail that carried the link. */
  delivery: MailDelivery,
  /** Hand-overs to the mail server tried so far (0 before the first). */
  deliveryAttempts: z.number().int().nonnegative(),
});
export type PortalLinkSummary = z.infer<typeof PortalLinkSummary>;

export const RevisionSendingState = z.object({
  revisionId: z.string(),
  state: z.enum(['draft', 'sent', 'superseded']),
  sentAt: z.string().nullable(),
  contentHash: z.string().nullable(),
  validUntil: z.string().nullable(),
  links: z.array(PortalLinkSummary),
});
export type RevisionSendingState = z.infer<typeof RevisionSendingState>;

export const SendQuoteResponse = z.object({ sending: RevisionSendingState, sentTo: z.string(), delivery: MailDelivery });
export type SendQuoteResponse = z.infer<typeof SendQuoteResponse>;

export const RevokeLinksResponse = z.object({ sending: RevisionSendingState, revoked: z.number().int() });
export type RevokeLinksResponse = z.infer<typeof RevokeLinksResponse>;

export const SendingStateResponse = z.object({ sending: RevisionSendingState });
export type SendingStateResponse = z.infer<typeof SendingStateResponse>;

/** The portal path a link opens: `${publicUrl}${portalQuotePath(token)}`. */
export const portalQuotePath = (token: string): string => `/portal/q/${token}`;
