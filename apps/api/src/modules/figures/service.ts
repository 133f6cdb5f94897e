/**
 * The owner's figures, read from the event history with SQL (MikroORM's query builder): one
 * aggregate query gives every cohort quote's first sent / viewed / approved / deposit-paid /
 * declined / expired time before the cut; a second gives each quote's latest decline reason;
 * a third sums the deposits collected and refunded in the period. figures-math does the rest.
 */
import {
  FIGURE_PERIODS,
  formatQuoteNumber,
  JOB_SIZE_BANDS,
  type FigurePeriod,
  type FiguresResponse,
} from '@gloaming/contracts';
import { dateFromSql, dateParam, jsonNumber, jsonValue, Organization, Quote, QuoteEvent, raw, sqlEm, type EntityManager } from '@gloaming/db';
import { bandOf, funnelOf, monthKey, periodFigures, wonValue, type Milestones, type MoneyMoved } from './figures-math';

export interface PeriodBounds {
  from: Date;
  /** Exclusive. */
  to: Date;
}

const DAY_MS = 86_400_000;
const monthStart = (y: number, m: number) => new Date(Date.UTC(y, m, 1));

/**
 * The period asked for and the one before it, same length. Calendar periods are whole UTC
 * months ending with the current one; a custom period runs from its first day to the end of
 * its last day.
 */
export function resolvePeriod(period: FigurePeriod, now: Date, custom?: { from?: string; to?: string }): { current: PeriodBounds; previous: PeriodBounds } {
  if (period === 'custom') {
    const from = new Date(`${custom?.from}T00:00:00.000Z`);
    const to = new Date(new Date(`${custom?.to}T00:00:00.000Z`).getTime() + DAY_MS);
    const len = to.getTime() - from.getTime();
    return { current: { from, to }, previous: { from: new Date(from.getTime() - len), to: from } };
  }
  const months = { 'this-month': 1, 'last-3-months': 3, 'last-12-months': 12 }[period];
  const y = now.getUTCFullYear();
  const m = now.getUTCMonth();
  const to = monthStart(y, m + 1);
  const from = monthStart(y, m + 1 - months);
  return { current: { from, to }, previous: { from: monthStart(y, m + 1 - 2 * months), to: from } };
}

/** SQLite hands back datetimes as stored (epoch ms or ISO text), PostgreSQL as timestamptz text; either way, a Date. */
const toDate = dateFromSql;
const toInt = (v: unknown): number | null => (v === null || v === undefined || v === '' ? null : Number.isFinite(Number(v)) ? Math.round(Number(v)) : null);

interface MilestoneRow {
  id: string;
  estimator_id: string;
  estimator_name: string;
  value_minor: number;
  created_at: unknown;
  valid_until: unknown;
  sent_at: unknown;
  viewed_at: unknown;
  approved_at: unknown;
  approved_total: unknown;
  deposit_paid_at: unknown;
  declined_at: unknown;
  expired_at: unknown;
}

const firstAt = (type: string, alias: string) => raw(`min(case when e.type = '${type}' then e.at end) as ${alias}`);

/** Each quote created in [from, to) with the first time it reached each step before `cut`. */
export async function cohortMilestones(em: EntityManager, organizationId: string, bounds: PeriodBounds, cut: Date): Promise<Milestones[]> {
  const sql = sqlEm(em);
  const rows = await sql
    .createQueryBuilder(QuoteEvent, 'e')
    .select([
      raw('q.id as id'),
      raw('q.estimator_id as estimator_id'),
      raw('u.name as estimator_name'),
      raw('q.value_minor as value_minor'),
      raw('q.created_at as created_at'),
      raw('q.valid_until as valid_until'),
      firstAt('sent', 'sent_at'),
      firstAt('viewed', 'viewed_at'),
      firstAt('approved', 'approved_at'),
      // the newest approval's frozen total (a quote approved again after a revision)
      raw(
        `(select ${jsonNumber(em, 'a.data', 'totalMinor')} from quote_events a where a.quote_id = q.id and a.type = 'approved' and a.at < ? order by a.at desc limit 1) as approved_total`,
        [dateParam(em, cut)],
      ),
      firstAt('deposit-paid', 'deposit_paid_at'),
      firstAt('declined', 'declined_at'),
      firstAt('expired', 'expired_at'),
    ])
    .join('e.quote', 'q')
    .join('q.estimator', 'u')
    .where({ quote: { organization: organizationId, createdAt: { $gte: bounds.from, $lt: bounds.to } }, at: { $lt: cut } })
    .groupBy(['q.id', 'u.name'])
    .execute<MilestoneRow[]>('all', false);

  const declined = rows.filter((r) => r.declined_at !== null).map((r) => r.id);
  const reasons = new Map<string, string>();
  if (declined.length) {
    const decl = await sql
      .createQueryBuilder(QuoteEvent, 'e')
      .select([raw('e.quote_id as quote_id'), raw(`${jsonValue(em, 'e.data', 'reason')} as reason`), 'e.at'])
      .where({ quote: { $in: declined }, type: 'declined', at: { $lt: cut } })
      .orderBy({ at: 'asc' })
      .execute<{ quote_id: string; reason: unknown }[]>('all', false);
    for (const d of decl) reasons.set(d.quote_id, typeof d.reason === 'string' ? d.reason : '');
  }

  return rows.map((r) => ({
    id: r.id,
    estimatorId: r.estimator_id,
    estimatorName: r.estimator_name,
    valueMinor: Number(r.value_minor),
    createdAt: toDate(r.created_at)!,
    validUntil: toDate(r.valid_until),
    sentAt: toDate(r.sent_at),
    viewedAt: toDate(r.viewed_at),
    approvedAt: toDate(r.approved_at),
    approvedTotalMinor: toDate(r.approved_at) ? toInt(r.approved_total) : null,
    depositPaidAt: toDate(r.deposit_paid_at),
    declinedAt: toDate(r.declined_at),
    declineReason: reasons.get(r.id) ?? null,
    expiredAt: toDate(r.expired_at),
  }));
}

