import express, { type Request, type Response, type Router } from 'express';
import { ApiError, invalidParam } from './api-error';
import { canonical, parseParams, rejectUnknown, stringList, type Params } from './form-params';
import { newId, type ProviderObject } from './objects';
import type { PaymentStore, RequestContext } from './store';

export interface RestOptions {
  store: PaymentStore;
  secretKey: string;
  isDown: () => boolean;
}

interface Saved {
  method: string;
  path: string;
  params: string;
  status: number;
  body: unknown;
}

/** Fields each object lets `expand[]` replace by the object it names (the ones we keep). */
const EXPANDABLE: Readonly<Record<string, readonly string[]>> = {
  'checkout.session': ['payment_intent'],
  payment_intent: ['latest_charge'],
  charge: ['payment_intent'],
  refund: ['charge', 'payment_intent'],
};

type Handler = (params: Params, ctx: RequestContext, id: string) => { status?: number; body: unknown };

/**
 * The REST api under /v1: Bearer secret key, form-encoded parameters, provider-shaped errors,
 * Idempotency-Key on POST (same key and parameters replay the saved answer with
 * `Idempotent-Replayed: true`; the same key with other parameters is an idempotency_error).
 */
export function restRoutes({ store, secretKey, isDown }: RestOptions): Router {
  const router = express.Router();
  const saved = new Map<string, Saved>();

  const expand = (object: ProviderObject, paths: readonly string[]): unknown => {
    const out = structuredClone(object) as unknown as Record<string, unknown>;
    for (const path of paths) {
      const [head = '', ...rest] = path.split('.');
      if (!EXPANDABLE[object.object]?.includes(head)) {
        throw invalidParam('expand', `This property cannot be expanded (${path}).`, 'parameter_invalid_string');
      }
      const value = out[head];
      const target = typeof value === 'string' ? store.byId(value) : (value as ProviderObject | null);
      if (target) out[head] = rest.length ? expand(target, [rest.join('.')]) : structuredClone(target);
    }
    return out;
  };
  const answer = (object: ProviderObject, params: Params) => ({ body: expand(object, stringList(params, 'expand')) });
  const onlyExpand = (params: Params) => rejectUnknown(params, ['expand']);

  const routes: { method: 'GET' | 'POST'; pattern: RegExp; handler: Handler }[] = [
    { method: 'POST', pattern: /^\/checkout\/sessions$/, handler: (p, ctx) => answer(store.createCheckoutSession(p, ctx), p) },
    {
      method: 'GET',
      pattern: /^\/checkout\/sessions\/([^/]+)$/,
      handler: (p, _c, id) => (onlyExpand(p), answer(store.sessionRecord(id).session, p)),
    },
    {
      method: 'POST',
      pattern: /^\/checkout\/sessions\/([^/]+)\/expire$/,
      handler: (p, ctx, id) => (onlyExpand(p), answer(store.expireSession(id, ctx), p)),
    },
    {
      method: 'GET',
      pattern: /^\/payment_intents\/([^/]+)$/,
      handler: (p, _c, id) => (onlyExpand(p), answer(store.paymentIntent(id), p)),
    },
    { method: 'GET', pattern: /^\/charges\/([^/]+)$/, handler: (p, _c, id) => (onlyExpand(p), answer(store.charge(id), p)) },
    { method: 'POST', pattern: /^\/refunds$/, handler: (p, ctx) => answer(store.createRefund(p, ctx), p) },
    { method: 'GET', pattern: /^\/refunds\/([^/]+)$/, handler: (p, _c, id) => (onlyExpand(p), answer(store.refund(id), p)) },
    { method: 'GET', pattern: /^\/events\/([^/]+)$/, handler: (p, _c, id) => (onlyExpand(p), { body: store.event(id) }) },
    { method: 'GET', pattern: /^\/events$/, handler: (p) => ({ body: store.listEvents(p) }) },
  ];

  router.use(express.text({ type: () => true, limit: '1mb' }));
  router.use((req: Request, res: Response) => {
    const requestId = newId('req', 14);
    res.setHeader('request-id', requestId);
    const version = req.get('stripe-version');
    if (version) res.setHeader('stripe-version', version);
    const send = (status: number, body: unknown) =>
      res
        .status(status)
        .type('application/json')
        .send(JSON.stringify(body, null, 2));
    const fail = (err: ApiError) => send(err.status, err.toBody());
    if (isDown()) {
      fail(new ApiError(503, 'api_error', 'The local payment fake is set to be unavailable (setDown(true)).'));
      return;
    }
    const auth = req.get('authorization') ?? '';
    const bearer = /^Bearer\s+(\S+)$/i.exec(auth)?.[1];
    const basic = /^Basic\s+(\S+)$/i.exec(auth)?.[1];
    const key = bearer ?? (basic ? Buffer.from(basic, 'base64').toString('utf8').split(':')[0] : undefined);
    if (!key) {
      fail(
        new ApiError(
          401,
          'invalid_request_error',
          "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
        ),
      );
      return;
    }
    if (key !== secretKey) {
      fail(
        new ApiError(
          401,
          'invalid_request_error',
          `Invalid API Key provided: ${key.slice(0, 8)}${'*'.repeat(4)}${key.slice(-4)}`,
          'api_key_invalid',
        ),
      );
      return;
    }
    const path = req.path;
    const method = req.method;
    const route = routes.find((r) => r.method === method && r.pattern.test(path));
    if (!route) {
      fail(new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${method}: /v1${path}).`));
      return;
    }
    const id = decodeURIComponent(route.pattern.exec(path)?.[1] ?? '');
    const rawQuery = req.originalUrl.includes('?') ? req.originalUrl.slice(req.originalUrl.indexOf('?') + 1) : '';
    const rawBody = typeof req.body === 'string' ? req.body : '';
    const params = parseParams(method === 'GET' ? rawQuery : rawBody || rawQuery);
    const idempotencyKey = method === 'POST' ? (req.get('idempotency-key') ?? null) : null;
    const ctx: RequestContext = { requestId, idempotencyKey, apiVersion: version ?? null };
    const paramText = canonical(params);
    if (idempotencyKey) {
      const earlier = saved.get(idempotencyKey);
      if (earlier) {
        if (earlier.method !== method || earlier.path !== path || earlier.params !== paramText) {
          fail(
            new ApiError(
              400,
              'idempotency_error',
              `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
            ),
          );
          return;
        }
        res.setHeader('idempotent-replayed', 'true');
        send(earlier.status, earlier.body);
        return;
      }
    }
    try {
      const result = route.handler(params, ctx, id);
      const status = result.status ?? 200;
      // Only requests that ran are kept for replay; a refused parameter check is not (provider behaviour).
      if (idempotencyKey) saved.set(idempotencyKey, { method, path, params: paramText, status, body: result.body });
      send(status, result.body);
    } catch (err) {
      if (err instanceof ApiError) fail(err);
      else fail(new ApiError(500, 'api_error', err instanceof Error ? err.message : 'Unexpected error in the payment fake.'));
    }
  });
  return router;
}
