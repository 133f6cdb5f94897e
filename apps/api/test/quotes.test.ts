import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  QuoteDetailResponse,
  QuoteEventsResponse,
  QuoteListResponse,
  RevisionResponse,
  SaveRevisionResponse,
  estimateQuoteInput,
  type EstimateContent,
  type EstimateLine,
} from '@gloaming/contracts';
import { Quote, QuoteRevision } from '@gloaming/db';
import { computeQuoteTotals } from '@gloaming/engine';
import { canonicalJson } from '@gloaming/db';
import { loadQuoteForFirm, loadRevision, markRevisionSent } from '../src/modules/quotes/service';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';

let t: TestServer;
let estimator: Awaited<ReturnType<TestServer['signIn']>>;
let owner: Awaited<ReturnType<TestServer['signIn']>>;
let installer: Awaited<ReturnType<TestServer['signIn']>>;
let fixtureA: Awaited<ReturnType<typeof createQuoteFixture>>;
let fixtureB: Awaited<ReturnType<typeof createQuoteFixture>>;

beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
  fixtureA = await createQuoteFixture(t.orm.em.fork(), t.firmA, 'Ada Thornfield');
  fixtureB = await createQuoteFixture(t.orm.em.fork(), t.firmB, 'Bram Otterley');
  estimator = await t.signIn('estimator');
  owner = await t.signIn('owner');
  installer = await t.signIn('installer');
});
afterAll(async () => t.close());

let lineCounter = 0;
function line(over: Partial<EstimateLine> = {}): EstimateLine {
  lineCounter++;
  return {
    id: `line-${lineCounter}`,
    productId: null,
    description: `Spike spotlight ${lineCounter}`,
    quantityMilli: 3000,
    unit: 'each',
    unitCostMinor: 2500,
    pricingMode: 'markup',
    pricingBp: 3500,
    unitPriceMinor: 3375,
    vatRateBp: 2000,
    discount: null,
    optional: false,
    alternativeGroup: null,
    selected: true,
    note: '',
    circuitId: null,
    overridden: false,
    ...over,
  };
}

function content(lines: EstimateLine[], over: Partial<EstimateContent> = {}): EstimateContent {
  return { sections: [{ id: 'sec-1', name: 'Front lawn', lines }], discount: null, deposit: { kind: 'percent', bp: 3000 }, introduction: '', ...over };
}

async function newQuote(agent = estimator, customerId = fixtureA.customer.id, siteId: string | null = fixtureA.site.id) {
  const res = await agent.post('/api/quotes').send({ customerId, siteId });
  expect(res.status).toBe(201);
  return QuoteDetailResponse.parse(res.body);
}

function problemPaths(res: request.Response): string[] {
  return (res.body.errors ?? []).map((e: { path: string }) => e.path);
}

describe('POST /api/quotes', () => {
  it('numbers quotes per firm and snapshots the firm settings into a first draft revision', async () => {
    const first = await newQuote();
    const second = await newQuote();
    expect(second.quote.number).toBe(first.quote.number + 1);
    expect(second.quote.reference).toBe(`Q-${String(second.quote.number).padStart(4, '0')}`);
    expect(first.quote.status).toBe('draft');
    expect(first.quote.customer.name).toBe('Ada Thornfield');
    expect(first.quote.site?.postcode).toBe('EW1 4LR');
    expect(first.revision).toMatchObject({ number: 1, state: 'draft' });
    // Organization defaults (packages/db entities/organization.ts): 20 % VAT, 35 % markup, 30 % deposit.
    expect(first.revision.settings).toMatchObject({ currency: 'GBP', defaultVatRateBp: 2000, markupPercentBp: 3500, depositPercentBp: 3000, vatRounding: 'line-nearest-1p' });
    expect(first.revisions.map((r) => r.number)).toEqual([1]);
    // Firm B's sequence is its own: its fixture quote is its number 1.
    const b = await (await t.signIn('estimator', 'B')).get('/api/quotes');
    expect(QuoteListResponse.parse(b.body).quotes.map((q) => q.number)).toEqual([1]);
  });

  it('answers bad input with field paths, and another firm’s customer or a foreign site with 404', async () => {
    const missing = await estimator.post('/api/quotes').send({});
    expect(missing.status).toBe(400);
    expect(missing.headers['content-type']).toContain('application/problem+json');
    expect(problemPaths(missing)).toContain('body.customerId');
    const wrongType = await estimator.post('/api/quotes').send({ customerId: 42, title: ['x'] });
    expect(wrongType.status).toBe(400);
    expect(problemPaths(wrongType)).toEqual(expect.arrayContaining(['body.customerId', 'body.title']));
    const longTitle = await estimator.post('/api/quotes').send({ customerId: fixtureA.customer.id, title: 'x'.repeat(201) });
    expect(problemPaths(longTitle)).toEqual(['body.title']);
    const foreignCustomer = await estimator.post('/api/quotes').send({ customerId: fixtureB.customer.id });
    expect(foreignCustomer.status).toBe(404);
    const foreignSite = await estimator.post('/api/quotes').send({ customerId: fixtureA.customer.id, siteId: fixtureB.site.id });
    expect(foreignSite.status).toBe(404);
  });

  it('is refused to installers', async () => {
    const res = await installer.post('/api/quotes').send({ customerId: fixtureA.customer.id });
    expect(res.status).toBe(403);
  });
});

