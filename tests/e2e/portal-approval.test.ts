/**
 * The homeowner's portal end to end: an estimator sends a quote, the homeowner opens the link
 * from the e-mail in the local catcher on a 320 px wide phone, ticks an optional extra and sees
 * the total follow, approves with their name, and both confirmation e-mails arrive; a second
 * quote is declined with a reason. axe-core runs on every portal page (no serious or critical
 * violations). Figures worked by hand beside each check.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EstimateContent, EstimateLine } from '@gloaming/contracts';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import type { BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../support/axe';
import { launchBrowser, screenshotPath, type BrowserSession } from '../support/browser';
import { createQuoteThroughApi, estimateLine, waitForMail as waitForMailIn, type CaughtMail } from '../support/quote-fixtures';
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

const line = (id: string, description: string, quantityMilli: number, unitPriceMinor: number, extra: Partial<EstimateLine> = {}) =>
  estimateLine(id, description, quantityMilli, unitPriceMinor, { unitCostMinor: 1313, ...extra });

const content: EstimateContent = {
  introduction: 'Low, warm light along the drive and a glow on the old pear tree.',
  discount: null,
  deposit: { kind: 'percent', bp: 2500 },
  sections: [
    {
      id: 'drive',
      name: 'Driveway',
      lines: [
        line('a', 'Path light, 3 W, 2700 K, IP65', 5000, 7200),
        line('b', 'Two-core outdoor cable, 1.5 mm²', 18000, 260, { unit: 'm' }),
        line('c', 'Pear tree uplighter, 6 W', 1000, 11800, { optional: true, selected: false }),
        line('d', 'Constant-current driver 350 mA, 20 W', 1000, 6400, { alternativeGroup: 'Driveway driver' }),
        line('e', 'Dimmable driver 350 mA, 20 W, with remote', 1000, 9200, {
          alternativeGroup: 'Driveway driver',
          selected: false,
        }),
      ],
    },
  ],
};
// By hand, VAT at the UK standard rate of 20 % (gov.uk) per line to the penny, deposit 25 %:
// suggested: 5 x £72.00 + 18 m x £2.60 + £64.00 = £470.80 net, VAT £94.16, total £564.96, deposit £141.24;
// with the uplighter (+£118.00): £588.80 net, VAT £117.76, total £706.56, deposit £176.64.
const SUGGESTED_TOTAL = '£564.96';
const UPGRADED_TOTAL = '£706.56';
const UPGRADED_DEPOSIT = '£176.64';

const waitForMail = (match: (m: CaughtMail) => boolean) => waitForMailIn(server.inboxUrl, match, 15_000);

/** Signed in as the demo estimator: create a customer and quote through the api and send it. */
async function sendQuote(staff: Page, customer: { name: string; email: string }): Promise<{ quoteId: string; link: string }> {
  const quoteId = await createQuoteThroughApi(staff, {
    customer,
    site: { label: 'Home', addressLines: '9 Wren Lane\nAshby Parva', postcode: 'AP4 9WL' },
    title: 'Driveway lighting',
    content,
    send: true,
  });
  const mail = await waitForMail((m) => m.to.includes(customer.email) && m.subject.includes('quotation'));
  const link = /http:\/\/127\.0\.0\.1:\d+\/portal\/q\/[A-Za-z0-9_-]+/.exec(mail.text)?.[0];
  if (!link) throw new Error(`no portal link in: ${mail.text}`);
  return { quoteId, link };
}

let staffContext: BrowserContext;
let staff: Page;
async function phone(): Promise<{ context: BrowserContext; page: Page; problems: string[] }> {
  // bypassCSP only so the test can inject axe-core's source; the app itself runs under its CSP
  const context = await browser.browser.newContext({ viewport: { width: 320, height: 720 }, bypassCSP: true });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (err) => problems.push(`page error: ${err.message}`));
  return { context, page, problems };
}

