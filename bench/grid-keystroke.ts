/**
 * Estimate grid: keystroke in a quantity cell -> live totals painted, on a large quote, in
 * Chromium against the production build. Reusable: the e2e test imports the pieces, and
 * `npx tsx bench/grid-keystroke.ts [lines] [samples]` runs it on its own (after `npx turbo run
 * build`) and prints the figures beside the target.
 *
 * What one sample is: a capture-phase keydown listener marks `grid-keystroke` at the event's
 * own time stamp; the sample ends when the total on screen has changed and the frame that
 * shows it has been produced (requestAnimationFrame, then a task after it), marked
 * `grid-totals-painted`. The figure is `performance.measure` between the two.
 */
import type { EstimateContent, EstimateLine } from '@gloaming/contracts';
import type { Page } from 'playwright-core';

/** Target for the later performance work: p95 of keystroke -> totals painted. */
export const KEYSTROKE_TARGET_P95_MS = 50;

const AREAS = ['Front garden', 'Driveway', 'Terrace', 'Lawn border', 'Pond and rill', 'Rear wall', 'Pergola', 'Side path'];
const ITEMS: [string, string, number][] = [
  ['Spike uplight 3 W, 350 mA', 'each', 2450],
  ['Path light 2 W, 24 V', 'each', 3120],
  ['Twin cable 1.5 mm²', 'm', 184],
  ['Connector block IP68, 3 way', 'each', 410],
  ['Driver 700 mA, 9-42 V', 'each', 3890],
  ['Install fitting and make off', 'hour', 3800],
];

/** A deterministic estimate of `count` lines over eight areas, with mixed VAT rates, options and groups. */
export function largeEstimate(count: number): EstimateContent {
  const per = Math.ceil(count / AREAS.length);
  const sections = AREAS.map((name, s) => {
    const lines: EstimateLine[] = [];
    for (let i = 0; i < per && s * per + i < count; i++) {
      const n = s * per + i;
      const [description, unit, cost] = ITEMS[n % ITEMS.length]!;
      lines.push({
        id: `bench-${n}`,
        productId: null,
        description: `${description} (${n + 1})`,
        quantityMilli: ((n % 9) + 1) * 1000,
        unit,
        unitCostMinor: cost,
        pricingMode: 'markup',
        pricingBp: 3500,
        unitPriceMinor: Math.round((cost * 13_500) / 10_000),
        vatRateBp: n % 17 === 0 ? 500 : 2000,
        discount: null,
        optional: n % 53 === 0,
        alternativeGroup: null,
        selected: n % 53 !== 0,
        note: '',
        circuitId: null,
        overridden: false,
      });
    }
    return { id: `bench-area-${s}`, name: name, lines };
  });
  return { sections, discount: null, deposit: { kind: 'percent', bp: 3000 }, introduction: '' };
}

/**
 * Sign in, start a quote for a new customer and save `content` as its estimate, through the
 * api as the page would (same cookies). Returns the quote id.
 */
export async function createLargeQuote(
  page: Page,
  baseUrl: string,
  login: { email: string; password: string },
  content: EstimateContent,
): Promise<string> {
  await allowBundledNames(page);
  await page.goto(`${baseUrl}/`);
  await page.getByLabel('E-mail').fill(login.email);
  await page.getByLabel('Password').fill(login.password);
  await page.keyboard.press('Enter');
  await page.getByRole('heading', { name: 'Quotes', level: 1 }).waitFor();
  return page.evaluate(async (doc) => {
    const post = (url: string, body: unknown, method = 'POST') =>
      fetch(url, { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) }).then(async (r) => {
        if (!r.ok) throw new Error(`${method} ${url}: ${r.status} ${await r.text()}`);
        return r.json();
      });
    const customer = await post('/api/customers', {
      name: 'Bench Measurement Ltd',
      sites: [{ label: 'Test garden', addressLines: '1 Long Border', postcode: 'LB1 1AA' }],
    });
    const quote = await post('/api/quotes', { customerId: customer.customer.id, siteId: customer.customer.sites[0].id });
    await post(`/api/quotes/${quote.quote.id}/revisions/1`, { version: quote.revision.version, content: doc }, 'PUT');
    return quote.quote.id as string;
  }, content);
}

/**
 * tsx and vitest transpile with esbuild's keepNames, which wraps named functions inside the
 * callbacks given to page.evaluate in a `__name(...)` helper the page does not have.
 */
