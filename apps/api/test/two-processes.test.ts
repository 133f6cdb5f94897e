import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createScratchDatabase, openDatabase, type ScratchDatabase } from '@gloaming/db';
import { createFirm, type FirmFixture } from '@gloaming/db/testing';
import { testPostgresUrl } from './harness';

/**
 * Scale-out: two real api processes (src/main.ts, started at the same moment so both migrate
 * at once) on one PostgreSQL database, as behind a load balancer. A session started through
 * one works through the other and ends for both; failed sign-ins counted by one process
 * count against the limit on the other. Runs under `npm run test:postgres` (DATABASE_URL).
 */
const MAX_FAILED_PER_ACCOUNT = 3;
const entry = fileURLToPath(new URL('../src/main.ts', import.meta.url));

interface ApiProcess {
  proc: ChildProcess;
  base: string;
  output: () => string;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

async function startApi(databaseUrl: string, dataDir: string): Promise<ApiProcess> {
  const port = await freePort();
  const proc = spawn(process.execPath, ['--import', 'tsx', entry], {
    env: {
      ...process.env,
      NODE_ENV: 'development',
      PORT: String(port),
      DATA_DIR: dataDir,
      DATABASE_URL: databaseUrl,
      GLOAMING_FAKES: 'false',
      GLOAMING_SEED_DEMO: 'false',
      SMTP_PORT: '9',
      GLOAMING_SIGNIN_MAX_PER_ACCOUNT: String(MAX_FAILED_PER_ACCOUNT),
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  proc.stdout!.on('data', (d: Buffer) => (output += d.toString()));
  proc.stderr!.on('data', (d: Buffer) => (output += d.toString()));
  return { proc, base: `http://127.0.0.1:${port}`, output: () => output };
}

async function healthy(api: ApiProcess): Promise<{ database: { status: string; pendingMigrations: number } }> {
  for (let i = 0; i < 1200; i++) {
    if (api.proc.exitCode !== null) throw new Error(`the api exited (${api.proc.exitCode}):\n${api.output()}`);
    try {
      const res = await fetch(`${api.base}/api/health`);
      if (res.ok) return (await res.json()) as { database: { status: string; pendingMigrations: number } };
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`the api did not start:\n${api.output()}`);
}

async function stop(api: ApiProcess): Promise<void> {
  if (api.proc.exitCode !== null) return;
  const exited = new Promise<void>((resolve) => api.proc.once('exit', () => resolve()));
  api.proc.kill('SIGTERM');
  await exited;
}

const signIn = (api: ApiProcess, email: string, password: string) =>
  fetch(`${api.base}/api/session`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
const whoAmI = (api: ApiProcess, cookie: string) => fetch(`${api.base}/api/session`, { headers: { cookie } });

describe.skipIf(!testPostgresUrl)('two api processes on one PostgreSQL database', () => {
  let scratch: ScratchDatabase;
  let dir: string;
  let a: ApiProcess;
  let b: ApiProcess;
  let firm: FirmFixture;

  beforeAll(async () => {
    scratch = await createScratchDatabase(testPostgresUrl!, 'gloaming_two_processes');
    dir = mkdtempSync(join(tmpdir(), 'gloaming-two-'));
    // both start on the empty database at once: one migrates, the other waits for it
    [a, b] = await Promise.all([startApi(scratch.url, join(dir, 'a')), startApi(scratch.url, join(dir, 'b'))]);
    const [ha, hb] = await Promise.all([healthy(a), healthy(b)]);
    expect(ha.database).toEqual({ status: 'ok', pendingMigrations: 0 });
    expect(hb.database).toEqual({ status: 'ok', pendingMigrations: 0 });
    const orm = await openDatabase({ url: scratch.url });
    try {
      firm = await createFirm(orm.em.fork(), 'Two Process Lighting');
    } finally {
      await orm.close(true);
    }
  }, 240_000);

  afterAll(async () => {
    await Promise.all([a && stop(a), b && stop(b)]);
    await scratch?.drop();
    if (dir) rmSync(dir, { recursive: true, force: true });
  }, 60_000);

  it('a session started on one process works on the other, and signing out on either ends it for both', async () => {
    const user = firm.users.estimator;
    const res = await signIn(a, user.email, firm.password);
    expect(res.status).toBe(200);
    const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
    expect(cookie).toMatch(/^gloaming_session=./);

    const onB = await whoAmI(b, cookie);
    expect(onB.status).toBe(200);
    expect(((await onB.json()) as { user: { email: string } }).user.email).toBe(user.email);

    const out = await fetch(`${b.base}/api/session`, { method: 'DELETE', headers: { cookie } });
    expect(out.status).toBeLessThan(300);
    expect((await whoAmI(a, cookie)).status).toBe(401);
    expect((await whoAmI(b, cookie)).status).toBe(401);
  });

  it('failed sign-ins counted on one process count against the limit on the other', async () => {
    const user = firm.users.owner;
    const failures = [a, a, b];
    for (const api of failures) expect((await signIn(api, user.email, 'not-the-password')).status).toBe(401);
    // MAX_FAILED_PER_ACCOUNT failures in the window, spread over both: the next attempt is
    // refused on either process, even with the right password, until the window ends
    expect(failures).toHaveLength(MAX_FAILED_PER_ACCOUNT);
    for (const api of [b, a]) {
      const refused = await signIn(api, user.email, firm.password);
      expect(refused.status).toBe(429);
      expect(refused.headers.get('content-type')).toMatch(/application\/problem\+json/);
      expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
    }
    // another account is not affected: the limit is per account
    expect((await signIn(b, firm.users.installer.email, firm.password)).status).toBe(200);
  });
});
