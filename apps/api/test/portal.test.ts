/**
 * The homeowner's portal routes: opening a link (good, unknown, withdrawn, expired, replaced),
 * the throttle on links that do not work, server-side totals, questions and replies, approving
 * (once, even in parallel) and declining. Figures are worked by hand beside each check.
 */
import request from 'supertest';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatQuoteNumber, PortalLinkProblem, PortalQuoteResponse, PortalTotalsResponse } from '@gloaming/contracts';
import { OutboxMessage, PortalToken, Quote, QuoteApproval, QuoteEvent, QuoteMessage, QuoteRevision } from '@gloaming/db';
import { expireOverdueQuotes } from '../src/modules/portal/service';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote, CUSTOMER_NAME, TELLTALE_COST_MINOR } from './estimate-fixture';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_PORTAL_MAX_FAILED_PER_IP: '1000' });
});
afterAll(async () => t.close());

function linkToken(text: string): string {
  const m = /http:\/\/gloaming\.test\/portal\/q\/([A-Za-z0-9_-]+)/.exec(text);
  if (!m) throw new Error(`no portal link in: ${text}`);
  return m[1]!;
}

let sent = 0;
/** A garden quote sent by firm A's estimator to a fresh address; returns its link's token. */
async function sendGarden() {
  const email = `home-${++sent}@portal.example`;
  const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email });
  const staff = await t.signIn('estimator');
  const res = await staff.post(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/send`).send({});
  expect(res.status).toBe(201);
  const mail = await t.catcher.waitFor((m) => m.to.includes(email) && m.subject.includes('quotation'));
  return { ...g, email, staff, token: linkToken(mail.text) };
}

const api = () => request(t.app);
const estimatorEmail = () => t.firmA.users.estimator.email;

/** Every key anywhere in a JSON value, and every number in it. */
function walk(value: unknown, keys: Set<string>, numbers: Set<number>): void {
  if (typeof value === 'number') numbers.add(value);
  else if (Array.isArray(value)) value.forEach((v) => walk(v, keys, numbers));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) {
      keys.add(k);
      walk(v, keys, numbers);
    }
}

// The garden estimate (test/estimate-fixture.ts), worked by hand at the UK standard VAT rate of
// 20 % (gov.uk), each line's VAT rounded to the nearest penny (the factory firm's rounding):
// suggested choice: net £1,126.60, VAT £225.32, total £1,351.92, deposit 30 % half-up £405.58.
// With the tree uplighter (2 x £84.00 = £168.00) and the dimmable driver (£148.00 in place of
// £96.00): net £1,346.60; VAT 20 % per line 81.60 + 11.52 + 54.00 + 59.00 + 33.60 + 29.60 =
// £269.32; total £1,615.92; deposit 30 % = £484.776, half-up £484.78; balance £1,131.14.
const SUGGESTED = { netMinor: 112660, vatMinor: 22532, totalMinor: 135192, depositMinor: 40558 };
const UPGRADED = { netMinor: 134660, vatMinor: 26932, totalMinor: 161592, depositMinor: 48478, balanceMinor: 113114 };

/** Ids of the fixture's choice lines: the tree uplighter (optional) and the two drivers. */
async function choiceIds(token: string) {
  const view = PortalQuoteResponse.parse((await api().get(`/api/portal/${token}`)).body).quote;
  const lines = view.sections.flatMap((s) => s.lines);
  const find = (start: string) => lines.find((l) => l.description.startsWith(start))!.id;
  return {
    tree: find('Tree uplighter'),
    plainDriver: find('Constant-current driver'),
    dimmable: find('Dimmable driver'),
    path: find('Bollard'),
  };
}

describe('opening a link', () => {
  it('shows the quote with prices, never cost or margin, and records every view; the first view e-mails the estimator once', async () => {
    const g = await sendGarden();
    t.catcher.clear();
    const first = await api().get(`/api/portal/${g.token}`);
    expect(first.status).toBe(200);
    const view = PortalQuoteResponse.parse(first.body).quote;
    expect(view.state).toBe('open');
    expect(view.customer.name).toBe(CUSTOMER_NAME);
    expect(view.firm.name).toBe('Firm A Lighting');
    expect(view.firm.contactEmail).toBe(estimatorEmail());
    expect(view.sections.map((s) => s.name)).toEqual(['Front path', 'Rear terrace']);
    expect(view.totals).toMatchObject({
      netMinor: SUGGESTED.netMinor,
      vatMinor: SUGGESTED.vatMinor,
      totalMinor: SUGGESTED.totalMinor,
    });
    expect(view.totals.deposit?.depositMinor).toBe(SUGGESTED.depositMinor);
    expect(view.totals.vatByRate).toEqual([{ rateBp: 2000, netMinor: SUGGESTED.netMinor, vatMinor: SUGGESTED.vatMinor }]);
    expect(view.safetyNote).toContain('licensed electrician');
    const kinds = view.sections.flatMap((s) => s.lines.map((l) => l.kind));
    expect(kinds.filter((k) => k === 'optional')).toHaveLength(1);
    expect(kinds.filter((k) => k === 'alternative')).toHaveLength(2);

    const keys = new Set<string>();
    const numbers = new Set<number>();
    walk(first.body, keys, numbers);
    for (const k of keys) expect(k).not.toMatch(/cost|margin|markup|pricing|productId|circuit/i);
    expect(numbers.has(TELLTALE_COST_MINOR)).toBe(false);

    expect((await api().get(`/api/portal/${g.token}`)).status).toBe(200);
    const em = t.orm.em.fork();
    expect(await em.count(QuoteEvent, { quote: g.quote.id, type: 'viewed' })).toBe(2);
    expect((await em.findOneOrFail(Quote, g.quote.id)).status).toBe('viewed');
    await t.catcher.waitFor((m) => m.to.includes(estimatorEmail()) && m.subject.includes('opened'));
    await new Promise((r) => setTimeout(r, 300)); // a second notice would have arrived by now
    const notices = t.catcher.messages().filter((m) => m.to.includes(estimatorEmail()) && m.subject.includes('opened'));
    expect(notices).toHaveLength(1);
    expect(notices[0]!.text).toContain(`http://gloaming.test/quotes/${g.quote.id}`);
  });

  it("shows the firm's logo through the link once the firm has one, and only through a live link", async () => {
    const { token } = await sendGarden();
    const before = PortalQuoteResponse.parse((await api().get(`/api/portal/${token}`).expect(200)).body);
    expect(before.quote.firm.hasLogo).toBe(false);
    await api().get(`/api/portal/${token}/logo`).expect(404);

    const owner = await t.signIn('owner');
    const png = await sharp({ create: { width: 600, height: 200, channels: 3, background: '#1b3a5c' } })
      .png()
      .toBuffer();
    await owner
      .put('/api/organization/logo')
      .attach('file', png, { filename: 'nightjar.png', contentType: 'image/png' })
      .expect(200);
    const after = PortalQuoteResponse.parse((await api().get(`/api/portal/${token}`).expect(200)).body);
    expect(after.quote.firm.hasLogo).toBe(true);
    const logo = await api().get(`/api/portal/${token}/logo`).buffer(true).expect(200);
    expect(logo.headers['content-type']).toMatch(/^image\/png/);
    expect((await sharp(logo.body as Buffer).metadata()).width).toBe(600);
    // an unknown link gets nothing, not even the logo
    await api().get('/api/portal/not-a-real-link-token-at-all-000000/logo').expect(404);
    await owner.delete('/api/organization/logo').expect(200);
  });

  it('answers an unknown link 404 with nothing about any firm, the same for every unknown link', async () => {
    const a = await api().get('/api/portal/not-a-real-link-at-all');
    const b = await api().get(`/api/portal/${'A'.repeat(43)}`);
    for (const res of [a, b]) {
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toContain('application/problem+json');
      const p = PortalLinkProblem.parse(res.body);
      expect(p.linkState).toBe('unknown');
      expect(p.firm).toBeUndefined();
      expect(JSON.stringify(res.body)).not.toContain('Firm A');
    }
    expect({ ...a.body, instance: '' }).toEqual({ ...b.body, instance: '' });
    // a POST to an unknown link is the same 404, whatever its body
    expect((await api().post('/api/portal/nope/approval').send({ signedName: 1 })).status).toBe(404);
  });

  it('answers a withdrawn link 410 with the firm to contact', async () => {
    const g = await sendGarden();
    expect((await g.staff.post(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/revoke`).send({})).status).toBe(200);
    const res = await api().get(`/api/portal/${g.token}`);
    expect(res.status).toBe(410);
    const p = PortalLinkProblem.parse(res.body);
    expect(p.linkState).toBe('revoked');
    expect(p.firm).toMatchObject({ name: 'Firm A Lighting', contactEmail: estimatorEmail() });
  });

  it('answers a quote past its date 410 with the firm, records `expired` once, and refuses approval', async () => {
    const g = await sendGarden();
    const { tree } = await choiceIds(g.token);
    const em = t.orm.em.fork();
    const past = new Date(Date.now() - 60_000);
    (await em.findOneOrFail(Quote, g.quote.id)).validUntil = past;
    for (const tok of await em.find(PortalToken, { revision: g.revision.id })) tok.expiresAt = past;
    await em.flush();

    for (let i = 0; i < 2; i++) {
      const res = await api().get(`/api/portal/${g.token}`);
      expect(res.status).toBe(410);
      expect(PortalLinkProblem.parse(res.body)).toMatchObject({ linkState: 'expired', firm: { name: 'Firm A Lighting' } });
    }
    const approve = await api()
      .post(`/api/portal/${g.token}/approval`)
      .send({ selection: { [tree]: true }, signedName: CUSTOMER_NAME, termsAccepted: true });
    expect(approve.status).toBe(410);
    const check = t.orm.em.fork();
    expect(await check.count(QuoteEvent, { quote: g.quote.id, type: 'expired' })).toBe(1);
    expect(await check.count(QuoteApproval, { quote: g.quote.id })).toBe(0);
    expect((await check.findOneOrFail(Quote, g.quote.id)).status).toBe('expired');
  });

  it('sends a replaced revision to the newer one through a fresh live link', async () => {
    const g = await sendGarden();
    const revised = await g.staff.post(`/api/quotes/${g.quote.id}/revisions`).send({});
    expect(revised.status).toBe(201);
    const r2 = await t.orm.em.fork().findOneOrFail(QuoteRevision, { quote: g.quote.id, number: 2 });
    expect((await g.staff.post(`/api/quotes/${g.quote.id}/revisions/${r2.id}/send`).send({})).status).toBe(201);

    const old = await api().get(`/api/portal/${g.token}`);
    expect(old.status).toBe(410);
    const p = PortalLinkProblem.parse(old.body);
    expect(p.linkState).toBe('superseded');
    expect(p.currentLink).toMatch(/^\/portal\/q\/[A-Za-z0-9_-]{43}$/);
    const next = await api().get(`/api${p.currentLink!.replace('/portal/q/', '/portal/')}`);
    expect(next.status).toBe(200);
    expect(PortalQuoteResponse.parse(next.body).quote.revisionNumber).toBe(2);
  });
});

describe('the throttle on links that do not work', () => {
  it('counts unknown links per IP (working ones are free) and then answers 429 with a wait', async () => {
    const s = await startTestServer({ GLOAMING_PORTAL_MAX_FAILED_PER_IP: '3' });
    try {
      const g = await createGardenQuote(s.orm.em.fork(), s.firmA, { email: 'throttle@portal.example' });
      const staff = await s.signIn('estimator');
      expect((await staff.post(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/send`).send({})).status).toBe(201);
      const token = linkToken((await s.catcher.waitFor((m) => m.to.includes('throttle@portal.example'))).text);
      for (let i = 0; i < 5; i++) expect((await request(s.app).get(`/api/portal/${token}`)).status).toBe(200);
      for (let i = 0; i < 3; i++) expect((await request(s.app).get(`/api/portal/guess-${i}`)).status).toBe(404);
      const blocked = await request(s.app).get('/api/portal/guess-4');
      expect(blocked.status).toBe(429);
      expect(blocked.headers['content-type']).toContain('application/problem+json');
      expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
      // once over the limit, the network waits even with a good link
      expect((await request(s.app).get(`/api/portal/${token}`)).status).toBe(429);
    } finally {
      await s.close();
    }
  });
});

