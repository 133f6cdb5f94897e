/**
 * Hostile content and the content security policy, end to end on the built app. HTML and
 * script saved into every free-text field (customer name, site address, notes, section names,
 * line descriptions, the introduction, the firm's terms, a homeowner's question and the firm's
 * reply) must come out as text: no dialog opens and no element is injected in the workbench or
 * the portal, the e-mails carry it as plain text (no HTML body to run it in), and the PDF shows
 * the characters literally. Every built page (sign-in, each main screen, the quote and circuit
 * pages, the portal quote page and the deposit return page) loads with zero CSP violations
 * (securitypolicyviolation events, recorded from the first script) and zero console errors.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import { pdfText } from '../support/pdf-text';
import { launchBrowser, screenshotPath, type BrowserSession } from '../support/browser';
import { waitForMail, type CaughtMail } from '../support/quote-fixtures';
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
/** Two classic payloads: an image whose error handler runs script, and a script element. */
const IMG = '<img src=x onerror=alert(1)>';
const SCRIPT = '<script>alert(2)</script>';
const hostile = (field: string) => `${field} ${IMG} ${SCRIPT}`;

interface Watch {
  dialogs: string[];
  problems: string[];
}

/** Record every dialog (alert/confirm/prompt) and every CSP violation from the first script on. */
async function watched(viewport = { width: 1440, height: 900 }): Promise<{ page: Page; watch: Watch }> {
  const { page, context, problems } = await browser.newPage(viewport);
  await context.addInitScript(() => {
    const w = window as unknown as { __csp: string[] };
    w.__csp = [];
    document.addEventListener('securitypolicyviolation', (e) => {
      w.__csp.push(`${e.violatedDirective} blocked ${e.blockedURI || '(inline)'} at ${e.sourceFile}:${e.lineNumber}`);
    });
  });
  const dialogs: string[] = [];
  page.on('dialog', (d) => {
    dialogs.push(`${d.type()}: ${d.message()}`);
    void d.dismiss();
  });
  return { page, watch: { dialogs, problems } };
}

async function cspViolations(page: Page): Promise<string[]> {
  return page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? []);
}

/** Elements a payload would have made if it had been parsed as HTML. */
async function injected(page: Page): Promise<number> {
  return page.evaluate(() => document.querySelectorAll('img[src="x"], img[onerror], script:not([src])').length);
}

const caught = (match: (m: CaughtMail) => boolean) => waitForMail(server.inboxUrl, match);

