/**
 * Quotes for the benchmarks, made through the api as the workbench would (signed-in cookie,
 * the same routes): a customer, quotes whose estimate has a given number of lines (the grid
 * bench's deterministic estimate), and circuits copied from the demo firm's seeded ones.
 */
import type {
  CircuitListResponse,
  CircuitView,
  CustomerResponse,
  EstimateContent,
  QuoteDetailResponse,
  QuoteListResponse,
  SaveRevisionResponse,
} from '@gloaming/contracts';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import { largeEstimate } from '../grid-keystroke';

export interface ApiSession {
  baseUrl: string;
  cookie: string;
  call<T>(method: string, path: string, body?: unknown): Promise<T>;
}

export async function signIn(baseUrl: string, role: 'estimator' | 'owner' | 'installer' = 'estimator'): Promise<ApiSession> {
  const account = DEMO_ACCOUNTS.find((a) => a.role === role)!;
  const res = await fetch(`${baseUrl}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: account.email, password: account.password }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${role}: ${res.status} ${await res.text()}`);
  const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
  return {
    baseUrl,
    cookie,
    async call<T>(method: string, path: string, body?: unknown): Promise<T> {
      const r = await fetch(`${baseUrl}${path}`, {
        method,
        headers: { cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      if (!r.ok) throw new Error(`${method} ${path}: ${r.status} ${(await r.text()).slice(0, 500)}`);
      return (await r.json()) as T;
    },
  };
}

export interface BenchQuote {
  quoteId: string;
  revisionId: string;
  revisionNumber: number;
  version: number;
  content: EstimateContent;
  lineCount: number;
  circuitCount: number;
}

/** Seeded circuits of the demo firm, to copy onto the bench's quotes (their products are the firm's own). */
export async function demoCircuits(s: ApiSession, want = 6): Promise<CircuitView[]> {
  const found: CircuitView[] = [];
  for (let page = 1; page <= 4 && found.length < want; page++) {
    const list = await s.call<QuoteListResponse>('GET', `/api/quotes?page=${page}&pageSize=50`);
    for (const q of list.quotes) {
      const detail = await s.call<QuoteDetailResponse>('GET', `/api/quotes/${q.id}`);
      const circuits = await s.call<CircuitListResponse>('GET', `/api/quotes/${q.id}/revisions/${detail.revision.number}/circuits`);
      for (const c of circuits.circuits) if (!c.result.findings.some((f) => f.severity === 'error')) found.push(c);
      if (found.length >= want) break;
    }
  }
  if (found.length === 0) throw new Error('the demo firm has no circuit without errors to copy');
  return found;
}

/** One bench customer per server (each suite starts its own server with a fresh database). */
const customerIds = new Map<string, string>();

/** A draft quote with `lines` estimate lines and `circuits` circuits (each adds its derived lines). */
export async function createBenchQuote(s: ApiSession, lines: number, circuits: number, templates: CircuitView[]): Promise<BenchQuote> {
  let customerId = customerIds.get(s.baseUrl);
  if (!customerId) {
    const customer = await s.call<CustomerResponse>('POST', '/api/customers', {
      name: 'Bench Measurement Ltd',
      sites: [{ label: 'Test garden', addressLines: '1 Long Border', postcode: 'LB1 1AA' }],
    });
    customerId = customer.customer.id;
    customerIds.set(s.baseUrl, customerId);
  }
  const created = await s.call<QuoteDetailResponse>('POST', '/api/quotes', { customerId });
  const quoteId = created.quote.id;
  const n = created.revision.number;
  const content = largeEstimate(lines);
  await s.call<SaveRevisionResponse>('PUT', `/api/quotes/${quoteId}/revisions/${n}`, { version: created.revision.version, content });
  const areas = content.sections.map((sec) => sec.name);
  for (let i = 0; i < circuits; i++) {
    const t = templates[i % templates.length]!;
    await s.call('POST', `/api/quotes/${quoteId}/revisions/${n}/circuits`, { area: areas[i % areas.length], name: `Circuit ${i + 1}`, design: t.design });
  }
  const detail = await s.call<QuoteDetailResponse>('GET', `/api/quotes/${quoteId}`);
  const saved = detail.revision.content;
  return {
    quoteId,
    revisionId: detail.revision.id,
    revisionNumber: n,
    version: detail.revision.version,
    content: saved,
    lineCount: saved.sections.reduce((sum, sec) => sum + sec.lines.length, 0),
    circuitCount: circuits,
  };
}