describe('choosing options', () => {
  it('prices a choice on the server from the stored lines, whatever the client claims', async () => {
    const g = await sendGarden();
    const { tree, dimmable } = await choiceIds(g.token);
    const res = await api()
      .post(`/api/portal/${g.token}/totals`)
      .send({ selection: { [tree]: true, [dimmable]: true }, totals: { totalMinor: 1 }, unitPriceMinor: 1 });
    expect(res.status).toBe(200);
    const body = PortalTotalsResponse.parse(res.body);
    expect(body.totals).toMatchObject({
      netMinor: UPGRADED.netMinor,
      vatMinor: UPGRADED.vatMinor,
      totalMinor: UPGRADED.totalMinor,
    });
    expect(body.totals.deposit).toEqual({ depositMinor: UPGRADED.depositMinor, balanceMinor: UPGRADED.balanceMinor });
    // choosing the dimmable driver un-chose the plain one
    expect(Object.values(body.selection).filter(Boolean)).toHaveLength(2);
  });

  it('refuses unknown lines, fixed lines and two alternatives of one group with 400 and the field', async () => {
    const g = await sendGarden();
    const { path, plainDriver, dimmable } = await choiceIds(g.token);
    const cases = [{ nope: true }, { [path]: false }, { [plainDriver]: true, [dimmable]: true }];
    for (const selection of cases) {
      const res = await api().post(`/api/portal/${g.token}/totals`).send({ selection });
      expect(res.status).toBe(400);
      expect(res.body.errors[0].path).toMatch(/^body\.selection/);
    }
  });
});