describe('PUT /api/quotes/:id/revisions/:n (save the grid)', () => {
  it('stores the document, recomputes totals with the engine and updates the quote value', async () => {
    const { quote, revision } = await newQuote();
    const lines = [
      line(),
      line({ quantityMilli: 12_500, unit: 'm', unitCostMinor: 180, unitPriceMinor: 243, vatRateBp: 2000 }),
      line({ vatRateBp: 500, unitPriceMinor: 99 }),
      line({ optional: true, selected: false, unitPriceMinor: 10_000 }),
      line({ alternativeGroup: 'path lights', selected: true, unitPriceMinor: 4000 }),
      line({ alternativeGroup: 'path lights', selected: false, unitPriceMinor: 6000 }),
    ];
    const doc = content(lines, { discount: { kind: 'percent', bp: 500 } });
    const res = await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: revision.version, content: doc });
    expect(res.status).toBe(200);
    const saved = SaveRevisionResponse.parse(res.body);
    const engine = computeQuoteTotals(estimateQuoteInput(doc, revision.settings));
    expect(saved.revision.totals.totalMinor).toBe(engine.totalMinor);
    expect(saved.revision.totals.vatByRate).toEqual(engine.vatByRate);
    expect(saved.revision.totals.costMinor).toBe(engine.costMinor);
    expect(saved.revision.totals.deposit).toEqual(engine.deposit);
    expect(saved.quote.valueMinor).toBe(engine.totalMinor);
    expect(saved.revision.version).toBeGreaterThan(revision.version);
    const again = QuoteDetailResponse.parse((await estimator.get(`/api/quotes/${quote.id}`)).body);
    expect(again.revision.content).toEqual(doc);
    expect(again.revision.totals?.totalMinor).toBe(engine.totalMinor);
    expect(again.quote.valueMinor).toBe(engine.totalMinor);
  });

  it('writes nothing for a save of the document already stored: same version, same time, 200', async () => {
    const { quote, revision } = await newQuote();
    const doc = content([line({ description: 'Spike light by the pond' })]);
    const first = SaveRevisionResponse.parse((await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: revision.version, content: doc }).expect(200)).body);
    const same = await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: first.revision.version, content: doc });
    expect(same.status).toBe(200);
    const again = SaveRevisionResponse.parse(same.body);
    expect(again.revision.version).toBe(first.revision.version);
    expect(again.revision.updatedAt).toBe(first.revision.updatedAt);
    expect(again.revision.totals).toEqual(first.revision.totals);
    // a changed document is written again and moves the version on
    const changed = content([line({ description: 'Spike light by the pond, moved left' })]);
    const next = SaveRevisionResponse.parse((await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: first.revision.version, content: changed }).expect(200)).body);
    expect(next.revision.version).toBe(first.revision.version + 1);
    const stored = QuoteDetailResponse.parse((await estimator.get(`/api/quotes/${quote.id}`)).body);
    expect(stored.revision.version).toBe(next.revision.version);
    expect(stored.revision.content).toEqual(changed);
  });

  it('answers a stale version with 409 and keeps what the first person saved', async () => {
    const { quote, revision } = await newQuote();
    const mine = content([line({ description: 'Mine: uplighter on the birch' })]);
    const theirs = content([line({ description: 'Theirs: wall washer on the shed' })]);
    const first = await owner.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: revision.version, content: theirs });
    expect(first.status).toBe(200);
    const stale = await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: revision.version, content: mine });
    expect(stale.status).toBe(409);
    expect(stale.headers['content-type']).toContain('application/problem+json');
    expect(stale.body.detail).toMatch(/Someone else saved/);
    const now = QuoteDetailResponse.parse((await estimator.get(`/api/quotes/${quote.id}`)).body);
    expect(now.revision.content.sections[0]!.lines[0]!.description).toBe('Theirs: wall washer on the shed');
    // "Keep mine": save again on the version the server now has.
    const keep = await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: now.revision.version, content: mine });
    expect(keep.status).toBe(200);
  });

  it('refuses bad documents with 400 and field paths, and writes nothing', async () => {
    const { quote, revision } = await newQuote();
    const url = `/api/quotes/${quote.id}/revisions/1`;
    const cases: [string, unknown, string][] = [
      ['missing content', { version: revision.version }, 'body.content'],
      ['missing version', { content: content([]) }, 'body.version'],
      ['wrong type', { version: 'one', content: content([]) }, 'body.version'],
      ['quantity as text', { version: revision.version, content: content([{ ...line(), quantityMilli: '3' } as unknown as EstimateLine]) }, 'body.content.sections.0.lines.0.quantityMilli'],
      ['huge price', { version: revision.version, content: content([line({ unitPriceMinor: 1e15 })]) }, 'body.content.sections.0.lines.0.unitPriceMinor'],
      ['fractional pence', { version: revision.version, content: content([line({ unitCostMinor: 12.5 })]) }, 'body.content.sections.0.lines.0.unitCostMinor'],
      ['negative quantity', { version: revision.version, content: content([line({ quantityMilli: -1000 })]) }, 'body.content.sections.0.lines.0.quantityMilli'],
      ['VAT over 100 %', { version: revision.version, content: content([line({ vatRateBp: 10_001 })]) }, 'body.content.sections.0.lines.0.vatRateBp'],
    ];
    for (const [name, body, path] of cases) {
      const res = await estimator.put(url).send(body as object);
      expect(res.status, name).toBe(400);
      expect(problemPaths(res), name).toContain(path);
    }
    const dup = line();
    const duplicate = await estimator.put(url).send({ version: revision.version, content: content([dup, { ...line(), id: dup.id }]) });
    expect(duplicate.status).toBe(400);
    expect(problemPaths(duplicate)).toContain('body.content.sections.0.lines.1.id');
    // The engine refuses a line that is both optional and in a pick-one group; the path names the line.
    const both = await estimator
      .put(url)
      .send({ version: revision.version, content: content([line(), line({ optional: true, alternativeGroup: 'g' })]) });
    expect(both.status).toBe(400);
    expect(both.body.detail).toMatch(/optional and part of a pick-one group/);
    expect(problemPaths(both)).toEqual(['body.content.sections.0.lines.1']);
    const after = QuoteDetailResponse.parse((await estimator.get(`/api/quotes/${quote.id}`)).body);
    expect(after.revision.version).toBe(revision.version);
    expect(after.revision.content.sections[0]!.lines).toEqual([]);
  });

  it('takes 10,000 lines and refuses 10,001 with a clear 400 (not a 413 or a 500)', async () => {
    const { quote, revision } = await newQuote();
    const many = (n: number) =>
      content([]).sections.map((s) => ({ ...s, lines: Array.from({ length: n }, (_, i) => line({ id: `bulk-${n}-${i}`, description: 'Cable 2-core 1.5 mm²' })) }));
    const ok = await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: revision.version, content: { ...content([]), sections: many(10_000) } });
    expect(ok.status).toBe(200);
    const tooMany = await estimator
      .put(`/api/quotes/${quote.id}/revisions/1`)
      .send({ version: ok.body.revision.version, content: { ...content([]), sections: many(10_001) } });
    expect(tooMany.status).toBe(400);
    expect(tooMany.headers['content-type']).toContain('application/problem+json');
    expect(problemPaths(tooMany)).toContain('body.content.sections.0.lines');
  }, 60_000);

  it('answers another firm’s quote with 404 and an installer with 403', async () => {
    const { revision } = await newQuote();
    const body = { version: revision.version, content: content([line()]) };
    expect((await estimator.put(`/api/quotes/${fixtureB.quote.id}/revisions/1`).send(body)).status).toBe(404);
    expect((await estimator.put(`/api/quotes/${fixtureA.quote.id}/revisions/9`).send(body)).status).toBe(404);
    expect((await installer.put(`/api/quotes/${fixtureA.quote.id}/revisions/1`).send(body)).status).toBe(403);
    const bad = await estimator.put(`/api/quotes/not-a-uuid/revisions/x`).send(body);
    expect(bad.status).toBe(400);
    expect(problemPaths(bad)).toEqual(expect.arrayContaining(['params.id', 'params.revisionNumber']));
    // The B quote is untouched.
    const em = t.orm.em.fork();
    const b = await em.findOneOrFail(QuoteRevision, { quote: fixtureB.quote.id, number: 1 });
    expect((b.content as EstimateContent).sections[0]!.lines).toEqual([]);
  });
});