describe('the homeowner portal', () => {
  beforeAll(async () => {
    staffContext = await browser.browser.newContext({ viewport: { width: 1280, height: 800 } });
    staff = await staffContext.newPage();
    await staff.goto(`${server.baseUrl}/sign-in`);
    const res = await staff.request.post(`${server.baseUrl}/api/session`, {
      data: { email: estimator.email, password: estimator.password },
      headers: { Origin: server.baseUrl },
    });
    expect(res.status()).toBe(200);
  });
  afterAll(async () => staffContext?.close());

  it('opens from the e-mail, follows a ticked extra, approves, and e-mails both sides', async () => {
    const customer = { name: 'Philippa Marchbank', email: 'philippa@marchbank.example' };
    const { quoteId, link } = await sendQuote(staff, customer);
    const { context, page, problems } = await phone();
    try {
      await page.goto(link);
      await page.getByRole('heading', { level: 1, name: 'Driveway lighting' }).waitFor();
      const total = page.getByTestId('quote-total');
      expect(await total.textContent()).toBe(SUGGESTED_TOTAL);
      await page.getByText('Totals confirmed.').waitFor();
      expect(await seriousViolations(page)).toEqual([]);

      await page.getByRole('checkbox', { name: /Pear tree uplighter/ }).check();
      expect(await total.textContent()).toBe(UPGRADED_TOTAL); // at once, worked out in the browser
      await page.getByText('Totals confirmed.').waitFor(); // and confirmed by the server
      expect(await total.textContent()).toBe(UPGRADED_TOTAL);
      expect(await page.getByTestId('quote-deposit').textContent()).toBe(UPGRADED_DEPOSIT);
      // the page fits a 320 px phone: nothing wider than the screen
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
      await page.screenshot({ path: screenshotPath('portal-quote-320'), fullPage: true });

      await page.getByRole('button', { name: /Approve quote for/ }).click();
      await page.getByText('Type your full name to approve.').waitFor();
      await page.getByLabel('Your full name').fill(customer.name);
      await page.getByRole('checkbox', { name: /accept them/ }).check();
      await page.getByRole('button', { name: `Approve quote for ${UPGRADED_TOTAL}` }).click();
      await page.getByRole('heading', { name: 'You approved this quote' }).waitFor();
      expect(await page.locator('#approved-actions').count()).toBe(1);
      expect(await seriousViolations(page)).toEqual([]);
      await page.screenshot({ path: screenshotPath('portal-approved-320'), fullPage: true });

      const confirmation = await waitForMail((m) => m.to.includes(customer.email) && m.subject.startsWith('You approved'));
      expect(confirmation.text).toContain(UPGRADED_TOTAL);
      expect(confirmation.text).toContain(UPGRADED_DEPOSIT);
      expect(confirmation.text).toContain('Pear tree uplighter, 6 W: included');
      await waitForMail(
        (m) =>
          m.to.includes(estimator.email) &&
          m.subject === `${customer.name} approved quotation ${/Q-\d{4}/.exec(confirmation.subject)![0]}`,
      );

      // the workbench follows: the quote reads Approved and the panel shows the recorded approval
      await staff.goto(`${server.baseUrl}/quotes/${quoteId}`);
      await staff.getByRole('heading', { level: 1 }).getByText('Approved').waitFor();
      await staff.getByRole('button', { name: /Homeowner/ }).click();
      expect(await staff.getByTestId('approval-summary').textContent()).toContain(`Approved by ${customer.name}`);
      expect(problems).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('takes a question, and the estimator’s reply arrives by e-mail with a working link', async () => {
    const customer = { name: 'Idris Fennimore', email: 'idris@fennimore.example' };
    const { quoteId, link } = await sendQuote(staff, customer);
    const { context, page } = await phone();
    try {
      await page.goto(link);
      await page.getByLabel('Your question').fill('Can the cable run under the gravel?');
      await page.getByRole('button', { name: 'Send question' }).click();
      await page.getByText(/^Sent\./).waitFor();
      await waitForMail((m) => m.to.includes(estimator.email) && m.text.includes('Can the cable run under the gravel?'));
      await staff.goto(`${server.baseUrl}/quotes/${quoteId}`);
      await staff.getByRole('button', { name: /Homeowner/ }).click();
      await staff.getByText('Can the cable run under the gravel?').waitFor();
      await staff.getByLabel('Reply to the homeowner').fill('Yes, in a duct 300 mm down.');
      await staff.getByRole('button', { name: 'Send reply' }).click();
      await staff.getByText(`Sent to ${customer.email}`).waitFor();
      const reply = await waitForMail((m) => m.to.includes(customer.email) && m.subject.startsWith('Reply about'));
      const replyLink = /http:\/\/127\.0\.0\.1:\d+\/portal\/q\/[A-Za-z0-9_-]+/.exec(reply.text)![0];
      await page.goto(replyLink);
      await page.getByText('Yes, in a duct 300 mm down.').waitFor();
    } finally {
      await context.close();
    }
  });

  it('declines with a reason, and links that do not work explain themselves', async () => {
    const customer = { name: 'Rosalind Achterberg', email: 'rosalind@achterberg.example' };
    const { link } = await sendQuote(staff, customer);
    const { context, page } = await phone();
    try {
      await page.goto(link);
      await page.getByRole('button', { name: 'I do not want to go ahead' }).click();
      await page.getByLabel(/Would you tell the firm why/).fill('We are moving house next year.');
      await page.getByRole('button', { name: 'Decline this quote' }).click();
      await page.getByRole('heading', { name: 'You declined this quote' }).waitFor();
      await page.getByText('Your reason: We are moving house next year.').waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      await waitForMail((m) => m.to.includes(estimator.email) && m.subject.includes('declined'));

      await page.goto(`${server.baseUrl}/portal/q/this-link-was-never-sent`);
      await page.getByRole('heading', { level: 1, name: 'We could not find this quote' }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      await page.screenshot({ path: screenshotPath('portal-unknown-link-320'), fullPage: true });
    } finally {
      await context.close();
    }
  });
});
