/**
 * The api under autocannon on loopback at 32 connections, side by side with a bare Express
 * server answering the same paths with the same bytes (support/side-by-side.ts):
 * - GET of a quote with its circuits: GET /api/quotes/:id and GET .../circuits, alternating
 *   on each connection, as the workbench opens a quote;
 * - a grid save: PUT /api/quotes/:id/revisions/:n of the whole estimate with its version, one
 *   draft quote per connection so every save is accepted (200, never a 409).
 * At 1x (300 lines, 6 circuits) the rows are the api's; 4x and 16x (1,200 and 4,800 lines,
 * 24 and 96 circuits on the GET) are the scale rows, with the growth of the time per request
 * (1 / throughput at the same 32 connections) against 1x.
 */
import type autocannon from 'autocannon';
import { startBuiltServer } from '../../tests/support/server';
import { createBenchQuote, demoCircuits, signIn, type ApiSession, type BenchQuote } from '../support/api-fixtures';
import { loadAverage, ms, type BenchRow, type Suite } from '../support/report';
import { sideBySide, startBareServer, type SideBySide, type Workload } from '../support/side-by-side';
import type { BareRoute } from '../support/bare-server';

const CONNECTIONS = 32;
const BASE_LINES = 300;
const BASE_CIRCUITS = 6;
const PER_DOUBLING = 2.3;

interface Fixture {
  scale: number;
  view: BenchQuote;
  drafts: BenchQuote[];
}

