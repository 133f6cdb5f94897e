/**
 * The estimate grid in Chromium (playwright-core, Debian's chromium) against the production
 * build served by the built api, with a 5,000-line quote:
 * - opening the quote: navigation start -> the grid's rows and the totals painted with the
 *   main thread free (the end of any long task that began before then), median of five opens;
 * - keystroke in a quantity cell -> new total painted (bench/grid-keystroke.ts), p95;
 * - scrolling the whole grid at full speed: one viewport further every animation frame from
 *   top to bottom; each frame's duration is the gap between two requestAnimationFrame calls.
 */
import { DEMO_ACCOUNTS } from '@gloaming/db';
import type { Page } from 'playwright-core';
import { launchBrowser } from '../../tests/support/browser';
import { startBuiltServer } from '../../tests/support/server';
import { allowBundledNames, createLargeQuote, largeEstimate, measureQuantityKeystrokes } from '../grid-keystroke';
import { median, ms, percentile, type BenchRow, type Suite } from '../support/report';

const LINES = 5000;
const SUITE = 'grid';

/** Page-side: when the grid's first line and the total are on screen, mark the moment (after the frame that shows them). */
const READY_SCRIPT = `(() => {
  const w = window;
  w.__longTasks = [];
  try {
    new PerformanceObserver((list) => { for (const e of list.getEntries()) w.__longTasks.push([e.startTime, e.duration]); })
      .observe({ type: 'longtask', buffered: true });
  } catch {}
  w.__quoteReady = new Promise((resolve) => {
    const check = () => {
      const total = document.querySelector('[data-total="total"]');
      const row = document.querySelector('[role="grid"] [role="row"][aria-rowindex="2"]');
      if (total && total.textContent && row) {
        observer.disconnect();
        requestAnimationFrame(() => setTimeout(() => resolve(performance.now()), 0));
      }
    };
    const observer = new MutationObserver(check);
    document.addEventListener('DOMContentLoaded', () => { observer.observe(document.body, { childList: true, subtree: true, characterData: true }); check(); });
  });
})();`;

async function openQuote(page: Page, url: string): Promise<number> {
  await page.goto(url);
  return page.evaluate(async () => {
    const w = window as unknown as { __quoteReady: Promise<number>; __longTasks: Array<[number, number]> };
    const ready = await w.__quoteReady;
    const blocking = w.__longTasks.filter(([start]) => start < ready).map(([start, d]) => start + d);
    return Math.max(ready, ...blocking);
  });
}

async function scrollWholeGrid(page: Page): Promise<number[]> {
  return page.evaluate(
    () =>
      new Promise<number[]>((resolve) => {
        const grid = document.querySelector<HTMLElement>('[role="grid"][aria-label="Estimate lines"]');
        if (!grid) throw new Error('no grid on the page');
        grid.scrollTop = 0;
        const frames: number[] = [];
        let last = 0;
        const step = (t: number) => {
          frames.push(t - last);
          last = t;
          if (grid.scrollTop + grid.clientHeight >= grid.scrollHeight - 1) return resolve(frames);
          grid.scrollTop += grid.clientHeight;
          requestAnimationFrame(step);
        };
        requestAnimationFrame((t) => {
          last = t;
          requestAnimationFrame((t2) => {
            last = t2;
            grid.scrollTop += grid.clientHeight;
            requestAnimationFrame(step);
          });
        });
      }),
  );
}

export const gridSuite: Suite = async ({ quick, log }) => {
  const server = await startBuiltServer();
  const browser = await launchBrowser();
  const rows: BenchRow[] = [];
  try {
    const { page } = await browser.newPage({ width: 1280, height: 800 });
    await allowBundledNames(page);
    await page.addInitScript(READY_SCRIPT);
    const estimator = DEMO_ACCOUNTS.find((a) => a.role === 'estimator')!;
    const quoteId = await createLargeQuote(page, server.baseUrl, estimator, largeEstimate(LINES));
    const url = `${server.baseUrl}/quotes/${quoteId}`;
    log(`  ${LINES}-line quote ${quoteId} created`);

    const opens: number[] = [];
    for (let i = 0; i < (quick ? 2 : 5); i++) opens.push(await openQuote(page, url));
    rows.push({
      suite: SUITE,
      case: `open a ${LINES.toLocaleString('en-GB')}-line quote, to interactive`,
      figure: `median ${ms(median(opens))}`,
      value: median(opens),
      unit: 'ms',
      target: 'median < 1,500 ms',
      met: median(opens) < 1500,
      note: `${opens.length} opens: ${opens.map((o) => o.toFixed(0)).join(', ')} ms (first with a cold cache)`,
    });

    await measureQuantityKeystrokes(page, 10); // warm-up, not counted
    const keys = await measureQuantityKeystrokes(page, quick ? 20 : 60);
    const p95 = percentile(keys, 95);
    rows.push({
      suite: SUITE,
      case: 'keystroke in a quantity cell -> totals painted',
      figure: `p95 ${ms(p95)}`,
      value: p95,
      unit: 'ms',
      target: 'p95 < 50 ms',
      met: p95 < 50,
      note: `${keys.length} keystrokes; p50 ${ms(median(keys))}, max ${ms(Math.max(...keys))}`,
    });

    await scrollWholeGrid(page); // warm-up pass
    const frames = await scrollWholeGrid(page);
    const worst = Math.max(...frames);
    const mid = median(frames);
    rows.push({
      suite: SUITE,
      case: 'scroll the whole grid at full speed: longest frame',
      figure: `max ${ms(worst)}`,
      value: worst,
      unit: 'ms',
      target: 'no frame over 50 ms',
      met: worst <= 50,
      note: `${frames.length} frames, one viewport per frame; ${frames.filter((f) => f > 50).length} over 50 ms`,
    });
    rows.push({
      suite: SUITE,
      case: 'scroll the whole grid at full speed: median frame',
      figure: `median ${ms(mid)}`,
      value: mid,
      unit: 'ms',
      target: 'median < 17 ms',
      met: mid < 17,
      note: `p95 ${ms(percentile(frames, 95))}`,
    });
  } finally {
    await browser.close();
    await server.stop();
  }
  return rows;
};
