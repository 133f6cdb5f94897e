import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { signatureHeader, startPaymentFake, type PaymentFake } from '../src';

const SECRET_KEY = 'sk_test_gloaming_fake_tests';
const WEBHOOK_SECRET = 'whsec_gloaming_fake_tests';

interface Received {
  headers: IncomingHttpHeaders;
  body: string;
}

/** A webhook receiver that answers `failFirst` requests with 500, then 200. */
async function startReceiver(failFirst = 0): Promise<{ url: string; received: Received[]; close: () => Promise<void> }> {
  const received: Received[] = [];
  let calls = 0;
  const server: Server = createServer((req, res) => {
    let body = '';
    req.on('data', (c: Buffer) => (body += c.toString('utf8')));
    req.on('end', () => {
      calls++;
      if (calls <= failFirst) {
        res.writeHead(500).end('not yet');
        return;
      }
      received.push({ headers: req.headers, body });
      res.writeHead(200).end('ok');
    });
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}/api/payments/webhook`,
    received,
    close: () =>
      new Promise<void>((r) => {
        server.closeAllConnections();
        server.close(() => r());
      }),
  };
}

let fake: PaymentFake;
let stripe: Stripe;
let receiver: Awaited<ReturnType<typeof startReceiver>> | undefined;
let clock = Date.now();

async function boot(options: { failFirst?: number; retryDelaysMs?: number[] } = {}) {
  receiver = await startReceiver(options.failFirst);
  fake = await startPaymentFake({
    secretKey: SECRET_KEY,
    webhookSecret: WEBHOOK_SECRET,
    webhookUrl: receiver.url,
    retryDelaysMs: options.retryDelaysMs ?? [20, 40, 80],
    now: () => clock,
    log: () => {},
  });
  stripe = new Stripe(SECRET_KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
}

beforeEach(() => {
  clock = Date.now();
});
afterEach(async () => {
  await fake?.close();
  await receiver?.close();
  receiver = undefined;
});

const depositSession = (extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) =>
  stripe.checkout.sessions.create({
    mode: 'payment',
    line_items: [
      {
        price_data: { currency: 'gbp', unit_amount: 45_000, product_data: { name: 'Deposit for garden lighting, Q-1042' } },
        quantity: 1,
      },
    ],
    success_url: 'http://127.0.0.1:9/portal/paid?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:9/portal/quote',
    client_reference_id: 'quote_1042',
    customer_email: 'hazel.marsh@example.com',
    metadata: { quote_id: 'quote_1042', payee_name: 'Lantern & Leaf Lighting' },
    payment_intent_data: { metadata: { quote_id: 'quote_1042' } },
    ...extra,
  });

/** Pays on the hosted page with a plain form POST, as a browser would. */
async function payOnPage(session: Stripe.Checkout.Session, card: string, expiry = '12/40') {
  const form = new URLSearchParams({ card_number: card, expiry, cvc: '123', name: 'Hazel Marsh' });
  return fetch(session.url ?? '', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: form.toString(),
    redirect: 'manual',
  });
}

describe('payment fake: signature', () => {
  it('matches the published vector', () => {
    // REFERENCES.md, payments: payload {"id":"evt_test_webhook","object":"event"}, secret whsec_test_secret, t 1700000000
    expect(signatureHeader('{"id":"evt_test_webhook","object":"event"}', 'whsec_test_secret', 1700000000)).toBe(
      't=1700000000,v1=d95c6b7477fbd7e9f90b1b0ef5f9c7ac25abca5382460e0d988c2b2a5b71b990',
    );
  });

  it('verifies with the official SDK and fails it when the body is altered', () => {
    const payload = JSON.stringify({ id: 'evt_test_1', object: 'event', type: 'checkout.session.completed' }, null, 2);
    const header = signatureHeader(payload, WEBHOOK_SECRET, Math.floor(Date.now() / 1000));
    const sdk = new Stripe(SECRET_KEY);
    expect(sdk.webhooks.constructEvent(payload, header, WEBHOOK_SECRET).id).toBe('evt_test_1');
    expect(() => sdk.webhooks.constructEvent(payload.replace('evt_test_1', 'evt_test_2'), header, WEBHOOK_SECRET)).toThrow();
    // The SDK's own helper signs the same way.
    const t = 1700000000;
    expect(sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp: t })).toBe(
      signatureHeader(payload, WEBHOOK_SECRET, t),
    );
  });
});

describe('payment fake: REST api through the official SDK', () => {
  beforeEach(() => boot());

  it('creates and retrieves a checkout session in the provider shape', async () => {
    const s = await depositSession();
    expect(s.id).toMatch(/^cs_test_/);
    expect(s).toMatchObject({
      object: 'checkout.session',
      mode: 'payment',
      amount_total: 45_000,
      currency: 'gbp',
      status: 'open',
      payment_status: 'unpaid',
      payment_intent: null,
      client_reference_id: 'quote_1042',
      customer_email: 'hazel.marsh@example.com',
      metadata: { quote_id: 'quote_1042', payee_name: 'Lantern & Leaf Lighting' },
      livemode: false,
      cancel_url: 'http://127.0.0.1:9/portal/quote',
    });
    expect(s.url).toBe(`${fake.url}/pay/${s.id}`);
    // default expiry 24 hours after creation (provider docs, from memory)
    expect(s.expires_at - s.created).toBe(24 * 3600);
    const again = await stripe.checkout.sessions.retrieve(s.id);
    expect(again).toEqual(s);
  });

  it('answers provider-shaped errors: missing param, unknown id, bad key', async () => {
    const missing = await stripe.checkout.sessions.create({ mode: 'payment' }).catch((e: unknown) => e);
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(missing).toMatchObject({ statusCode: 400, code: 'parameter_missing', param: 'line_items' });

    const unknown = await stripe.checkout.sessions.retrieve('cs_test_nope').catch((e: unknown) => e);
    expect(unknown).toMatchObject({ statusCode: 404, code: 'resource_missing', type: 'StripeInvalidRequestError' });

    const badKey = new Stripe('sk_test_wrong', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    const denied = await badKey.checkout.sessions.retrieve('cs_test_nope').catch((e: unknown) => e);
    expect(denied).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(denied).toMatchObject({ statusCode: 401 });

    const res = await fetch(`${fake.url}/v1/events`);
    expect(res.status).toBe(401);
    const body = (await res.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');

    const tooLate = await depositSession({ expires_at: Math.floor(clock / 1000) + 25 * 3600 }).catch((e: unknown) => e);
    expect(tooLate).toMatchObject({ statusCode: 400, param: 'expires_at' });
    // REFERENCES.md: GBP minimum charge £0.30 [memory]
    const tooSmall = await stripe.checkout.sessions
      .create({
        mode: 'payment',
        line_items: [{ price_data: { currency: 'gbp', unit_amount: 29, product_data: { name: 'x' } }, quantity: 1 }],
      })
      .catch((e: unknown) => e);
    expect(tooSmall).toMatchObject({ statusCode: 400, code: 'amount_too_small' });
    const atMinimum = await stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ price_data: { currency: 'gbp', unit_amount: 30, product_data: { name: 'x' } }, quantity: 1 }],
    });
    expect(atMinimum.amount_total).toBe(30);
  });

  it('replays a POST with the same idempotency key and refuses the key with other parameters', async () => {
    const params: Stripe.Checkout.SessionCreateParams = {
      mode: 'payment',
      line_items: [{ price_data: { currency: 'gbp', unit_amount: 1200, product_data: { name: 'Deposit' } }, quantity: 2 }],
    };
    const a = await stripe.checkout.sessions.create(params, { idempotencyKey: 'quote-1042-deposit' });
    const b = await stripe.checkout.sessions.create(params, { idempotencyKey: 'quote-1042-deposit' });
    expect(b.id).toBe(a.id);
    expect(b.amount_total).toBe(2400);
    expect(b.lastResponse.headers['idempotent-replayed']).toBe('true');
    const other = await stripe.checkout.sessions
      .create({ ...params, client_reference_id: 'other' }, { idempotencyKey: 'quote-1042-deposit' })
      .catch((e: unknown) => e);
    expect(other).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    const c = await stripe.checkout.sessions.create(params, { idempotencyKey: 'another-key' });
    expect(c.id).not.toBe(a.id);
  });

  it('expires an open session once (checkout.session.expired), and sessions past expires_at expire by themselves', async () => {
    const s = await depositSession();
    const expired = await stripe.checkout.sessions.expire(s.id);
    expect(expired).toMatchObject({ status: 'expired', url: null });
    const twice = await stripe.checkout.sessions.expire(s.id).catch((e: unknown) => e);
    expect(twice).toMatchObject({ statusCode: 400 });

    const later = await depositSession({ expires_at: Math.floor(clock / 1000) + 31 * 60 });
    clock += 30 * 60 * 1000;
    expect((await stripe.checkout.sessions.retrieve(later.id)).status).toBe('open');
    clock += 2 * 60 * 1000;
    expect((await stripe.checkout.sessions.retrieve(later.id)).status).toBe('expired');
    const page = await fetch(later.url ?? '');
    expect(page.status).toBe(410);

    const events = await stripe.events.list({ type: 'checkout.session.expired' });
    expect(events.data.map((e) => (e.data.object as Stripe.Checkout.Session).id)).toEqual([later.id, s.id]);
  });
});

describe('payment fake: hosted page and test cards', () => {
  beforeEach(() => boot());

  it('shows the banner, payee, amount and labelled fields', async () => {
    const s = await depositSession();
    const res = await fetch(s.url ?? '');
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain('Test payment page — no real money moves');
    expect(html).toContain('Pay Lantern &amp; Leaf Lighting');
    expect(html).toContain('£450.00');
    for (const id of ['card-number', 'expiry', 'cvc', 'name']) expect(html).toMatch(new RegExp(`<label for="${id}"`));
    expect(html).toContain('href="http://127.0.0.1:9/portal/quote"');
    expect(html).not.toMatch(/<(script|link)\b/);
  });

  it('4242 4242 4242 4242 pays: session complete and paid, intent succeeded, 303 to success_url', async () => {
    // provider testing docs via REFERENCES.md: 4242 4242 4242 4242 succeeds
    const s = await depositSession();
    const res = await payOnPage(s, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:9/portal/paid?session=${s.id}`);
    const paid = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(paid).toMatchObject({ status: 'complete', payment_status: 'paid', url: null });
    const intent = paid.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({
      object: 'payment_intent',
      status: 'succeeded',
      amount: 45_000,
      amount_received: 45_000,
      currency: 'gbp',
      last_payment_error: null,
      metadata: { quote_id: 'quote_1042' },
    });
    expect(intent.latest_charge).toMatch(/^ch_test_/);
    expect((await stripe.paymentIntents.retrieve(intent.id)).status).toBe('succeeded');
    // paying again is refused: the page says it is complete
    const again = await payOnPage(s, '4242424242424242');
    expect(again.status).toBe(200);
    expect(await again.text()).toContain('Payment complete');
  });

  const declines: [string, string, string, string | undefined, string][] = [
    // provider testing docs via REFERENCES.md: 4000 0000 0000 0002 declined
    ['4000 0000 0000 0002', 'generic decline', 'card_declined', 'generic_decline', 'Your card was declined.'],
    // provider testing docs via REFERENCES.md: 4000 0000 0000 9995 insufficient funds
    ['4000 0000 0000 9995', 'insufficient funds', 'card_declined', 'insufficient_funds', 'Your card has insufficient funds.'],
    // provider testing docs via REFERENCES.md: 4000 0000 0000 0069 expired
    ['4000 0000 0000 0069', 'expired card', 'expired_card', 'expired_card', 'Your card has expired.'],
  ];
  it.each(declines)(
    '%s (%s) is refused, the session stays open, and another card then pays',
    async (card, _label, code, declineCode, message) => {
      const s = await depositSession();
      const res = await payOnPage(s, card);
      expect(res.status).toBe(402);
      const html = await res.text();
      expect(html).toContain(message);
      expect(html).toContain('role="alert"');
      const open = await stripe.checkout.sessions.retrieve(s.id);
      expect(open).toMatchObject({ status: 'open', payment_status: 'unpaid' });
      const intent = await stripe.paymentIntents.retrieve(open.payment_intent as string);
      expect(intent.status).toBe('requires_payment_method');
      expect(intent.last_payment_error).toMatchObject({ type: 'card_error', code, message });
      expect(intent.last_payment_error?.decline_code).toBe(declineCode);
      const failed = await stripe.events.list({ type: 'payment_intent.payment_failed' });
      expect(failed.data).toHaveLength(1);

      const retry = await payOnPage(s, '4242424242424242');
      expect(retry.status).toBe(303);
      const done = await stripe.checkout.sessions.retrieve(s.id);
      expect(done.payment_status).toBe('paid');
      expect(done.payment_intent).toBe(intent.id);
    },
  );

  it('gives field errors for a past expiry, a malformed number and a missing name, without charging', async () => {
    const s = await depositSession();
    const past = await payOnPage(s, '4242424242424242', '01/20');
    expect(past.status).toBe(422);
    expect(await past.text()).toContain('This expiry date is in the past.');
    const malformed = await payOnPage(s, '4242 4242 4242 4241');
    expect(malformed.status).toBe(422);
    const html = await malformed.text();
    expect(html).toContain('This card number is not valid');
    expect(html).toContain('aria-invalid="true"');
    const noName = await fetch(s.url ?? '', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: 'card_number=4242424242424242&expiry=12%2F40&cvc=123&name=',
    });
    expect(noName.status).toBe(422);
    expect((await stripe.checkout.sessions.retrieve(s.id)).payment_intent).toBeNull();
    expect((await fetch(`${fake.url}/pay/cs_test_unknown`)).status).toBe(404);
  });
});

