import { z } from 'zod';
import { PersonRef } from './quotes';

/**
 * The owner's activity log: who did what, when. Quote history (QuoteEvent) and the firm's
 * own history (settings, logo, team) in one list, newest first.
 */

export const FIRM_EVENT_TYPES = [
  'settings-changed',
  'logo-changed',
  'logo-removed',
  'member-invited',
  'role-changed',
  'member-deactivated',
  'member-reactivated',
] as const;
export const FirmEventType = z.enum(FIRM_EVENT_TYPES);
export type FirmEventType = z.infer<typeof FirmEventType>;

export const ActivityEntry = z.object({
  id: z.string(),
  at: z.iso.datetime(),
  /** Who did it; null for the homeowner or the system. */
  actor: PersonRef.nullable(),
  /** `quote` entries carry the quote; `firm` entries the person acted on, if any. */
  kind: z.enum(['quote', 'firm']),
  type: z.string(),
  /** A plain sentence: "Sent Q-0042 to the customer", "Changed Priya's role to owner". */
  summary: z.string(),
  quote: z.object({ id: z.string(), reference: z.string() }).nullable(),
  subject: PersonRef.nullable(),
});
export type ActivityEntry = z.infer<typeof ActivityEntry>;

export const ActivityQuery = z.object({
  /** Entries strictly older than this (the previous page's last `at`). */
  before: z.iso.datetime('Give a date-time like 2026-05-01T10:00:00.000Z.').optional(),
  /**
   * With `before`: the previous page's last entry id (`nextBeforeId`), so entries at the same
   * instant as that one are neither skipped nor repeated at the page edge.
   */
  beforeId: z.string().min(1, 'Give the id of the last entry seen.').max(100, 'At most 100 characters.').optional(),
  limit: z.coerce.number().int('A whole number.').min(1, 'At least 1.').max(200, 'At most 200 entries a page.').default(50),
  /** Only what this person did. */
  actorId: z.uuid('Give a person’s id.').optional(),
  /** Only quote history or only the firm's own (settings, logo, team). */
  kind: z.enum(['quote', 'firm'], 'The kind is quote or firm.').optional(),
});
export type ActivityQuery = z.input<typeof ActivityQuery>;

export const ActivityResponse = z.object({
  entries: z.array(ActivityEntry),
  /** Pass as `before` (with `nextBeforeId` as `beforeId`) for the next page; null at the end. */
  nextBefore: z.iso.datetime().nullable(),
  nextBeforeId: z.string().nullable(),
});
export type ActivityResponse = z.infer<typeof ActivityResponse>;
