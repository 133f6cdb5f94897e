/**
 * The access matrix: every api route x every actor (signed out, owner, estimator, installer)
 * x own firm's data / another firm's data. Expected statuses come from each route's declared
 * policy; the route list comes from the Express router itself, so a route added without a
 * policy (outside `moduleRouter`) fails here.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '@gloaming/contracts';
import type { RegisteredRoute } from '../src/http/routes';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';
import { createCatalogueFixture } from './catalogue-fixtures';
import { createQuoteMediaFixture } from './image-fixtures';
import { createCircuitFixture } from './circuit-fixtures';
import { createJobFixture } from './job-fixtures';
import { createPortalLinkFixture } from './portal-fixtures';
import { createDepositPaymentFixture } from './deposit-fixtures';

let t: TestServer;
let quoteA: string;
let quoteB: string;
let mediaA: { photoId: string; revisionId: string };
let mediaB: { photoId: string; revisionId: string };
let catalogueA: Awaited<ReturnType<typeof createCatalogueFixture>>;
let catalogueB: Awaited<ReturnType<typeof createCatalogueFixture>>;
let circuitA: string;
let circuitB: string;
let jobA: Awaited<ReturnType<typeof createJobFixture>>;
let jobB: Awaited<ReturnType<typeof createJobFixture>>;
let portalTokenA: string;
let paymentA: string;
let paymentB: string;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000', GLOAMING_PORTAL_MAX_FAILED_PER_IP: '10000' });
  quoteA = (await createQuoteFixture(t.orm.em.fork(), t.firmA)).quote.id;
  quoteB = (await createQuoteFixture(t.orm.em.fork(), t.firmB)).quote.id;
  mediaA = await createQuoteMediaFixture(t.orm.em.fork(), t.firmA.firm.id, quoteA, t.config.dataDir);
  mediaB = await createQuoteMediaFixture(t.orm.em.fork(), t.firmB.firm.id, quoteB, t.config.dataDir);
  catalogueA = await createCatalogueFixture(t.orm.em.fork(), t.firmA, t.config.dataDir);
  catalogueB = await createCatalogueFixture(t.orm.em.fork(), t.firmB, t.config.dataDir);
  circuitA = (await createCircuitFixture(t.orm.em.fork(), t.firmA, quoteA)).circuit.id;
  circuitB = (await createCircuitFixture(t.orm.em.fork(), t.firmB, quoteB)).circuit.id;
  jobA = await createJobFixture(t.orm.em.fork(), t.firmA);
  jobB = await createJobFixture(t.orm.em.fork(), t.firmB);
  portalTokenA = await createPortalLinkFixture(t.orm.em.fork(), t.firmA);
  paymentA = await createDepositPaymentFixture(t.orm.em.fork(), t.firmA, quoteA);
  paymentB = await createDepositPaymentFixture(t.orm.em.fork(), t.firmB, quoteB);
});
afterAll(async () => t.close());

interface Layer {
  rawPath?: string;
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
}

/** Every (method, full path) the Express app would route, read from its router stack. */
function expressRoutes(stack: Layer[], prefix = ''): string[] {
  const out: string[] = [];
  for (const layer of stack) {
    if (layer.route) {
      for (const method of Object.keys(layer.route.methods)) out.push(`${method} ${join(prefix, layer.route.path)}`);
    } else if (layer.handle.stack) {
      out.push(...expressRoutes(layer.handle.stack, join(prefix, layer.rawPath ?? '')));
    }
  }
  return out;
}
function join(a: string, b: string): string {
  const s = `${a}/${b}`.replace(/\/+/g, '/');
  return s.length > 1 ? s.replace(/\/$/, '') : s;
}

/** Ids to put in path parameters: one owned by firm A (the actor's) and one by firm B. */
function paramsFor(route: RegisteredRoute): { own: Record<string, string>; foreign: Record<string, string> } {
  if (route.params.length === 0) return { own: {}, foreign: {} };
  if (route.path.startsWith('/api/users/:id'))
    return { own: { id: t.firmA.users.installer.id }, foreign: { id: t.firmB.users.installer.id } };
  // A portal link is its own key: "own" is a working link of firm A, "foreign" a link that does not exist.
  if (route.path.startsWith('/api/portal/:token'))
    return {
      own: { token: portalTokenA, photoId: '00000000-0000-4000-8000-000000000000' },
      foreign: { token: 'no-such-link', photoId: '00000000-0000-4000-8000-000000000000' },
    };
  if (route.path.startsWith('/api/quotes/:id'))
    return {
      own: { id: quoteA, revisionNumber: '1', ...mediaA, circuitId: circuitA, paymentId: paymentA },
      foreign: { id: quoteB, revisionNumber: '1', ...mediaB, circuitId: circuitB, paymentId: paymentB },
    };
  if (route.path.startsWith('/api/jobs/:id'))
    return {
      own: { id: jobA.quote.id, circuitId: jobA.circuit.id },
      foreign: { id: jobB.quote.id, circuitId: jobB.circuit.id },
    };
  if (route.path.startsWith('/api/customers/:id'))
    return {
      own: { id: catalogueA.customer.id, siteId: catalogueA.site.id },
      foreign: { id: catalogueB.customer.id, siteId: catalogueB.site.id },
    };
  if (route.path.startsWith('/api/products/:id'))
    return { own: { id: catalogueA.product.id }, foreign: { id: catalogueB.product.id } };
  if (route.path.startsWith('/api/product-imports/:id'))
    return { own: { id: catalogueA.job.id }, foreign: { id: catalogueB.job.id } };
  throw new Error(`route-matrix: add fixtures for the path parameters of ${route.method.toUpperCase()} ${route.path}`);
}