describe('questions and replies', () => {
  it('stores a question, records it and e-mails the estimator; the reply reaches the homeowner with a working link', async () => {
    const g = await sendGarden();
    t.catcher.clear();
    const question = 'Could the path lights be black rather than bronze?';
    const asked = await api().post(`/api/portal/${g.token}/questions`).send({ body: question });
    expect(asked.status).toBe(201);
    expect(asked.body.message).toMatchObject({ from: 'homeowner', authorName: CUSTOMER_NAME, body: question });
    const mail = await t.catcher.waitFor((m) => m.to.includes(estimatorEmail()) && m.subject.startsWith('Question from'));
    expect(mail.text).toContain(question);
    const em = t.orm.em.fork();
    expect(await em.count(QuoteMessage, { quote: g.quote.id, from: 'homeowner' })).toBe(1);
    expect(await em.count(QuoteEvent, { quote: g.quote.id, type: 'question' })).toBe(1);
    expect((await api().post(`/api/portal/${g.token}/questions`).send({ body: '   ' })).status).toBe(400);

    const reply = await g.staff.post(`/api/quotes/${g.quote.id}/messages`).send({ body: 'Yes, black costs the same.' });
    expect(reply.status).toBe(201);
    expect(reply.body.sentTo).toBe(g.email);
    const replyMail = await t.catcher.waitFor((m) => m.to.includes(g.email) && m.subject.startsWith('Reply about'));
    expect(replyMail.text).toContain('Yes, black costs the same.');
    const view = await api().get(`/api/portal/${linkToken(replyMail.text)}`);
    expect(view.status).toBe(200);
    expect(PortalQuoteResponse.parse(view.body).quote.messages.map((m) => m.from)).toEqual(['homeowner', 'staff']);
    const thread = await g.staff.get(`/api/quotes/${g.quote.id}/messages`);
    expect(thread.body.messages).toHaveLength(2);
    expect(await t.orm.em.fork().count(QuoteEvent, { quote: g.quote.id, type: 'reply' })).toBe(1);
  });
});

