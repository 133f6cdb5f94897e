/**
 * Start-up: `npm start` on a built tree (turbo finds every build cached) until the first page
 * is served (GET / answers 200 with the workbench's index.html), twice: on a new data folder
 * (migrations and the demo seed run first) and again on the same folder (an existing database).
 * Free ports for the api and the local fakes, so nothing collides with another running copy.
 * With BENCH_COLD_INSTALL=1, also a cold `npm ci` (empty npm cache, no node_modules) in a
 * throwaway clone of the committed tree, for information.
 */
import { execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { freePorts } from '../../tests/support/server';
import { repoRoot } from '../support/paths';
import { info, ms, type BenchRow, type Suite } from '../support/report';

/**
 * Build first, untimed: other work in the tree may have changed a source since the bench's
 * own build, and the figure is for a built tree (turbo finding its cache), not a rebuild.
 */
function ensureBuilt(): void {
  execFileSync('npx', ['turbo', 'run', 'build', '--output-logs=errors-only'], { cwd: repoRoot, stdio: 'ignore' });
}

async function timeToFirstPage(dataDir: string, command: [string, string[]] = ['npm', ['start']]): Promise<number> {
  if (command[0] === 'npm') ensureBuilt();
  const [port, smtp, inbox, payments] = (await freePorts(4)) as [number, number, number, number];
  const t0 = performance.now();
  const child = spawn(command[0], command[1], {
    cwd: repoRoot,
    detached: true, // its own process group: npm, turbo and node are stopped together
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      ...process.env,
      PORT: String(port),
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      DATA_DIR: dataDir,
      GLOAMING_SMTP_CATCHER_PORT: String(smtp),
      GLOAMING_INBOX_PORT: String(inbox),
      GLOAMING_PAYMENTS_FAKE_PORT: String(payments),
    },
  });
  let out = '';
  child.stdout.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr.on('data', (d: Buffer) => (out += d.toString()));
  try {
    for (;;) {
      if (child.exitCode !== null) throw new Error(`npm start exited ${child.exitCode}: ${out.slice(-1000)}`);
      if (performance.now() - t0 > 60_000) throw new Error(`no page in 60 s: ${out.slice(-1000)}`);
      try {
        const res = await fetch(`http://127.0.0.1:${port}/`);
        const html = await res.text();
        if (res.status === 200 && html.includes('id="root"')) return performance.now() - t0;
      } catch {
        // not listening yet
      }
      await new Promise((r) => setTimeout(r, 50));
    }
  } finally {
    const exited = new Promise((r) => child.once('exit', r));
    if (child.exitCode === null && child.pid) process.kill(-child.pid, 'SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    if (child.exitCode === null && child.pid) process.kill(-child.pid, 'SIGKILL');
  }
}

function coldInstall(): number {
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-cold-ci-'));
  try {
    execFileSync('git', ['clone', '--quiet', '--no-hardlinks', repoRoot, join(dir, 'repo')], { stdio: 'ignore' });
    const t0 = performance.now();
    execFileSync('npm', ['ci', '--no-audit', '--no-fund', '--cache', join(dir, 'npm-cache')], { cwd: join(dir, 'repo'), stdio: 'ignore', timeout: 900_000 });
    return performance.now() - t0;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export const startupSuite: Suite = async ({ log }) => {
  const rows: BenchRow[] = [];
  const dataDir = mkdtempSync(join(tmpdir(), 'gloaming-startup-'));
  try {
    const fresh = await timeToFirstPage(dataDir);
    const again = await timeToFirstPage(dataDir);
    const serverOnly = await timeToFirstPage(dataDir, [process.execPath, ['apps/api/dist/main.js']]);
    const otherDir = mkdtempSync(join(tmpdir(), 'gloaming-startup-'));
    const serverFresh = await timeToFirstPage(otherDir, [process.execPath, ['apps/api/dist/main.js']]).finally(() => rmSync(otherDir, { recursive: true, force: true }));
    log(`  first page: new database ${ms(fresh)}, existing database ${ms(again)}; the server alone ${ms(serverFresh)} and ${ms(serverOnly)}`);
    rows.push(
      {
        suite: 'startup',
        case: '`npm start` on a built tree -> first page, new database',
        figure: ms(fresh),
        value: fresh,
        unit: 'ms',
        target: '< 5,000 ms',
        met: fresh < 5000,
        note: 'turbo build cached, migrations and the demo seed included',
      },
      {
        suite: 'startup',
        case: '`npm start` on a built tree -> first page, existing database',
        figure: ms(again),
        value: again,
        unit: 'ms',
        target: '< 5,000 ms',
        met: again < 5000,
      },
      {
        suite: 'startup',
        case: '`node apps/api/dist/main.js` alone -> first page, existing database',
        figure: ms(serverOnly),
        value: serverOnly,
        unit: 'ms',
        target: info,
        met: null,
        note: 'the part of `npm start` after turbo has checked its cache',
      },
      {
        suite: 'startup',
        case: '`node apps/api/dist/main.js` alone -> first page, new database',
        figure: ms(serverFresh),
        value: serverFresh,
        unit: 'ms',
        target: info,
        met: null,
        note: 'migrations and the demo seed included',
      },
    );
  } finally {
    rmSync(dataDir, { recursive: true, force: true });
  }
  if (process.env.BENCH_COLD_INSTALL === '1') {
    log('  cold npm ci in a throwaway clone (empty npm cache)...');
    const took = coldInstall();
    rows.push({ suite: 'startup', case: 'cold `npm ci` (empty cache, throwaway clone of HEAD)', figure: `${(took / 1000).toFixed(0)} s`, value: took / 1000, unit: 's', target: info, met: null });
  } else {
    rows.push({ suite: 'startup', case: 'cold `npm ci`', figure: 'not run (set BENCH_COLD_INSTALL=1)', value: null, unit: 's', target: info, met: null });
  }
  return rows;
};
