/**
 * An estimator's day one: a new customer with a site through the form (inline errors first),
 * then a supplier's price list with one bad row imported through the wizard, then the new
 * products in the catalogue. The built server with a fresh demo database, Debian's Chromium.
 */
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

const estimator = DEMO_ACCOUNTS.find((a) => a.role === 'estimator')!;
// The first session check answers 401 before anyone signs in.
const unexpected = (problems: string[]) => problems.filter((p) => !/status of 401/.test(p));

const PRICE_LIST = [
  'Code,Name,Cost,List,IP code,"Drive current, mA","Power, W"',
  'GL-SP1,Moorhen spike spot 3 W,18.40,34.50,IP67,700,3',
  'GL-WL2,Heron wall light 2 W,21.00,39.00,IP65,350,2',
  'GL-BAD,Broken price row,eighteen,34.50,IP67,700,3',
  'GL-UP3,Kingfisher uplight 5 W,27.50,49.00,IP68,700,5',
].join('\n');

describe('customers and the price-list import', () => {
  it('creates a customer with a site, imports a price list with one bad row, and finds the products in the catalogue', async () => {
    const { page, context, problems } = await browser.newPage({ width: 1360, height: 900 });
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill(estimator.email);
    await page.getByLabel('Password').fill(estimator.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Quotes', level: 1 }).waitFor();

    // customers: the form shows inline errors before anything is sent
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Customers' }).click();
    await page.getByRole('heading', { name: 'Customers', level: 1 }).waitFor();
    await page.getByRole('link', { name: 'New customer' }).click();
    await page.getByRole('heading', { name: 'New customer', level: 1 }).waitFor();
    await page.getByLabel('E-mail').fill('not an address');
    await page.getByRole('button', { name: 'Save customer' }).click();
    await page.getByText('Enter the customer’s name.').waitFor();
    await expect.poll(() => page.getByText('Enter the address of the site.').isVisible()).toBe(true);
    expect(await page.getByText('Enter an e-mail address like name@example.com.').isVisible()).toBe(true);
    expect(await page.getByLabel('Name', { exact: true }).getAttribute('aria-invalid')).toBe('true');
    await page.screenshot({ path: screenshotPath('customer-form-errors'), fullPage: true });

    await page.getByLabel('Name', { exact: true }).fill('Marguerite Oldcastle');
    await page.getByLabel('E-mail').fill('marguerite@oldcastle.example');
    await page.getByLabel('Phone').fill('01632 960 481');
    await page.getByLabel('Label').fill('Home');
    await page.getByLabel('Postcode').fill('FH2 8QD');
    await page.getByLabel('Address', { exact: true }).fill('The Old Dairy\nQuarry Lane\nFernhollow');
    await page.getByLabel('Access notes').fill('Side gate; beware of the geese');
    await page.getByRole('button', { name: 'Save customer' }).click();
    await page.getByRole('heading', { name: 'Marguerite Oldcastle', level: 1 }).waitFor();
    const details = page.getByRole('form', { name: 'Customer details' });
    await details.getByLabel('Phone').fill('01632 960 999');
    await details.getByRole('button', { name: 'Save details' }).click();
    await details.getByText('Saved.').waitFor();
    await page.screenshot({ path: screenshotPath('customer-detail'), fullPage: true });
    await page.getByRole('link', { name: '← All customers' }).click();
    await page.getByRole('searchbox', { name: 'Search' }).fill('FH2 8QD');
    await page.getByRole('table', { name: 'Customers' }).getByRole('link', { name: 'Marguerite Oldcastle' }).waitFor();
    await page.screenshot({ path: screenshotPath('customer-list'), fullPage: true });

    // the price list: upload, columns guessed from the headers, preview with the bad row's reason
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalogue' }).click();
    await page.getByRole('heading', { name: 'Catalogue', level: 1 }).waitFor();
    await page.getByRole('link', { name: 'Import a price list' }).click();
    await page.getByLabel('Supplier').fill('Wagtail Lighting Wholesale');
    await page.getByLabel('Price list (CSV)').setInputFiles({ name: 'wagtail-2026.csv', mimeType: 'text/csv', buffer: Buffer.from(PRICE_LIST) });
    await page.getByRole('button', { name: 'Upload and read columns' }).click();
    await page.getByRole('heading', { name: 'wagtail-2026.csv: 4 rows' }).waitFor();
    expect(await page.getByLabel('Supplier code').inputValue()).toBe('Code');
    expect(await page.getByLabel('Drive current, mA').inputValue()).toBe('Drive current, mA');
    await page.screenshot({ path: screenshotPath('import-mapping'), fullPage: true });
    await page.getByRole('button', { name: 'Check the first rows' }).click();
    const preview = page.getByTestId('import-preview');
    await preview.waitFor();
    const badRow = preview.getByRole('row').filter({ hasText: 'GL-BAD' });
    expect(await badRow.textContent()).toContain('Set aside');
    expect(await badRow.textContent()).toContain('“eighteen” is not an amount of money');
    await page.screenshot({ path: screenshotPath('import-preview'), fullPage: true });

    await page.getByRole('button', { name: 'Import all 4 rows' }).click();
    const result = page.getByTestId('import-result');
    await result.waitFor();
    expect(await result.textContent()).toMatch(/Added3Updated0Set aside1/);
    const rejections = page.getByTestId('import-rejections');
    expect(await rejections.textContent()).toMatch(/Row 4.*Cost \(column “Cost”\): “eighteen” is not an amount of money/);
    expect(await page.getByRole('link', { name: 'Download as CSV' }).getAttribute('href')).toMatch(/\/api\/product-imports\/.+\/rejections\.csv$/);
    const csv = await page.evaluate(async (href) => (await fetch(href)).text(), (await page.getByRole('link', { name: 'Download as CSV' }).getAttribute('href'))!);
    expect(csv).toContain('GL-BAD');
    await page.screenshot({ path: screenshotPath('import-result'), fullPage: true });

    // the products are in the catalogue under our name for their kind
    await page.getByRole('link', { name: 'Open the catalogue' }).click();
    const table = page.getByRole('table', { name: 'Light fittings' });
    await table.getByText('Moorhen spike spot 3 W').waitFor();
    for (const name of ['Heron wall light 2 W', 'Kingfisher uplight 5 W']) expect(await table.getByText(name).isVisible()).toBe(true);
    expect(await table.getByText('Broken price row').count()).toBe(0);
    expect(await table.getByRole('row').filter({ hasText: 'Moorhen' }).textContent()).toContain('£34.50');
    await page.screenshot({ path: screenshotPath('catalogue-after-import'), fullPage: true });

    // a driver through the catalogue form: inline errors from the kind's schema, then saved
    await page.getByRole('tab', { name: 'LED drivers' }).click();
    await page.getByRole('button', { name: 'Add to LED drivers' }).click();
    const form = page.getByRole('form', { name: 'New in LED drivers' });
    await form.getByRole('button', { name: 'Add to catalogue' }).click();
    await form.getByText('Enter a name.').waitFor();
    expect(await form.getByText('Enter the output current in A.').isVisible()).toBe(true);
    expect(await form.getByText('Write an IP code like IP65, IP66/IP67 or IPX4.').isVisible()).toBe(true);
    await page.screenshot({ path: screenshotPath('driver-form-errors'), fullPage: true });
    await form.getByLabel('Name', { exact: true }).fill('Nightingale 700 mA driver');
    await form.getByLabel('Supplier', { exact: true }).fill('Wagtail Lighting Wholesale');
    await form.getByLabel('Supplier code').fill('GL-DRV700');
    await form.getByLabel('Cost (£)').fill('21.50');
    await form.getByLabel('List price (£)').fill('39.00');
    await form.getByLabel('Output current, A').fill('0.7');
    await form.getByLabel('Lowest output voltage, V').fill('9');
    await form.getByLabel('Highest output voltage, V').fill('42');
    await form.getByLabel('Maximum power, W').fill('29.4');
    await form.getByLabel('IP code').fill('ip67');
    await form.getByRole('button', { name: 'Add to catalogue' }).click();
    const drivers = page.getByRole('table', { name: 'LED drivers' });
    await drivers.getByText('Nightingale 700 mA driver').waitFor();
    expect(await drivers.getByRole('row').filter({ hasText: 'Nightingale' }).textContent()).toContain('700 mA · 9–42 V · 29.4 W max · IP67');
    await page.screenshot({ path: screenshotPath('catalogue-drivers'), fullPage: true });

    expect(unexpected(problems)).toEqual([]);
    await context.close();
  });
});
