/**
 * Bad input, generated: every api route the app registers (read from the app's own route
 * registry, so a new route is fuzzed without anyone remembering to add it) receives
 * generated bodies, path parameters and query strings from fast-check, signed in as an owner
 * so the requests get past access checks. Whatever arrives, the answer is never a 5xx, and
 * every 4xx is RFC 9457 problem+json whose field errors carry paths. The figures (cases,
 * statuses) are printed.
 */
import fc from 'fast-check';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RegisteredRoute } from '../src/http/routes';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';
import { createCircuitFixture } from './circuit-fixtures';

const CASES_PER_ROUTE = Number(process.env.GLOAMING_FUZZ_CASES ?? 40);

let t: TestServer;
let knownIds: string[] = [];
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '100000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '100000' });
  const { quote, customer, site } = await createQuoteFixture(t.orm.em.fork(), t.firmA);
  const { circuit } = await createCircuitFixture(t.orm.em.fork(), t.firmA, quote.id);
  knownIds = [quote.id, customer.id, site.id, circuit.id, t.firmA.users.estimator.id, t.firmB.users.owner.id];
});
afterAll(async () => t.close());

/** Path parameter values: real ids of the firm's own rows sometimes, hostile strings mostly. */
const paramValue = () =>
  fc.oneof(
    fc.constantFrom(...knownIds, '1', '0', '-1', '1e309', 'null', 'undefined', '..', '%2e%2e%2f', 'Q-0001'),
    fc.string({ maxLength: 40 }),
    fc.string({ unit: 'grapheme', maxLength: 20 }),
    fc.stringMatching(/^[a-z0-9-]{1,64}$/),
    fc.constant('x'.repeat(5000)),
  );

/** Bodies: any JSON at all, objects shaped a little like ours, and odd scalars. */
const jsonBody = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  fc.dictionary(
    fc.constantFrom(
      'name',
      'email',
      'quantity',
      'lines',
      'sections',
      'content',
      'version',
      'role',
      'password',
      'selection',
      'amountMinor',
      'design',
      'kind',
      'reason',
      'signedName',
      'id',
    ),
    fc.oneof(fc.jsonValue({ maxDepth: 2 }), fc.string(), fc.integer(), fc.double(), fc.constant(null)),
    { maxKeys: 6 },
  ),
  fc.constantFrom(null, 0, -1, '', [], {}, 'ø', Number.MAX_SAFE_INTEGER),
);

/** Query strings: random keys and values, including our list parameters with bad values. */
const query = fc.dictionary(
  fc.oneof(
    fc.constantFrom('page', 'pageSize', 'q', 'sort', 'status', 'from', 'to', 'kind', 'period'),
    fc.string({ minLength: 1, maxLength: 8 }),
  ),
  fc.oneof(fc.string({ maxLength: 30 }), fc.integer().map(String), fc.constant('-1'), fc.constant('9'.repeat(30))),
  { maxKeys: 4 },
);

/** A raw body that is not what it claims to be. */
const rawBody = fc.oneof(
  fc.constant({ type: 'application/json', data: '{"unterminated": ' }),
  fc.constant({ type: 'application/json', data: '\u0000\u0001' }),
  fc.constant({ type: 'text/plain', data: 'hello' }),
  fc.constant({ type: 'application/x-www-form-urlencoded', data: 'a[b][c]=1&a[b][c]=2' }),
  fc.constant({
    type: 'multipart/form-data; boundary=zz',
    data: '--zz\r\nContent-Disposition: form-data; name="file"; filename="../../etc/passwd"\r\n\r\nx\r\n--zz--',
  }),
);

const request_ = fc.record({
  params: fc.array(paramValue(), { minLength: 4, maxLength: 4 }),
  query,
  body: fc.oneof(
    { weight: 4, arbitrary: jsonBody.map((data) => ({ kind: 'json' as const, data })) },
    { weight: 1, arbitrary: rawBody.map((r) => ({ kind: 'raw' as const, ...r })) },
  ),
});

function fillPath(route: RegisteredRoute, values: string[]): string {
  let i = 0;
  return route.path.replace(/:(\w+)/g, () => encodeURIComponent(values[i++ % values.length]!));
}

type Agent = ReturnType<typeof request.agent>;

type FuzzInput = typeof request_ extends fc.Arbitrary<infer T> ? T : never;

async function send(agent: Agent, route: RegisteredRoute, input: FuzzInput) {
  const url = fillPath(route, input.params);
  const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  let req = agent[method](url).query(input.query);
  if (method !== 'get') {
    if (input.body.kind === 'json') req = req.set('content-type', 'application/json').send(JSON.stringify(input.body.data));
    else req = req.set('content-type', input.body.type).send(input.body.data);
  }
  return req;
}

describe('fuzzing every api route with generated bad input', () => {
  it('never answers 5xx, and every 4xx is problem+json with field paths', { timeout: 600_000 }, async () => {
    // Routes that end the owner's own session would only make the rest of the run 401s;
    // they are fuzzed last, after everything else.
    const endsSession = (r: RegisteredRoute) => r.method === 'delete' && r.path === '/api/session';
    const routes = [...t.routes].sort((a, b) => Number(endsSession(a)) - Number(endsSession(b)));
    expect(routes.length).toBeGreaterThan(40);
    const statuses = new Map<number, number>();
    let cases = 0;
    let owner = await t.signIn('owner');

    for (const route of routes) {
      await fc.assert(
        fc.asyncProperty(request_, async (input) => {
          const res = await send(owner, route, input);
          cases++;
          statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
          const where = `${route.method} ${route.path} -> ${res.status}`;
          expect(res.status, `${where}: ${JSON.stringify(res.body)}`).toBeLessThan(500);
          if (res.status >= 400) {
            expect(res.headers['content-type'], where).toMatch(/^application\/problem\+json/);
            expect(typeof res.body.title, where).toBe('string');
            expect(res.body.status, where).toBe(res.status);
            for (const e of (res.body.errors ?? []) as Array<{ path?: unknown; message?: unknown }>) {
              expect(typeof e.path, where).toBe('string');
              expect(typeof e.message, where).toBe('string');
            }
          }
          if (res.status === 401) owner = await t.signIn('owner'); // a fuzzed route signed us out
        }),
        { numRuns: CASES_PER_ROUTE, seed: Number(process.env.GLOAMING_FUZZ_SEED ?? 20261201), endOnFailure: true },
      );
    }
    const table = [...statuses.entries()].sort((a, b) => a[0] - b[0]).map(([s, n]) => `${s}: ${n}`);
    console.log(`fuzz: ${routes.length} routes, ${cases} cases; statuses ${table.join(', ')}`);
    expect(cases).toBe(routes.length * CASES_PER_ROUTE);
  });
});
