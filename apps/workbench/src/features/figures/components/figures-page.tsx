import {
  FIGURE_PERIOD_LABELS,
  FIGURE_PERIODS,
  FUNNEL_STEP_LABELS,
  FUNNEL_STEPS,
  FigurePeriod,
  type FiguresResponse,
  type Funnel,
} from '@gloaming/contracts';
import { useState, type FormEvent } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useFigures } from '../api/get-figures';
import { FigureTable, type FigureColumn } from './figure-table';
import { figureFormat, type FigureFormat } from './figure-format';
import { figuresQueryFrom } from '../figures-query';

const NOW_COLOUR = 'var(--color-dusk-600)';
const BEFORE_COLOUR = 'var(--color-mist-400)';
const LAMP = 'var(--color-lamp-500)';
const LEAF = 'var(--color-leaf-700)';

function funnelColumns<R>(f: FigureFormat, funnel: (r: R) => Funnel): FigureColumn<R>[] {
  return [
    ...FUNNEL_STEPS.map((s) => ({
      label: FUNNEL_STEP_LABELS[s],
      show: (r: R) => f.count(funnel(r)[s]),
      csv: (r: R) => funnel(r)[s],
      numeric: true,
    })),
    {
      label: 'Overall',
      show: (r: R) => f.rate(funnel(r).overallRateBp),
      csv: (r: R) => f.rateCsv(funnel(r).overallRateBp),
      numeric: true,
    },
  ];
}

export function FiguresPage() {
  const user = useSignedInUser();
  const [search, setSearch] = useSearchParams();
  const query = figuresQueryFrom(search);
  const figures = useFigures(query);
  const [period, setPeriod] = useState<FigurePeriod>(query.period ?? 'last-12-months');

  function apply(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const next = new URLSearchParams({ period });
    if (period === 'custom') {
      next.set('from', String(data.get('from') ?? ''));
      next.set('to', String(data.get('to') ?? ''));
    }
    setSearch(next);
  }

  return (
    <>
      <title>{`Figures · ${user.organization.name} · Gloaming`}</title>
      <PageHeader eyebrow={user.organization.name} title="Figures">
        Which quotes turn into paid work, how fast, for whom, and why the rest are lost. A period counts the quotes created in it
        and how far each got by its end; the comparison is the period of the same length before it.
      </PageHeader>

      <form onSubmit={apply} className="mb-6 flex flex-wrap items-end gap-4" aria-label="Choose the period">
        <SelectField
          label="Period"
          name="period"
          value={period}
          onChange={(e) => {
            const p = FigurePeriod.safeParse(e.target.value);
            if (p.success) setPeriod(p.data);
          }}
          options={FIGURE_PERIODS.map((p) => ({ value: p, label: FIGURE_PERIOD_LABELS[p] }))}
          className="w-56"
        />
        {period === 'custom' ? (
          <>
            <TextField label="From" name="from" type="date" defaultValue={query.from ?? ''} required />
            <TextField label="To" name="to" type="date" defaultValue={query.to ?? ''} required />
          </>
        ) : null}
        <Button type="submit" variant="secondary">
          Show
        </Button>
      </form>

      {figures.isError ? (
        <FormMessage tone="error" title="The figures could not be loaded">
          {figures.error.message}
        </FormMessage>
      ) : !figures.data ? (
        <p role="status" className="text-ink-muted">
          Working out the figures…
        </p>
      ) : (
        <FiguresBody data={figures.data} />
      )}
    </>
  );
}

function Headline({
  label,
  now,
  before,
  format,
}: {
  label: string;
  now: number | null;
  before: number | null;
  format: (n: number | null) => string;
}) {
  return (
    <div className="rounded-card bg-surface px-5 py-4 shadow-card ring-1 ring-line">
      <dt className="text-caption text-ink-muted">{label}</dt>
      <dd className="mt-1 font-mono text-heading font-semibold text-ink">{format(now)}</dd>
      <dd className="text-caption text-ink-muted">Period before: {format(before)}</dd>
    </div>
  );
}

