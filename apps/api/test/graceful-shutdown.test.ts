import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { connect, createServer, type Socket } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, integrityCheck } from '@gloaming/db';

/**
 * Graceful shutdown of the real entry point (src/main.ts) on SIGTERM: a request already
 * running finishes with its real answer, a new request on an open keep-alive connection gets
 * 503 problem+json with Connection: close, new connections are refused, the process exits 0
 * and the database is closed cleanly (the WAL is checkpointed away; integrity ok).
 */
const dir = mkdtempSync(join(tmpdir(), 'gloaming-shutdown-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

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

function open(port: number): Promise<Socket> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, '127.0.0.1', () => resolve(socket));
    socket.once('error', reject);
  });
}

type HttpResponse = { status: number; headers: Record<string, string>; body: string };

/** Reads HTTP/1.1 responses (headers + Content-Length body) off a socket, one after another. */
function responses(socket: Socket): () => Promise<HttpResponse> {
  let buf = '';
  let waiting: (() => void) | undefined;
  socket.on('data', (d: Buffer) => {
    buf += d.toString('utf8');
    waiting?.();
  });
  const take = (): HttpResponse | undefined => {
    const end = buf.indexOf('\r\n\r\n');
    if (end < 0) return undefined;
    const [statusLine, ...lines] = buf.slice(0, end).split('\r\n');
    const headers = Object.fromEntries(
      lines.map((l) => [l.slice(0, l.indexOf(':')).toLowerCase(), l.slice(l.indexOf(':') + 1).trim()]),
    );
    const length = Number(headers['content-length'] ?? 0);
    const rest = Buffer.from(buf.slice(end + 4), 'utf8');
    if (rest.length < length) return undefined;
    buf = rest.subarray(length).toString('utf8');
    return { status: Number(statusLine!.split(' ')[1]), headers, body: rest.subarray(0, length).toString('utf8') };
  };
  return () =>
    new Promise((resolve, reject) => {
      const attempt = () => {
        const r = take();
        if (r) {
          waiting = undefined;
          resolve(r);
        }
      };
      waiting = attempt;
      socket.once('close', () => reject(new Error('connection closed before a response')));
      attempt();
    });
}

describe('graceful shutdown', () => {
  it(
    'finishes running requests, answers new ones 503, refuses new connections and closes the database',
    { timeout: 120_000 },
    async () => {
      const port = await freePort();
      const proc = spawn(process.execPath, ['--import', 'tsx', fileURLToPath(new URL('../src/main.ts', import.meta.url))], {
        env: {
          ...process.env,
          NODE_ENV: 'development',
          PORT: String(port),
          DATA_DIR: dir,
          DATABASE_URL: '', // the SQLite file under DATA_DIR, whichever database the suite runs on: the checks below read its WAL
          GLOAMING_FAKES: 'false',
          SMTP_PORT: '9',
        },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      let output = '';
      proc.stdout!.on('data', (d: Buffer) => (output += d.toString()));
      proc.stderr!.on('data', (d: Buffer) => (output += d.toString()));
      const exited = new Promise<number | null>((resolve) => proc.once('exit', (code) => resolve(code)));
      for (let i = 0; ; i++) {
        try {
          if ((await fetch(`http://127.0.0.1:${port}/api/health`)).ok) break;
        } catch {
          // not yet listening
        }
        if (i > 400) throw new Error(`the api did not start:\n${output}`);
        await new Promise((r) => setTimeout(r, 100));
      }

      // A: a sign-in whose body is only half sent: in flight when the signal arrives.
      const owner = DEMO_ACCOUNTS.find((x) => x.role === 'owner')!;
      const body = JSON.stringify({ email: owner.email, password: owner.password });
      const a = await open(port);
      const nextOnA = responses(a);
      a.write(
        `POST /api/session HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\nContent-Type: application/json\r\nContent-Length: ${Buffer.byteLength(body)}\r\n\r\n`,
      );
      a.write(body.slice(0, 10));
      // B: an idle keep-alive connection that has had one answer.
      const b = await open(port);
      const bClosed = new Promise<void>((resolve) => b.once('close', () => resolve()));
      b.write(`GET /api/health HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\n\r\n`);
      expect((await responses(b)()).status).toBe(200);

      proc.kill('SIGTERM');
      for (let i = 0; !output.includes('shutting down') && i < 200; i++) await new Promise((r) => setTimeout(r, 20));
      expect(output).toContain('SIGTERM: shutting down');

      // A brand-new connection is not accepted any more, and the idle one is closed.
      await expect(open(port)).rejects.toThrow(/ECONNREFUSED/);
      await bClosed;

      // The running sign-in completes with its real answer; a request pipelined behind it
      // arrives during the drain and gets 503 problem+json with Connection: close.
      a.write(body.slice(10) + `GET /api/health HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\n\r\n`);
      const signedIn = await nextOnA();
      expect(signedIn.status).toBe(200);
      expect(signedIn.headers['set-cookie']).toMatch(/gloaming_session=/);
      const refused = await nextOnA();
      expect(refused.status).toBe(503);
      expect(refused.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(refused.headers.connection).toBe('close');
      expect(JSON.parse(refused.body).type).toBe('/problems/shutting-down');
      a.destroy();

      expect(await exited).toBe(0);
      const file = join(dir, 'gloaming.sqlite');
      expect(existsSync(`${file}-wal`)).toBe(false); // closed: the last connection checkpointed the WAL
      expect(await integrityCheck(file)).toBe('ok');
    },
  );
});
