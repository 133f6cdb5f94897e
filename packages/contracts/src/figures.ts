import { z } from 'zod';
import { PersonRef } from './quotes';

/**
 * The owner's figures (GET /api/figures). A period is a cohort: the quotes *created* in it,
 * and how far each had got by the period's end (or now, if sooner). Deposits collected and
 * refunded are money moved within the period. The open pipeline and quotes about to expire
 * are as of now. Money is minor units of the firm's currency; rates basis points.
 */

export const FIGURE_PERIODS = ['this-month', 'last-3-months', 'last-12-months', 'custom'] as const;
export const FigurePeriod = z.enum(FIGURE_PERIODS, `A period is one of ${FIGURE_PERIODS.join(', ')}.`);
export type FigurePeriod = z.infer<typeof FigurePeriod>;

export const FIGURE_PERIOD_LABELS: Record<FigurePeriod, string> = {
  'this-month': 'This month',
  'last-3-months': 'Last 3 months',
  'last-12-months': 'Last 12 months',
  custom: 'Custom dates',
};

const IsoDay = z.iso.date('Give a date as YYYY-MM-DD.');

export const FiguresQuery = z
  .object({
    period: FigurePeriod.default('last-12-months'),
    /** Custom periods only: first day, inclusive. */
    from: IsoDay.optional(),
    /** Custom periods only: last day, inclusive. */
    to: IsoDay.optional(),
  })
  .superRefine((q, ctx) => {
    if (q.period !== 'custom') return;
    if (!q.from) ctx.addIssue({ code: 'custom', path: ['from'], message: 'Give the first day of the period.' });
    if (!q.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'Give the last day of the period.' });
    if (q.from && q.to) {
      if (q.from > q.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The last day is before the first.' });
      else if ((Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 > 366 * 5)
        ctx.addIssue({ code: 'custom', path: ['to'], message: 'A period is at most five years.' });
    }
  });
export type FiguresQuery = z.input<typeof FiguresQuery>;

export const FUNNEL_STEPS = ['created', 'sent', 'viewed', 'approved', 'depositPaid'] as const;
export type FunnelStep = (typeof FUNNEL_STEPS)[number];
export const FUNNEL_STEP_LABELS: Record<FunnelStep, string> = {
  created: 'Created',
  sent: 'Sent',
  viewed: 'Viewed',
  approved: 'Approved',
  depositPaid: 'Deposit paid',
};

const Count = z.number().int().min(0);
/** A rate in basis points, or null when there was nothing to divide by. */
const RateBp = z.number().int().nullable();

export const Funnel = z.object({
  created: Count,
  sent: Count,
  viewed: Count,
  approved: Count,
  depositPaid: Count,
  /** Each step over the one before it: sent/created, viewed/sent, approved/viewed, depositPaid/approved. */
  stepRateBp: z.object({ sent: RateBp, viewed: RateBp, approved: RateBp, depositPaid: RateBp }),
  /** depositPaid / created. */
  overallRateBp: RateBp,
});
export type Funnel = z.infer<typeof Funnel>;

export const ValueFigures = z.object({
  /** Sum of the sent quotes' values (current revision, incl. VAT). */
  sentValueMinor: z.number().int(),
  /** Sum of the approved totals (as frozen at approval). */
  wonValueMinor: z.number().int(),
  averageQuoteMinor: z.number().int().nullable(),
  medianQuoteMinor: z.number().int().nullable(),
  /** wonValue / sentValue. */
  winRateByValueBp: RateBp,
  /** approved / sent. */
  winRateByCountBp: RateBp,
});
export type ValueFigures = z.infer<typeof ValueFigures>;

export const SpeedFigure = z.object({
  /** How many quotes reached this step (the sample). */
  count: Count,
  medianDays: z.number().nullable(),
  p90Days: z.number().nullable(),
});
export type SpeedFigure = z.infer<typeof SpeedFigure>;

export const SpeedFigures = z.object({ toViewed: SpeedFigure, toApproved: SpeedFigure, toDepositPaid: SpeedFigure });
export type SpeedFigures = z.infer<typeof SpeedFigures>;

export const MoneyCount = z.object({ count: Count, amountMinor: z.number().int() });

export const LostFigures = z.object({
  byReason: z.array(z.object({ reason: z.string(), count: Count, valueMinor: z.number().int() })),
  declined: MoneyCount,
  expired: MoneyCount,
});
export type LostFigures = z.infer<typeof LostFigures>;

/** The figures of one period (the chosen one, or the one before it for comparison). */
export const PeriodFigures = z.object({
  from: z.iso.datetime(),
  /** Exclusive. */
  to: z.iso.datetime(),
  funnel: Funnel,
  value: ValueFigures,
  speed: SpeedFigures,
  deposits: z.object({ collected: MoneyCount, refunded: MoneyCount }),
  lost: LostFigures,
});
export type PeriodFigures = z.infer<typeof PeriodFigures>;

export const JOB_SIZE_BANDS = ['under-2500', '2500-5000', '5000-10000', 'over-10000'] as const;
export type JobSizeBand = (typeof JOB_SIZE_BANDS)[number];

export const OpenQuote = z.object({
  id: z.string(),
  reference: z.string(),
  title: z.string(),
  customer: z.string(),
  estimator: PersonRef,
  valueMinor: z.number().int(),
  validUntil: z.iso.datetime(),
  daysLeft: z.number().int(),
});
export type OpenQuote = z.infer<typeof OpenQuote>;

export const FiguresResponse = z.object({
  currency: z.string(),
  locale: z.string(),
  period: FigurePeriod,
  current: PeriodFigures,
  previous: PeriodFigures,
  byEstimator: z.array(z.object({ estimator: PersonRef, funnel: Funnel, wonValueMinor: z.number().int() })),
  /** Calendar months (UTC) of the period, oldest first, by the month each quote was created. */
  byMonth: z.array(z.object({ month: z.string().regex(/^\d{4}-\d{2}$/), funnel: Funnel, wonValueMinor: z.number().int() })),
  /** By the quote's value incl. VAT, in major units of the currency. */
  bySize: z.array(z.object({ band: z.enum(JOB_SIZE_BANDS), label: z.string(), funnel: Funnel, wonValueMinor: z.number().int() })),
  pipeline: z.object({ count: Count, valueMinor: z.number().int(), expiringSoon: z.array(OpenQuote), expiringWithinDays: z.number().int() }),
});
export type FiguresResponse = z.infer<typeof FiguresResponse>;