function FiguresBody({ data }: { data: FiguresResponse }) {
  const f = figureFormat(data.locale, data.currency);
  const cur = data.current;
  const prev = data.previous;
  const range = `${f.date(cur.from)} – ${f.date(new Date(new Date(cur.to).getTime() - 1).toISOString())}`;

  const funnelRows = FUNNEL_STEPS.map((s) => ({
    step: FUNNEL_STEP_LABELS[s],
    now: cur.funnel[s],
    before: prev.funnel[s],
    rate: s === 'created' ? null : cur.funnel.stepRateBp[s],
  }));
  type FunnelRow = (typeof funnelRows)[number];
  const speedRows = (['toViewed', 'toApproved', 'toDepositPaid'] as const).map((k) => ({
    label: { toViewed: 'Sent to viewed', toApproved: 'Sent to approved', toDepositPaid: 'Sent to deposit paid' }[k],
    ...cur.speed[k],
    prevMedian: prev.speed[k].medianDays,
  }));
  type SpeedRow = (typeof speedRows)[number];
  const monthRows = data.byMonth.map((m) => ({ month: f.month(m.month), ...m.funnel, won: m.wonValueMinor }));
  type MonthRow = (typeof monthRows)[number];
  type EstimatorRow = FiguresResponse['byEstimator'][number];
  type SizeRow = FiguresResponse['bySize'][number];
  type ReasonRow = FiguresResponse['current']['lost']['byReason'][number];
  type OpenRow = FiguresResponse['pipeline']['expiringSoon'][number];
  const lostRows: ReasonRow[] = [
    ...cur.lost.byReason,
    ...(cur.lost.expired.count
      ? [{ reason: 'Expired (validity ran out)', count: cur.lost.expired.count, valueMinor: cur.lost.expired.amountMinor }]
      : []),
  ];

  return (
    <div className="flex flex-col gap-6">
      <p className="text-caption text-ink-muted" aria-live="polite">
        Showing {range}.
      </p>
      <dl className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4">
        <Headline
          label="Quotes created"
          now={cur.funnel.created}
          before={prev.funnel.created}
          format={(n) => (n === null ? '–' : f.count(n))}
        />
        <Headline label="Won value" now={cur.value.wonValueMinor} before={prev.value.wonValueMinor} format={f.money} />
        <Headline
          label="Created to deposit paid"
          now={cur.funnel.overallRateBp}
          before={prev.funnel.overallRateBp}
          format={f.rate}
        />
        <Headline
          label="Deposits collected"
          now={cur.deposits.collected.amountMinor}
          before={prev.deposits.collected.amountMinor}
          format={f.money}
        />
      </dl>

      <Card title="Funnel" description="Quotes created in the period and how far they got, beside the period before.">
        <div className="h-64" role="img" aria-label="Bar chart of the funnel; the table below holds the same numbers">
          <ResponsiveContainer>
            <BarChart data={funnelRows}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="step" />
              <YAxis allowDecimals={false} />
              <Tooltip />
              <Legend />
              <Bar dataKey="now" name="This period" fill={NOW_COLOUR} isAnimationActive={false} />
              <Bar dataKey="before" name="Period before" fill={BEFORE_COLOUR} isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
        </div>
        <FigureTable<FunnelRow>
          caption="Funnel"
          fileName="funnel.csv"
          rows={funnelRows}
          columns={[
            { label: 'Step', show: (r) => r.step, csv: (r) => r.step },
            { label: 'This period', show: (r) => f.count(r.now), csv: (r) => r.now, numeric: true },
            { label: 'From the step before', show: (r) => f.rate(r.rate), csv: (r) => f.rateCsv(r.rate), numeric: true },
            { label: 'Period before', show: (r) => f.count(r.before), csv: (r) => r.before, numeric: true },
          ]}
        />
      </Card>

      <Card title="Month by month" description="By the month each quote was created.">
        <div className="h-64" role="img" aria-label="Line chart of quotes per month; the table below holds the same numbers">
          <ResponsiveContainer>
            <LineChart data={monthRows}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="month" />
              <YAxis allowDecimals={false} />
              <Tooltip />
              <Legend />
              <Line dataKey="created" name="Created" stroke={NOW_COLOUR} isAnimationActive={false} />
              <Line dataKey="approved" name="Approved" stroke={LAMP} isAnimationActive={false} />
              <Line dataKey="depositPaid" name="Deposit paid" stroke={LEAF} isAnimationActive={false} />
            </LineChart>
          </ResponsiveContainer>
        </div>
        <FigureTable<MonthRow>
          caption="Month by month"
          fileName="months.csv"
          rows={monthRows}
          columns={[
            { label: 'Month', show: (r) => r.month, csv: (r) => r.month },
            ...funnelColumns<MonthRow>(f, (r) => r),
            { label: 'Won value', show: (r) => f.money(r.won), csv: (r) => f.moneyCsv(r.won), numeric: true },
          ]}
        />
      </Card>

      <div className="grid gap-6 xl:grid-cols-2">
        <Card title="By estimator">
          <div className="h-56" role="img" aria-label="Bar chart of quotes by estimator; the table below holds the same numbers">
            <ResponsiveContainer>
              <BarChart data={data.byEstimator.map((r) => ({ name: r.estimator.name, ...r.funnel }))}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} />
                <XAxis dataKey="name" />
                <YAxis allowDecimals={false} />
                <Tooltip />
                <Legend />
                <Bar dataKey="sent" name="Sent" fill={NOW_COLOUR} isAnimationActive={false} />
                <Bar dataKey="approved" name="Approved" fill={LAMP} isAnimationActive={false} />
              </BarChart>
            </ResponsiveContainer>
          </div>
          <FigureTable<EstimatorRow>
            caption="By estimator"
            fileName="estimators.csv"
            rows={data.byEstimator}
            columns={[
              { label: 'Estimator', show: (r) => r.estimator.name, csv: (r) => r.estimator.name },
              ...funnelColumns<EstimatorRow>(f, (r) => r.funnel),
              {
                label: 'Won value',
                show: (r) => f.money(r.wonValueMinor),
                csv: (r) => f.moneyCsv(r.wonValueMinor),
                numeric: true,
              },
            ]}
          />
        </Card>
        <Card title="By job size" description="By the quote's value including VAT.">
          <div className="h-56" role="img" aria-label="Bar chart of quotes by job size; the table below holds the same numbers">
            <ResponsiveContainer>
              <BarChart data={data.bySize.map((r) => ({ name: r.label, ...r.funnel }))}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} />
                <XAxis dataKey="name" />
                <YAxis allowDecimals={false} />
                <Tooltip />
                <Legend />
                <Bar dataKey="sent" name="Sent" fill={NOW_COLOUR} isAnimationActive={false} />
                <Bar dataKey="approved" name="Approved" fill={LAMP} isAnimationActive={false} />
              </BarChart>
            </ResponsiveContainer>
          </div>
          <FigureTable<SizeRow>
            caption="By job size"
            fileName="job-sizes.csv"
            rows={data.bySize}
            columns={[
              { label: 'Size', show: (r) => r.label, csv: (r) => r.label },
              ...funnelColumns<SizeRow>(f, (r) => r.funnel),
              {
                label: 'Won value',
                show: (r) => f.money(r.wonValueMinor),
                csv: (r) => f.moneyCsv(r.wonValueMinor),
                numeric: true,
              },
            ]}
          />
        </Card>
      </div>

      <div className="grid gap-6 xl:grid-cols-2">
        <Card title="Value">
          <FigureTable<{ label: string; now: number | null; before: number | null; rate?: boolean }>
            caption="Value"
            fileName="value.csv"
            rows={[
              { label: 'Sent value', now: cur.value.sentValueMinor, before: prev.value.sentValueMinor },
              { label: 'Won value', now: cur.value.wonValueMinor, before: prev.value.wonValueMinor },
              { label: 'Average quote', now: cur.value.averageQuoteMinor, before: prev.value.averageQuoteMinor },
              { label: 'Median quote', now: cur.value.medianQuoteMinor, before: prev.value.medianQuoteMinor },
              { label: 'Win rate by value', now: cur.value.winRateByValueBp, before: prev.value.winRateByValueBp, rate: true },
              { label: 'Win rate by count', now: cur.value.winRateByCountBp, before: prev.value.winRateByCountBp, rate: true },
            ]}
            columns={[
              { label: 'Figure', show: (r) => r.label, csv: (r) => r.label },
              {
                label: 'This period',
                show: (r) => (r.rate ? f.rate(r.now) : f.money(r.now)),
                csv: (r) => (r.rate ? f.rateCsv(r.now) : f.moneyCsv(r.now)),
                numeric: true,
              },
              {
                label: 'Period before',
                show: (r) => (r.rate ? f.rate(r.before) : f.money(r.before)),
                csv: (r) => (r.rate ? f.rateCsv(r.before) : f.moneyCsv(r.before)),
                numeric: true,
              },
            ]}
          />
        </Card>
        <Card title="Speed" description="Days from sending; the 90th percentile is the slow end.">
          <FigureTable<SpeedRow>
            caption="Speed"
            fileName="speed.csv"
            rows={speedRows}
            columns={[
              { label: 'Step', show: (r) => r.label, csv: (r) => r.label },
              { label: 'Quotes', show: (r) => f.count(r.count), csv: (r) => r.count, numeric: true },
              { label: 'Median', show: (r) => f.days(r.medianDays), csv: (r) => r.medianDays, numeric: true },
              { label: '90th percentile', show: (r) => f.days(r.p90Days), csv: (r) => r.p90Days, numeric: true },
              { label: 'Median, period before', show: (r) => f.days(r.prevMedian), csv: (r) => r.prevMedian, numeric: true },
            ]}
          />
        </Card>
      </div>

      <div className="grid gap-6 xl:grid-cols-2">
        <Card title="Lost quotes" description="Declined, by the customer's reason, and those whose validity ran out.">
          <div
            className="h-56"
            role="img"
            aria-label="Bar chart of lost quotes by reason; the table below holds the same numbers"
          >
            <ResponsiveContainer>
              <BarChart data={lostRows} layout="vertical" margin={{ left: 40 }}>
                <CartesianGrid strokeDasharray="3 3" horizontal={false} />
                <XAxis type="number" allowDecimals={false} />
                <YAxis type="category" dataKey="reason" width={180} />
                <Tooltip />
                <Bar dataKey="count" name="Quotes" fill="var(--color-ember-600)" isAnimationActive={false} />
              </BarChart>
            </ResponsiveContainer>
          </div>
          <FigureTable<ReasonRow>
            caption="Lost quotes"
            fileName="lost.csv"
            rows={lostRows}
            columns={[
              { label: 'Reason', show: (r) => r.reason, csv: (r) => r.reason },
              { label: 'Quotes', show: (r) => f.count(r.count), csv: (r) => r.count, numeric: true },
              { label: 'Value', show: (r) => f.money(r.valueMinor), csv: (r) => f.moneyCsv(r.valueMinor), numeric: true },
            ]}
          />
        </Card>
        <Card title="Deposits and pipeline" description="Deposits moved in the period; the pipeline is as of today.">
          <dl className="mb-4 grid grid-cols-2 gap-3 text-body">
            <dt className="text-ink-muted">Deposits collected</dt>
            <dd className="text-right font-mono">
              {f.money(cur.deposits.collected.amountMinor)} ({f.count(cur.deposits.collected.count)})
            </dd>
            <dt className="text-ink-muted">Deposits refunded</dt>
            <dd className="text-right font-mono">
              {f.money(cur.deposits.refunded.amountMinor)} ({f.count(cur.deposits.refunded.count)})
            </dd>
            <dt className="text-ink-muted">Open pipeline (sent, undecided, still valid)</dt>
            <dd className="text-right font-mono">
              {f.money(data.pipeline.valueMinor)} ({f.count(data.pipeline.count)})
            </dd>
          </dl>
          <h3 className="mb-2 text-body font-semibold text-ink">Expiring within {data.pipeline.expiringWithinDays} days</h3>
          <FigureTable<OpenRow>
            caption="Quotes about to expire"
            fileName="expiring.csv"
            rows={data.pipeline.expiringSoon}
            columns={[
              { label: 'Quote', show: (r) => r.reference, csv: (r) => r.reference },
              { label: 'Customer', show: (r) => r.customer, csv: (r) => r.customer },
              { label: 'Estimator', show: (r) => r.estimator.name, csv: (r) => r.estimator.name },
              { label: 'Value', show: (r) => f.money(r.valueMinor), csv: (r) => f.moneyCsv(r.valueMinor), numeric: true },
              { label: 'Days left', show: (r) => f.count(r.daysLeft), csv: (r) => r.daysLeft, numeric: true },
            ]}
          />
        </Card>
      </div>
    </div>
  );
}
