/**
 * The estimate editor's finishing pieces, in Chromium against the production build:
 * - a 5,000-line quote renders only the rows in view while scrolling, and typing in a
 *   quantity cell is timed keystroke -> totals painted (printed beside the target, not asserted:
 *   speed targets live in bench/grid-keystroke.ts);
 * - scrolled sideways at 1280x800, the line number, product and description columns and the
 *   area names stay in view;
 * - Alt+N starts a new quote (not while typing in the search box); the new quote's deposit is
 *   the firm's default; the quote discount set from the totals panel is priced by the engine,
 *   autosaved, and undone with Ctrl+Z like a grid edit.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QuoteDetailResponse, estimateQuoteInput } from '@gloaming/contracts';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import { computeQuoteTotals, formatMoney } from '@gloaming/engine';
import type { Page } from 'playwright-core';
import {
  allowBundledNames,
  createLargeQuote,
  keystrokeReport,
  largeEstimate,
  measureQuantityKeystrokes,
} from '../../bench/grid-keystroke';
import { launchBrowser, screenshotPath, type BrowserSession } from '../support/browser';
import { startBuiltServer, type RunningServer } from '../support/server';

let server: RunningServer;
let browser: BrowserSession;

beforeAll(async () => {
  server = await startBuiltServer();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const estimator = DEMO_ACCOUNTS.find((a) => a.role === 'estimator')!;
const LINES = 5000;
const unexpected = (problems: string[]) => problems.filter((p) => !/status of 401/.test(p));

/** aria-rowindex of every row element in the DOM (header included). */
const renderedRows = (page: Page) =>
  page.locator('[role="grid"] [role="row"]').evaluateAll((rows) => rows.map((r) => Number(r.getAttribute('aria-rowindex'))));

async function fetchDetail(page: Page, quoteId: string) {
  return QuoteDetailResponse.parse(await page.evaluate(async (id) => (await fetch(`/api/quotes/${id}`)).json(), quoteId));
}

describe('a 5,000-line quote', () => {
  it('renders only the visible rows, keeps what a line is in view sideways, and times a quantity keystroke', async () => {
    const { page, context, problems } = await browser.newPage({ width: 1280, height: 800 });
    const quoteId = await createLargeQuote(page, server.baseUrl, estimator, largeEstimate(LINES));
    await page.goto(`${server.baseUrl}/quotes/${quoteId}`);
    const grid = page.getByRole('grid', { name: 'Estimate lines' });
    await page.locator('[data-total="total"]').waitFor();
    expect(await grid.getAttribute('aria-rowcount')).toBe(String(LINES + 8 + 1)); // lines, 8 area rows, header

    // Virtualised: a window of rows around what is visible, at the top and deep down.
    const top = await renderedRows(page);
    expect(top.length).toBeLessThan(60);
    await grid.evaluate((el) => (el.scrollTop = 34 * 3000));
    await expect.poll(async () => Math.min(...(await renderedRows(page)).filter((i) => i > 1))).toBeGreaterThan(2900);
    const deep = await renderedRows(page);
    expect(deep.length).toBeLessThan(60);
    expect(Math.max(...deep)).toBeLessThan(3200);

    // Sideways: scroll to the far right; the gutter, product and description stay at the left edge.
    await grid.evaluate((el) => {
      el.scrollTop = 0;
      el.scrollLeft = el.scrollWidth;
    });
    await expect.poll(() => grid.evaluate((el) => el.scrollLeft)).toBeGreaterThan(300);
    const box = (await grid.boundingBox())!;
    const firstLine = page
      .locator('[role="row"]')
      .filter({ has: page.locator('[data-col="description"]') })
      .first();
    const description = (await firstLine.locator('[data-col="description"]').boundingBox())!;
    const product = (await firstLine.locator('[data-col="product"]').boundingBox())!;
    const note = (await firstLine.locator('[data-col="note"]').boundingBox())!;
    expect(Math.round(product.x - box.x)).toBeGreaterThanOrEqual(35); // just right of the 36 px gutter
    expect(Math.round(product.x - box.x)).toBeLessThanOrEqual(38);
    expect(Math.round(description.x - product.x)).toBe(120);
    expect(note.x + note.width).toBeLessThanOrEqual(box.x + box.width + 1); // the far column is in view
    expect(await firstLine.locator('[data-col="description"]').innerText()).toBe('Spike uplight 3 W, 350 mA (1)');
    const areaName = page.locator('[data-section-name]').first();
    const area = (await areaName.boundingBox())!;
    expect(area.x).toBeGreaterThanOrEqual(box.x);
    expect(area.x).toBeLessThan(box.x + 60);
    expect(await areaName.innerText()).toMatch(/^Front garden/);
    // what is drawn there is the sticky cell itself, not a cell scrolled underneath it
    const hit = await page.evaluate(
      ({ x, y }) => document.elementFromPoint(x, y)?.closest('[data-col]')?.getAttribute('data-col'),
      { x: description.x + 20, y: description.y + description.height / 2 },
    );
    expect(hit).toBe('description');
    await page.screenshot({ path: screenshotPath('estimate-grid-sticky-1280x800') });

    // Typing in a quantity cell: figures printed for the record, never asserted.
    await grid.evaluate((el) => (el.scrollLeft = 0));
    await measureQuantityKeystrokes(page, 6); // warm-up
    const times = await measureQuantityKeystrokes(page, 30);
    console.log(keystrokeReport(LINES, times));
    expect(times).toHaveLength(30);
    // the edits were cancelled with Escape: the document is unchanged
    const detail = await fetchDetail(page, quoteId);
    expect(detail.revision.content.sections[0]!.lines[1]!.quantityMilli).toBe(2000);
    expect(unexpected(problems)).toEqual([]);
    await context.close();
  }, 180_000);
});

