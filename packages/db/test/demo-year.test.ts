/**
 * The demo year: a deterministic history across the two estimators with every kind of outcome,
 * circuits on most quotes, approvals and deposit payments matching the events, all in the past.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { Circuit, DepositPayment, Quote, QuoteApproval, QuoteEvent, seedDemoIfEmpty } from '../src';
import { DEMO_YEAR_QUOTES, mulberry32 } from '../src/seeders/demo-year';
import { openTestDatabase } from '../src/testing';

const closers: (() => Promise<void>)[] = [];
afterEach(async () => {
  while (closers.length) await closers.pop()!();
});

async function seeded() {
  const db = await openTestDatabase();
  closers.push(db.close);
  const t0 = performance.now();
  expect(await seedDemoIfEmpty(db.orm)).toBe(true);
  // printed, not asserted: speed targets live in benchmarks
  console.log(`demo seed (firm, catalogue, year of quotes): ${Math.round(performance.now() - t0)} ms`);
  return db.orm.em.fork();
}

describe('demo year', () => {
  it('mulberry32 is the published algorithm: the same seed gives the same sequence', () => {
    const a = mulberry32(1);
    const b = mulberry32(1);
    const xs = Array.from({ length: 5 }, () => a());
    expect(xs).toEqual(Array.from({ length: 5 }, () => b()));
    expect(xs.every((x) => x >= 0 && x < 1)).toBe(true);
    // first output for seed 1 of the widely circulated JavaScript mulberry32 (from memory): 0.6270739405881613
    expect(xs[0]).toBeCloseTo(0.6270739405881613, 12);
  });

  it('spreads a year of quotes over both estimators with every outcome, dated before today', async () => {
    const em = await seeded();
    const year = await em.find(Quote, { number: { $gt: 1000 } }, { populate: ['estimator'] });
    expect(year).toHaveLength(DEMO_YEAR_QUOTES);
    const now = Date.now();
    expect(year.every((q) => q.createdAt.getTime() < now && q.createdAt.getTime() > now - 366 * 86_400_000)).toBe(true);
    const byEstimator = new Map<string, number>();
    for (const q of year) byEstimator.set(q.estimator.email, (byEstimator.get(q.estimator.email) ?? 0) + 1);
    expect([...byEstimator.keys()].sort()).toEqual(['priya@nightjar.example', 'tomasz@nightjar.example']);
    expect(Math.min(...byEstimator.values())).toBeGreaterThan(DEMO_YEAR_QUOTES / 4);
    const statuses = new Set(year.map((q) => q.status));
    for (const s of ['draft', 'sent', 'viewed', 'declined', 'expired', 'deposit-paid'] as const) expect(statuses, s).toContain(s);

    const events = await em.find(QuoteEvent, { quote: { number: { $gt: 1000 } } });
    expect(events.every((e) => e.at.getTime() <= now)).toBe(true);
    const reasons = events.filter((e) => e.type === 'declined').map((e) => e.data.reason);
    expect(new Set(reasons).size).toBeGreaterThan(2);
    expect(events.some((e) => e.type === 'refunded')).toBe(true);

    // circuits on most quotes, each checked by the engine
    const circuits = await em.find(Circuit, { revision: { quote: { number: { $gt: 1000 } } } });
    expect(circuits.length).toBeGreaterThan(DEMO_YEAR_QUOTES / 2);
    expect(circuits.every((c) => typeof c.result.ok === 'boolean')).toBe(true);

    // an approval per approved quote, a payment per deposit-paid event, amounts agreeing
    const approvedEvents = events.filter((e) => e.type === 'approved');
    expect(await em.count(QuoteApproval, { quote: { number: { $gt: 1000 } } })).toBe(approvedEvents.length);
    const payments = await em.find(DepositPayment, { quote: { number: { $gt: 1000 } } });
    const paid = events.filter((e) => e.type === 'deposit-paid');
    expect(payments).toHaveLength(paid.length);
    expect(payments.map((p) => p.amountMinor).sort()).toEqual(paid.map((e) => Number(e.data.amountMinor)).sort());
  });

  it('is deterministic: two seeds give the same quote values and outcomes', async () => {
    const a = await seeded();
    const b = await seeded();
    const shape = async (em: typeof a) =>
      (await em.find(Quote, { number: { $gt: 1000 } }, { orderBy: { number: 'asc' } })).map((q) => [q.number, q.valueMinor, q.status]);
    expect(await shape(a)).toEqual(await shape(b));
  });
});