describe('approving', () => {
  it('freezes the choice and the server totals with who, when, where and the content hash, and e-mails both sides', async () => {
    const g = await sendGarden();
    const { tree, dimmable } = await choiceIds(g.token);
    t.catcher.clear();
    const res = await api()
      .post(`/api/portal/${g.token}/approval`)
      .set('User-Agent', 'PortalTest/1.0 (phone)')
      .send({
        selection: { [tree]: true, [dimmable]: true },
        signedName: '  Marguerite Okonedo-Vale ',
        termsAccepted: true,
        totalMinor: 5,
      });
    expect(res.status).toBe(201);
    expect(res.body.approval).toMatchObject({
      totalMinor: UPGRADED.totalMinor,
      depositMinor: UPGRADED.depositMinor,
      signedName: CUSTOMER_NAME,
    });

    const em = t.orm.em.fork();
    const approval = await em.findOneOrFail(QuoteApproval, { revision: g.revision.id });
    const revision = await em.findOneOrFail(QuoteRevision, g.revision.id);
    expect(approval.totalMinor).toBe(UPGRADED.totalMinor);
    expect(approval.depositMinor).toBe(UPGRADED.depositMinor);
    expect(approval.currency).toBe('GBP');
    expect(approval.selection[tree]).toBe(true);
    expect(approval.selection[dimmable]).toBe(true);
    expect(Object.keys(approval.selection)).toHaveLength(3);
    expect(approval.termsAccepted).toBe(true);
    expect(approval.userAgent).toBe('PortalTest/1.0 (phone)');
    expect(approval.ipAddress).toMatch(/127\.0\.0\.1|::1/);
    expect(approval.contentHash).toBe(revision.contentHash);
    const events = await em.find(QuoteEvent, { quote: g.quote.id, type: 'approved' });
    expect(events).toHaveLength(1);
    expect(events[0]!.data).toMatchObject({ totalMinor: UPGRADED.totalMinor, depositMinor: UPGRADED.depositMinor });
    expect((await em.findOneOrFail(Quote, g.quote.id)).status).toBe('approved');

    const toHome = await t.catcher.waitFor((m) => m.to.includes(g.email) && m.subject.startsWith('You approved'));
    expect(toHome.text).toContain('£1,615.92');
    expect(toHome.text).toContain('£484.78');
    await t.catcher.waitFor((m) => m.to.includes(estimatorEmail()) && m.subject.includes('approved'));

    const view = PortalQuoteResponse.parse((await api().get(`/api/portal/${g.token}`)).body).quote;
    expect(view.state).toBe('approved');
    expect(view.totals.totalMinor).toBe(UPGRADED.totalMinor);
    expect(view.approval?.signedName).toBe(CUSTOMER_NAME);
    const decision = await g.staff.get(`/api/quotes/${g.quote.id}/decision`);
    expect(decision.body.approval).toMatchObject({
      revisionNumber: 1,
      totalMinor: UPGRADED.totalMinor,
      userAgent: 'PortalTest/1.0 (phone)',
    });

    const again = await api()
      .post(`/api/portal/${g.token}/approval`)
      .send({ selection: {}, signedName: CUSTOMER_NAME, termsAccepted: true });
    expect(again.status).toBe(409);
    expect((await api().post(`/api/portal/${g.token}/decline`).send({})).status).toBe(409);
  });

  it('records exactly one approval when two arrive at once', async () => {
    const g = await sendGarden();
    const body = { selection: {}, signedName: CUSTOMER_NAME, termsAccepted: true };
    const results = await Promise.all(Array.from({ length: 4 }, () => api().post(`/api/portal/${g.token}/approval`).send(body)));
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([201, 409, 409, 409]);
    const em = t.orm.em.fork();
    expect(await em.count(QuoteApproval, { quote: g.quote.id })).toBe(1);
    expect(await em.count(QuoteEvent, { quote: g.quote.id, type: 'approved' })).toBe(1);
    // the e-mails were in the approval's own transaction: the refused ones left none behind
    const reference = formatQuoteNumber(g.quote.number);
    for (const kind of ['approval-confirmation', 'approved-notice']) {
      const rows = await em.find(OutboxMessage, { kind, organization: g.quote.organization });
      expect(rows.filter((m) => m.subject.includes(reference)), kind).toHaveLength(1);
    }
  });

  it('needs a typed name and the terms accepted', async () => {
    const g = await sendGarden();
    const res = await api()
      .post(`/api/portal/${g.token}/approval`)
      .send({ selection: {}, signedName: ' ', termsAccepted: false });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path).sort()).toEqual(['body.signedName', 'body.termsAccepted']);
    expect(await t.orm.em.fork().count(QuoteApproval, { quote: g.quote.id })).toBe(0);
  });

  it('refuses a cross-site approval', async () => {
    const g = await sendGarden();
    const res = await api()
      .post(`/api/portal/${g.token}/approval`)
      .set('Origin', 'http://elsewhere.example')
      .send({ selection: {}, signedName: CUSTOMER_NAME, termsAccepted: true });
    expect(res.status).toBe(403);
  });
});

