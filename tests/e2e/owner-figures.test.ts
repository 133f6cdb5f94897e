/**
 * The owner's figures end to end on the demo year: open the figures, change the period,
 * download a table's CSV, and check its numbers are the table's numbers.
 */
import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS } from '@gloaming/db';
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

const owner = DEMO_ACCOUNTS.find((a) => a.role === 'owner')!;
/** "£12,345.60", "42.9%", "1,234" -> 12345.6, 42.9, 1234; a dash is empty. */
const numberOf = (text: string) => {
  const t = text.replace(/[£€$,%\s d]/g, '');
  return t === '–' || t === '' ? null : Number(t);
};

describe('owner figures', () => {
  it('opens the figures, changes the period, and the CSV download matches the table', async () => {
    const { page, context, problems } = await browser.newPage();
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password').fill(owner.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();
    await page.getByRole('link', { name: 'Figures' }).click();
    await page.getByRole('heading', { name: 'Figures', level: 1 }).waitFor();
    await page.getByRole('heading', { name: 'Funnel' }).waitFor();
    await page.waitForLoadState('networkidle');
    await page.screenshot({ path: screenshotPath('figures-12-months'), fullPage: true });
    const created12 = numberOf(
      await page.locator('table[data-figure-table="funnel.csv"] tbody tr').first().locator('td').nth(1).innerText(),
    );
    expect(created12).toBeGreaterThan(100); // the demo year has 150 quotes

    await page.getByLabel('Period', { exact: true }).selectOption('last-3-months');
    await page.getByRole('button', { name: 'Show' }).click();
    await page.waitForURL(/period=last-3-months/);
    await page.waitForLoadState('networkidle');
    const table = page.locator('table[data-figure-table="months.csv"]');
    await expect.poll(async () => table.locator('tbody tr').count()).toBe(3);
    await page.screenshot({ path: screenshotPath('figures-3-months'), fullPage: true });

    const cells = await table
      .locator('tbody tr')
      .evaluateAll((rows) => rows.map((r) => Array.from(r.querySelectorAll('td'), (td) => td.textContent ?? '')));
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download Month by month as CSV' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('months.csv');
    const csv = (await readFile((await download.path())!, 'utf8')).replace(/^\uFEFF/, '');
    const lines = csv.trim().split(/\r\n/);
    expect(lines[0]).toBe('Month,Created,Sent,Viewed,Approved,Deposit paid,Overall,Won value');
    const rows = lines.slice(1).map((l) => l.split(','));
    expect(rows).toHaveLength(cells.length);
    rows.forEach((row, i) => {
      expect(row[0]).toBe(cells[i]![0]);
      for (let c = 1; c < row.length; c++)
        expect(row[c] === '' ? null : Number(row[c]), `row ${i} column ${c}`).toBe(numberOf(cells[i]![c]!));
    });
    // a quarter holds fewer quotes than a year
    const created3 = numberOf(
      await page.locator('table[data-figure-table="funnel.csv"] tbody tr').first().locator('td').nth(1).innerText(),
    );
    expect(created3).toBeLessThan(created12!);
    // expected noise: the session check before signing in answers 401
    expect(problems.filter((p) => !/status of 401/.test(p))).toEqual([]);
    await context.close();
  });
});
