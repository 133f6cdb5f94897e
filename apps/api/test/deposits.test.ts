/**
 * Deposit payments end to end through the official SDK and the local payment fake: checkout,
 * the signed webhook (good, tampered, wrong secret, stale, replayed, out of order, wrong
 * amount or currency, another firm's, unknown), refunds, and a provider that is down.
 */
import { createHmac, randomUUID } from 'node:crypto';
import request from 'supertest';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@gloaming/contracts';
import { DepositPayment, PaymentWebhookEvent, Quote, QuoteEvent } from '@gloaming/db';
import { recordOpenSession } from '../src/modules/deposits/service';
import {
  GARDEN_DEPOSIT_MINOR,
  WEBHOOK_SECRET,
  createApprovedQuote,
  payOnHostedPage,
  startPaymentsRig,
  type PaymentsRig,
} from './deposit-fixtures';
import { startTestServer, type TestServer } from './harness';

let t: TestServer;
let rig: PaymentsRig;
beforeAll(async () => {
  t = await startTestServer();
  rig = await startPaymentsRig(t);
});
afterAll(async () => {
  await rig.close();
  await t.close();
});

const sdk = new Stripe('sk_test_unused'); // only its webhook helpers, which never call out
const nowS = () => Math.floor(Date.now() / 1000);
const em = () => t.orm.em.fork();
const portal = (token: string) => `/api/portal/${token}/deposit`;

/** Signed in on the rig's app (the one wired to the fake), not the harness's. */
async function signIn(role: Role, firm: 'A' | 'B' = 'A') {
  const f = firm === 'A' ? t.firmA : t.firmB;
  const agent = request.agent(rig.api.app);
  const res = await agent.post('/api/session').send({ email: f.users[role].email, password: f.password });
  expect(res.status).toBe(200);
  return agent;
}

async function approvedQuote(firm: 'A' | 'B' = 'A') {
  return createApprovedQuote(em(), firm === 'A' ? t.firmA : t.firmB);
}

async function checkout(token: string, body: Record<string, unknown> = {}) {
  return request(rig.api.app).post(`${portal(token)}/checkout`).send(body);
}

/** Start a checkout and return the provider's session for it. */
async function openCheckout(token: string) {
  const res = await checkout(token);
  expect(res.status).toBe(201);
  const row = await em().findOneOrFail(DepositPayment, res.body.paymentId);
  const session = await rig.stripe.checkout.sessions.retrieve(row.checkoutSessionId);
  return { res, row, session };
}

function eventJson(type: string, object: unknown, id = `evt_test_${randomUUID().replaceAll('-', '')}`): string {
  return JSON.stringify({
    id,
    object: 'event',
    api_version: null,
    created: nowS(),
    type,
    data: { object },
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
  });
}

function sign(payload: string, secret = WEBHOOK_SECRET, timestamp = nowS()): string {
  return sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp });
}

async function deliver(payload: string, header = sign(payload)) {
  return request(rig.api.app)
    .post('/api/payments/webhook')
    .set('content-type', 'application/json')
    .set('stripe-signature', header)
    .send(payload);
}

/** A completed, paid version of a real session, as the provider would send it. */
function completed(session: Stripe.Checkout.Session, overrides: Partial<Record<keyof Stripe.Checkout.Session, unknown>> = {}) {
  return { ...session, status: 'complete', payment_status: 'paid', payment_intent: `pi_test_${randomUUID().slice(0, 8)}`, url: null, ...overrides };
}

async function stateOf(paymentId: string) {
  return em().findOneOrFail(DepositPayment, paymentId);
}
async function eventsOf(quoteId: string, type: string) {
  return em().find(QuoteEvent, { quote: quoteId, type: type as QuoteEvent['type'] });
}

