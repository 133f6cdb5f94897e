/**
 * Firm settings end to end on the demo firm: the owner changes the default markup and the terms
 * on the settings screen; a quote made afterwards takes them, a quote sent before keeps its old
 * values; the owner's activity log shows the change; an estimator cannot open the settings.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
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
const estimator = DEMO_ACCOUNTS.find((a) => a.role === 'estimator')!;

async function signIn(page: Page, account: { email: string; password: string }) {
  await page.goto(`${server.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(account.email);
  await page.getByLabel('Password').fill(account.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}

/** The api from inside the signed-in page (its cookie and origin), answering status and body. */
async function api(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; body: unknown }> {
  return page.evaluate(
    async ([m, p, b]) => {
      const res = await fetch(p as string, {
        method: m as string,
        headers: b === undefined ? {} : { 'Content-Type': 'application/json' },
        ...(b === undefined ? {} : { body: JSON.stringify(b) }),
      });
      return { status: res.status, body: (await res.json().catch(() => null)) as unknown };
    },
    [method, path, body] as const,
  );
}

type Settings = { markupPercentBp: number; termsText: string };
const revisionSettings = async (page: Page, quoteId: string) =>
  ((await api(page, 'GET', `/api/quotes/${quoteId}`)).body as { revision: { settings: Settings } }).revision.settings;

describe('firm settings', () => {
  it('the owner changes the markup and terms; a new quote takes them, a sent quote keeps its own', async () => {
    const { page, context, problems } = await browser.newPage();
    await signIn(page, owner);

    // a quote the firm sent before the change, with the values it was priced with
    const sentList = (await api(page, 'GET', '/api/quotes?status=sent')).body as { quotes: { id: string; customer: { id: string } }[] };
    expect(sentList.quotes.length).toBeGreaterThan(0); // the demo year has open sent quotes
    const sent = sentList.quotes[0]!;
    const sentBefore = await revisionSettings(page, sent.id);

    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('heading', { name: 'Firm settings', level: 1 }).waitFor();
    await page.getByText('Changes apply to new quotes').waitFor();
    await page.waitForLoadState('networkidle');
    await page.screenshot({ path: screenshotPath('firm-settings'), fullPage: true });

    const markup = page.getByLabel('Default markup (%)');
    const newMarkupBp = sentBefore.markupPercentBp === 4250 ? 4300 : 4250;
    await markup.fill(String(newMarkupBp / 100));
    const terms = `Balance due within 7 days of completion (end-to-end check ${Date.now()}).`;
    await page.getByLabel('Terms and conditions').fill(terms);
    // a bad value first: the contract's message sits beside the field and nothing is sent
    await page.getByLabel('Quote valid for (days)').fill('0');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('At least 1 day.').waitFor();
    await page.screenshot({ path: screenshotPath('firm-settings-field-error') });
    await page.getByLabel('Quote valid for (days)').fill('30');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved').waitFor();
    await page.getByText('All changes saved').waitFor();

    // a new quote takes the new markup and terms
    const created = await api(page, 'POST', '/api/quotes', { customerId: sent.customer.id });
    expect(created.status).toBe(201);
    const newQuote = (created.body as { quote: { id: string } }).quote.id;
    expect(await revisionSettings(page, newQuote)).toMatchObject({ markupPercentBp: newMarkupBp, termsText: terms });
    // the sent quote keeps what it was sent with
    const sentAfter = await revisionSettings(page, sent.id);
    expect(sentAfter).toMatchObject({ markupPercentBp: sentBefore.markupPercentBp, termsText: sentBefore.termsText });
    expect(sentAfter.termsText).not.toBe(terms);

    // the reload shows what was saved
    await page.reload();
    await page.getByRole('heading', { name: 'Firm settings', level: 1 }).waitFor();
    expect(await page.getByLabel('Default markup (%)').inputValue()).toBe(String(newMarkupBp / 100));
    expect(await page.getByLabel('Terms and conditions').inputValue()).toBe(terms);

    // the activity log says who changed what
    await page.getByRole('link', { name: 'Activity' }).click();
    await page.getByRole('heading', { name: 'Activity', level: 1 }).waitFor();
    await page.getByLabel('Kind').selectOption('firm');
    const entry = page.getByTestId('activity-entry').filter({ hasText: 'Changed the firm settings' }).first();
    await entry.waitFor();
    expect(await entry.innerText()).toMatch(new RegExp(`${owner.name}[\\s\\S]*Changed the firm settings: default markup, terms`));
    await page.screenshot({ path: screenshotPath('activity-firm'), fullPage: true });

    // the new quote's own log, on its page
    await page.goto(`${server.baseUrl}/quotes/${newQuote}`);
    await page.getByRole('button', { name: 'Show who did what' }).click();
    await page.getByRole('region', { name: 'Quote activity' }).getByText(/Created Q-\d+/).waitFor();
    await page.getByRole('region', { name: 'Quote activity' }).screenshot({ path: screenshotPath('activity-quote') });

    // expected noise: the session check before signing in answers 401; the bad-days try sends nothing
    expect(problems.filter((p) => !/status of 401/.test(p))).toEqual([]);
    await context.close();
  });

  it('an estimator has no settings in the navigation and is sent home from the address', async () => {
    const { page, context } = await browser.newPage();
    await signIn(page, estimator);
    await page.getByRole('link', { name: 'Quotes' }).first().waitFor();
    expect(await page.getByRole('link', { name: 'Settings' }).count()).toBe(0);
    expect(await page.getByRole('link', { name: 'Activity' }).count()).toBe(0);
    await page.goto(`${server.baseUrl}/settings`);
    await page.waitForURL((u) => u.pathname !== '/settings');
    expect(await page.getByRole('heading', { name: 'Firm settings' }).count()).toBe(0);
    expect((await api(page, 'GET', '/api/organization/settings')).status).toBe(403);
    expect((await api(page, 'GET', '/api/activity')).status).toBe(403);
    await context.close();
  });
});