async function recorded(s: ApiSession, method: 'get' | 'put', path: string, body?: unknown): Promise<BareRoute> {
  const res = await fetch(`${s.baseUrl}${path}`, {
    method: method.toUpperCase(),
    headers: { cookie: s.cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${text.slice(0, 300)}`);
  return { method, path, status: res.status, contentType: res.headers.get('content-type') ?? 'application/json', body: text };
}

function viewWorkload(q: BenchQuote, cookie: string): Workload {
  const headers = { cookie };
  return async () => ({
    requests: [
      { method: 'GET', path: `/api/quotes/${q.quoteId}`, headers },
      { method: 'GET', path: `/api/quotes/${q.quoteId}/revisions/${q.revisionNumber}/circuits`, headers },
    ],
  });
}

/** Stands in for the first line's quantity in the prepared body; each save puts a new one there. */
const QUANTITY_MARK = 987_654_321;

/**
 * Saves over a pool of drafts: each request takes a free draft, sends its whole estimate with
 * the first line's quantity changed (as a keystroke in the grid would; an unchanged estimate
 * is not written) and the version the last accepted save returned, and gives the draft back
 * when answered.
 */
function saveWorkload(drafts: BenchQuote[], cookie: string, unexpected: string[], resync: boolean): Workload {
  const slots = drafts.map((d) => {
    const content = structuredClone(d.content);
    content.sections[0]!.lines[0]!.quantityMilli = QUANTITY_MARK;
    const [head, tail] = JSON.stringify(content).split(String(QUANTITY_MARK)) as [string, string];
    return { ...d, head, tail, seq: 0 };
  });
  type Ctx = { slot?: (typeof slots)[number] };
  let pool: typeof slots = [];
  let slotTurn = 0;
  return async (baseUrl: string) => {
    // A run ends with saves in flight whose answers are never read: let them land, then take
    // every draft back with the version the server now holds.
    await new Promise((r) => setTimeout(r, 300));
    if (resync) {
      for (const slot of slots) {
        const res = await fetch(`${baseUrl}/api/quotes/${slot.quoteId}`, { headers: { cookie } });
        slot.version = ((await res.json()) as { revision: { version: number } }).revision.version;
      }
    }
    pool = [...slots];
    return {
      requests: [
        {
          method: 'PUT',
          headers: { cookie, 'content-type': 'application/json' },
          setupRequest: (req: autocannon.Request, context: Ctx) => {
            // A request autocannon gave up on (timeout) never gives its draft back: then share the
            // oldest one, and a stale version shows up as an unexpected 409 in the row, not a crash.
            const slot = pool.shift() ?? slots[slotTurn++ % slots.length]!;
            context.slot = slot;
            slot.seq++;
            const quantity = 1000 + (slot.seq % 9000) * 1000;
            return {
              ...req,
              path: `/api/quotes/${slot.quoteId}/revisions/${slot.revisionNumber}`,
              body: `{"version":${slot.version},"content":${slot.head}${quantity}${slot.tail}}`,
            };
          },
          onResponse: (status: number, body: string, context: Ctx) => {
            const slot = context.slot!;
            if (status === 200) {
              const m = /"version":(\d+)/.exec(body);
              if (m) slot.version = Number(m[1]);
            } else if (unexpected.length < 5) unexpected.push(`${status} ${body.slice(0, 200)}`);
            pool.push(slot);
          },
        },
      ],
    };
  };
}

function figures(s: SideBySide): string {
  return `api ${s.apiThroughput.toFixed(0)}/s vs bare ${s.bareThroughput.toFixed(0)}/s`;
}

export const apiSuite: Suite = async ({ quick, log }) => {
  const scales = quick ? [1] : [1, 4, 16];
  const rounds = quick ? 1 : 3;
  // a run must be long enough for the slowest requests to finish several times over
  const secondsAt = (scale: number) => (quick ? 2 : ({ 1: 5, 4: 8, 16: 15 } as Record<number, number>)[scale] ?? 5);
  const server = await startBuiltServer({ GLOAMING_SIGNIN_MAX_PER_IP: '100000' });
  const rows: BenchRow[] = [];
  const base: Partial<Record<'view' | 'save', SideBySide>> = {};
  try {
    const s = await signIn(server.baseUrl);
    const templates = await demoCircuits(s);
    const fixtures: Fixture[] = [];
    for (const scale of scales) {
      const lines = BASE_LINES * scale;
      const view = await createBenchQuote(s, lines, BASE_CIRCUITS * scale, templates);
      const drafts: BenchQuote[] = [];
      for (let i = 0; i < CONNECTIONS; i++) drafts.push(await createBenchQuote(s, lines, 0, templates));
      fixtures.push({ scale, view, drafts });
      log(`  ${scale}x: quote of ${view.lineCount} lines with ${view.circuitCount} circuits, ${drafts.length} drafts of ${lines} lines`);
    }
    for (const { scale, view, drafts } of fixtures) {
      const suite = scale === 1 ? 'api' : 'scale';
      const size = `${view.lineCount.toLocaleString('en-GB')} lines, ${view.circuitCount} circuits`;
      const seconds = secondsAt(scale);
      const opts = { rounds, seconds, connections: CONNECTIONS };
      // GET side by side
      const viewRoutes = [
        await recorded(s, 'get', `/api/quotes/${view.quoteId}`),
        await recorded(s, 'get', `/api/quotes/${view.quoteId}/revisions/${view.revisionNumber}/circuits`),
      ];
      const bareView = await startBareServer(viewRoutes);
      const viewRun = await sideBySide(server.baseUrl, viewWorkload(view, s.cookie), bareView.baseUrl, viewWorkload(view, s.cookie), opts);
      await bareView.stop();
      log(`  ${scale}x GET: ${figures(viewRun)}, p99 ${viewRun.apiP99} ms (load ${loadAverage()})`);
      // PUT side by side: the bare side answers with a recorded save of the same size
      const d0 = drafts[0]!;
      const changed = structuredClone(d0.content);
      changed.sections[0]!.lines[0]!.quantityMilli += 1000;
      const saveRoute = await recorded(s, 'put', `/api/quotes/${d0.quoteId}/revisions/${d0.revisionNumber}`, { version: d0.version, content: changed });
      d0.version = (JSON.parse(saveRoute.body) as { revision: { version: number } }).revision.version;
      const bareSave = await startBareServer(drafts.map((d) => ({ ...saveRoute, path: `/api/quotes/${d.quoteId}/revisions/${d.revisionNumber}` })));
      const unexpected: string[] = [];
      const saveRun = await sideBySide(server.baseUrl, saveWorkload(drafts, s.cookie, unexpected, true), bareSave.baseUrl, saveWorkload(drafts, s.cookie, [], false), opts);
      await bareSave.stop();
      log(`  ${scale}x PUT: ${figures(saveRun)}, p99 ${saveRun.apiP99} ms (load ${loadAverage()})${unexpected.length ? `; unexpected: ${unexpected[0]}` : ''}`);

      const cases: Array<['view' | 'save', string, SideBySide]> = [
        ['view', `GET a quote with its circuits (${size})`, viewRun],
        ['save', `PUT a grid save (${drafts[0]!.lineCount.toLocaleString('en-GB')} lines)`, saveRun],
      ];
      for (const [key, name, run] of cases) {
        const answered = run.api.every((f) => f.requests > 0);
        const runs = `${rounds} alternating ${seconds}-s runs per side at ${CONNECTIONS} connections; ${run.errors} errors, ${run.non2xx} non-2xx`;
        rows.push({
          suite,
          case: `${scale}x ${name}: throughput vs bare Express`,
          figure: `ratio ${run.ratio.toFixed(2)} (${figures(run)})`,
          value: run.ratio,
          unit: 'x',
          target: '>= 0.3 of bare',
          met: answered && run.ratio >= 0.3 && run.errors === 0 && run.non2xx === 0,
          note: runs,
        });
        rows.push({
          suite,
          case: `${scale}x ${name}: p99 latency`,
          figure: answered ? `p99 ${ms(run.apiP99)}` : 'no answer within a run',
          value: answered ? run.apiP99 : null,
          unit: 'ms',
          target: 'p99 < 50 ms',
          met: answered && run.apiP99 < 50,
          note: `median of the runs' p99; bare p99 ${ms(run.bareP99)}`,
        });
        if (scale === 1) base[key] = run;
        const b = base[key];
        if (scale > 1 && b) {
          const growth = b.apiThroughput / run.apiThroughput;
          const limit = Math.round(PER_DOUBLING ** Math.log2(scale) * 100) / 100;
          rows.push({
            suite,
            case: `${scale}x ${name}: growth of the time per request vs 1x`,
            figure: `growth ${growth.toFixed(2)}x`,
            value: growth,
            unit: 'x',
            target: `<= ${limit}x (2.3x per doubling)`,
            met: growth <= limit,
            note: `1 / throughput at ${CONNECTIONS} connections`,
          });
        }
      }
    }
  } finally {
    await server.stop();
  }
  return rows;
};