describe('the published signature vector', () => {
  // REFERENCES.md, Payments: payload {"id":"evt_test_webhook","object":"event"}, secret
  // whsec_test_secret, t 1700000000 -> v1 d95c6b74…b990 [derived, SDK helper and node:crypto]
  const payload = '{"id":"evt_test_webhook","object":"event"}';
  const v1 = 'd95c6b7477fbd7e9f90b1b0ef5f9c7ac25abca5382460e0d988c2b2a5b71b990';

  it('the SDK helper and node:crypto both give the published v1', () => {
    const header = sdk.webhooks.generateTestHeaderString({ payload, secret: 'whsec_test_secret', timestamp: 1700000000 });
    expect(header).toBe(`t=1700000000,v1=${v1}`);
    expect(createHmac('sha256', 'whsec_test_secret').update(`1700000000.${payload}`).digest('hex')).toBe(v1);
  });

  it('the verification the webhook route uses accepts it at its own time and refuses it now (stale)', async () => {
    const header = `t=1700000000,v1=${v1}`;
    expect(sdk.webhooks.constructEvent(payload, header, 'whsec_test_secret', 300, undefined, (1700000000 + 299) * 1000).id).toBe('evt_test_webhook');
    expect(() => sdk.webhooks.constructEvent(payload, header, 'whsec_test_secret', 300, undefined, (1700000000 + 301) * 1000)).toThrow();
    const res = await deliver(payload, header); // and our route, with our secret and the wall clock
    expect(res.status).toBe(400);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(await em().count(PaymentWebhookEvent, { id: 'evt_test_webhook' })).toBe(0);
  });
});

describe('checkout', () => {
  it('asks the provider for the approved deposit, whatever the client sends, and stores an open payment', async () => {
    const q = await approvedQuote();
    const res = await checkout(q.token, { amountMinor: 1, currency: 'usd' });
    expect(res.status).toBe(201);
    expect(res.body.depositMinor).toBe(GARDEN_DEPOSIT_MINOR);
    expect(res.body.url).toMatch(new RegExp(`^${rig.fake.url}/pay/cs_test_`));
    const row = await stateOf(res.body.paymentId);
    expect(row).toMatchObject({ state: 'open', amountMinor: GARDEN_DEPOSIT_MINOR, currency: 'GBP', refundedMinor: 0 });
    const session = await rig.stripe.checkout.sessions.retrieve(row.checkoutSessionId);
    expect(session.amount_total).toBe(GARDEN_DEPOSIT_MINOR);
    expect(session.currency).toBe('gbp');
    expect(session.client_reference_id).toBe(row.id);
    expect(session.metadata).toEqual({
      organizationId: t.firmA.firm.id,
      quoteId: q.quote.id,
      approvalId: q.approval!.id,
      paymentId: row.id,
    });
    expect(session.success_url).toBe(`http://gloaming.test/portal/q/${q.token}/deposit/return?session_id={CHECKOUT_SESSION_ID}`);
    expect(session.cancel_url).toBe(`http://gloaming.test/portal/q/${q.token}`);
    expect(session.customer_email).toBe(q.email);

    const state = await request(rig.api.app).get(portal(q.token));
    expect(state.status).toBe(200);
    expect(state.body.deposit).toMatchObject({ depositMinor: GARDEN_DEPOSIT_MINOR, currency: 'GBP', state: 'open', canPay: true });
  });

  it('reuses a still-open session instead of making another', async () => {
    const q = await approvedQuote();
    const first = await checkout(q.token);
    const second = await checkout(q.token);
    expect(second.status).toBe(201);
    expect(second.body.url).toBe(first.body.url);
    expect(second.body.paymentId).toBe(first.body.paymentId);
    expect(await em().count(DepositPayment, { quote: q.quote.id })).toBe(1);
  });

  it('refuses a quote that is not approved, and an unknown link', async () => {
    const q = await createApprovedQuote(em(), t.firmA, { approve: false });
    const res = await checkout(q.token);
    expect(res.status).toBe(409);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect((await request(rig.api.app).get(portal(q.token))).status).toBe(409);
    expect((await checkout('x'.repeat(43))).status).toBe(404);
    expect(await em().count(DepositPayment, { quote: q.quote.id })).toBe(0);
  });

  it('a provider that answers 503 is a clear 503 problem with nothing recorded', async () => {
    const q = await approvedQuote();
    rig.fake.setDown(true);
    try {
      const res = await checkout(q.token);
      expect(res.status).toBe(503);
      expect(res.headers['content-type']).toContain('application/problem+json');
      expect(res.body.type).toBe('/problems/payment-provider-unavailable');
      expect(res.body.detail).toContain('nothing was charged or recorded');
    } finally {
      rig.fake.setDown(false);
    }
    expect(await em().count(DepositPayment, { quote: q.quote.id })).toBe(0);
    expect((await checkout(q.token)).status).toBe(201); // and works once it is back
  });

  it('a provider that cannot be reached at all is the same 503 with nothing recorded', async () => {
    const closed = await startPaymentsRig(t, { apiPort: 9 }); // discard port: nothing listens
    try {
      const q = await approvedQuote();
      const res = await request(closed.api.app).post(`${portal(q.token)}/checkout`).send({});
      expect(res.status).toBe(503);
      expect(res.body.type).toBe('/problems/payment-provider-unavailable');
      expect(await em().count(DepositPayment, { quote: q.quote.id })).toBe(0);
    } finally {
      await closed.close();
    }
  });
});

