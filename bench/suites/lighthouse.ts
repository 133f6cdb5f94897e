/**
 * The portal under Lighthouse 12.2.3 (its default mobile configuration: a phone screen,
 * simulated slow 4G and a 4x slower CPU) with Debian's chromium, against a real portal link:
 * the demo firm's data with one sent quote and a live token written before the server starts
 * (tests/support/bulk-firm.ts), opened at /portal/q/<token>. Median of three runs per score.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { portalQuotePath } from '@gloaming/contracts';
import { CHROMIUM_PATH } from '../../tests/support/browser';
import { createBulkFirm } from '../../tests/support/bulk-firm';
import { startBuiltServer } from '../../tests/support/server';
import { benchDir } from '../support/paths';
import { median, type BenchRow, type Suite } from '../support/report';

const run = promisify(execFile);

interface Lhr {
  finalDisplayedUrl: string;
  categories: Record<string, { score: number | null; auditRefs: Array<{ id: string; weight: number }> }>;
  audits: Record<string, { score: number | null; scoreDisplayMode: string; title: string; numericValue?: number }>;
}

async function lighthouse(url: string): Promise<Lhr> {
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-lighthouse-'));
  const out = join(dir, 'report.json');
  try {
    await run(
      join(benchDir, '../node_modules/.bin/lighthouse'),
      [
        url,
        '--only-categories=performance,accessibility',
        '--output=json',
        `--output-path=${out}`,
        '--quiet',
        `--chrome-flags=--headless=new --no-sandbox --disable-gpu --disable-background-networking --disable-component-update --disable-sync --no-first-run --user-data-dir=${join(dir, 'profile')}`,
      ],
      { env: { ...process.env, CHROME_PATH: CHROMIUM_PATH, XDG_CONFIG_HOME: join(dir, 'config'), XDG_CACHE_HOME: join(dir, 'cache') }, timeout: 180_000 },
    );
    return JSON.parse(readFileSync(out, 'utf8')) as Lhr;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const failing = (lhr: Lhr, ids: string[]) =>
  ids.filter((id) => {
    const a = lhr.audits[id];
    return a && a.scoreDisplayMode === 'binary' && a.score === 0;
  });

export const lighthouseSuite: Suite = async ({ quick, log }) => {
  const firm = await createBulkFirm(200, 1, 0);
  const token = firm.portalTokens[0];
  if (!token) throw new Error('no portal token was made for the Lighthouse run');
  const server = await startBuiltServer({ DATA_DIR: firm.dataDir });
  const rows: BenchRow[] = [];
  try {
    const url = `${server.baseUrl}${portalQuotePath(token)}`;
    const check = await fetch(`${server.baseUrl}/api/portal/${token}`);
    log(`  portal link answers ${check.status} from /api/portal/:token`);
    const reports: Lhr[] = [];
    for (let i = 0; i < (quick ? 1 : 3); i++) reports.push(await lighthouse(url));
    const score = (lhr: Lhr, cat: string) => Math.round((lhr.categories[cat]?.score ?? 0) * 100);
    const perf = reports.map((r) => score(r, 'performance'));
    const a11y = reports.map((r) => score(r, 'accessibility'));
    const last = reports[reports.length - 1]!;
    const metric = (id: string) => last.audits[id]?.numericValue;
    const a11yFails = failing(last, (last.categories.accessibility?.auditRefs ?? []).map((a) => a.id));
    const apiNote = check.status === 200 ? 'a sent quote' : `GET /api/portal/:token answered ${check.status}, so the page shown is what the portal renders for that`;
    rows.push({
      suite: 'lighthouse',
      case: 'portal quote link: performance score (mobile)',
      figure: `${median(perf)}`,
      value: median(perf),
      unit: 'score',
      target: '>= 95',
      met: median(perf) >= 95,
      note: `runs ${perf.join(', ')}; ${apiNote}; last run FCP ${metric('first-contentful-paint')?.toFixed(0)} ms, LCP ${metric('largest-contentful-paint')?.toFixed(0)} ms, TBT ${metric('total-blocking-time')?.toFixed(0)} ms, CLS ${metric('cumulative-layout-shift')?.toFixed(3)}`,
    });
    rows.push({
      suite: 'lighthouse',
      case: 'portal quote link: accessibility score',
      figure: `${median(a11y)}`,
      value: median(a11y),
      unit: 'score',
      target: '100',
      met: median(a11y) === 100,
      note: a11yFails.length ? `failing audits: ${a11yFails.join(', ')}` : `runs ${a11y.join(', ')}`,
    });
  } finally {
    await server.stop();
    rmSync(firm.dataDir, { recursive: true, force: true });
  }
  return rows;
};
