/**
 * Side-by-side load runs: the real api and the bare Express server under the same autocannon
 * workload, alternating (api, bare, bare, api, api, bare...) so a drift in machine load falls
 * on both; the medians of the runs are compared.
 */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { BareRoute } from './bare-server';
import { benchDir } from './paths';
import { median } from './report';

export interface BareServer {
  baseUrl: string;
  stop(): Promise<void>;
}

export async function startBareServer(routes: BareRoute[]): Promise<BareServer> {
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-bare-'));
  const file = join(dir, 'routes.json');
  writeFileSync(file, JSON.stringify(routes));
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', join(benchDir, 'support/bare-server.ts'), file], {
    cwd: benchDir,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const port = await new Promise<number>((resolve, reject) => {
    let out = '';
    child.stdout?.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /listening (\d+)/.exec(out);
      if (m) resolve(Number(m[1]));
    });
    child.stderr?.on('data', (d: Buffer) => (out += d.toString()));
    child.on('exit', (code) => reject(new Error(`bare server exited ${code}: ${out}`)));
  });
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    async stop() {
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await exited;
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export interface LoadFigures {
  throughput: number;
  p50: number;
  p99: number;
  requests: number;
  errors: number;
  non2xx: number;
}

/** Called before every run (so it can settle state the previous run left, e.g. requests cut off at its end). */
export type Workload = (baseUrl: string) => Promise<Omit<autocannon.Options, 'url' | 'connections' | 'duration'>>;

/** How long a request may take before autocannon gives up on it (counted in `errors`); its default is 10 s. */
const REQUEST_TIMEOUT_S = 60;

export async function loadRun(baseUrl: string, workload: Workload, connections: number, seconds: number): Promise<LoadFigures> {
  const result = await autocannon({ url: baseUrl, connections, duration: seconds, timeout: REQUEST_TIMEOUT_S, ...(await workload(baseUrl)) });
  return {
    throughput: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    requests: result.requests.total,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  };
}

export interface SideBySide {
  api: LoadFigures[];
  bare: LoadFigures[];
  apiThroughput: number;
  bareThroughput: number;
  ratio: number;
  apiP99: number;
  bareP99: number;
  errors: number;
  non2xx: number;
}

export async function sideBySide(
  apiUrl: string,
  apiWorkload: Workload,
  bareUrl: string,
  bareWorkload: Workload,
  opts: { rounds: number; seconds: number; connections: number },
): Promise<SideBySide> {
  // a short warm-up of each side first (JIT, connection pools, SQLite page cache)
  await loadRun(apiUrl, apiWorkload, opts.connections, 1);
  await loadRun(bareUrl, bareWorkload, opts.connections, 1);
  const api: LoadFigures[] = [];
  const bare: LoadFigures[] = [];
  for (let r = 0; r < opts.rounds; r++) {
    if (r % 2 === 0) {
      api.push(await loadRun(apiUrl, apiWorkload, opts.connections, opts.seconds));
      bare.push(await loadRun(bareUrl, bareWorkload, opts.connections, opts.seconds));
    } else {
      bare.push(await loadRun(bareUrl, bareWorkload, opts.connections, opts.seconds));
      api.push(await loadRun(apiUrl, apiWorkload, opts.connections, opts.seconds));
    }
  }
  const apiThroughput = median(api.map((f) => f.throughput));
  const bareThroughput = median(bare.map((f) => f.throughput));
  return {
    api,
    bare,
    apiThroughput,
    bareThroughput,
    ratio: apiThroughput / bareThroughput,
    apiP99: median(api.map((f) => f.p99)),
    bareP99: median(bare.map((f) => f.p99)),
    errors: api.reduce((n, f) => n + f.errors, 0),
    non2xx: api.reduce((n, f) => n + f.non2xx, 0),
  };
}