export async function allowBundledNames(page: Page): Promise<void> {
  await page.addInitScript('window.__name = (f) => f;');
}

/** Arm the page-side timing: marks the next keydown and resolves when the totals have been painted. */
async function armSample(page: Page): Promise<void> {
  await page.evaluate(() => {
    const w = window as unknown as { __gridSample?: Promise<number> };
    const total = document.querySelector('[data-total="total"]');
    if (!total) throw new Error('no total on the page');
    const before = total.textContent;
    w.__gridSample = new Promise<number>((resolve) => {
      const onKey = (e: KeyboardEvent) => {
        performance.clearMarks('grid-keystroke');
        performance.mark('grid-keystroke', { startTime: e.timeStamp });
      };
      document.addEventListener('keydown', onKey, { capture: true, once: true });
      const done = () => {
        observer.disconnect();
        requestAnimationFrame(() =>
          setTimeout(() => {
            performance.clearMarks('grid-totals-painted');
            performance.mark('grid-totals-painted');
            resolve(performance.measure('grid-keystroke-to-totals', 'grid-keystroke', 'grid-totals-painted').duration);
          }, 0),
        );
      };
      const observer = new MutationObserver(() => {
        if (total.textContent !== before) done();
      });
      observer.observe(total, { characterData: true, childList: true, subtree: true });
    });
  });
}

/**
 * Time `samples` keystrokes in the quantity cell of the grid's second line: the cell is opened
 * with Enter, then a digit and Backspace alternate, each changing the quantity and so the total.
 */
export async function measureQuantityKeystrokes(page: Page, samples: number): Promise<number[]> {
  const grid = page.getByRole('grid', { name: 'Estimate lines' });
  await grid.focus();
  await page.keyboard.press('Control+Home');
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('ArrowDown'); // the second line of the first area
  await page.keyboard.press('Home');
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('ArrowRight'); // Qty
  await page.keyboard.press('Enter'); // edit, keeping the quantity
  await page.getByRole('textbox', { name: 'Cell value' }).waitFor();
  const times: number[] = [];
  for (let i = 0; i < samples; i++) {
    await armSample(page);
    await page.keyboard.press(i % 2 === 0 ? String(3 + ((i / 2) % 7)) : 'Backspace');
    times.push(await page.evaluate(() => (window as unknown as { __gridSample: Promise<number> }).__gridSample));
  }
  await page.keyboard.press('Escape');
  return times;
}

export function percentile(values: readonly number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

/** One line for the log: the figure beside the target. */
export function keystrokeReport(lines: number, times: readonly number[]): string {
  const p95 = percentile(times, 95);
  const verdict = p95 < KEYSTROKE_TARGET_P95_MS ? 'within target' : 'OVER target';
  return (
    `grid keystroke -> totals painted, ${lines.toLocaleString('en-GB')} lines, ${times.length} keystrokes: ` +
    `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${p95.toFixed(1)} ms, max ${Math.max(...times).toFixed(1)} ms ` +
    `(target p95 < ${KEYSTROKE_TARGET_P95_MS} ms: ${verdict}; ratio ${(p95 / KEYSTROKE_TARGET_P95_MS).toFixed(2)})`
  );
}

async function main(): Promise<void> {
  const [{ DEMO_ACCOUNTS }, { launchBrowser }, { startBuiltServer }] = await Promise.all([
    import('@gloaming/db'),
    import('../tests/support/browser'),
    import('../tests/support/server'),
  ]);
  const lines = Number(process.argv[2] ?? 5000);
  const samples = Number(process.argv[3] ?? 60);
  const server = await startBuiltServer();
  const browser = await launchBrowser();
  try {
    const { page } = await browser.newPage({ width: 1280, height: 800 });
    const estimator = DEMO_ACCOUNTS.find((a) => a.role === 'estimator')!;
    const quoteId = await createLargeQuote(page, server.baseUrl, estimator, largeEstimate(lines));
    await page.goto(`${server.baseUrl}/quotes/${quoteId}`);
    await page.locator('[data-total="total"]').waitFor();
    await measureQuantityKeystrokes(page, 10); // warm-up, not counted
    console.log(keystrokeReport(lines, await measureQuantityKeystrokes(page, samples)));
  } finally {
    await browser.close();
    await server.stop();
  }
}

if (process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href) {
  main().catch((err: unknown) => {
    console.error(err);
    process.exit(1);
  });
}
