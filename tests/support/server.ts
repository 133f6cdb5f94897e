import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

export interface RunningServer {
  baseUrl: string;
  inboxUrl: string;
  /** Base URL of the local payment-provider fake (REST under /v1, test payment page under /pay/). */
  paymentsUrl: string;
  dataDir: string;
  output: () => string;
  stop: () => Promise<void>;
}

/** `count` distinct free loopback ports: all are held open together, so none repeats. */
export async function freePorts(count: number): Promise<number[]> {
  const servers = await Promise.all(
    Array.from(
      { length: count },
      () =>
        new Promise<ReturnType<typeof createServer>>((resolveServer, reject) => {
          const s = createServer();
          s.once('error', reject);
          s.listen(0, '127.0.0.1', () => resolveServer(s));
        }),
    ),
  );
  const ports = servers.map((s) => {
    const address = s.address();
    return typeof address === 'object' && address ? address.port : 0;
  });
  await Promise.all(servers.map((s) => new Promise((r) => s.close(r))));
  return ports;
}

/**
 * Start the real built server (`node apps/api/dist/main.js`, as `npm start` does) on a
 * random port with a fresh DATA_DIR, so it migrates and seeds a new demo database.
 */
export async function startBuiltServer(env: Record<string, string> = {}): Promise<RunningServer> {
  const dataDir = mkdtempSync(join(tmpdir(), 'gloaming-e2e-'));
  const [port, smtpPort, inboxPort, paymentsPort] = (await freePorts(4)) as [number, number, number, number];
  let out = '';
  // GLOAMING_SERVER_NODE_ARGS: extra node flags for the server, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof"
  const nodeArgs = (process.env.GLOAMING_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const child: ChildProcess = spawn(process.execPath, [...nodeArgs, join(repoRoot, 'apps/api/dist/main.js')], {
    cwd: repoRoot,
    env: {
      ...process.env,
      NODE_ENV: 'development',
      PORT: String(port),
      // An IP literal, not "localhost": the server binds 127.0.0.1 only, and the browser must
      // never try ::1 first. E-mailed links use the same origin.
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      DATA_DIR: dataDir,
      GLOAMING_SMTP_CATCHER_PORT: String(smtpPort),
      GLOAMING_INBOX_PORT: String(inboxPort),
      GLOAMING_PAYMENTS_FAKE_PORT: String(paymentsPort),
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr?.on('data', (d: Buffer) => (out += d.toString()));
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early (${child.exitCode}):\n${out}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`server did not become healthy in 30 s:\n${out}`);
    await new Promise((r) => setTimeout(r, 150));
  }
  return {
    baseUrl,
    inboxUrl: `http://127.0.0.1:${inboxPort}`,
    paymentsUrl: `http://127.0.0.1:${paymentsPort}`,
    dataDir,
    output: () => out,
    stop: async () => {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null) child.kill('SIGKILL');
      }
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