describe('the webhook', () => {
  it('a real payment on the hosted page: paid once, quote deposit-paid, receipt and estimator note', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    expect(await payOnHostedPage(rig.fake, session.id, '4242424242424242')).toBe(303); // test card: succeeds
    await rig.fake.waitForIdle();
    const paid = await stateOf(row.id);
    expect(paid.state).toBe('paid');
    expect(paid.paidAt).toBeInstanceOf(Date);
    expect(paid.paymentIntentId).toMatch(/^pi_test_/);
    expect((await em().findOneOrFail(Quote, q.quote.id)).status).toBe('deposit-paid');
    const events = await eventsOf(q.quote.id, 'deposit-paid');
    expect(events).toHaveLength(1);
    expect(events[0]!.data).toMatchObject({ amountMinor: GARDEN_DEPOSIT_MINOR, currency: 'GBP', paymentId: row.id });
    const receipt = await t.catcher.waitFor((m) => m.to.includes(q.email));
    expect(receipt.subject).toContain('Deposit received');
    expect(receipt.text).toContain('£405.58');
    const note = await t.catcher.waitFor((m) => m.to.includes(t.firmA.users.estimator.email) && m.subject.startsWith('Deposit paid'));
    expect(note.text).toContain(`/quotes/${q.quote.id}`);
    const state = await request(rig.api.app).get(portal(q.token)).query({ session: session.id });
    expect(state.body.deposit).toMatchObject({ state: 'paid', canPay: false });
    expect((await checkout(q.token)).status).toBe(409); // paid: no second checkout
  });

  it('a declined card: failed with the code, a deposit-failed event; the same session then succeeds', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    await payOnHostedPage(rig.fake, session.id, '4000000000000002'); // test card: declined
    await rig.fake.waitForIdle();
    const failed = await stateOf(row.id);
    expect(failed.state).toBe('failed');
    expect(failed.failureCode).toBe('generic_decline');
    expect(await eventsOf(q.quote.id, 'deposit-failed')).toHaveLength(1);
    expect((await em().findOneOrFail(Quote, q.quote.id)).status).toBe('approved');
    const state = await request(rig.api.app).get(portal(q.token));
    expect(state.body.deposit).toMatchObject({ state: 'failed', failureCode: 'generic_decline', canPay: true });
    expect(state.body.deposit.failureMessage).toContain('declined');

    const retry = await checkout(q.token);
    expect(retry.body.paymentId).toBe(row.id); // the open session is offered again
    await payOnHostedPage(rig.fake, session.id, '4242424242424242');
    await rig.fake.waitForIdle();
    expect((await stateOf(row.id)).state).toBe('paid');
  });

  it('insufficient funds is stored with its own code', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    await payOnHostedPage(rig.fake, session.id, '4000000000009995'); // test card: insufficient funds
    await rig.fake.waitForIdle();
    expect(await stateOf(row.id)).toMatchObject({ state: 'failed', failureCode: 'insufficient_funds' });
  });

  it('refuses a tampered body, a wrong secret, a stale timestamp and a missing signature, recording nothing', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    const id = `evt_test_${randomUUID().replaceAll('-', '')}`;
    const payload = eventJson('checkout.session.completed', completed(session), id);
    const tampered = payload.replace(`"amount_total":${GARDEN_DEPOSIT_MINOR}`, '"amount_total":1');
    expect(tampered).not.toBe(payload);
    const cases = [
      await deliver(tampered, sign(payload)),
      await deliver(payload, sign(payload, 'whsec_someone_else')),
      await deliver(payload, sign(payload, WEBHOOK_SECRET, nowS() - 301)), // tolerance 300 s (provider's documented default)
      await request(rig.api.app).post('/api/payments/webhook').set('content-type', 'application/json').send(payload),
    ];
    for (const res of cases) {
      expect(res.status).toBe(400);
      expect(res.body.type).toBe('/problems/invalid-signature');
    }
    expect(await em().count(PaymentWebhookEvent, { id })).toBe(0);
    expect((await stateOf(row.id)).state).toBe('open');
    // within the tolerance it is accepted
    expect((await deliver(payload, sign(payload, WEBHOOK_SECRET, nowS() - 200))).status).toBe(200);
    expect((await stateOf(row.id)).state).toBe('paid');
  });

  it('is exempt from the Origin check, and only that route is', async () => {
    const q = await approvedQuote();
    const { session } = await openCheckout(q.token);
    const payload = eventJson('checkout.session.completed', completed(session));
    const res = await request(rig.api.app)
      .post('/api/payments/webhook')
      .set('origin', 'https://elsewhere.example')
      .set('content-type', 'application/json')
      .set('stripe-signature', sign(payload))
      .send(payload);
    expect(res.status).toBe(200);
    const other = await request(rig.api.app).post(`${portal(q.token)}/checkout`).set('origin', 'https://elsewhere.example').send({});
    expect(other.status).toBe(403);
  });

  it('the same event delivered 100 times at once records one payment, one event and one receipt', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    const payload = eventJson('checkout.session.completed', completed(session));
    const header = sign(payload);
    const results = await Promise.all(Array.from({ length: 100 }, () => deliver(payload, header)));
    expect(results.map((r) => r.status)).toEqual(Array(100).fill(200));
    expect(results.filter((r) => r.body.outcome === 'recorded')).toHaveLength(1);
    expect((await stateOf(row.id)).state).toBe('paid');
    expect(await eventsOf(q.quote.id, 'deposit-paid')).toHaveLength(1);
    expect(await em().count(DepositPayment, { quote: q.quote.id })).toBe(1);
    await t.catcher.waitFor((m) => m.to.includes(q.email));
    await new Promise((r) => setTimeout(r, 300));
    expect(t.catcher.messages().filter((m) => m.to.includes(q.email))).toHaveLength(1);
  });

  it('two different events for the same session (a provider retry with a new id) record one payment', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    const object = completed(session);
    const [a, b] = await Promise.all([deliver(eventJson('checkout.session.completed', object)), deliver(eventJson('checkout.session.completed', object))]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect([a.body.outcome, b.body.outcome].sort()).toEqual(['ignored', 'recorded']);
    expect(await eventsOf(q.quote.id, 'deposit-paid')).toHaveLength(1);
    expect((await stateOf(row.id)).state).toBe('paid');
  });

  it('out of order: a payment_failed arriving after completed does not un-pay', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    const intent = `pi_test_${randomUUID().slice(0, 8)}`;
    expect((await deliver(eventJson('checkout.session.completed', completed(session, { payment_intent: intent })))).body.outcome).toBe('recorded');
    const failure = {
      id: intent,
      object: 'payment_intent',
      amount: GARDEN_DEPOSIT_MINOR,
      currency: 'gbp',
      status: 'requires_payment_method',
      metadata: session.metadata,
      last_payment_error: { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline' },
    };
    const res = await deliver(eventJson('payment_intent.payment_failed', failure));
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe('ignored');
    expect(await stateOf(row.id)).toMatchObject({ state: 'paid', failureCode: null });
    expect(await eventsOf(q.quote.id, 'deposit-failed')).toHaveLength(0);
    const expired = await deliver(eventJson('checkout.session.expired', { ...session, status: 'expired' }));
    expect(expired.body.outcome).toBe('ignored');
    expect((await stateOf(row.id)).state).toBe('paid');
  });

  it('out of order: completed arriving before the checkout row is committed is recorded, once', async () => {
    const q = await approvedQuote();
    const paymentId = randomUUID();
    const metadata = { organizationId: t.firmA.firm.id, quoteId: q.quote.id, approvalId: q.approval!.id, paymentId };
    // the checkout request is mid-way: the provider has made the session, our row is not written yet
    const session = await rig.stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency: 'gbp', unit_amount: GARDEN_DEPOSIT_MINOR, product_data: { name: 'Deposit' } } }],
      client_reference_id: paymentId,
      metadata,
      success_url: 'http://gloaming.test/portal/',
    });
    const res = await deliver(eventJson('checkout.session.completed', completed(session)));
    expect(res.body.outcome).toBe('recorded');
    expect(await stateOf(paymentId)).toMatchObject({ state: 'paid', checkoutSessionId: session.id, amountMinor: GARDEN_DEPOSIT_MINOR });
    // now the checkout request commits its row: the paid one stands, no second row
    const row = await recordOpenSession(em(), { quote: q.quote, revision: q.revision, organization: q.quote.organization }, q.approval!, paymentId, session);
    expect(row.state).toBe('paid');
    expect(await em().count(DepositPayment, { quote: q.quote.id })).toBe(1);
    expect(await eventsOf(q.quote.id, 'deposit-paid')).toHaveLength(1);
  });

  it('a wrong amount or a wrong currency is recorded as ignored and the quote is not marked paid', async () => {
    for (const overrides of [{ amount_total: GARDEN_DEPOSIT_MINOR - 1 }, { currency: 'eur' }]) {
      const q = await approvedQuote();
      const { row, session } = await openCheckout(q.token);
      const id = `evt_test_${randomUUID().replaceAll('-', '')}`;
      const res = await deliver(eventJson('checkout.session.completed', completed(session, overrides), id));
      expect(res.status).toBe(200);
      expect(res.body.outcome).toBe('ignored');
      const logged = await em().findOneOrFail(PaymentWebhookEvent, id);
      expect(logged.outcome).toMatch(/^ignored: amount mismatch/);
      expect((await stateOf(row.id)).state).toBe('open');
      expect((await em().findOneOrFail(Quote, q.quote.id)).status).toBe('approved');
      expect(await eventsOf(q.quote.id, 'deposit-paid')).toHaveLength(0);
    }
  });

  it("another firm's session never pays this firm's deposit", async () => {
    const a = await approvedQuote('A');
    const b = await approvedQuote('B');
    const { row, session } = await openCheckout(a.token);
    // firm A's session, claiming to be firm B's
    const claimB = { ...session.metadata, organizationId: t.firmB.firm.id };
    const res = await deliver(eventJson('checkout.session.completed', completed(session, { metadata: claimB })));
    expect(res.body.outcome).toBe('ignored');
    expect((await stateOf(row.id)).state).toBe('open');
    // a session nobody stored whose metadata mixes firm B's id with firm A's approval
    const mixed = {
      ...completed(session),
      id: `cs_test_${randomUUID().replaceAll('-', '')}`,
      metadata: { organizationId: t.firmB.firm.id, quoteId: a.quote.id, approvalId: a.approval!.id, paymentId: randomUUID() },
    };
    const id = `evt_test_${randomUUID().replaceAll('-', '')}`;
    expect((await deliver(eventJson('checkout.session.completed', mixed, id))).body.outcome).toBe('unknown');
    expect(await em().count(PaymentWebhookEvent, { id })).toBe(0);
    expect(await em().count(DepositPayment, { quote: { $in: [a.quote.id, b.quote.id] } })).toBe(1);
    expect((await em().findOneOrFail(Quote, b.quote.id)).status).toBe('approved');
  });

  it('an unknown session is acknowledged with 200 and nothing is recorded', async () => {
    const id = `evt_test_${randomUUID().replaceAll('-', '')}`;
    const session = { id: 'cs_test_nobody', object: 'checkout.session', amount_total: 500, currency: 'gbp', payment_status: 'paid', status: 'complete', metadata: {} };
    const res = await deliver(eventJson('checkout.session.completed', session, id));
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe('unknown');
    expect(await em().count(PaymentWebhookEvent, { id })).toBe(0);
    expect(await em().count(DepositPayment, { checkoutSessionId: 'cs_test_nobody' })).toBe(0);
  });

  it('an expired session becomes expired, and a new checkout makes a new session', async () => {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    await rig.stripe.checkout.sessions.expire(session.id);
    await rig.fake.waitForIdle();
    expect((await stateOf(row.id)).state).toBe('expired');
    const again = await checkout(q.token);
    expect(again.status).toBe(201);
    expect(again.body.paymentId).not.toBe(row.id);
  });
});

