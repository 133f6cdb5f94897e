/**
 * The estimate grid end to end: an estimator starts a quote and builds it with the keyboard
 * only (add lines, paste a block of rows as spreadsheet text, undo, fill down); the totals on
 * screen and on the server equal the engine's computeQuoteTotals for the same lines.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QuoteDetailResponse, estimateQuoteInput } from '@gloaming/contracts';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import { computeQuoteTotals, formatMoney } from '@gloaming/engine';
import type { Page } from 'playwright-core';
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

/** Spreadsheet text as a clipboard holds it, delivered as a real paste event on the grid. */
async function pasteText(page: Page, text: string) {
  await page.getByRole('grid', { name: 'Estimate lines' }).evaluate((grid, t) => {
    const data = new DataTransfer();
    data.setData('text/plain', t);
    grid.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
  }, text);
}

async function lineDescriptions(page: Page): Promise<string[]> {
  return page.locator('[role="row"] [data-col="description"]').allInnerTexts();
}

describe('estimate grid', () => {
  it('builds a quote from the keyboard and its totals match the engine', async () => {
    const { page, context, problems } = await browser.newPage({ width: 1600, height: 900 });
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill(estimator.email);
    await page.getByLabel('Password').fill(estimator.password);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Quotes', level: 1 }).waitFor();

    // A customer to quote for (the customers screen is tested on its own).
    const created = await page.evaluate(async () => {
      const res = await fetch('/api/customers', {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ name: 'Marisol Quenby', sites: [{ label: 'Home', addressLines: '12 Heron Walk\nFallowfield', postcode: 'FW4 7TT' }] }),
      });
      return res.status;
    });
    expect(created).toBe(201);

    // New quote: the button by keyboard, type the name, Enter picks, Enter on the site starts it.
    await page.getByRole('button', { name: 'New quote' }).focus();
    await page.keyboard.press('Enter');
    await page.getByRole('combobox', { name: 'Customer' }).waitFor();
    await page.keyboard.type('Quenby');
    await page.getByRole('option', { name: /Marisol Quenby/ }).waitFor();
    await page.keyboard.press('Enter');
    await page.getByLabel('Site').waitFor();
    await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).toBe('SELECT');
    await page.keyboard.press('Enter');
    await page.getByRole('grid', { name: 'Estimate lines' }).waitFor();
    const quoteId = new URL(page.url()).pathname.split('/').pop()!;

    // Line one, typed: description, quantity as a sum, unit, cost (priced by the firm's markup).
    await page.getByRole('grid', { name: 'Estimate lines' }).focus();
    await page.keyboard.press('Control+Enter');
    await page.keyboard.type('Brass spike uplighter');
    await page.keyboard.press('Tab');
    await page.keyboard.type('3*2');
    await page.keyboard.press('Tab');
    await page.keyboard.press('Tab');
    await page.keyboard.type('42.5');
    await page.keyboard.press('Enter');
    await expect.poll(() => lineDescriptions(page)).toEqual(['Brass spike uplighter']);
    await expect.poll(() => page.locator('[data-col="quantity"]').first().innerText()).toBe('6');

    // A new line and a pasted block of three rows (description, qty, unit, cost).
    await page.keyboard.press('Control+Enter');
    await pasteText(page, 'Path light "Heron"\t4\teach\t31.20\r\nTwin cable 1.5 mm²\t25\tm\t1.84\r\nConnector block IP68\t6\teach\t4.10\r\n');
    await expect.poll(() => lineDescriptions(page)).toEqual(['Brass spike uplighter', 'Path light "Heron"', 'Twin cable 1.5 mm²', 'Connector block IP68']);

    // Undo takes the paste away in one step, redo brings it back.
    await page.keyboard.press('Control+z');
    await expect.poll(() => lineDescriptions(page)).toEqual(['Brass spike uplighter', '']);
    await page.keyboard.press('Control+y');
    await expect.poll(async () => (await lineDescriptions(page)).length).toBe(4);

    // Fill down: set the path light's VAT to 5 % and fill it over the two rows below it.
    for (let i = 0; i < 20; i++) await page.keyboard.press('ArrowLeft');
    await page.keyboard.press('Control+ArrowUp');
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowDown'); // row 2: the path light
    for (let i = 0; i < 8; i++) await page.keyboard.press('ArrowRight'); // the VAT column
    await page.keyboard.type('5');
    await page.keyboard.press('Enter');
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('Shift+ArrowDown');
    await page.keyboard.press('Shift+ArrowDown');
    await page.keyboard.press('Control+d');
    await expect.poll(() => page.locator('[data-col="vat"]').allInnerTexts()).toEqual(['20%', '5%', '5%', '5%']);

    // Autosave lands; the server's copy is what the grid shows.
    await page.getByText(/^Saved \d/).waitFor({ timeout: 15_000 });
    const detail = QuoteDetailResponse.parse(await page.evaluate(async (id) => (await fetch(`/api/quotes/${id}`)).json(), quoteId));
    const lines = detail.revision.content.sections.flatMap((s) => s.lines);
    expect(lines.map((l) => [l.description, l.quantityMilli, l.unitCostMinor, l.vatRateBp])).toEqual([
      ['Brass spike uplighter', 6000, 4250, 2000],
      ['Path light "Heron"', 4000, 3120, 500],
      ['Twin cable 1.5 mm²', 25_000, 184, 500],
      ['Connector block IP68', 6000, 410, 500],
    ]);

    const engine = computeQuoteTotals(estimateQuoteInput(detail.revision.content, detail.revision.settings));
    const { currency, locale } = detail.revision.settings;
    expect(detail.revision.totals?.totalMinor).toBe(engine.totalMinor);
    expect(detail.quote.valueMinor).toBe(engine.totalMinor);
    expect(await page.locator('[data-total="total"]').innerText()).toBe(formatMoney(engine.totalMinor, currency, locale));
    expect(await page.locator('[data-total="net"]').innerText()).toBe(formatMoney(engine.netMinor, currency, locale));
    expect(await page.locator('[data-total="vat-500"]').innerText()).toBe(formatMoney(engine.vatByRate.find((r) => r.rateBp === 500)!.vatMinor, currency, locale));
    expect(await page.locator('[data-total="deposit"]').innerText()).toBe(formatMoney(engine.deposit!.depositMinor, currency, locale));
    expect(await page.locator('[data-total="cost"]').innerText()).toBe(formatMoney(engine.costMinor, currency, locale));

    await page.screenshot({ path: screenshotPath('estimate-grid'), fullPage: false });

    // The list shows it with its value.
    await page.goto(`${server.baseUrl}/quotes`);
    await page.getByRole('link', { name: detail.quote.reference }).waitFor();
    await page.screenshot({ path: screenshotPath('quote-list'), fullPage: true });
    expect(problems.filter((p) => !/status of 401/.test(p))).toEqual([]);
    await context.close();
  }, 120_000);
});
