import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { startPaymentFake, type PaymentFake } from '@gloaming/fakes';
import { DepositPayment, PortalToken, Quote, QuoteApproval, QuoteRevision, newSecretToken, type EntityManager } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import { createApp, type GloamingApp } from '../src/app';
import { hashToken } from '../src/auth/tokens';
import type { AppConfig } from '../src/config/env';
import { createSmtpMailer, type MailTransport } from '../src/mail/mailer';
import {
  appendQuoteEvent,
  markRevisionSent,
  priceRevision,
  revisionContent,
  revisionSettings,
  storedTotals,
} from '../src/modules/quotes/service';
import { createGardenQuote } from './estimate-fixture';
import type { TestServer } from './harness';

export const SECRET_KEY = 'sk_test_gloaming_deposits';
export const WEBHOOK_SECRET = 'whsec_gloaming_deposits_test';

/**
 * The garden estimate's deposit: 30 % of £1,351.92 = £405.576, half-up £405.58 (worked by
 * hand in estimate-fixture.ts).
 */
export const GARDEN_DEPOSIT_MINOR = 40558;

export interface PaymentsRig {
  fake: PaymentFake;
  /** An SDK client on the fake, as a test's own view of the provider. */
  stripe: Stripe;
  /** The api on a real port (the fake delivers webhooks to it). */
  api: GloamingApp & { url: string; config: AppConfig };
  close(): Promise<void>;
}

/**
 * The api wired to the local payment fake through config.payments, listening on loopback so
 * the fake can deliver its signed webhooks. Shares the test server's database and catcher.
 */
export async function startPaymentsRig(t: TestServer, opts: { apiPort?: number } = {}): Promise<PaymentsRig> {
  const fake = await startPaymentFake({ secretKey: SECRET_KEY, webhookSecret: WEBHOOK_SECRET, retryDelaysMs: [50, 100, 200], log: () => {} });
  const config: AppConfig = {
    ...t.config,
    payments: {
      secretKey: SECRET_KEY,
      webhookSecret: WEBHOOK_SECRET,
      api: { host: '127.0.0.1', port: opts.apiPort ?? fake.port, protocol: 'http' },
    },
  };
  const mailer: MailTransport = createSmtpMailer(config.mail);
  const built = createApp({ orm: t.orm, config, mailer, logger: { info: () => {}, error: () => {} } });
  const server: Server = createServer(built.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.setWebhookUrl(`${url}/api/payments/webhook`);
  const stripe = new Stripe(SECRET_KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
  return {
    fake,
    stripe,
    api: { ...built, url, config },
    async close() {
      await fake.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await built.outbox.idle();
      mailer.close();
    },
  };
}

let n = 0;

/**
 * A garden quote sent to the homeowner (with a live portal link) and approved by them: the
 * approval row as the portal's approval step stores it, totals from the engine.
 */
export async function createApprovedQuote(em: EntityManager, firm: FirmFixture, opts: { approve?: boolean } = {}) {
  const email = `deposit-${++n}-${Date.now()}@home.example`;
  const g = await createGardenQuote(em, firm, { email });
  const quote = await em.findOneOrFail(Quote, g.quote.id, { populate: ['organization'] });
  const revision = await em.findOneOrFail(QuoteRevision, g.revision.id);
  await markRevisionSent(em, quote, revision, { id: firm.users.estimator.id });
  const token = newSecretToken();
  em.create(PortalToken, {
    organization: quote.organization,
    revision,
    tokenHash: hashToken(token),
    sentTo: email,
    expiresAt: quote.validUntil!,
    revokedAt: null,
  });
  await em.flush();
  let approval: QuoteApproval | null = null;
  if (opts.approve !== false) {
    const settings = revisionSettings(revision);
    const totals = priceRevision(revisionContent(revision), settings);
    approval = em.create(QuoteApproval, {
      organization: quote.organization,
      quote,
      revision,
      selection: {},
      totals: storedTotals(totals),
      totalMinor: totals.totalMinor,
      depositMinor: totals.deposit?.depositMinor ?? 0,
      currency: settings.currency,
      signedName: 'Marguerite Okonedo-Vale',
      termsAccepted: true,
      ipAddress: '127.0.0.1',
      userAgent: 'deposit test',
      contentHash: revision.contentHash!,
    });
    appendQuoteEvent(em, quote, 'approved', null, {}, revision);
    await em.flush();
  }
  return { quote, revision, approval, token, email };
}

/** Pay on the fake's hosted page the way a browser posts its form. Resolves with the status. */
export async function payOnHostedPage(fake: PaymentFake, sessionId: string, cardNumber: string): Promise<number> {
  const body = new URLSearchParams({ card_number: cardNumber, expiry: '12/40', cvc: '123', name: 'M Okonedo-Vale' });
  const res = await fetch(`${fake.url}/pay/${encodeURIComponent(sessionId)}`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body,
    redirect: 'manual',
  });
  await res.arrayBuffer();
  return res.status;
}

/** An approval and an open payment row on an existing quote (ids for the route matrix). */
export async function createDepositPaymentFixture(em: EntityManager, firm: FirmFixture, quoteId: string): Promise<string> {
  const quote = await em.findOneOrFail(Quote, { id: quoteId, organization: firm.firm.id });
  const revision = await em.findOneOrFail(QuoteRevision, { quote: quote.id }, { orderBy: { number: 'desc' } });
  const approval = em.create(QuoteApproval, {
    organization: firm.firm,
    quote,
    revision,
    selection: {},
    totals: {},
    totalMinor: 10000,
    depositMinor: 3000,
    currency: 'GBP',
    signedName: 'Route Matrix',
    termsAccepted: true,
    ipAddress: '127.0.0.1',
    contentHash: 'none',
  });
  const payment = em.create(DepositPayment, {
    organization: firm.firm,
    quote,
    approval,
    checkoutSessionId: `cs_test_matrix_${quote.id}`,
    paymentIntentId: null,
    amountMinor: 3000,
    currency: 'GBP',
    state: 'open',
    failureCode: null,
    paidAt: null,
  });
  await em.flush();
  return payment.id;
}