describe('hostile content and the content security policy', () => {
  it('shows every saved payload as text everywhere, and no built page breaks the CSP', async () => {
    const { page, watch } = await watched();
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password').fill(owner.password);
    await page.keyboard.press('Enter');
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.getByRole('heading', { level: 1 }).first().waitFor();

    const email = 'hostile@home.example';
    // everything through the api, as any client could send it
    const ids = await page.evaluate(
      async ({ email, img, script }) => {
        const p = (field: string) => `${field} ${img} ${script}`;
        const call = (path: string, body?: unknown, method = body === undefined ? 'GET' : 'POST') =>
          fetch(path, {
            method,
            headers: { 'Content-Type': 'application/json' },
            ...(body === undefined ? {} : { body: JSON.stringify(body) }),
          }).then(async (r) => {
            if (!r.ok) throw new Error(`${method} ${path}: ${r.status} ${await r.text()}`);
            return r.json();
          });
        const settings = await call('/api/organization/settings');
        await call(
          '/api/organization/settings',
          { version: settings.version, settings: { ...settings.settings, termsText: p('Terms') } },
          'PUT',
        );
        const c = await call('/api/customers', {
          name: p('Customer'),
          email,
          notes: p('Notes'),
          sites: [{ label: p('Site label'), addressLines: p('Site address'), postcode: 'NB2 5SC', accessNotes: p('Access') }],
        });
        const q = await call('/api/quotes', { customerId: c.customer.id, siteId: c.customer.sites[0].id, title: p('Title') });
        const detail = await call(`/api/quotes/${q.quote.id}`);
        const line = (id: string, description: string) => ({
          id,
          productId: null,
          description,
          quantityMilli: 2000,
          unit: 'each',
          unitCostMinor: 1000,
          pricingMode: 'fixed',
          pricingBp: 0,
          unitPriceMinor: 4500,
          vatRateBp: 2000,
          discount: null,
          optional: false,
          alternativeGroup: null,
          selected: true,
          note: p('Line note'),
          circuitId: null,
          overridden: false,
        });
        const content = {
          ...detail.revision.content,
          introduction: p('Introduction'),
          sections: [{ id: 's1', name: p('Section'), lines: [line('l1', p('Line description'))] }],
        };
        await call(`/api/quotes/${q.quote.id}/revisions/1`, { version: detail.revision.version, content }, 'PUT');
        return { quoteId: q.quote.id as string, customerId: c.customer.id as string, revisionId: detail.revision.id as string };
      },
      { email, img: IMG, script: SCRIPT },
    );

    // the workbench: every main screen, the customer, the quote and its circuits
    const screens = [
      '/overview',
      '/figures',
      '/activity',
      '/settings',
      '/quotes',
      '/customers',
      `/customers/${ids.customerId}`,
      '/catalogue',
      '/catalogue/import',
      '/jobs',
      `/quotes/${ids.quoteId}`,
      `/quotes/${ids.quoteId}/circuits`,
    ];
    const report: string[] = [];
    for (const path of screens) {
      await page.goto(`${server.baseUrl}${path}`);
      await page.getByRole('heading', { level: 1 }).first().waitFor();
      await page.waitForLoadState('networkidle');
      const csp = await cspViolations(page);
      const extra = await injected(page);
      report.push(`${path}: csp ${csp.length}, injected ${extra}`);
      expect(csp, path).toEqual([]);
      expect(extra, path).toBe(0);
    }
    // the payloads are on screen as characters
    await page.goto(`${server.baseUrl}/customers/${ids.customerId}`);
    await page.getByText(hostile('Customer')).first().waitFor();
    await page.goto(`${server.baseUrl}/quotes/${ids.quoteId}`);
    await page.getByRole('grid', { name: 'Estimate lines' }).waitFor();
    await page.screenshot({ path: screenshotPath('hostile-content-quote'), fullPage: true });

    // the PDF shows the characters literally
    const pdf = Buffer.from(await (await page.request.get(`${server.baseUrl}/api/quotes/${ids.quoteId}/revisions/${ids.revisionId}/pdf`)).body());
    const text = (await pdfText(pdf)).replace(/\s+/g, ' ');
    for (const field of ['Customer', 'Section', 'Line description', 'Introduction', 'Terms'])
      expect(text, field).toContain(`${field} ${IMG}`);
    expect(text).toContain(SCRIPT);

    // send it; the e-mail is plain text with the payload as characters, no HTML body to run
    await page.getByRole('button', { name: 'Send…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Send revision 1' });
    await dialog.waitFor();
    await dialog.getByLabel(/Personal note/).fill(hostile('Personal note'));
    await dialog.getByRole('button', { name: 'Send quote' }).click();
    await page.getByText(/^Sent/).first().waitFor();
    expect(await injected(page)).toBe(0);
    const mail = await caught((m) => m.to.includes(email));
    expect(mail.html).toBe('');
    expect(mail.text).toContain(hostile('Personal note'));
    expect(mail.text).toContain(hostile('Customer'));
    const link = /\/portal\/q\/[A-Za-z0-9_-]{43}/.exec(mail.text)![0];

    // the portal: the quote page and a question, then the deposit return page
    const home = await watched({ width: 414, height: 860 });
    await home.page.goto(`${server.baseUrl}${link}`);
    await home.page.getByText(hostile('Line description')).first().waitFor();
    await home.page.getByText(hostile('Terms')).first().waitFor();
    await home.page.waitForLoadState('networkidle');
    report.push(`portal quote: csp ${(await cspViolations(home.page)).length}, injected ${await injected(home.page)}`);
    expect(await cspViolations(home.page)).toEqual([]);
    expect(await injected(home.page)).toBe(0);
    const asked = await home.page.evaluate(
      async ({ token, body }) =>
        (
          await fetch(`/api/portal/${token}/questions`, {
            method: 'POST',
            headers: { 'Content-Type': 'application/json' },
            body: JSON.stringify({ body }),
          })
        ).status,
      { token: link.split('/').pop()!, body: hostile('Question') },
    );
    expect(asked).toBe(201);
    const question = await caught((m) => m.subject.startsWith('Question from') && m.text.includes('Question'));
    expect(question.html).toBe('');
    expect(question.text).toContain(hostile('Question'));
    await home.page.screenshot({ path: screenshotPath('hostile-content-portal'), fullPage: true });

    // a made-up payment session on a quote not yet approved: the api refuses it (4xx), the page says so
    const beforeReturn = home.watch.problems.length;
    await home.page.goto(`${server.baseUrl}${link}/deposit/return?session_id=cs_test_unknown`);
    await home.page.waitForLoadState('networkidle');
    const returnProblems = home.watch.problems.splice(beforeReturn);
    expect(returnProblems.filter((p) => !/status of 4\d\d/.test(p))).toEqual([]);
    report.push(`portal deposit return: csp ${(await cspViolations(home.page)).length}, injected ${await injected(home.page)}`);
    expect(await cspViolations(home.page)).toEqual([]);

    // the quote page again with the question in its thread, and the sign-in page signed out
    await page.goto(`${server.baseUrl}/quotes/${ids.quoteId}`);
    await page.getByRole('grid', { name: 'Estimate lines' }).waitFor();
    await page.waitForLoadState('networkidle');
    const thread = await (await page.request.get(`${server.baseUrl}/api/quotes/${ids.quoteId}/messages`)).text();
    expect(thread).toContain(JSON.stringify(hostile('Question')).slice(1, -1)); // stored as typed
    expect(await injected(page)).toBe(0);
    const signedOut = await watched();
    await signedOut.page.goto(`${server.baseUrl}/sign-in`);
    await signedOut.page.getByLabel('E-mail').waitFor();
    report.push(`sign-in: csp ${(await cspViolations(signedOut.page)).length}`);
    expect(await cspViolations(signedOut.page)).toEqual([]);
    await signedOut.page.goto(`${server.baseUrl}/portal/`);
    await signedOut.page.waitForLoadState('networkidle');
    expect(await cspViolations(signedOut.page)).toEqual([]);

    console.log(
      `hostile content / CSP:\n  ${report.join('\n  ')}\n  dialogs: ${[...watch.dialogs, ...home.watch.dialogs].length}`,
    );
    expect([...watch.dialogs, ...home.watch.dialogs, ...signedOut.watch.dialogs]).toEqual([]);
    // the one 401 is the signed-out session check on the sign-in page
    const problems = [
      ...watch.problems.map((p) => `workbench ${p}`),
      ...home.watch.problems.map((p) => `portal ${p}`),
      ...signedOut.watch.problems.map((p) => `signed out ${p}`),
    ].filter((p) => !/status of 401/.test(p));
    expect(problems).toEqual([]);
  }, 240_000);
});