describe('refunds', () => {
  async function paidDeposit() {
    const q = await approvedQuote();
    const { row, session } = await openCheckout(q.token);
    await payOnHostedPage(rig.fake, session.id, '4242424242424242');
    await rig.fake.waitForIdle();
    expect((await stateOf(row.id)).state).toBe('paid');
    return { ...q, paymentId: row.id };
  }
  /** The refunds the provider made for a payment intent (from its refund.created events). */
  async function providerRefunds(intentId: string) {
    const events = await rig.stripe.events.list({ type: 'refund.created', limit: 100 });
    return events.data.map((e) => e.data.object as Stripe.Refund).filter((r) => r.payment_intent === intentId);
  }
  const refundUrl = (quoteId: string, paymentId: string) => `/api/quotes/${quoteId}/deposits/${paymentId}/refund`;

  it('the owner refunds in full through the provider; the quote shows it; the provider webhook adds nothing', async () => {
    const p = await paidDeposit();
    const owner = await signIn('owner');
    const res = await owner.post(refundUrl(p.quote.id, p.paymentId)).send({});
    expect(res.status).toBe(201);
    expect(res.body.refundedNowMinor).toBe(GARDEN_DEPOSIT_MINOR);
    expect(res.body.payment).toMatchObject({ state: 'refunded', refundedMinor: GARDEN_DEPOSIT_MINOR, refundableMinor: 0 });
    const row = await stateOf(p.paymentId);
    expect((await providerRefunds(row.paymentIntentId!)).map((r) => r.amount)).toEqual([GARDEN_DEPOSIT_MINOR]);
    await rig.fake.waitForIdle(); // charge.refunded comes back: already recorded
    const events = await eventsOf(p.quote.id, 'refunded');
    expect(events).toHaveLength(1);
    expect(events[0]!.data).toMatchObject({ amountMinor: GARDEN_DEPOSIT_MINOR, currency: 'GBP' });
    const list = await owner.get(`/api/quotes/${p.quote.id}/deposits`);
    expect(list.status).toBe(200);
    expect(list.body).toMatchObject({ paidMinor: GARDEN_DEPOSIT_MINOR, refundedMinor: GARDEN_DEPOSIT_MINOR });
    expect(list.body.payments[0]).toMatchObject({ id: p.paymentId, state: 'refunded' });
    expect((await owner.post(refundUrl(p.quote.id, p.paymentId)).send({})).status).toBe(409); // nothing left
  });

  it('partial refunds add up; an over-refund is refused with the field named', async () => {
    const p = await paidDeposit();
    const owner = await signIn('owner');
    const part = await owner.post(refundUrl(p.quote.id, p.paymentId)).send({ amountMinor: 10000 });
    expect(part.status).toBe(201);
    expect(part.body.payment).toMatchObject({ state: 'partly-refunded', refundedMinor: 10000, refundableMinor: GARDEN_DEPOSIT_MINOR - 10000 });
    const over = await owner.post(refundUrl(p.quote.id, p.paymentId)).send({ amountMinor: GARDEN_DEPOSIT_MINOR - 10000 + 1 });
    expect(over.status).toBe(400);
    expect(over.body.errors).toEqual([expect.objectContaining({ path: 'body.amountMinor' })]);
    const rest = await owner.post(refundUrl(p.quote.id, p.paymentId)).send({});
    expect(rest.body.refundedNowMinor).toBe(GARDEN_DEPOSIT_MINOR - 10000);
    expect(rest.body.payment.state).toBe('refunded');
    await rig.fake.waitForIdle();
    expect((await stateOf(p.paymentId)).refundedMinor).toBe(GARDEN_DEPOSIT_MINOR);
    expect(await eventsOf(p.quote.id, 'refunded')).toHaveLength(2);
    const bad = await owner.post(refundUrl(p.quote.id, p.paymentId)).send({ amountMinor: 0 });
    expect(bad.status).toBe(400);
  });

  it('two refunds submitted at once make exactly one refund', async () => {
    const p = await paidDeposit();
    const owner = await signIn('owner');
    const [a, b] = await Promise.all([
      owner.post(refundUrl(p.quote.id, p.paymentId)).send({}),
      owner.post(refundUrl(p.quote.id, p.paymentId)).send({}),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const row = await stateOf(p.paymentId);
    expect(row.refundedMinor).toBe(GARDEN_DEPOSIT_MINOR);
    expect(await providerRefunds(row.paymentIntentId!)).toHaveLength(1);
    await rig.fake.waitForIdle();
    expect(await eventsOf(p.quote.id, 'refunded')).toHaveLength(1);
  });

  it('a provider that is down gives the claim back: 503 and nothing refunded', async () => {
    const p = await paidDeposit();
    const owner = await signIn('owner');
    rig.fake.setDown(true);
    let res;
    try {
      res = await owner.post(refundUrl(p.quote.id, p.paymentId)).send({});
    } finally {
      rig.fake.setDown(false);
    }
    expect(res.status).toBe(503);
    expect(await stateOf(p.paymentId)).toMatchObject({ state: 'paid', refundedMinor: 0 });
    expect(await eventsOf(p.quote.id, 'refunded')).toHaveLength(0);
    expect((await owner.post(refundUrl(p.quote.id, p.paymentId)).send({})).status).toBe(201);
  });

  it('an estimator sees the payments but cannot refund; another firm gets 404', async () => {
    const p = await paidDeposit();
    const estimator = await signIn('estimator');
    expect((await estimator.get(`/api/quotes/${p.quote.id}/deposits`)).status).toBe(200);
    expect((await estimator.post(refundUrl(p.quote.id, p.paymentId)).send({})).status).toBe(403);
    const ownerB = await signIn('owner', 'B');
    expect((await ownerB.get(`/api/quotes/${p.quote.id}/deposits`)).status).toBe(404);
    expect((await ownerB.post(refundUrl(p.quote.id, p.paymentId)).send({})).status).toBe(404);
    expect((await stateOf(p.paymentId)).refundedMinor).toBe(0);
  });
});