describe('payment fake: refunds and events', () => {
  beforeEach(() => boot());

  async function paidSession() {
    const s = await depositSession();
    await payOnPage(s, '4242424242424242');
    return stripe.checkout.sessions.retrieve(s.id);
  }

  it('refunds in part, then the rest, and refuses more than remains', async () => {
    const s = await paidSession();
    const pi = s.payment_intent as string;
    const part = await stripe.refunds.create({
      payment_intent: pi,
      amount: 10_000,
      reason: 'requested_by_customer',
      metadata: { by: 'owner' },
    });
    expect(part).toMatchObject({
      object: 'refund',
      amount: 10_000,
      currency: 'gbp',
      payment_intent: pi,
      status: 'succeeded',
      reason: 'requested_by_customer',
    });
    const over = await stripe.refunds.create({ payment_intent: pi, amount: 35_001 }).catch((e: unknown) => e);
    expect(over).toMatchObject({ statusCode: 400, code: 'amount_too_large', param: 'amount' });
    const rest = await stripe.refunds.create({ payment_intent: pi });
    expect(rest.amount).toBe(35_000);
    const charge = await stripe.charges.retrieve(rest.charge as string);
    expect(charge).toMatchObject({ amount_refunded: 45_000, refunded: true });
    const again = await stripe.refunds.create({ payment_intent: pi, amount: 1 }).catch((e: unknown) => e);
    expect(again).toMatchObject({ statusCode: 400, code: 'charge_already_refunded' });
    expect((await stripe.refunds.retrieve(part.id)).amount).toBe(10_000);

    const refunded = await stripe.events.list({ type: 'charge.refunded', limit: 1 });
    expect(refunded.has_more).toBe(true);
    const first = refunded.data[0];
    expect(first?.data.object).toMatchObject({ object: 'charge', amount_refunded: 45_000, refunded: true });
    expect(first?.data.previous_attributes).toEqual({ amount_refunded: 10_000, refunded: false });
    expect((await stripe.events.list({ type: 'refund.created' })).data).toHaveLength(2);
  });

  it('refuses a refund of an unpaid intent and of an unknown one', async () => {
    const s = await depositSession();
    await payOnPage(s, '4000000000000002');
    const open = await stripe.checkout.sessions.retrieve(s.id);
    const unpaid = await stripe.refunds.create({ payment_intent: open.payment_intent as string }).catch((e: unknown) => e);
    expect(unpaid).toMatchObject({ statusCode: 400, code: 'payment_intent_unexpected_state' });
    const unknown = await stripe.refunds.create({ payment_intent: 'pi_test_nope' }).catch((e: unknown) => e);
    expect(unknown).toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('lists events newest first with a limit, and retrieves one', async () => {
    await paidSession();
    const all = await stripe.events.list({ limit: 100 });
    expect(all.object).toBe('list');
    expect(all.data.map((e) => e.type)).toEqual([
      'checkout.session.completed',
      'payment_intent.succeeded',
      'charge.succeeded',
      'payment_intent.created',
    ]);
    const two = await stripe.events.list({ limit: 2 });
    expect(two.data.map((e) => e.id)).toEqual(all.data.slice(0, 2).map((e) => e.id));
    expect(two.has_more).toBe(true);
    const next = await stripe.events.list({ limit: 2, starting_after: two.data[1]?.id ?? '' });
    expect(next.data.map((e) => e.id)).toEqual(all.data.slice(2, 4).map((e) => e.id));
    const one = await stripe.events.retrieve(all.data[0]?.id ?? '');
    expect(one.type).toBe('checkout.session.completed');
    expect((one.data.object as Stripe.Checkout.Session).payment_status).toBe('paid');
  });
});

describe('payment fake: webhooks', () => {
  it('delivers every event signed, verifiable with constructEvent, in creation order', async () => {
    await boot();
    const s = await depositSession();
    await payOnPage(s, '4000000000009995');
    await payOnPage(s, '4242424242424242');
    await fake.waitForIdle();
    const sdk = new Stripe(SECRET_KEY);
    const events = receiver!.received.map((r) =>
      sdk.webhooks.constructEvent(r.body, String(r.headers['stripe-signature']), WEBHOOK_SECRET),
    );
    expect(events.map((e) => e.type)).toEqual([
      'payment_intent.created',
      'charge.failed',
      'payment_intent.payment_failed',
      'charge.succeeded',
      'payment_intent.succeeded',
      'checkout.session.completed',
    ]);
    const completed = events[5]!;
    expect(completed.data.object).toMatchObject({ id: s.id, payment_status: 'paid', metadata: { quote_id: 'quote_1042' } });
    // a wrong secret fails verification
    expect(() =>
      sdk.webhooks.constructEvent(
        receiver!.received[0]!.body,
        String(receiver!.received[0]!.headers['stripe-signature']),
        'whsec_other',
      ),
    ).toThrow();
    expect(fake.deliveries().every((d) => d.status === 200 && d.attempt === 1)).toBe(true);
  });

  it('retries a receiver that fails twice, then succeeds', async () => {
    await boot({ failFirst: 2 });
    const s = await depositSession();
    await stripe.checkout.sessions.expire(s.id);
    await fake.waitForIdle();
    const log = fake.deliveries();
    expect(log.map((d) => [d.type, d.attempt, d.status])).toEqual([
      ['checkout.session.expired', 1, 500],
      ['checkout.session.expired', 2, 500],
      ['checkout.session.expired', 3, 200],
    ]);
    expect(receiver!.received).toHaveLength(1);
  });

  it('gives up after the last delay when the receiver is unreachable', async () => {
    await boot({ retryDelaysMs: [5, 5] });
    await receiver!.close();
    const s = await depositSession();
    await stripe.checkout.sessions.expire(s.id);
    await fake.waitForIdle();
    const log = fake.deliveries();
    expect(log).toHaveLength(3);
    expect(log.every((d) => typeof d.error === 'string')).toBe(true);
    expect(log.map((d) => d.gaveUp)).toEqual([false, false, true]);
    receiver = undefined;
  });
});

describe('payment fake: down', () => {
  it('answers 503 to every REST call while down, and recovers', async () => {
    await boot();
    fake.setDown(true);
    const err = await depositSession().catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeAPIError);
    expect(err).toMatchObject({ statusCode: 503 });
    fake.setDown(false);
    expect((await depositSession()).status).toBe('open');
  });
});