describe('revisions and events', () => {
  it('freezes a sent revision, revises into a new draft, keeps the earlier one viewable, and logs events', async () => {
    const { quote, revision } = await newQuote();
    const doc = content([line({ description: 'Bollard by the gate' })]);
    const saved = await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: revision.version, content: doc });
    expect(saved.status).toBe(200);

    // The sending module freezes it through the service.
    const em = t.orm.em.fork();
    const q = await loadQuoteForFirm(em, t.firmA.firm.id, quote.id);
    await markRevisionSent(em, q, await loadRevision(em, q, 1), { id: t.firmA.users.estimator.id });
    await em.flush();
    // The hash is of the canonical JSON (keys sorted), not of the stored key order.
    const frozen = await t.orm.em.fork().findOneOrFail(QuoteRevision, { quote: quote.id, number: 1 });
    expect(frozen.contentHash).toBe(createHash('sha256').update(canonicalJson(doc)).digest('hex'));
    expect(frozen.contentHash).not.toBe(createHash('sha256').update(JSON.stringify(frozen.content)).digest('hex'));

    const sent = QuoteDetailResponse.parse((await estimator.get(`/api/quotes/${quote.id}`)).body);
    expect(sent.quote.status).toBe('sent');
    expect(sent.revision.state).toBe('sent');
    expect(sent.quote.validUntil).not.toBeNull();
    const refused = await estimator.put(`/api/quotes/${quote.id}/revisions/1`).send({ version: sent.revision.version, content: content([]) });
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/frozen.*Revise/);

    const revised = await estimator.post(`/api/quotes/${quote.id}/revisions`);
    expect(revised.status).toBe(201);
    const r2 = QuoteDetailResponse.parse(revised.body);
    expect(r2.revision).toMatchObject({ number: 2, state: 'draft' });
    expect(r2.revision.content).toEqual(doc);
    expect(r2.quote.status).toBe('draft');
    expect(r2.revisions.map((r) => [r.number, r.state])).toEqual([
      [2, 'draft'],
      [1, 'sent'],
    ]);
    // A draft is edited, not revised.
    expect((await estimator.post(`/api/quotes/${quote.id}/revisions`)).status).toBe(409);

    const edit = await estimator.put(`/api/quotes/${quote.id}/revisions/2`).send({ version: r2.revision.version, content: content([]) });
    expect(edit.status).toBe(200);
    // opening the quote shows the current revision's own document, the earlier one listed
    const opened = QuoteDetailResponse.parse((await estimator.get(`/api/quotes/${quote.id}`).expect(200)).body);
    expect(opened.revision).toMatchObject({ number: 2, state: 'draft', version: edit.body.revision.version });
    expect(opened.revision.content).toEqual(content([]));
    expect(opened.revision.content).not.toEqual(doc);
    expect(opened.revisions.map((r) => [r.number, r.state])).toEqual([
      [2, 'draft'],
      [1, 'sent'],
    ]);
    const earlier = RevisionResponse.parse((await estimator.get(`/api/quotes/${quote.id}/revisions/1`)).body);
    expect(earlier.revision.content).toEqual(doc);
    expect(earlier.revision.state).toBe('sent');
    expect((await estimator.get(`/api/quotes/${quote.id}/revisions/3`)).status).toBe(404);

    const events = QuoteEventsResponse.parse((await estimator.get(`/api/quotes/${quote.id}/events`)).body);
    expect(events.events.map((e) => [e.type, e.revisionNumber])).toEqual([
      ['created', 1],
      ['sent', 1],
      ['revised', 2],
    ]);
    expect(events.events[0]!.actor?.id).toBe(t.firmA.users.estimator.id);
    expect((await installer.get(`/api/quotes/${quote.id}/events`)).status).toBe(403);
    expect((await estimator.get(`/api/quotes/${fixtureB.quote.id}/events`)).status).toBe(404);
  });
});