describe('declining', () => {
  it('stores the reason with the event, and the quote can no longer be approved', async () => {
    const g = await sendGarden();
    const res = await api().post(`/api/portal/${g.token}/decline`).send({ reason: 'We have decided to wait until next spring.' });
    expect(res.status).toBe(201);
    const em = t.orm.em.fork();
    const events = await em.find(QuoteEvent, { quote: g.quote.id, type: 'declined' });
    expect(events).toHaveLength(1);
    expect(events[0]!.data).toMatchObject({ reason: 'We have decided to wait until next spring.' });
    expect((await em.findOneOrFail(Quote, g.quote.id)).status).toBe('declined');
    const view = PortalQuoteResponse.parse((await api().get(`/api/portal/${g.token}`)).body).quote;
    expect(view.state).toBe('declined');
    expect(view.declined?.reason).toBe('We have decided to wait until next spring.');
    expect(
      (
        await api()
          .post(`/api/portal/${g.token}/approval`)
          .send({ selection: {}, signedName: CUSTOMER_NAME, termsAccepted: true })
      ).status,
    ).toBe(409);
    expect((await api().post(`/api/portal/${g.token}/decline`).send({})).status).toBe(409);
  });

  it('takes no reason at all', async () => {
    const g = await sendGarden();
    expect((await api().post(`/api/portal/${g.token}/decline`).send({})).status).toBe(201);
    const event = await t.orm.em.fork().findOneOrFail(QuoteEvent, { quote: g.quote.id, type: 'declined' });
    expect(event.data.reason).toBeUndefined();
  });
});

