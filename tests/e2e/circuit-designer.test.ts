/**
 * The circuit designer, end to end: an estimator designs a constant-current string of six
 * fittings over two connector blocks and sees the live results, the terminal schedule and the
 * diagram; saves it and the server's stored check matches the page; then picks a driver of the
 * wrong current and sees the mismatch reported at the driver.
 * Figures: 6 x 3.0 V = 18 V (a series string's voltage is the sum of its forward voltages);
 * drop 0.35 A x 2 x 18 m x 13.3 ohm/km (IEC 60228 Table 3, class 5 plain 1.5 mm²) x 1.1965
 * (70 °C, derived) = 0.2005 V; a six-way block a link leaves takes 4 fittings (common practice).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QuoteDetailResponse } from '@gloaming/contracts';
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
const common = { supplier: 'Owlbrook Trade', description: '', unit: 'each', active: true };
const PRODUCTS = {
  spike: {
    ...common,
    kind: 'fitting',
    supplierCode: 'OW-SP3',
    name: 'Fernlight spike 3 W',
    costMinor: 2100,
    listPriceMinor: 3900,
    spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.35, forwardVoltageV: 3.0, lumens: 180 }], ipCode: 'IP66' },
  },
  driver350: {
    ...common,
    kind: 'driver',
    supplierCode: 'OW-D350',
    name: 'Lantern driver 350 mA',
    costMinor: 2800,
    listPriceMinor: 5200,
    spec: { currentA: 0.35, voltageWindowV: { minV: 6, maxV: 48 }, maxPowerW: 20, efficiencyPct: 88, ipCode: 'IP66' },
  },
  driver700: {
    ...common,
    kind: 'driver',
    supplierCode: 'OW-D700',
    name: 'Lantern driver 700 mA',
    costMinor: 3000,
    listPriceMinor: 5600,
    spec: { currentA: 0.7, voltageWindowV: { minV: 9, maxV: 42 }, maxPowerW: 30, efficiencyPct: 88, ipCode: 'IP66' },
  },
  cable: {
    ...common,
    kind: 'cable',
    unit: 'm',
    supplierCode: 'OW-F15',
    name: 'Two-core flex 1.5 mm²',
    costMinor: 90,
    listPriceMinor: 160,
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
  },
  block: {
    ...common,
    kind: 'connector-block',
    supplierCode: 'OW-G6',
    name: 'Six-way gel box',
    costMinor: 600,
    listPriceMinor: 1100,
    spec: { terminals: 6, entries: 6, conductorsPerTerminal: 2, ipCode: 'IP68' },
  },
};

describe('circuit designer', () => {
  it('designs a six-fitting string over two blocks and reports a wrong-current driver at the driver', async () => {
    const { page, problems } = await browser.newPage({ width: 1600, height: 1000 });
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill(estimator.email);
    await page.getByLabel('Password').fill(estimator.password);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Quotes', level: 1 }).waitFor();

    // The catalogue products and a quote through the api (the catalogue and quotes have their own browser tests).
    const made = await page.evaluate(async (products) => {
      const post = (path: string, body: unknown) =>
        fetch(path, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) }).then(
          async (r) => {
            if (!r.ok) throw new Error(`POST ${path}: ${r.status} ${await r.text()}`);
            return r.json();
          },
        );
      const ids: Record<string, string> = {};
      for (const [key, p] of Object.entries(products)) ids[key] = (await post('/api/products', p)).product.id;
      const c = await post('/api/customers', {
        name: 'Wilhelmina Ashgrove',
        sites: [{ label: 'Home', addressLines: '12 Tansy Walk\nHollinmoor', postcode: 'HM4 2TW' }],
      });
      const q = await post('/api/quotes', {
        customerId: c.customer.id,
        siteId: c.customer.sites[0].id,
        title: 'Front path lighting',
      });
      return { ids, quoteId: q.quote.id as string };
    }, PRODUCTS);

    await page.goto(`${server.baseUrl}/quotes/${made.quoteId}`);
    await page.getByRole('link', { name: 'Circuits' }).click();
    await page.getByRole('heading', { name: /Circuits/, level: 1 }).waitFor();
    await expect.poll(() => page.getByRole('note').textContent()).toContain('licensed electrician');

    const form = page.getByRole('form', { name: 'New circuit' });
    await form.getByLabel('Area').fill('Front path');
    await form.getByLabel('Name (optional)').fill('Path string');
    await form.getByRole('button', { name: 'Add circuit' }).click();
    const editor = page.getByRole('article', { name: 'Circuit Front path: Path string' });
    await editor.waitFor();

    await editor.getByRole('combobox', { name: 'Driver', exact: true }).selectOption(made.ids.driver350!);
    for (let i = 0; i < 6; i++) await editor.getByRole('button', { name: 'Add fitting' }).click();
    // the demo catalogue has fittings of its own: choose this test's spike for every position
    for (let i = 1; i <= 6; i++) await editor.getByLabel(`Fitting ${i} product`).selectOption(made.ids.spike!);
    await editor.getByLabel('Fitting 6 label').fill('Gate post');
    // keyboard reorder: Alt+Up moves the fitting you are on, and the focus goes with it
    await editor.getByLabel('Fitting 6 label').press('Alt+ArrowUp');
    await expect.poll(() => editor.getByLabel('Fitting 5 label').inputValue()).toBe('Gate post');
    await expect.poll(() => page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.value)).toBe('Gate post');
    await page.keyboard.press('Alt+ArrowDown');
    await expect.poll(() => editor.getByLabel('Fitting 6 label').inputValue()).toBe('Gate post');

    await editor.getByRole('button', { name: 'Add driver lead' }).click();
    await editor.getByLabel('Driver lead: cable').selectOption(made.ids.cable!);
    await editor.getByLabel('Driver lead: length (m)').fill('10');
    await editor.getByLabel('Connector block type').selectOption(made.ids.block!);
    await editor.getByRole('button', { name: 'Match links to blocks' }).click();
    await editor.getByLabel('Link 1 (block 1 to 2): length (m)').fill('8');

    const figure = (name: string) => editor.locator(`[data-figure="${name}"]`).textContent();
    await expect.poll(() => figure('string-voltage')).toMatch(/^18 V/);
    await expect.poll(() => figure('cable-drop')).toMatch(/^0\.201 V/); // 0.2005 V to three places
    await expect.poll(() => figure('compliance-voltage')).toMatch(/^18\.2 V/);
    expect(await figure('loading')).toMatch(/%/);
    await editor.getByRole('table', { name: 'Terminal schedule, block 1' }).waitFor();
    await editor.getByRole('table', { name: 'Terminal schedule, block 2' }).waitFor();
    expect(await editor.getByRole('table', { name: 'Terminal schedule, block 1' }).textContent()).toContain(
      'fittings 1, 2, 3, 4',
    );
    expect(await editor.getByRole('table', { name: 'Terminal schedule, block 2' }).textContent()).toContain('fittings 5, 6');
    expect(await editor.getByRole('list', { name: 'Installer’s steps' }).locator('li').count()).toBeGreaterThan(3);
    await editor.getByRole('img', { name: /Wiring diagram/ }).waitFor();
    expect(await editor.getByRole('status').filter({ hasText: 'No blocking errors' }).count()).toBe(1);

    await editor.getByRole('button', { name: 'Save circuit' }).click();
    const saved = page.getByRole('article', { name: 'Circuit Front path: Path string' });
    await expect.poll(() => saved.getByText('the server’s check matches this page').count(), { timeout: 10_000 }).toBe(1);
    await page.screenshot({ path: screenshotPath('circuit-designer'), fullPage: true });
    await saved
      .getByRole('region', { name: 'Wiring' })
      .screenshot({ path: screenshotPath('circuit-designer-wiring') })
      .catch(() => undefined);

    // The derived lines reached the estimate.
    const detail = QuoteDetailResponse.parse(
      await (await page.request.get(`${server.baseUrl}/api/quotes/${made.quoteId}`)).json(),
    );
    const lines = detail.revision.content.sections.flatMap((s) => s.lines).filter((l) => l.circuitId !== null);
    expect(lines.find((l) => l.productId === made.ids.spike)?.quantityMilli).toBe(6000);
    expect(lines.find((l) => l.productId === made.ids.block)?.quantityMilli).toBe(2000);

    // A driver of the wrong current: the mismatch is reported beside the driver.
    await saved.getByRole('combobox', { name: 'Driver', exact: true }).selectOption(made.ids.driver700!);
    const atDriver = saved.getByRole('list', { name: 'Findings about the driver' });
    await atDriver.locator('[data-finding="driver-current-mismatch"]').waitFor();
    expect(await atDriver.textContent()).toContain('This driver gives 700 mA');
    expect(await atDriver.textContent()).toContain('Error');
    await saved
      .getByRole('list', { name: 'Findings about fitting 1' })
      .locator('[data-finding="current-above-rating"]')
      .waitFor();
    await page.screenshot({ path: screenshotPath('circuit-designer-wrong-driver'), fullPage: true });
    expect(problems.filter((p) => !/status of 401/.test(p))).toEqual([]); // the signed-out session check before sign-in
  }, 120_000);
});