/** Deposits collected and refunded within [from, to): counts and sums of the events' amounts. */
export async function moneyMoved(em: EntityManager, organizationId: string, bounds: PeriodBounds): Promise<MoneyMoved> {
  const rows = await sqlEm(em)
    .createQueryBuilder(QuoteEvent, 'e')
    .select(['e.type', raw('count(*) as n'), raw(`coalesce(sum(${jsonNumber(em, 'e.data', 'amountMinor')}), 0) as amount`)])
    .where({ organization: organizationId, type: { $in: ['deposit-paid', 'refunded'] }, at: { $gte: bounds.from, $lt: bounds.to } })
    .groupBy('e.type')
    .execute<{ type: string; n: number; amount: number }[]>('all', false);
  const of = (type: string) => {
    const r = rows.find((x) => x.type === type);
    return { count: r ? Number(r.n) : 0, amountMinor: r ? Math.round(Number(r.amount)) : 0 };
  };
  return { collected: of('deposit-paid'), refunded: of('refunded') };
}

export const EXPIRING_WITHIN_DAYS = 7;

const BAND_LABELS: Record<(typeof JOB_SIZE_BANDS)[number], (f: (major: number) => string) => string> = {
  'under-2500': (f) => `Under ${f(2500)}`,
  '2500-5000': (f) => `${f(2500)} to ${f(5000)}`,
  '5000-10000': (f) => `${f(5000)} to ${f(10_000)}`,
  'over-10000': (f) => `${f(10_000)} and over`,
};

export async function figuresFor(
  em: EntityManager,
  organizationId: string,
  period: FigurePeriod,
  now: Date,
  custom?: { from?: string; to?: string },
): Promise<FiguresResponse> {
  if (!FIGURE_PERIODS.includes(period)) throw new Error(`Unknown period ${period}`);
  const firm = await em.findOneOrFail(Organization, organizationId);
  const { current, previous } = resolvePeriod(period, now, custom);
  const cutOf = (b: PeriodBounds) => new Date(Math.min(b.to.getTime(), now.getTime()));
  const [curMs, prevMs, curMoney, prevMoney] = [
    await cohortMilestones(em, organizationId, current, cutOf(current)),
    await cohortMilestones(em, organizationId, previous, cutOf(previous)),
    await moneyMoved(em, organizationId, current),
    await moneyMoved(em, organizationId, previous),
  ];

  const estimators = new Map<string, { name: string; ms: Milestones[] }>();
  for (const m of curMs) {
    const e = estimators.get(m.estimatorId) ?? { name: m.estimatorName, ms: [] };
    e.ms.push(m);
    estimators.set(m.estimatorId, e);
  }
  const months: string[] = [];
  for (let d = new Date(current.from); d < current.to && months.length < 120; d = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1)))
    months.push(monthKey(d));
  const major = new Intl.NumberFormat(firm.locale, { style: 'currency', currency: firm.currency, maximumFractionDigits: 0 });

  const open = await em.find(
    Quote,
    { organization: organizationId, status: { $in: ['sent', 'viewed'] }, validUntil: { $gt: now } },
    { populate: ['customer', 'estimator'], orderBy: { validUntil: 'asc' } },
  );
  const soon = open.filter((q) => q.validUntil!.getTime() - now.getTime() <= EXPIRING_WITHIN_DAYS * DAY_MS);

  return {
    currency: firm.currency,
    locale: firm.locale,
    period,
    current: periodFigures(current.from, current.to, cutOf(current), curMs, curMoney),
    previous: periodFigures(previous.from, previous.to, cutOf(previous), prevMs, prevMoney),
    byEstimator: [...estimators.entries()]
      .map(([id, e]) => ({ estimator: { id, name: e.name }, funnel: funnelOf(e.ms), wonValueMinor: wonValue(e.ms) }))
      .sort((a, b) => a.estimator.name.localeCompare(b.estimator.name)),
    byMonth: months.map((month) => {
      const ms = curMs.filter((m) => monthKey(m.createdAt) === month);
      return { month, funnel: funnelOf(ms), wonValueMinor: wonValue(ms) };
    }),
    bySize: JOB_SIZE_BANDS.map((band) => {
      const ms = curMs.filter((m) => bandOf(m.approvedTotalMinor ?? m.valueMinor) === band);
      return { band, label: BAND_LABELS[band]((n) => major.format(n)), funnel: funnelOf(ms), wonValueMinor: wonValue(ms) };
    }),
    pipeline: {
      count: open.length,
      valueMinor: open.reduce((n, q) => n + q.valueMinor, 0),
      expiringWithinDays: EXPIRING_WITHIN_DAYS,
      expiringSoon: soon.map((q) => ({
        id: q.id,
        reference: formatQuoteNumber(q.number),
        title: q.title,
        customer: q.customer.name,
        estimator: { id: q.estimator.id, name: q.estimator.name },
        valueMinor: q.valueMinor,
        validUntil: q.validUntil!.toISOString(),
        daysLeft: Math.ceil((q.validUntil!.getTime() - now.getTime()) / DAY_MS),
      })),
    },
  };
}
