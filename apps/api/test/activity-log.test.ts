/**
 * The owner's activity log, filtered by person and by kind, a page at a time; a quote's own log.
 * The histories are made through the api here: an estimator's quote, the owner's settings save.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ActivityResponse, FirmSettingsResponse, QuoteDetailResponse } from '@gloaming/contracts';
import { FirmEvent, QuoteEvent } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';

let t: TestServer;
let owner: Awaited<ReturnType<TestServer['signIn']>>;
let quoteId: string;

beforeAll(async () => {
  t = await startTestServer();
  const { customer } = await createQuoteFixture(t.orm.em.fork(), t.firmA, 'Ada Thornfield');
  owner = await t.signIn('owner');
  const estimator = await t.signIn('estimator');
  quoteId = QuoteDetailResponse.parse((await estimator.post('/api/quotes').send({ customerId: customer.id }).expect(201)).body).quote.id;
  const { settings, version } = FirmSettingsResponse.parse((await owner.get('/api/organization/settings').expect(200)).body);
  await owner.put('/api/organization/settings').send({ version, settings: { ...settings, termsText: 'Balance on completion.' } }).expect(200);
});
afterAll(async () => t.close());

const log = async (query: string) => ActivityResponse.parse((await owner.get(`/api/activity${query}`).expect(200)).body);

describe('the activity log', () => {
  it('filters by person: the estimator’s quote, not the owner’s settings', async () => {
    const mine = await log(`?actorId=${t.firmA.users.estimator.id}`);
    expect(mine.entries.length).toBeGreaterThan(0);
    expect(mine.entries.every((e) => e.actor?.id === t.firmA.users.estimator.id)).toBe(true);
    expect(mine.entries.some((e) => e.quote?.id === quoteId && e.type === 'created')).toBe(true);
    const owners = await log(`?actorId=${t.firmA.users.owner.id}`);
    expect(owners.entries.find((e) => e.type === 'settings-changed')?.summary).toBe('Changed the firm settings: terms');
    expect(owners.entries.some((e) => e.quote?.id === quoteId)).toBe(false);
  });

  it('filters by kind', async () => {
    const firm = await log('?kind=firm');
    expect(firm.entries.length).toBeGreaterThan(0);
    expect(firm.entries.every((e) => e.kind === 'firm')).toBe(true);
    const quotes = await log('?kind=quote');
    expect(quotes.entries.length).toBeGreaterThan(0);
    expect(quotes.entries.every((e) => e.kind === 'quote')).toBe(true);
  });

  it('pages with nextBefore, newest first, and refuses a bad filter with a field error', async () => {
    const all = await log('?limit=200');
    const first = await log('?limit=1');
    expect(first.entries).toEqual(all.entries.slice(0, 1));
    expect(first.nextBefore).toBe(all.entries[0]!.at);
    const second = await log(`?limit=1&before=${encodeURIComponent(first.nextBefore!)}`);
    expect(new Date(second.entries[0]!.at).getTime()).toBeLessThan(new Date(first.entries[0]!.at).getTime());
    const bad = await owner.get('/api/activity?kind=everything').expect(400);
    expect(bad.body.errors[0].path).toBe('query.kind');
  });

  it('pages through entries that share one instant without skipping or repeating any', async () => {
    // five quote events and three firm events at the very same millisecond, in firm B
    const em = t.orm.em.fork();
    const { quote } = await createQuoteFixture(em, t.firmB, 'Bryony Castell');
    const at = new Date('2026-06-01T09:00:00.000Z');
    for (let i = 0; i < 5; i++) em.create(QuoteEvent, { organization: t.firmB.firm, quote, type: 'viewed', actor: null, at });
    for (let i = 0; i < 3; i++) em.create(FirmEvent, { organization: t.firmB.firm, type: 'settings-changed', actor: t.firmB.users.owner, at });
    await em.flush();
    const ownerB = await t.signIn('owner', 'B');
    const logB = async (query: string) => ActivityResponse.parse((await ownerB.get(`/api/activity${query}`).expect(200)).body);
    const all = await logB('?limit=200');
    const paged: string[] = [];
    let page = await logB('?limit=2');
    for (;;) {
      paged.push(...page.entries.map((e) => e.id));
      if (!page.nextBefore) break;
      page = await logB(`?limit=2&before=${encodeURIComponent(page.nextBefore)}&beforeId=${encodeURIComponent(page.nextBeforeId!)}`);
    }
    expect(all.entries.length).toBeGreaterThanOrEqual(8);
    expect(paged).toEqual(all.entries.map((e) => e.id));
  });

  it('gives another firm’s person nothing, and the quote’s own log only its history', async () => {
    expect((await log(`?actorId=${t.firmB.users.estimator.id}`)).entries).toEqual([]);
    const q = ActivityResponse.parse((await owner.get(`/api/quotes/${quoteId}/activity`).expect(200)).body);
    expect(q.entries.length).toBeGreaterThan(0);
    expect(q.entries.every((e) => e.quote?.id === quoteId)).toBe(true);
  });
});