describe('GET /api/quotes', () => {
  it('filters by status and estimator, searches, and pages', async () => {
    const em = t.orm.em.fork();
    const other = await createQuoteFixture(em, t.firmA, 'Cressida Penhallow');
    // The owner drafts one too.
    const ownerQuote = await newQuote(owner, other.customer.id, other.site.id);

    const all = QuoteListResponse.parse((await estimator.get('/api/quotes?pageSize=100')).body);
    expect(all.total).toBe(all.quotes.length);
    expect(all.quotes.map((q) => q.number)).toEqual([...all.quotes.map((q) => q.number)].sort((a, b) => b - a));
    expect(all.estimators.map((e) => e.id)).toEqual(expect.arrayContaining([t.firmA.users.owner.id, t.firmA.users.estimator.id]));
    expect(all.estimators.map((e) => e.id)).not.toContain(t.firmA.users.installer.id);
    expect(all.quotes.every((q) => q.customer.name !== 'Bram Otterley')).toBe(true);

    const byOwner = QuoteListResponse.parse((await estimator.get(`/api/quotes?estimatorId=${t.firmA.users.owner.id}`)).body);
    expect(byOwner.quotes.map((q) => q.id)).toEqual([ownerQuote.quote.id]);

    const sent = QuoteListResponse.parse((await estimator.get('/api/quotes?status=sent')).body);
    expect(sent.quotes.every((q) => q.status === 'sent')).toBe(true);
    const draftCount = QuoteListResponse.parse((await estimator.get('/api/quotes?status=draft')).body).total;
    expect(draftCount + sent.total).toBeLessThanOrEqual(all.total);

    const byName = QuoteListResponse.parse((await estimator.get('/api/quotes?q=penhall')).body);
    expect(byName.quotes.map((q) => q.customer.name)).toEqual(['Cressida Penhallow', 'Cressida Penhallow']);
    const byNumber = QuoteListResponse.parse((await estimator.get(`/api/quotes?q=${ownerQuote.quote.reference}`)).body);
    expect(byNumber.quotes.map((q) => q.id)).toEqual([ownerQuote.quote.id]);
    const wildcard = QuoteListResponse.parse((await estimator.get('/api/quotes?q=%25')).body);
    expect(wildcard.total).toBe(0);

    const page1 = QuoteListResponse.parse((await estimator.get('/api/quotes?pageSize=2&page=1')).body);
    const page2 = QuoteListResponse.parse((await estimator.get('/api/quotes?pageSize=2&page=2')).body);
    expect(page1.quotes).toHaveLength(2);
    expect(page1.total).toBe(all.total);
    expect(page2.quotes[0]!.number).toBeLessThan(page1.quotes[1]!.number);
  });

  it('answers bad queries with 400 and installers with 403', async () => {
    for (const q of ['page=0', 'pageSize=1000', 'status=pending', 'estimatorId=me', `q=${'x'.repeat(201)}`, 'page=abc']) {
      const res = await estimator.get(`/api/quotes?${q}`);
      expect(res.status, q).toBe(400);
      expect(res.headers['content-type']).toContain('application/problem+json');
    }
    expect((await installer.get('/api/quotes')).status).toBe(403);
    expect((await request(t.app).get('/api/quotes')).status).toBe(401);
  });

  it('shows another firm’s quote as 404, not as someone else’s data', async () => {
    expect((await estimator.get(`/api/quotes/${fixtureB.quote.id}`)).status).toBe(404);
    expect((await estimator.get(`/api/quotes/${fixtureB.quote.id}/revisions/1`)).status).toBe(404);
    expect((await estimator.post(`/api/quotes/${fixtureB.quote.id}/revisions`)).status).toBe(404);
    const em = t.orm.em.fork();
    expect(await em.count(Quote, { id: fixtureB.quote.id })).toBe(1);
  });
});
