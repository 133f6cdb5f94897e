/**
 * The owner's figures from each quote's milestones (the first time its history reached each
 * step). Pure: the service reads the milestones from the event history with SQL and hands
 * them here. Definitions (also in packages/contracts/src/figures.ts):
 *
 * - a period's cohort is the quotes created in [from, to); a step counts when it happened
 *   before the cut (the period's end, or now if sooner);
 * - a quote's value is its approved total when approved, else its current revision's total;
 * - conversion rates are basis points rounded half up; a rate over nothing is null;
 * - median: the middle value, or the mean of the two middle values; p90: nearest rank, the
 *   ceil(0.9 n)-th smallest value; days to one decimal;
 * - lost: declined (last decline's reason; blank is "No reason given") or expired (an
 *   `expired` event, or validity that ran out before the cut), and never approved.
 */
import type { Funnel, JobSizeBand, LostFigures, PeriodFigures, SpeedFigure } from '@gloaming/contracts';

export interface Milestones {
  id: string;
  estimatorId: string;
  estimatorName: string;
  valueMinor: number;
  createdAt: Date;
  sentAt: Date | null;
  viewedAt: Date | null;
  approvedAt: Date | null;
  approvedTotalMinor: number | null;
  depositPaidAt: Date | null;
  declinedAt: Date | null;
  declineReason: string | null;
  expiredAt: Date | null;
  validUntil: Date | null;
}

export interface MoneyMoved {
  collected: { count: number; amountMinor: number };
  refunded: { count: number; amountMinor: number };
}

const DAY_MS = 86_400_000;
export const NO_REASON = 'No reason given';

export function rateBp(num: number, den: number): number | null {
  return den === 0 ? null : Math.floor((num * 10_000) / den + 0.5);
}

export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

export function p90(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  return s[Math.ceil(0.9 * s.length) - 1]!;
}

const oneDecimal = (x: number | null) => (x === null ? null : Math.round(x * 10) / 10);

/** The quote's value for the figures: approved total when approved, else the current total. */
export const quoteValue = (m: Milestones) => m.approvedTotalMinor ?? m.valueMinor;

export function funnelOf(ms: readonly Milestones[]): Funnel {
  const created = ms.length;
  const sent = ms.filter((m) => m.sentAt).length;
  const viewed = ms.filter((m) => m.sentAt && m.viewedAt).length;
  const approved = ms.filter((m) => m.approvedAt).length;
  const depositPaid = ms.filter((m) => m.approvedAt && m.depositPaidAt).length;
  return {
    created,
    sent,
    viewed,
    approved,
    depositPaid,
    stepRateBp: {
      sent: rateBp(sent, created),
      viewed: rateBp(viewed, sent),
      approved: rateBp(approved, viewed),
      depositPaid: rateBp(depositPaid, approved),
    },
    overallRateBp: rateBp(depositPaid, created),
  };
}

export const wonValue = (ms: readonly Milestones[]) => ms.reduce((n, m) => n + (m.approvedAt ? quoteValue(m) : 0), 0);

function speed(ms: readonly Milestones[], step: (m: Milestones) => Date | null): SpeedFigure {
  const days = ms.flatMap((m) => {
    const at = step(m);
    return m.sentAt && at ? [(at.getTime() - m.sentAt.getTime()) / DAY_MS] : [];
  });
  return { count: days.length, medianDays: oneDecimal(median(days)), p90Days: oneDecimal(p90(days)) };
}

/** Was it lost by the cut, and how. Approved quotes are never lost. */
export function lostAs(m: Milestones, cut: Date): 'declined' | 'expired' | null {
  if (m.approvedAt) return null;
  if (m.declinedAt) return 'declined';
  if (m.expiredAt) return 'expired';
  if (m.sentAt && m.validUntil && m.validUntil.getTime() < cut.getTime()) return 'expired';
  return null;
}

function lostOf(ms: readonly Milestones[], cut: Date): LostFigures {
  const reasons = new Map<string, { reason: string; count: number; valueMinor: number }>();
  const declined = { count: 0, amountMinor: 0 };
  const expired = { count: 0, amountMinor: 0 };
  for (const m of ms) {
    const how = lostAs(m, cut);
    if (!how) continue;
    const v = quoteValue(m);
    if (how === 'expired') {
      expired.count++;
      expired.amountMinor += v;
      continue;
    }
    declined.count++;
    declined.amountMinor += v;
    const reason = m.declineReason?.trim() || NO_REASON;
    const key = reason.toLowerCase();
    const r = reasons.get(key) ?? { reason, count: 0, valueMinor: 0 };
    r.count++;
    r.valueMinor += v;
    reasons.set(key, r);
  }
  const byReason = [...reasons.values()].sort((a, b) => b.count - a.count || b.valueMinor - a.valueMinor || a.reason.localeCompare(b.reason));
  return { byReason, declined, expired };
}

/** Every figure of one period from its cohort's milestones (already cut) and its money moved. */
export function periodFigures(from: Date, to: Date, cut: Date, ms: readonly Milestones[], money: MoneyMoved): PeriodFigures {
  const sent = ms.filter((m) => m.sentAt);
  const sentValues = sent.map(quoteValue);
  const sentValueMinor = sentValues.reduce((a, b) => a + b, 0);
  const won = wonValue(ms);
  const med = median(sentValues);
  const funnel = funnelOf(ms);
  return {
    from: from.toISOString(),
    to: to.toISOString(),
    funnel,
    value: {
      sentValueMinor,
      wonValueMinor: won,
      averageQuoteMinor: sent.length ? Math.round(sentValueMinor / sent.length) : null,
      medianQuoteMinor: med === null ? null : Math.round(med),
      winRateByValueBp: rateBp(won, sentValueMinor),
      winRateByCountBp: rateBp(funnel.approved, funnel.sent),
    },
    speed: {
      toViewed: speed(ms, (m) => m.viewedAt),
      toApproved: speed(ms, (m) => m.approvedAt),
      toDepositPaid: speed(ms, (m) => (m.approvedAt ? m.depositPaidAt : null)),
    },
    deposits: money,
    lost: lostOf(ms, cut),
  };
}

/** Job-size bands by value incl. VAT in major units: under 2,500; 2,500-5,000; 5,000-10,000; 10,000 and over. */
export const BAND_LIMITS_MAJOR: readonly [JobSizeBand, number][] = [
  ['under-2500', 2500],
  ['2500-5000', 5000],
  ['5000-10000', 10_000],
  ['over-10000', Infinity],
];

export function bandOf(valueMinor: number): JobSizeBand {
  for (const [band, limit] of BAND_LIMITS_MAJOR) if (valueMinor < limit * 100) return band;
  return 'over-10000';
}

/** 'YYYY-MM' of a date, UTC. */
export const monthKey = (d: Date) => `${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, '0')}`;