function fill(path: string, params: Record<string, string>): string {
  return path.replace(/:([A-Za-z_]+)/g, (_, name: string) => params[name] ?? `missing-${name}`);
}

type Actor = 'signed-out' | Role;
const ACTORS: Actor[] = ['signed-out', ...ROLES];

async function call(route: RegisteredRoute, actor: Actor, path: string) {
  const agent = actor === 'signed-out' ? request.agent(t.app) : await t.signIn(actor);
  const req = agent[route.method](path);
  return route.method === 'get' || route.method === 'delete' ? req : req.send({});
}

describe('route x role x firm matrix', () => {
  it('every route Express knows is registered with a policy', () => {
    const known = expressRoutes((t.app as unknown as { router: { stack: Layer[] } }).router.stack).sort();
    const registered = t.routes.map((r) => `${r.method} ${r.path === '/api' ? r.path : r.path.replace(/\/$/, '')}`).sort();
    expect(known).toEqual(registered);
    expect(registered.length).toBeGreaterThanOrEqual(10);
  });

  it('declares the policies we mean: a changed policy must be changed here too, on purpose', () => {
    const table = Object.fromEntries(
      t.routes.map((r) => [
        `${r.method.toUpperCase()} ${r.path}`,
        r.policy.kind === 'public' ? 'public' : r.policy.roles.join(','),
      ]),
    );
    expect(table).toEqual({
      'GET /api/health': 'public',
      'POST /api/session': 'public',
      'GET /api/session': 'owner,estimator,installer',
      'DELETE /api/session': 'public',
      'GET /api/users': 'owner',
      'GET /api/users/:id': 'owner',
      'PATCH /api/users/:id': 'owner',
      'POST /api/users/:id/invite': 'owner',
      'POST /api/invites': 'owner',
      'POST /api/invites/accept': 'public',
      'POST /api/password-resets': 'public',
      'POST /api/password-resets/complete': 'public',
      'GET /api/organization': 'owner,estimator,installer',
      'GET /api/organization/settings': 'owner',
      'PUT /api/organization/settings': 'owner',
      'GET /api/organization/logo': 'owner,estimator,installer',
      'PUT /api/organization/logo': 'owner',
      'DELETE /api/organization/logo': 'owner',
      'GET /api/figures': 'owner',
      'GET /api/activity': 'owner',
      'GET /api/quotes/:id/activity': 'owner',
      'GET /api/customers': 'owner,estimator',
      'POST /api/customers': 'owner,estimator',
      'GET /api/customers/:id': 'owner,estimator',
      'PATCH /api/customers/:id': 'owner,estimator',
      'POST /api/customers/:id/sites': 'owner,estimator',
      'PATCH /api/customers/:id/sites/:siteId': 'owner,estimator',
      'DELETE /api/customers/:id/sites/:siteId': 'owner,estimator',
      'GET /api/products': 'owner,estimator',
      'POST /api/products': 'owner,estimator',
      'GET /api/products/:id': 'owner,estimator',
      'PUT /api/products/:id': 'owner,estimator',
      'POST /api/products/:id/deactivate': 'owner,estimator',
      'POST /api/product-imports': 'owner,estimator',
      'GET /api/product-imports/:id': 'owner,estimator',
      'POST /api/product-imports/:id/preview': 'owner,estimator',
      'POST /api/product-imports/:id/run': 'owner,estimator',
      'GET /api/product-imports/:id/rejections.csv': 'owner,estimator',
      'GET /api/quotes': 'owner,estimator',
      'POST /api/quotes': 'owner,estimator',
      'GET /api/quotes/:id': 'owner,estimator',
      'POST /api/quotes/:id/revisions': 'owner,estimator',
      'GET /api/quotes/:id/revisions/:revisionNumber': 'owner,estimator',
      'PUT /api/quotes/:id/revisions/:revisionNumber': 'owner,estimator',
      'GET /api/quotes/:id/events': 'owner,estimator',
      'GET /api/quotes/:id/photos': 'owner,estimator',
      'POST /api/quotes/:id/photos': 'owner,estimator',
      'PUT /api/quotes/:id/photos/order': 'owner,estimator',
      'PATCH /api/quotes/:id/photos/:photoId': 'owner,estimator',
      'DELETE /api/quotes/:id/photos/:photoId': 'owner,estimator',
      'GET /api/quotes/:id/photos/:photoId/image': 'owner,estimator',
      'GET /api/quotes/:id/photos/:photoId/thumbnail': 'owner,estimator',
      'GET /api/quotes/:id/revisions/:revisionId/pdf': 'owner,estimator',
      'GET /api/quotes/:id/revisions/:revisionId/sending': 'owner,estimator',
      'GET /api/quotes/:id/revisions/:revisionId/send-preview': 'owner,estimator',
      'POST /api/quotes/:id/revisions/:revisionId/send': 'owner,estimator',
      'POST /api/quotes/:id/revisions/:revisionId/resend': 'owner,estimator',
      'POST /api/quotes/:id/revisions/:revisionId/revoke': 'owner,estimator',
      'GET /api/quotes/:id/revisions/:revisionNumber/circuits': 'owner,estimator',
      'POST /api/quotes/:id/revisions/:revisionNumber/circuits': 'owner,estimator',
      'PUT /api/quotes/:id/revisions/:revisionNumber/circuits/:circuitId': 'owner,estimator',
      'DELETE /api/quotes/:id/revisions/:revisionNumber/circuits/:circuitId': 'owner,estimator',
      'POST /api/quotes/:id/revisions/:revisionNumber/circuit-suggestions': 'owner,estimator',
      'GET /api/jobs': 'owner,estimator,installer',
      'GET /api/jobs/:id': 'owner,estimator,installer',
      'GET /api/jobs/:id/pack.pdf': 'owner,estimator,installer',
      'PUT /api/jobs/:id/circuits/:circuitId/as-wired': 'owner,estimator,installer',
      'PUT /api/jobs/:id/circuits/:circuitId/commissioning': 'owner,estimator,installer',
      'GET /api/portal/:token': 'public',
      'POST /api/portal/:token/totals': 'public',
      'POST /api/portal/:token/questions': 'public',
      'POST /api/portal/:token/approval': 'public',
      'POST /api/portal/:token/decline': 'public',
      'GET /api/portal/:token/pdf': 'public',
      'GET /api/portal/:token/logo': 'public',
      'GET /api/portal/:token/photos/:photoId': 'public',
      'GET /api/quotes/:id/messages': 'owner,estimator',
      'POST /api/quotes/:id/messages': 'owner,estimator',
      'GET /api/quotes/:id/decision': 'owner,estimator',
      'GET /api/portal/:token/deposit': 'public',
      'POST /api/portal/:token/deposit/checkout': 'public',
      'POST /api/payments/webhook': 'public',
      'GET /api/quotes/:id/deposits': 'owner,estimator',
      'POST /api/quotes/:id/deposits/:paymentId/refund': 'owner',
    });
  });

  it('answers 401 / 403 / 404 exactly where each policy says', async () => {
    const failures: string[] = [];
    for (const route of t.routes) {
      const { own, foreign } = paramsFor(route);
      for (const actor of ACTORS) {
        const allowed = route.policy.kind === 'public' || (actor !== 'signed-out' && route.policy.roles.includes(actor));
        const expected =
          route.policy.kind === 'public' ? 'not 401/403' : actor === 'signed-out' ? 401 : allowed ? 'not 401/403' : 403;
        const res = await call(route, actor, fill(route.path, own));
        const ok = expected === 'not 401/403' ? res.status !== 401 && res.status !== 403 : res.status === expected;
        if (!ok) failures.push(`${route.method.toUpperCase()} ${route.path} as ${actor}: got ${res.status}, want ${expected}`);
        if (res.status >= 500)
          failures.push(`${route.method.toUpperCase()} ${route.path} as ${actor}: server error ${res.status}`);
        if (res.status >= 400 && !String(res.headers['content-type']).includes('application/problem+json'))
          failures.push(`${route.method.toUpperCase()} ${route.path} as ${actor}: ${res.status} without problem+json`);

        if (route.params.length > 0 && allowed && actor !== 'signed-out') {
          const other = await call(route, actor, fill(route.path, foreign));
          if (other.status !== 404)
            failures.push(
              `${route.method.toUpperCase()} ${route.path} as ${actor} with another firm's id: got ${other.status}, want 404`,
            );
        }
      }
    }
    expect(failures).toEqual([]);
    // every call signs in afresh (argon2): ~60 routes x 4 actors take 10-15 s alone, more on a busy CI machine
  }, 400_000);
});
