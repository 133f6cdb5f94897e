/**
 * The homeowner's whole journey against the built server, its SMTP catcher and its payment
 * fake: the estimator sends a quote from the workbench -> the e-mail in the catcher -> the
 * link -> an option toggled -> approved -> "Pay deposit" -> the fake's hosted page with the
 * success card -> the return page says paid -> the receipt in the catcher. A second quote: the
 * declined card -> a clear failure -> a retry with the success card. The quote's status in the
 * workbench follows each step, and the owner refunds from the workbench.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { EstimateContent } from '@gloaming/contracts';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import { seriousViolations } from '../support/axe';
import { launchBrowser, screenshotPath, type BrowserSession } from '../support/browser';
import { createQuoteThroughApi, estimateLine, portalLinkIn, waitForMail } from '../support/quote-fixtures';
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
const owner = DEMO_ACCOUNTS.find((a) => a.role === 'owner')!;

const line = estimateLine;

/**
 * Worked by hand: 4 x £80.00 + 20 m x £2.50 = £370.00 net; with the optional £100.00 uplighter
 * chosen £470.00 net, VAT at the UK standard rate of 20 % (gov.uk) £94.00, total £564.00;
 * deposit 25 % = £141.00.
 */
const content: EstimateContent = {
  introduction: 'Warm path lights and a soft uplight on the birch.',
  discount: null,
  deposit: { kind: 'percent', bp: 2500 },
  sections: [
    {
      id: 'path',
      name: 'Side path',
      lines: [
        line('a', 'Path light, 3 W, 2700 K, IP65', 4000, 8000),
        line('b', 'Two-core outdoor cable, 1.5 mm²', 20000, 250, { unit: 'm' }),
        line('c', 'Birch uplighter, 5 W', 1000, 10000, { optional: true, selected: false }),
      ],
    },
  ],
};
const DEPOSIT_TEXT = '£141.00';

const mailTo = (address: string, subject: RegExp) => waitForMail(server.inboxUrl, (m) => m.to.includes(address) && subject.test(m.subject));

/** Failed responses from our own origin (the fake's hosted page answers 402 to a declined card, as the provider's does, and has no favicon). */
function ourFailures(page: Page): string[] {
  const failures: string[] = [];
  page.on('response', (r) => {
    if (r.url().startsWith(server.baseUrl) && r.status() >= 400) failures.push(`${r.status()} ${r.url()}`);
  });
  page.on('pageerror', (err) => failures.push(`page error: ${err.message}`));
  return failures;
}

