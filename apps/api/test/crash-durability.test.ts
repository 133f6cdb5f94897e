import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { Customer, Quote, Site, integrityCheck, migrate, openDatabase } from '@gloaming/db';
import { createFirm } from '@gloaming/db/testing';

/**
 * Crash durability: a child api process takes quote writes in a loop and is killed with
 * SIGKILL at random moments, many times over. Every write the api acknowledged (201) must be
 * in the database afterwards, and SQLite's integrity_check must say ok. (WAL with
 * synchronous=NORMAL: a process crash never loses a committed transaction; only an OS crash
 * or power cut could lose the last ones — https://www.sqlite.org/pragma.html#pragma_synchronous.)
 * Rounds and time are bounded; the figures are printed.
 */
const ROUNDS = 10;
const dir = mkdtempSync(join(tmpdir(), 'gloaming-crash-'));
const file = join(dir, 'crash.sqlite');
const child = fileURLToPath(new URL('./support/crash-child.ts', import.meta.url));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function startChild(): Promise<{ proc: ChildProcess; base: string }> {
  return new Promise((resolve, reject) => {
    const proc = spawn(process.execPath, ['--import', 'tsx', child, file], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    proc.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /PORT (\d+)/.exec(out);
      if (m) resolve({ proc, base: `http://127.0.0.1:${m[1]}` });
    });
    proc.stderr!.on('data', (d: Buffer) => (err += d.toString()));
    proc.once('exit', (code) => reject(new Error(`child exited (${code}) before listening: ${err}`)));
  });
}

describe('crash durability', () => {
  it(`keeps every acknowledged quote across ${ROUNDS} SIGKILLs, with integrity ok`, { timeout: 240_000 }, async () => {
    // The firm, a customer and a site, written before the first child starts.
    const setup = await openDatabase({ file });
    await migrate(setup);
    const em = setup.em.fork();
    const firm = await createFirm(em, 'Crash Test Lighting');
    const customer = em.create(Customer, { organization: firm.firm, name: 'Iris Calloway', email: null, phone: null });
    const site = em.create(Site, { organization: firm.firm, customer, label: 'Home', addressLines: '9 Mill Race\nLowbridge', postcode: 'LB1 9MR' });
    await em.flush();
    await setup.close(true);

    const acknowledged = new Set<string>();
    let cookie = '';
    let attempted = 0;
    let lostInFlight = 0;
    for (let round = 0; round < ROUNDS; round++) {
      const { proc, base } = await startChild();
      const exited = new Promise<void>((resolve) => proc.once('exit', () => resolve()));
      if (!cookie) {
        const res = await fetch(`${base}/api/session`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ email: firm.users.estimator.email, password: firm.password }),
        });
        expect(res.status).toBe(200);
        cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
      }
      // Four writers keep requests in flight; once this round has had three writes
      // acknowledged (the process is warm), kill it at a random moment 0-300 ms later.
      const ackedBefore = acknowledged.size;
      let killScheduled = false;
      const maybeScheduleKill = () => {
        if (killScheduled || acknowledged.size - ackedBefore < 3) return;
        killScheduled = true;
        setTimeout(() => proc.kill('SIGKILL'), Math.floor(Math.random() * 300));
      };
      const writer = async () => {
        for (;;) {
          attempted++;
          try {
            const res = await fetch(`${base}/api/quotes`, {
              method: 'POST',
              headers: { 'content-type': 'application/json', cookie },
              body: JSON.stringify({ customerId: customer.id, siteId: site.id }),
            });
            if (res.status !== 201) throw new Error(`unexpected ${res.status}: ${await res.text()}`);
            const body = (await res.json()) as { quote: { id: string } };
            acknowledged.add(body.quote.id);
            maybeScheduleKill();
          } catch (err) {
            if (err instanceof Error && err.message.startsWith('unexpected')) throw err;
            lostInFlight++;
            return; // the process is gone: this request was never acknowledged
          }
        }
      };
      await Promise.all([writer(), writer(), writer(), writer()]);
      await exited;
    }

    expect(await integrityCheck(file)).toBe('ok');
    const check = await openDatabase({ file });
    try {
      const rows = await check.em.fork().find(Quote, { organization: firm.firm.id }, { fields: ['id', 'number'] });
      const present = new Set(rows.map((q) => q.id));
      const missing = [...acknowledged].filter((id) => !present.has(id));
      console.log(
        `crash durability: ${ROUNDS} SIGKILLs, ${attempted} writes attempted, ${acknowledged.size} acknowledged, ` +
          `${lostInFlight} cut off in flight, ${rows.length} quotes stored, ${missing.length} acknowledged missing`,
      );
      expect(acknowledged.size).toBeGreaterThanOrEqual(3 * ROUNDS);
      expect(missing).toEqual([]);
      // Quote numbers stay unique per firm after every crash.
      expect(new Set(rows.map((q) => q.number)).size).toBe(rows.length);
    } finally {
      await check.close(true);
    }
  });
});