describe('the PDF and photos', () => {
  it('serves the sent PDF, and no photo the quote does not show', async () => {
    const g = await sendGarden();
    const pdf = await api().get(`/api/portal/${g.token}/pdf`).buffer(true);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(
      Buffer.from(pdf.body as Buffer)
        .subarray(0, 5)
        .toString(),
    ).toBe('%PDF-');
    expect((await api().get(`/api/portal/${g.token}/photos/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
  });
});

describe('expiry sweep', () => {
  it('records `expired` once for an undecided quote past its date, and leaves approved ones alone', async () => {
    const waiting = await sendGarden();
    const approved = await sendGarden();
    expect(
      (
        await api()
          .post(`/api/portal/${approved.token}/approval`)
          .send({ selection: {}, signedName: CUSTOMER_NAME, termsAccepted: true })
      ).status,
    ).toBe(201);
    const em = t.orm.em.fork();
    const later = new Date(Date.now() + 31 * 24 * 3600_000); // the factory firm's quotes are valid 30 days
    expect(await expireOverdueQuotes(em, later)).toBeGreaterThanOrEqual(1);
    expect(await expireOverdueQuotes(t.orm.em.fork(), later)).toBe(0);
    const check = t.orm.em.fork();
    expect(await check.count(QuoteEvent, { quote: waiting.quote.id, type: 'expired' })).toBe(1);
    expect((await check.findOneOrFail(Quote, waiting.quote.id)).status).toBe('expired');
    expect(await check.count(QuoteEvent, { quote: approved.quote.id, type: 'expired' })).toBe(0);
    expect((await check.findOneOrFail(Quote, approved.quote.id)).status).toBe('approved');
  });
});