describe('new quote by Alt+N, deposit and discount from the totals panel', () => {
  it('starts a quote with the firm deposit, prices a 10 % discount as the engine does, saves it and undoes it', async () => {
    const { page, context, problems } = await browser.newPage({ width: 1280, height: 800 });
    await allowBundledNames(page);
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill(estimator.email);
    await page.getByLabel('Password').fill(estimator.password);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Quotes', level: 1 }).waitFor();
    const status = await page.evaluate(async () => {
      const res = await fetch('/api/customers', {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({
          name: 'Rosalind Tenterden',
          email: 'rosalind@tenterden.example',
          sites: [{ label: 'Home', addressLines: '3 Weir Close\nOtterbrook', postcode: 'OB2 9LX' }],
        }),
      });
      return res.status;
    });
    expect(status).toBe(201);
    await page.reload();
    await page.getByRole('heading', { name: 'Quotes', level: 1 }).waitFor();

    // Alt+N while typing in the search box types, it does not open the panel.
    const search = page.getByPlaceholder('Customer, address, postcode or Q-number');
    await search.focus();
    await page.keyboard.press('Alt+n');
    expect(await page.getByRole('heading', { name: 'New quote' }).count()).toBe(0);
    await search.evaluate((el) => (el as HTMLInputElement).blur());
    await page.keyboard.press('Alt+n');
    await page.getByRole('combobox', { name: 'Customer' }).waitFor();
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('role'))).toBe('combobox');
    await page.keyboard.type('Tenterden');
    await page.getByRole('option', { name: /Rosalind Tenterden/ }).waitFor();
    await expect.poll(() => page.getByRole('listbox').getByRole('option').count()).toBe(1); // the search has caught up
    await page.keyboard.press('Enter');
    await page.getByLabel('Site').waitFor();
    await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).toBe('SELECT');
    await page.keyboard.press('Enter');
    const grid = page.getByRole('grid', { name: 'Estimate lines' });
    await grid.waitFor();
    const quoteId = new URL(page.url()).pathname.split('/').pop()!;
    await page.getByRole('heading', { name: /Rosalind Tenterden/ }).waitFor();

    // The firm's default deposit (the demo firm's 30 %) is already there.
    expect(await page.getByLabel('Deposit', { exact: true }).inputValue()).toBe('percent');
    expect(await page.getByLabel('Deposit percentage').inputValue()).toBe('30');

    // Two lines by keyboard.
    await grid.focus();
    await page.keyboard.press('Control+Enter');
    await page.keyboard.type('Wall washer 6 W');
    await page.keyboard.press('Tab');
    await page.keyboard.type('4');
    await page.keyboard.press('Tab');
    await page.keyboard.press('Tab');
    await page.keyboard.type('58.40');
    await page.keyboard.press('Enter');
    await page.getByText(/^Saved \d/).waitFor({ timeout: 15_000 });

    // Discount: Percentage, 10, Enter, from the keyboard.
    await page.getByLabel('Discount', { exact: true }).focus();
    await page.getByLabel('Discount', { exact: true }).selectOption('percent');
    const pct = page.getByLabel('Discount percentage');
    await pct.focus();
    await page.keyboard.press('Control+a');
    await page.keyboard.type('10');
    await page.keyboard.press('Enter');
    await expect.poll(() => page.locator('[data-total="discount"]').count()).toBe(1);
    await expect
      .poll(async () => (await fetchDetail(page, quoteId)).revision.content.discount, { timeout: 15_000 })
      .toEqual({ kind: 'percent', bp: 1000 });
    const saved = await fetchDetail(page, quoteId);
    const engine = computeQuoteTotals(estimateQuoteInput(saved.revision.content, saved.revision.settings));
    const { currency, locale } = saved.revision.settings;
    expect(engine.quoteDiscountMinor).toBeGreaterThan(0);
    expect(saved.revision.totals?.totalMinor).toBe(engine.totalMinor);
    expect(await page.locator('[data-total="total"]').innerText()).toBe(formatMoney(engine.totalMinor, currency, locale));
    expect(await page.locator('[data-total="deposit"]').innerText()).toBe(
      formatMoney(engine.deposit!.depositMinor, currency, locale),
    );
    await page.screenshot({ path: screenshotPath('totals-discount-deposit') });

    // Ctrl+Z in the grid takes the discount back, one step at a time, and that is saved too.
    await grid.focus();
    await page.keyboard.press('Control+z'); // 10 % -> 0 %
    await page.keyboard.press('Control+z'); // percentage -> none
    await expect.poll(() => page.getByLabel('Discount', { exact: true }).inputValue()).toBe('none');
    await expect.poll(async () => (await fetchDetail(page, quoteId)).revision.content.discount, { timeout: 15_000 }).toBeNull();
    expect(await page.locator('[data-total="discount"]').count()).toBe(0);
    expect(unexpected(problems)).toEqual([]);
    await context.close();
  }, 120_000);
});
