/**
 * Sign-in end to end: the built server (as `npm start` runs it) on a random port with a
 * fresh demo database, driven by Debian's Chromium.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, type DemoAccount } from '@gloaming/db';
import { launchBrowser, screenshotPath, type BrowserSession } from '../support/browser';
import { startBuiltServer, type RunningServer } from '../support/server';

let server: RunningServer;
let browser: BrowserSession;

beforeAll(async () => {
  server = await startBuiltServer({ GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '4' });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const HOME_HEADING: Record<DemoAccount['role'], string> = { owner: 'Overview', estimator: 'Quotes', installer: 'Jobs' };
const account = (email: string) => DEMO_ACCOUNTS.find((a) => a.email === email)!;
// Expected noise: the first session check answers 401 before anyone signs in, and the
// wrong-password / throttle tests provoke 401 and 429 on purpose.
const unexpected = (problems: string[]) => problems.filter((p) => !/status of (401|429)/.test(p));

describe('sign-in page', () => {
  it('looks finished and has no console errors or CSP violations', async () => {
    const { page, context, problems } = await browser.newPage();
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').waitFor();
    await page.screenshot({ path: screenshotPath('sign-in'), fullPage: true });
    expect(await page.getByRole('button', { name: 'Sign in' }).isVisible()).toBe(true);
    expect(unexpected(problems)).toEqual([]);
    await context.close();
  });

  for (const email of ['harriet@nightjar.example', 'tomasz@nightjar.example', 'callum@nightjar.example']) {
    const a = account(email);
    it(`signs in as the ${a.role}, lands on the ${HOME_HEADING[a.role]} home, and signs out`, async () => {
      const { page, context, problems } = await browser.newPage();
      await page.goto(`${server.baseUrl}/`);
      await page.getByLabel('E-mail').fill(a.email);
      await page.getByLabel('Password').fill(a.password);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('heading', { name: HOME_HEADING[a.role], level: 1 }).waitFor();
      await page.waitForLoadState('networkidle');
      await page.screenshot({ path: screenshotPath(`home-${a.role}`), fullPage: true });

      await page.getByRole('button', { name: a.name, exact: true }).click();
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.getByLabel('E-mail').waitFor();
      const session = await page.evaluate(async () => (await fetch('/api/session')).status);
      expect(session).toBe(401);
      expect(unexpected(problems)).toEqual([]);
      await context.close();
    });
  }

  it('shows a clear message for a wrong password', async () => {
    const { page, context } = await browser.newPage();
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill('tomasz@nightjar.example');
    await page.getByLabel('Password').fill('not-my-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match an active account').waitFor();
    await page.screenshot({ path: screenshotPath('sign-in-wrong-password') });
    await context.close();
  });

  it('shows the throttle message after repeated failures', async () => {
    const { page, context } = await browser.newPage();
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill('priya@nightjar.example');
    for (let i = 0; i < 4; i++) {
      await page.getByLabel('Password').fill(`wrong-password-${i}`);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByText('do not match an active account').waitFor();
    }
    await page.getByLabel('Password').fill('wrong-password-last');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Too many failed sign-in attempts for this account').waitFor();
    await page.screenshot({ path: screenshotPath('sign-in-throttled') });
    await context.close();
  });
});

describe('portal', () => {
  it('serves the homeowner landing page under /portal/', async () => {
    const { page, context, problems } = await browser.newPage({ width: 390, height: 844 });
    await page.goto(`${server.baseUrl}/portal/`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.screenshot({ path: screenshotPath('portal-landing'), fullPage: true });
    expect(unexpected(problems)).toEqual([]);
    await context.close();
  });
});
