/**
 * The owner's figures against a small history whose answers were worked out by hand, not by
 * running the code: the working is in the comments beside each expectation. The period is
 * custom, 1-31 March 2026 (so it does not move with the clock); the previous period is the 31
 * days before it, 29 January - 28 February 2026. Times are 10:00 UTC unless said.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FiguresResponse, type QuoteEventType } from '@gloaming/contracts';
import { Customer, Quote, QuoteEvent, type EntityManager, type User } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import { startTestServer, type TestServer } from './harness';

let t: TestServer;
const DAY = 86_400_000;
const at = (day: string, time = '10:00') => new Date(`2026-${day}T${time}:00.000Z`);

interface Step {
  type: QuoteEventType;
  at: Date;
  data?: Record<string, unknown>;
}

let number = 0;
async function seedQuote(
  em: EntityManager,
  f: FirmFixture,
  estimator: User,
  valueMinor: number,
  status: Quote['status'],
  validUntil: Date | null,
  steps: Step[],
) {
  const customer = em.create(Customer, { organization: f.firm, name: `Customer ${++number}`, email: null, phone: null });
  const quote = em.create(Quote, {
    organization: f.firm,
    number,
    customer,
    estimator,
    status,
    valueMinor,
    validUntil,
    sentAt: steps.find((s) => s.type === 'sent')?.at ?? null,
    createdAt: steps[0]!.at,
  });
  for (const s of steps) em.create(QuoteEvent, { organization: f.firm, quote, type: s.type, actor: null, data: s.data ?? {}, at: s.at });
  await em.flush();
}

beforeAll(async () => {
  t = await startTestServer();
  const em = t.orm.em.fork();
  const A = t.firmA;
  const E = A.users.estimator;
  const O = A.users.owner;
  // Q1 (E) £2,000, approved at £2,100, deposit £630 paid 8 March
  await seedQuote(em, A, E, 200_000, 'deposit-paid', at('03-16'), [
    { type: 'created', at: at('03-01') },
    { type: 'sent', at: at('03-02') },
    { type: 'viewed', at: at('03-03') },
    { type: 'approved', at: at('03-06'), data: { totalMinor: 210_000, depositMinor: 63_000 } },
    { type: 'deposit-paid', at: at('03-08'), data: { amountMinor: 63_000, currency: 'GBP' } },
  ]);
  // Q2 (E) £4,500, viewed twice (the first counts), declined "Too expensive"
  await seedQuote(em, A, E, 450_000, 'declined', at('04-03'), [
    { type: 'created', at: at('03-03') },
    { type: 'sent', at: at('03-04') },
    { type: 'viewed', at: at('03-05') },
    { type: 'viewed', at: at('03-07') },
    { type: 'declined', at: at('03-10'), data: { reason: 'Too expensive' } },
  ]);
  // Q3 (owner) £8,000, created 09:00 and sent 10:00 the same day, approved, no deposit yet
  await seedQuote(em, A, O, 800_000, 'approved', at('04-04'), [
    { type: 'created', at: at('03-05', '09:00') },
    { type: 'sent', at: at('03-05') },
    { type: 'viewed', at: at('03-09') },
    { type: 'approved', at: at('03-15'), data: { totalMinor: 800_000, depositMinor: 240_000 } },
  ]);
  // Q4 (owner) £12,000, sent, never opened; valid until 25 March, so it ran out inside the period
  await seedQuote(em, A, O, 1_200_000, 'sent', at('03-25'), [
    { type: 'created', at: at('03-10') },
    { type: 'sent', at: at('03-11') },
  ]);
  // Q5 (E) £3,000, still a draft
  await seedQuote(em, A, E, 300_000, 'draft', null, [{ type: 'created', at: at('03-12') }]);
  // Q6 (E) £1,500, declined without a reason
  await seedQuote(em, A, E, 150_000, 'declined', at('04-20'), [
    { type: 'created', at: at('03-20') },
    { type: 'sent', at: at('03-21') },
    { type: 'viewed', at: at('03-22') },
    { type: 'declined', at: at('03-23'), data: {} },
  ]);
  // Q7 (owner) £6,000, approved on 2 April: after the period, so not approved in it
  await seedQuote(em, A, O, 600_000, 'deposit-paid', at('04-25'), [
    { type: 'created', at: at('03-25') },
    { type: 'sent', at: at('03-26') },
    { type: 'viewed', at: at('03-27') },
    { type: 'approved', at: at('04-02'), data: { totalMinor: 600_000, depositMinor: 180_000 } },
    { type: 'deposit-paid', at: at('04-03'), data: { amountMinor: 180_000, currency: 'GBP' } },
  ]);
  // Q8 (E) created in the previous period; its deposit (2 March) and refund (15 March) are money moved in March
  await seedQuote(em, A, E, 500_000, 'deposit-paid', at('03-13'), [
    { type: 'created', at: at('02-10') },
    { type: 'sent', at: at('02-11') },
    { type: 'viewed', at: at('02-12') },
    { type: 'approved', at: at('02-20'), data: { totalMinor: 500_000, depositMinor: 150_000 } },
    { type: 'deposit-paid', at: at('03-02'), data: { amountMinor: 150_000, currency: 'GBP' } },
    { type: 'refunded', at: at('03-15'), data: { amountMinor: 150_000, currency: 'GBP' } },
  ]);
  // Firm B's March quote must never show in firm A's figures
  await seedQuote(em, t.firmB, t.firmB.users.estimator, 9_999_900, 'approved', at('04-01'), [
    { type: 'created', at: at('03-04') },
    { type: 'sent', at: at('03-04') },
    { type: 'approved', at: at('03-05'), data: { totalMinor: 9_999_900, depositMinor: 0 } },
  ]);
  // Open now (the pipeline is as of today): Q10 viewed, 3 days left; Q11 sent, 20 days left
  const now = Date.now();
  await seedQuote(em, A, E, 99_900, 'viewed', new Date(now + 3 * DAY - 60_000), [
    { type: 'created', at: new Date(now - 10 * DAY) },
    { type: 'sent', at: new Date(now - 9 * DAY) },
    { type: 'viewed', at: new Date(now - 8 * DAY) },
  ]);
  await seedQuote(em, A, O, 50_000, 'sent', new Date(now + 20 * DAY), [
    { type: 'created', at: new Date(now - 2 * DAY) },
    { type: 'sent', at: new Date(now - 1 * DAY) },
  ]);
});
afterAll(async () => t.close());

async function marchFigures() {
  const owner = await t.signIn('owner');
  const res = await owner.get('/api/figures?period=custom&from=2026-03-01&to=2026-03-31').expect(200);
  return FiguresResponse.parse(res.body);
}

describe('figures for March 2026 (worked by hand)', () => {
  it('funnel: created -> sent -> viewed -> approved -> deposit paid, with step and overall rates', async () => {
    const f = await marchFigures();
    expect(f.current.from).toBe('2026-03-01T00:00:00.000Z');
    expect(f.current.to).toBe('2026-04-01T00:00:00.000Z');
    // cohort: Q1-Q7 (created in March); Q8 was created in February, firm B's is not ours
    // sent: Q1 Q2 Q3 Q4 Q6 Q7 = 6; viewed: Q1 Q2 Q3 Q6 Q7 = 5; approved by 1 April: Q1 Q3 = 2 (Q7's is 2 April);
    // deposit paid: Q1 = 1
    expect(f.current.funnel).toEqual({
      created: 7,
      sent: 6,
      viewed: 5,
      approved: 2,
      depositPaid: 1,
      // 6/7 = 0.857142 -> 8571; 5/6 = 0.833333 -> 8333; 2/5 = 4000; 1/2 = 5000
      stepRateBp: { sent: 8571, viewed: 8333, approved: 4000, depositPaid: 5000 },
      // 1/7 = 0.142857 -> 1429
      overallRateBp: 1429,
    });
  });

  it('value: sent, won, average, median and win rates', async () => {
    const f = await marchFigures();
    // values: Q1 210,000 (approved total), Q2 450,000, Q3 800,000, Q4 1,200,000, Q6 150,000, Q7 600,000 (not approved by the cut)
    // sent = 3,410,000; won = Q1 + Q3 = 1,010,000; average = 3,410,000 / 6 = 568,333.3 -> 568,333
    // median of 150k 210k 450k 600k 800k 1.2m = (450,000 + 600,000) / 2 = 525,000
    // by value 1,010,000 / 3,410,000 = 0.296187 -> 2962; by count 2/6 -> 3333
    expect(f.current.value).toEqual({
      sentValueMinor: 3_410_000,
      wonValueMinor: 1_010_000,
      averageQuoteMinor: 568_333,
      medianQuoteMinor: 525_000,
      winRateByValueBp: 2962,
      winRateByCountBp: 3333,
    });
  });

  it('speed: median and 90th percentile days from sent', async () => {
    const f = await marchFigures();
    // to viewed: Q1 1, Q2 1 (first view), Q3 4, Q6 1, Q7 1 -> sorted 1 1 1 1 4: median 1; p90 rank ceil(4.5) = 5th -> 4
    // to approved: Q1 4, Q3 10 -> median (4 + 10) / 2 = 7; p90 rank ceil(1.8) = 2nd -> 10
    // to deposit paid: Q1 6 -> 6 and 6
    expect(f.current.speed).toEqual({
      toViewed: { count: 5, medianDays: 1, p90Days: 4 },
      toApproved: { count: 2, medianDays: 7, p90Days: 10 },
      toDepositPaid: { count: 1, medianDays: 6, p90Days: 6 },
    });
  });

  it('deposits collected and refunded in the period, whichever period the quote was created in', async () => {
    const f = await marchFigures();
    // collected: Q1 63,000 (8 March) + Q8 150,000 (2 March); Q7's 180,000 is 3 April. Refunded: Q8 150,000
    expect(f.current.deposits).toEqual({ collected: { count: 2, amountMinor: 213_000 }, refunded: { count: 1, amountMinor: 150_000 } });
  });

  it('lost by decline reason and by expiry', async () => {
    const f = await marchFigures();
    // declined: Q2 "Too expensive" 450,000; Q6 no reason 150,000. Expired: Q4 (valid until 25 March, never approved) 1,200,000
    expect(f.current.lost).toEqual({
      byReason: [
        { reason: 'Too expensive', count: 1, valueMinor: 450_000 },
        { reason: 'No reason given', count: 1, valueMinor: 150_000 },
      ],
      declined: { count: 2, amountMinor: 600_000 },
      expired: { count: 1, amountMinor: 1_200_000 },
    });
  });

  it('per estimator, per month and per job size', async () => {
    const f = await marchFigures();
    // estimator: Q1 Q2 Q5 Q6 -> created 4, sent 3, viewed 3, approved 1 (Q1), paid 1, won 210,000
    // owner: Q3 Q4 Q7 -> created 3, sent 3, viewed 2, approved 1 (Q3), paid 0, won 800,000
    const rows = f.byEstimator.map((r) => [r.estimator.id, r.funnel.created, r.funnel.sent, r.funnel.viewed, r.funnel.approved, r.funnel.depositPaid, r.wonValueMinor]);
    expect(rows).toEqual([
      [t.firmA.users.estimator.id, 4, 3, 3, 1, 1, 210_000],
      [t.firmA.users.owner.id, 3, 3, 2, 1, 0, 800_000],
    ]);
    // one month in the period, holding the whole cohort
    expect(f.byMonth.map((m) => [m.month, m.funnel.created, m.funnel.approved, m.wonValueMinor])).toEqual([['2026-03', 7, 2, 1_010_000]]);
    // bands by value: under £2,500: Q1 210k, Q6 150k; £2,500-5,000: Q2 450k, Q5 300k; £5,000-10,000: Q3 800k, Q7 600k; over: Q4
    expect(f.bySize.map((b) => [b.band, b.funnel.created, b.funnel.sent, b.funnel.approved, b.wonValueMinor])).toEqual([
      ['under-2500', 2, 2, 1, 210_000],
      ['2500-5000', 2, 1, 0, 0],
      ['5000-10000', 2, 2, 1, 800_000],
      ['over-10000', 1, 1, 0, 0],
    ]);
    expect(f.bySize[0]!.label).toBe('Under £2,500');
  });

  it('the previous period: same length, cut at its own end', async () => {
    const f = await marchFigures();
    // 31 days before 1 March: 29 January - 28 February. Cohort: Q8 only; its deposit (2 March) is after the cut
    expect(f.previous.from).toBe('2026-01-29T00:00:00.000Z');
    expect(f.previous.to).toBe('2026-03-01T00:00:00.000Z');
    expect([f.previous.funnel.created, f.previous.funnel.sent, f.previous.funnel.viewed, f.previous.funnel.approved, f.previous.funnel.depositPaid]).toEqual([1, 1, 1, 1, 0]);
    expect(f.previous.funnel.overallRateBp).toBe(0);
    expect(f.previous.deposits.collected).toEqual({ count: 0, amountMinor: 0 });
  });

  it('open pipeline and quotes about to expire are as of now', async () => {
    const f = await marchFigures();
    // Q10 (viewed, 3 days left) and Q11 (sent, 20 days left) are open; Q4 is sent but its validity ran out
    expect(f.pipeline.count).toBe(2);
    expect(f.pipeline.valueMinor).toBe(99_900 + 50_000);
    expect(f.pipeline.expiringSoon.map((q) => [q.valueMinor, q.daysLeft])).toEqual([[99_900, 3]]);
  });
});

describe('figures access and input', () => {
  it('estimators and installers get 403; signed out 401', async () => {
    for (const role of ['estimator', 'installer'] as const) {
      const agent = await t.signIn(role);
      const res = await agent.get('/api/figures').expect(403);
      expect(res.headers['content-type']).toContain('application/problem+json');
    }
    const { default: request } = await import('supertest');
    await request(t.app).get('/api/figures').expect(401);
  });

  it('a custom period needs both dates in order, with field paths', async () => {
    const owner = await t.signIn('owner');
    const missing = await owner.get('/api/figures?period=custom&from=2026-03-01').expect(400);
    expect(missing.body.errors.map((e: { path: string }) => e.path)).toEqual(['query.to']);
    const backwards = await owner.get('/api/figures?period=custom&from=2026-03-10&to=2026-03-01').expect(400);
    expect(backwards.body.errors[0].path).toBe('query.to');
    const bad = await owner.get('/api/figures?period=fortnight').expect(400);
    expect(bad.body.errors[0].path).toBe('query.period');
  });

  it('calendar periods end with the current month and compare with the same number of months before', async () => {
    const owner = await t.signIn('owner');
    const f = FiguresResponse.parse((await owner.get('/api/figures?period=last-3-months').expect(200)).body);
    const now = new Date();
    expect(f.current.to).toBe(new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + 1, 1)).toISOString());
    expect(f.current.from).toBe(new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 2, 1)).toISOString());
    expect(f.previous.to).toBe(f.current.from);
    expect(f.byMonth).toHaveLength(3);
    // Q10 and Q11 were created in the last few days: they are in this cohort
    expect(f.current.funnel.created).toBeGreaterThanOrEqual(2);
  });
});
