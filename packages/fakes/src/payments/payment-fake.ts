import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import { ApiError } from './api-error';
import { checkoutPageRoutes } from './checkout-page';
import { restRoutes } from './rest-routes';
import { PaymentStore } from './store';
import { WebhookDelivery, type DeliveryLogEntry } from './webhook-delivery';

export type { DeliveryLogEntry } from './webhook-delivery';

export interface PaymentFakeOptions {
  /** Default 127.0.0.1. */
  host?: string;
  /** Default 0 (any free port). */
  port?: number;
  /** The one secret key the REST api accepts (Bearer). */
  secretKey: string;
  /** The webhook endpoint secret (`whsec_...`) events are signed with. */
  webhookSecret: string;
  /** Where events are POSTed; none (the default) means events are kept but not sent. */
  webhookUrl?: string;
  /** Waits between delivery attempts; default 1, 2, 4, 8, 16 s (six attempts, then give up). */
  retryDelaysMs?: number[];
  /** Clock in ms (tests move it to pass expires_at); default Date.now. Webhook signatures always use the wall clock. */
  now?: () => number;
  /** Where a given-up delivery is reported; default console.warn. */
  log?: (line: string) => void;
}

export interface PaymentFake {
  port: number;
  /** Base URL, e.g. http://127.0.0.1:3026 (REST under /v1, hosted page under /pay/). */
  url: string;
  setWebhookUrl(url: string): void;
  /** While down every REST call (/v1) answers 503 api_error; the hosted page and webhooks carry on. */
  setDown(down: boolean): void;
  deliveries(): readonly DeliveryLogEntry[];
  /** Resolves when every queued webhook delivery has succeeded or been given up. */
  waitForIdle(): Promise<void>;
  close(): Promise<void>;
}

export const DEFAULT_RETRY_DELAYS_MS: readonly number[] = [1000, 2000, 4000, 8000, 16000];

/**
 * A local stand-in for the hosted payment provider, on loopback: what Gloaming uses of its REST
 * api (checkout sessions, payment intents, charges, refunds, events) with the provider's object
 * shapes, a hosted test payment page, and signed webhook delivery with retries. The official
 * SDK talks to it with `new Stripe(key, { host, port, protocol: 'http' })`.
 */
export async function startPaymentFake(options: PaymentFakeOptions): Promise<PaymentFake> {
  const host = options.host ?? '127.0.0.1';
  const now = options.now ?? Date.now;
  let webhookUrl = options.webhookUrl;
  let down = false;
  let base = '';

  const delivery = new WebhookDelivery({
    secret: options.webhookSecret,
    retryDelaysMs: options.retryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS,
    url: () => webhookUrl,
    log: options.log ?? ((line) => console.warn(line)),
  });
  const store = new PaymentStore({
    now,
    hostedPageUrl: (id) => `${base}/pay/${id}`,
    onEvent: (event, key) => delivery.enqueue(event, key),
    pendingWebhooks: () => (webhookUrl ? 1 : 0),
  });

  const app = express();
  app.disable('x-powered-by');
  app.use('/v1', restRoutes({ store, secretKey: options.secretKey, isDown: () => down }));
  app.use(checkoutPageRoutes({ store, now }));
  app.get('/', (_req, res) => {
    res.type('text').send('Gloaming local payment fake: REST api under /v1, hosted test payment page under /pay/<session id>.\n');
  });
  app.use((_req, res) => {
    res.status(404).type('text').send('Not found');
  });
  // Body-parser failures (oversized or undecodable bodies) answer in the provider's error shape.
  app.use((err: unknown, _req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) return next(err);
    const status = typeof err === 'object' && err && 'status' in err && typeof err.status === 'number' ? err.status : 500;
    const message = err instanceof Error ? err.message : 'Unexpected error';
    const body = new ApiError(status, status < 500 ? 'invalid_request_error' : 'api_error', message).toBody();
    res.status(status).type('application/json').send(JSON.stringify(body));
  });

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(options.port ?? 0, host, () => resolve(s));
    s.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  base = `http://${host.includes(':') ? `[${host}]` : host}:${port}`;
  const sweeper = setInterval(() => store.sweepExpired(), 1000);
  sweeper.unref();

  return {
    port,
    url: base,
    setWebhookUrl: (url) => {
      webhookUrl = url;
    },
    setDown: (value) => {
      down = value;
    },
    deliveries: () => delivery.entries(),
    waitForIdle: () => delivery.idle(),
    close: async () => {
      clearInterval(sweeper);
      delivery.close();
      await delivery.idle();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
