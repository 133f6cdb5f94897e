/**
 * Photos, the quote PDF and sending, end to end: an estimator opens a quote, adds a site photo,
 * downloads the PDF and finds the customer and the engine's total in its text, then sends it
 * and finds the e-mail, its PDF and a working portal link in the local catcher.
 */
import { readFile, writeFile } from 'node:fs/promises';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QuoteDetailResponse, estimateQuoteInput, type EstimateContent } from '@gloaming/contracts';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import { computeQuoteTotals, formatMoney } from '@gloaming/engine';
import { pdfText } from '../support/pdf-text';
import { ARTIFACTS_DIR, launchBrowser, screenshotPath, type BrowserSession } from '../support/browser';
import { startBuiltServer, type RunningServer } from '../support/server';
import { estimateLine, portalLinkIn, waitForMail } from '../support/quote-fixtures';

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
const PHOTO = resolve(dirname(fileURLToPath(import.meta.url)), '../fixtures/front-path-dusk.jpg');
const CUSTOMER = { name: 'Ottilie Brackenbury', email: 'ottilie@brackenbury.example' };

const line = estimateLine;

const content: EstimateContent = {
  introduction: 'Soft light along the front path and a glow on the old pear tree.',
  discount: null,
  deposit: { kind: 'percent', bp: 2500 },
  sections: [
    {
      id: 'front',
      name: 'Front path',
      lines: [
        line('a', 'Path light, 3 W, 2700 K, IP65', 5000, 7200),
        line('b', 'Two-core outdoor cable, 1.5 mm²', 18000, 260, { unit: 'm' }),
        line('c', 'Pear tree uplighter, 6 W', 1000, 11800, { optional: true, selected: false }),
      ],
    },
  ],
};

describe('quote photos, PDF and sending', () => {
  it('uploads a photo, downloads the PDF and sends the quote with a working link', async () => {
    const { page, problems } = await browser.newPage({ width: 1600, height: 960 });
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill(estimator.email);
    await page.getByLabel('Password').fill(estimator.password);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Quotes', level: 1 }).waitFor();

    // The customer and the estimate through the api (the grid has its own browser test).
    const quoteId = await page.evaluate(
      async ({ customer, content }) => {
        const post = (path: string, body: unknown, method = 'POST') =>
          fetch(path, { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) }).then(async (r) => {
            if (!r.ok) throw new Error(`${method} ${path}: ${r.status} ${await r.text()}`);
            return r.json();
          });
        const c = await post('/api/customers', {
          ...customer,
          sites: [{ label: 'Home', addressLines: '3 Sorrel Close\nNetherby', postcode: 'NB2 5SC' }],
        });
        const q = await post('/api/quotes', {
          customerId: c.customer.id,
          siteId: c.customer.sites[0].id,
          title: 'Front garden lighting',
        });
        const detail = await fetch(`/api/quotes/${q.quote.id}`).then((r) => r.json());
        await post(`/api/quotes/${q.quote.id}/revisions/1`, { version: detail.revision.version, content }, 'PUT');
        return q.quote.id as string;
      },
      { customer: CUSTOMER, content },
    );
    const detail = QuoteDetailResponse.parse(await (await page.request.get(`${server.baseUrl}/api/quotes/${quoteId}`)).json());
    const totals = computeQuoteTotals(estimateQuoteInput(detail.revision.content, detail.revision.settings));
    const totalText = formatMoney(totals.totalMinor, detail.revision.settings.currency, detail.revision.settings.locale);
    // 5 x £72.00 + 18 m x £2.60 = £406.80 net, VAT 20 % (gov.uk standard rate) £81.36, total £488.16 (worked by hand)
    expect(totalText).toBe('£488.16');

    await page.goto(`${server.baseUrl}/quotes/${quoteId}`);
    await page.getByRole('grid', { name: 'Estimate lines' }).waitFor();

    // Upload from the keyboard: focus the button, Enter opens the file chooser. The chooser is
    // awaited before the key press so playwright has switched on its interception in time.
    const chooserOpened = page.waitForEvent('filechooser');
    await page.getByRole('button', { name: 'Add photos…' }).focus();
    await page.keyboard.press('Enter');
    const chooser = await chooserOpened;
    await chooser.setFiles(PHOTO);
    const thumb = page.getByRole('img', { name: 'Photo 1' });
    await thumb.waitFor();
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(720);
    const caption = page.getByLabel('Caption for Photo 1');
    await caption.fill('Front path at dusk');
    await caption.press('Enter');
    await page.getByRole('img', { name: 'Front path at dusk' }).waitFor();
    await page.screenshot({ path: screenshotPath('quote-send-photos'), fullPage: true });
    await page.getByRole('region', { name: 'Photos and plans' }).screenshot({ path: screenshotPath('quote-send-photos-panel') });

    // The PDF as the homeowner will get it.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download PDF' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^Quotation Q-\d{4} rev 1\.pdf$/);
    const pdf = await readFile((await download.path())!);
    await writeFile(resolve(ARTIFACTS_DIR, 'quote-send.pdf'), pdf); // look at it: pdftoppm -png -r 60
    const text = await pdfText(pdf);
    expect(text).toContain(CUSTOMER.name);
    expect(text).toContain(totalText);
    expect(text).toContain('Front path at dusk');
    expect(text).not.toContain('11.11'); // the unit cost of every line

    // Send: the dialog has the customer's address and the message preview.
    await page.getByRole('button', { name: 'Send…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Send revision 1' });
    await dialog.waitFor();
    await expect.poll(() => dialog.getByLabel('Send to').inputValue()).toBe(CUSTOMER.email);
    await dialog.getByLabel(/Personal note/).fill('Thank you for showing us round on Thursday.');
    await expect
      .poll(() => dialog.getByTestId('send-preview').innerText())
      .toContain('Thank you for showing us round on Thursday.');
    await page.screenshot({ path: screenshotPath('quote-send-dialog') });
    await dialog.getByRole('button', { name: 'Send quote' }).click();
    await page.getByText(`Sent to ${CUSTOMER.email}.`).waitFor();
    await page.getByText(/was sent .* and is frozen/).waitFor();
    await page.screenshot({ path: screenshotPath('quote-send-sent') });

    // The e-mail in the catcher, with the PDF and a link that opens the portal.
    const mail = await waitForMail(server.inboxUrl, (m) => m.to.includes(CUSTOMER.email));
    expect(mail.text).toContain(totalText);
    expect(mail.text).toContain('Thank you for showing us round on Thursday.');
    expect(mail.attachments.map((a) => a.contentType)).toEqual(['application/pdf']);
    const link = portalLinkIn(mail.text, server.baseUrl);
    expect(link).not.toBeNull();
    const portal = await fetch(link!);
    expect(portal.status).toBe(200);
    // the one 401 is the signed-out session check on the sign-in page
    expect(problems.filter((p) => !/status of 401/.test(p))).toEqual([]);
  });
});