async function signIn(page: Page, who: { email: string; password: string }) {
  await page.goto(`${server.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.keyboard.press('Enter');
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  await page.getByRole('heading', { level: 1 }).first().waitFor();
}

/** A customer and the estimate through the api, then sent from the quote page; returns the portal link. */
async function sendQuote(page: Page, customer: { name: string; email: string }): Promise<{ quoteId: string; link: string }> {
  const quoteId = await createQuoteThroughApi(page, {
    customer,
    site: { label: 'Home', addressLines: '9 Rowan Walk\nHollin', postcode: 'HL3 9RW' },
    title: 'Side path lighting',
    content,
  });
  await page.goto(`${server.baseUrl}/quotes/${quoteId}`);
  await page.getByRole('grid', { name: 'Estimate lines' }).waitFor();
  await page.getByRole('button', { name: 'Send…' }).click();
  const dialog = page.getByRole('dialog', { name: 'Send revision 1' });
  await dialog.getByRole('button', { name: 'Send quote' }).click();
  await page.getByText(`Sent to ${customer.email}.`).waitFor();
  const mail = await mailTo(customer.email, /Q-\d{4}/);
  const link = portalLinkIn(mail.text, server.baseUrl);
  expect(link).not.toBeNull();
  return { quoteId, link: link! };
}

async function statusInWorkbench(page: Page, quoteId: string): Promise<string> {
  await page.goto(`${server.baseUrl}/quotes/${quoteId}`);
  const heading = page.getByRole('heading', { level: 1 });
  await heading.waitFor();
  return heading.innerText();
}

/** On the homeowner's phone: open the link, choose the option, approve. */
async function approveOnPortal(home: Page, link: string, name: string) {
  await home.goto(link);
  await home.getByRole('checkbox', { name: /Birch uplighter/ }).check();
  await expect.poll(() => home.getByRole('button', { name: /^Approve quote for/ }).innerText()).toContain('£564.00');
  await home.getByLabel('Your full name').fill(name);
  await home.getByRole('checkbox', { name: /accept them/ }).check();
  await home.getByRole('button', { name: /^Approve quote for/ }).click();
  await home.getByRole('heading', { name: 'You approved this quote' }).waitFor();
}

async function payOnHostedPage(home: Page, card: string) {
  await home.getByLabel('Card number').fill(card);
  await home.getByLabel(/Expiry date/).fill('12/34');
  await home.getByLabel(/Security code/).fill('123');
  await home.getByLabel('Name on card').fill('Test Homeowner');
  await home.getByRole('button', { name: /^Pay / }).click();
}

describe('deposit journey', () => {
  it('sent -> viewed -> approved -> deposit paid with the success card; receipt; the owner refunds', async () => {
    const staff = await browser.newPage({ width: 1600, height: 960 });
    await signIn(staff.page, estimator);
    const customer = { name: 'Isolde Farrant', email: 'isolde@farrant.example' };
    const { quoteId, link } = await sendQuote(staff.page, customer);
    expect(await statusInWorkbench(staff.page, quoteId)).toContain('Sent');

    const home = await browser.newPage({ width: 360, height: 780 });
    const homeFailures = ourFailures(home.page);
    await home.page.goto(link);
    await home.page.getByRole('checkbox', { name: /Birch uplighter/ }).waitFor();
    expect(await statusInWorkbench(staff.page, quoteId)).toContain('Viewed');
    await approveOnPortal(home.page, link, customer.name);
    expect(await statusInWorkbench(staff.page, quoteId)).toContain('Approved');

    const panel = home.page.getByRole('region', { name: 'Deposit' });
    await panel.getByText(DEPOSIT_TEXT).first().waitFor();
    await home.page.screenshot({ path: screenshotPath('deposit-approved-phone'), fullPage: true });
    expect(await seriousViolations(home.page)).toEqual([]); // axe-core: the deposit panel
    await panel.getByRole('button', { name: `Pay deposit ${DEPOSIT_TEXT}` }).click();
    await home.page.waitForURL(`${server.paymentsUrl}/pay/**`);
    await home.page.getByText(DEPOSIT_TEXT).first().waitFor(); // the fake's page asks for the server's amount
    await home.page.screenshot({ path: screenshotPath('deposit-hosted-page'), fullPage: true });
    await payOnHostedPage(home.page, '4242 4242 4242 4242'); // provider's test card: succeeds

    await home.page.waitForURL(/\/portal\/q\/[A-Za-z0-9_-]{43}\/deposit\/return\?session_id=cs_test_/);
    const status = home.page.getByTestId('deposit-return');
    await expect.poll(() => status.innerText(), { timeout: 30_000 }).toContain('Deposit paid. Thank you.');
    expect(await status.innerText()).toContain(DEPOSIT_TEXT);
    await home.page.screenshot({ path: screenshotPath('deposit-return-paid'), fullPage: true });
    expect(await seriousViolations(home.page)).toEqual([]); // axe-core: the return page, paid

    const receipt = await mailTo(customer.email, /Deposit received/);
    expect(receipt.text).toContain(DEPOSIT_TEXT);
    expect(await statusInWorkbench(staff.page, quoteId)).toContain('Deposit paid');

    // the owner refunds from the workbench and it shows on the quote
    const ownerPage = await browser.newPage({ width: 1600, height: 960 });
    await signIn(ownerPage.page, owner);
    await ownerPage.page.goto(`${server.baseUrl}/quotes/${quoteId}`);
    const deposits = ownerPage.page.getByTestId('quote-deposits');
    await deposits.getByText('Paid', { exact: true }).first().waitFor();
    await deposits.getByRole('button', { name: 'Refund…' }).click();
    await deposits.getByRole('button', { name: `Refund ${DEPOSIT_TEXT}` }).click();
    await deposits.getByText('Refunded', { exact: true }).first().waitFor();
    await deposits.screenshot({ path: screenshotPath('deposit-refunded-workbench') });
    expect(homeFailures).toEqual([]);
    expect(ownerPage.problems.filter((p) => !/status of 401/.test(p))).toEqual([]);
  });

  it('the declined card fails clearly; a retry with the success card pays', async () => {
    const staff = await browser.newPage({ width: 1600, height: 960 });
    await signIn(staff.page, estimator);
    const customer = { name: 'Barnaby Quillon', email: 'barnaby@quillon.example' };
    const { quoteId, link } = await sendQuote(staff.page, customer);
    const home = await browser.newPage({ width: 360, height: 780 });
    const homeFailures = ourFailures(home.page);
    await approveOnPortal(home.page, link, customer.name);

    await home.page.getByRole('button', { name: `Pay deposit ${DEPOSIT_TEXT}` }).click();
    await home.page.waitForURL(`${server.paymentsUrl}/pay/**`);
    await payOnHostedPage(home.page, '4000 0000 0000 0002'); // provider's test card: declined
    await home.page
      .getByText(/declined/i)
      .first()
      .waitFor(); // the payment page says so and stays open
    await home.page.screenshot({ path: screenshotPath('deposit-hosted-declined'), fullPage: true });

    // back to the quote: the refusal is shown there too, with a retry
    await home.page.getByRole('link', { name: /go back/i }).click();
    const panel = home.page.getByRole('region', { name: 'Deposit' });
    await expect.poll(() => panel.innerText(), { timeout: 20_000 }).toContain('declined');
    await home.page.screenshot({ path: screenshotPath('deposit-failed-phone'), fullPage: true });
    expect(await seriousViolations(home.page)).toEqual([]); // axe-core: the quote page with the refused deposit
    expect(await statusInWorkbench(staff.page, quoteId)).toContain('Approved');

    await panel.getByRole('button', { name: `Try again: pay ${DEPOSIT_TEXT}` }).click();
    await home.page.waitForURL(`${server.paymentsUrl}/pay/**`);
    await payOnHostedPage(home.page, '4242 4242 4242 4242');
    const status = home.page.getByTestId('deposit-return');
    await expect.poll(() => status.innerText(), { timeout: 30_000 }).toContain('Deposit paid. Thank you.');
    await mailTo(customer.email, /Deposit received/);
    expect(await statusInWorkbench(staff.page, quoteId)).toContain('Deposit paid');
    expect(homeFailures).toEqual([]);
  });
});
