/**
 * The owner's activity log: the firm's own history (FirmEvent: settings, logo, team) and its
 * quotes' history (QuoteEvent) in one list, newest first. recordFirmEvent appends to the
 * first; quote events are appended by the quotes module (appendQuoteEvent).
 */
import {
  formatQuoteNumber,
  QUOTE_STATUS_LABELS,
  type ActivityEntry,
  type FirmEventType,
  type FirmSettings,
  type QuoteStatus,
} from '@gloaming/contracts';
import { FirmEvent, Organization, QuoteEvent, User, type EntityManager } from '@gloaming/db';

/** Append to the firm's history. Persisted, not flushed: the caller flushes with its change. */
export function recordFirmEvent(
  em: EntityManager,
  organizationId: string,
  type: FirmEventType,
  actorId: string | null,
  subjectId: string | null = null,
  data: Record<string, unknown> = {},
): FirmEvent {
  return em.create(FirmEvent, {
    organization: em.getReference(Organization, organizationId),
    type,
    actor: actorId ? em.getReference(User, actorId) : null,
    subject: subjectId ? em.getReference(User, subjectId) : null,
    data,
    at: new Date(),
  });
}

const person = (u: { id: string; name: string } | null | undefined) => (u ? { id: u.id, name: u.name } : null);

/** The settings as the owner knows them, for "Changed the firm settings: default markup, terms". */
const SETTING_WORDS: Record<keyof FirmSettings, string> = {
  name: 'firm name',
  addressLines: 'address',
  vatNumber: 'VAT number',
  currency: 'currency',
  locale: 'number and date format',
  vatRateBp: 'standard VAT rate',
  vatRatesBp: 'VAT rates',
  vatRounding: 'VAT rounding',
  depositPercentBp: 'default deposit',
  markupPercentBp: 'default markup',
  labourRateMinorPerHour: 'labour rate',
  design: 'circuit design settings',
  quoteValidityDays: 'quote validity',
  termsText: 'terms',
  emailSenderName: 'e-mail sender name',
};
const settingWord = (key: string) => (key in SETTING_WORDS ? SETTING_WORDS[key as keyof FirmSettings] : key);

function firmSummary(e: FirmEvent): string {
  const who = e.subject?.name ?? 'someone';
  const d = e.data;
  switch (e.type as FirmEventType) {
    case 'settings-changed': {
      const fields = Array.isArray(d.fields) ? (d.fields as unknown[]).map((f) => settingWord(String(f))) : [];
      return fields.length ? `Changed the firm settings: ${fields.join(', ')}` : 'Saved the firm settings';
    }
    case 'logo-changed':
      return 'Uploaded a new logo';
    case 'logo-removed':
      return 'Removed the logo';
    case 'member-invited':
      return `Invited ${who} as ${String(d.role ?? 'a team member')}`;
    case 'role-changed':
      return `Changed ${who}’s role from ${String(d.from)} to ${String(d.to)}`;
    case 'member-deactivated':
      return `Deactivated ${who} (their sessions ended)`;
    case 'member-reactivated':
      return `Reactivated ${who}`;
    default:
      return e.type;
  }
}

const QUOTE_VERBS: Record<string, string> = {
  created: 'Created',
  revised: 'Started a new revision of',
  sent: 'Sent',
  resent: 'Sent again',
  'link-revoked': 'Revoked the links of',
  viewed: 'Customer viewed',
  approved: 'Customer approved',
  declined: 'Customer declined',
  expired: 'Validity ran out on',
  'deposit-paid': 'Deposit paid on',
  'deposit-failed': 'A deposit payment failed on',
  refunded: 'Deposit refunded on',
  question: 'Customer asked a question on',
  reply: 'Replied to the customer on',
  won: 'Marked won:',
  lost: 'Marked lost:',
};

function quoteSummary(e: QuoteEvent, reference: string): string {
  const verb =
    QUOTE_VERBS[e.type] ??
    (QUOTE_STATUS_LABELS[e.type as QuoteStatus] ? `${QUOTE_STATUS_LABELS[e.type as QuoteStatus]}:` : e.type);
  const reason =
    e.type === 'declined' && typeof e.data.reason === 'string' && e.data.reason.trim() ? ` (“${e.data.reason.trim()}”)` : '';
  return `${verb} ${reference}${reason}`;
}

export interface ActivityPage {
  entries: ActivityEntry[];
  nextBefore: string | null;
  nextBeforeId: string | null;
}

/**
 * Newest first (by time, then id), `limit` at a time, strictly after the entry `before` /
 * `beforeId` in that order (without `beforeId`: strictly older than `before`). With `quoteId`,
 * only that quote's history (no firm events); `actorId` keeps what one person did, `kind` one
 * of the two histories.
 */
export async function activityLog(
  em: EntityManager,
  organizationId: string,
  opts: { before?: Date; beforeId?: string; limit: number; quoteId?: string; actorId?: string; kind?: ActivityEntry['kind'] },
): Promise<ActivityPage> {
  const after = opts.before
    ? opts.beforeId
      ? { $or: [{ at: { $lt: opts.before } }, { at: opts.before, id: { $lt: opts.beforeId } }] }
      : { at: { $lt: opts.before } }
    : {};
  const actor = opts.actorId ? { actor: opts.actorId } : {};
  const take = opts.limit + 1;
  const quoteEvents =
    opts.kind === 'firm'
      ? []
      : await em.find(
          QuoteEvent,
          { organization: organizationId, ...(opts.quoteId ? { quote: opts.quoteId } : {}), ...after, ...actor },
          { populate: ['actor', 'quote'], orderBy: { at: 'desc', id: 'desc' }, limit: take },
        );
  const firmEvents =
    opts.quoteId || opts.kind === 'quote'
      ? []
      : await em.find(
          FirmEvent,
          { organization: organizationId, ...after, ...actor },
          { populate: ['actor', 'subject'], orderBy: { at: 'desc', id: 'desc' }, limit: take },
        );
  const merged: { at: Date; entry: ActivityEntry }[] = [
    ...quoteEvents.map((e) => {
      const reference = formatQuoteNumber(e.quote.number);
      return {
        at: e.at,
        entry: {
          id: e.id,
          at: e.at.toISOString(),
          actor: person(e.actor),
          kind: 'quote' as const,
          type: e.type,
          summary: quoteSummary(e, reference),
          quote: { id: e.quote.id, reference },
          subject: null,
        },
      };
    }),
    ...firmEvents.map((e) => ({
      at: e.at,
      entry: {
        id: e.id,
        at: e.at.toISOString(),
        actor: person(e.actor),
        kind: 'firm' as const,
        type: e.type,
        summary: firmSummary(e),
        quote: null,
        subject: person(e.subject),
      },
    })),
  ].sort((a, b) => b.at.getTime() - a.at.getTime() || (a.entry.id < b.entry.id ? 1 : -1));
  const page = merged.slice(0, opts.limit);
  const more = merged.length > opts.limit;
  const last = more && page.length ? page[page.length - 1]!.entry : null;
  return { entries: page.map((m) => m.entry), nextBefore: last ? last.at : null, nextBeforeId: last ? last.id : null };
}
