import Stripe from 'stripe';
import type { AppConfig } from '../../config/env';
import { HttpError } from '../../http/problem';

/** The one payment-provider client the api uses: the official SDK. */
export type PaymentClient = Stripe;

/** Webhook timestamps older than this are refused (the provider's documented default, 300 s). */
export const WEBHOOK_TOLERANCE_SECONDS = 300;

/**
 * The SDK client made from config.payments. With `api` set (development, tests, the demo) it
 * talks to that host, port and protocol (the local fake); without it, to the hosted service.
 * The same calls either way: there is no second code path for the fake.
 */
export function createPaymentClient(payments: AppConfig['payments']): PaymentClient {
  return new Stripe(payments.secretKey, {
    ...(payments.api ? { host: payments.api.host, port: payments.api.port, protocol: payments.api.protocol } : {}),
    maxNetworkRetries: 1,
    timeout: 15_000,
    telemetry: false,
  });
}

/** The provider could not be reached or answered with its own fault: tell the homeowner plainly. */
export const providerUnavailable = () =>
  new HttpError(
    503,
    'payment-provider-unavailable',
    'Card payments are unavailable',
    'We could not reach the card payment service just now, so nothing was charged or recorded. Please try again in a few minutes.',
    { retryAfterSeconds: 30 },
  );

export function isProviderError(err: unknown): err is Stripe.errors.StripeError {
  return err instanceof Stripe.errors.StripeError;
}

/** Run a provider call; any SDK error (network, auth, 5xx, a refused request) becomes a 503 after logging. */
export async function callProvider<T>(what: string, log: (msg: string, err?: unknown) => void, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    if (!isProviderError(err)) throw err;
    log(`payment provider: ${what} failed (${err.type}${err.code ? `, ${err.code}` : ''}): ${err.message}`);
    throw providerUnavailable();
  }
}
