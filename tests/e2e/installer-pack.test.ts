/**
 * The installer's pack, end to end on a phone-sized screen: the demo installer opens the
 * approved courtyard job, sees the pick list and the terminal schedule, records a wrong
 * termination and is told exactly what to move, fixes it, enters commissioning readings (one
 * out of range is flagged) and downloads the pack PDF, whose text carries the schedule and the
 * readings and no prices.
 * Figures: 9 m driver lead + 10 % slack = 9.9 m (common practice, the takeoff's default);
 * nine fittings on five-way junctions go three to a block (one terminal per joint, common
 * practice); the deck light's forward voltage 3.1 V ± 10 % = 2.79-3.41 V (common practice).
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { pdfText } from '../support/pdf-text';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS } from '@gloaming/db';
import { ARTIFACTS_DIR, launchBrowser, screenshotPath, type BrowserSession } from '../support/browser';
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

const installer = DEMO_ACCOUNTS.find((a) => a.role === 'installer')!;

describe("installer's pack", () => {
  it('opens an approved job, records a wrong termination and sees the fix, enters readings and downloads the PDF', async () => {
    expect(installer.email).toBe('callum@nightjar.example');
    const { page, problems } = await browser.newPage({ width: 390, height: 844 });
    await page.goto(`${server.baseUrl}/`);
    await page.getByLabel('E-mail').fill(installer.email);
    await page.getByLabel('Password').fill(installer.password);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Jobs', level: 1 }).waitFor();

    // installers never reach estimates
    expect((await page.request.get(`${server.baseUrl}/api/quotes`)).status()).toBe(403);

    const jobs = page.getByRole('list', { name: 'Approved jobs' });
    await jobs.waitFor();
    expect(await jobs.textContent()).not.toContain('£');
    await jobs.getByRole('link', { name: /Courtyard and bollards/ }).click();
    await page.getByRole('heading', { name: 'Courtyard and bollards', level: 1 }).waitFor();
    await expect
      .poll(() => page.getByRole('complementary', { name: 'Electrical caution' }).textContent())
      .toContain('licensed electrician');

    // pick list: the bench (driver, supply, cable cuts) and the van (fittings, junctions, seals)
    const bench = page.getByRole('table', { name: 'bench items' });
    expect(await bench.textContent()).toContain('Fernlea driver 350 mA 3-48 V');
    expect(await bench.textContent()).toContain('Fernlea supply 12 V 60 W');
    const van = page.getByRole('table', { name: 'van items' });
    const deck = van.getByRole('row', { name: /Pebble deck light 1 W/ });
    expect(await deck.textContent()).toContain('9');
    expect(await van.getByRole('row', { name: /Gel-filled junction 5 way/ }).textContent()).toContain('3');
    const cuts = page.getByRole('table', { name: 'Cable cuts' });
    expect(await cuts.getByRole('row', { name: /Driver lead/ }).textContent()).toContain('9.9 m');
    expect(await page.locator('main').textContent()).not.toMatch(/£|\bmargin\b/);

    // the designed schedule and the steps
    const block3 = page.getByRole('table', { name: 'Terminal schedule, block 3' });
    await block3.waitFor();
    expect(await block3.textContent()).toContain('fittings 7, 8, 9');
    expect(await page.getByRole('list', { name: 'Installer’s steps' }).locator('li').count()).toBeGreaterThan(5);
    await page.getByRole('img', { name: /Wiring diagram: .* in series/ }).waitFor();
    await page.getByRole('img', { name: /Wiring diagram: .* in parallel/ }).waitFor(); // the 12 V run diagram
    await page.screenshot({ path: screenshotPath('installer-pack-phone'), fullPage: true });

    // as wired: fitting 9's − landed on terminal 3 with its own + instead of terminal 4 with the return
    const t3 = page.getByLabel('Block 3 terminal 3, conductor ends connected');
    const t4 = page.getByLabel('Block 3 terminal 4, conductor ends connected');
    expect(await t3.inputValue()).toBe('fitting:8-, fitting:9+');
    expect(await t4.inputValue()).toBe('fitting:9-, link:2/core:2/end:B');
    await t3.fill('fitting:8-, fitting:9+, fitting:9-');
    await t4.fill('link:2/core:2/end:B');
    const fix =
      'Block 3 terminal 3: fitting 9 (Let 3 path) − lands here, on the joint for fitting 8 (Let 3 door) − and fitting 9 (Let 3 path) +; move it to block 3 terminal 4 (with link cable 2 core 2 (end B)).';
    const verdict = page.locator('[data-testid$="-verdict"]');
    await expect.poll(() => verdict.textContent()).toContain('Not safe to power up');
    expect(await verdict.textContent()).toContain(fix);
    const beside = page.locator('[data-testid$="-b3-t3-problems"]');
    await expect.poll(() => beside.textContent()).toContain(fix);
    await beside.scrollIntoViewIfNeeded();
    await page.screenshot({ path: screenshotPath('installer-pack-wrong-termination') });
    await page.getByRole('button', { name: 'Save what was wired' }).click();
    await page.getByText('Saved. The check says it is not safe yet.').waitFor();

    // the record is kept with the job
    await page.reload();
    await page.getByLabel('Block 3 terminal 3, conductor ends connected').waitFor();
    expect(await page.getByLabel('Block 3 terminal 3, conductor ends connected').inputValue()).toBe(
      'fitting:8-, fitting:9+, fitting:9-',
    );
    // do what it says
    await page.getByLabel('Block 3 terminal 3, conductor ends connected').fill('fitting:8-, fitting:9+');
    await page.getByLabel('Block 3 terminal 4, conductor ends connected').fill('fitting:9-, link:2/core:2/end:B');
    await expect.poll(() => verdict.textContent()).toContain('Safe to power up');
    await page.getByRole('button', { name: 'Save what was wired' }).click();
    await page.getByText('Saved. The check says it is safe to power up.').waitFor();

    // commissioning readings on the deck-light string: the far fitting reads low
    const current = page.getByLabel(/^Output current at the driver/).first();
    await current.fill('0.351');
    const far = page.getByLabel(/^Voltage across the last fitting/).first();
    await far.fill('2.1');
    await page
      .getByLabel(/^Insulation resistance/)
      .first()
      .fill('200');
    await page
      .getByLabel(/^Polarity checked/)
      .first()
      .check();
    await page
      .getByLabel(/^Every connector block, gland and entry sealed/)
      .first()
      .check();
    const farStatus = page.locator('[data-testid$="-far-fitting-voltage-status"]').first();
    await expect.poll(() => farStatus.textContent()).toBe('Low: outside 2.79–3.41 V');
    expect(await page.locator('[data-testid$="-output-current-status"]').first().textContent()).toBe('In range');
    await page.getByRole('button', { name: 'Save readings' }).first().click();
    await page.getByText('Readings saved, 1 flagged.').waitFor();
    await far.scrollIntoViewIfNeeded();
    await page.screenshot({ path: screenshotPath('installer-pack-readings') });

    // the PDF: downloaded as the installer, its text read back
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download the pack (PDF)' }).click(),
    ]);
    const file = join(ARTIFACTS_DIR, 'installer-pack.pdf');
    await download.saveAs(file);
    expect(download.suggestedFilename()).toMatch(/^Q-\d{4}-installers-pack\.pdf$/);
    const text = await pdfText(readFileSync(file));
    expect(text).toContain('Installer’s pack');
    expect(text).toContain('Pick list');
    expect(text).toContain('Entrances: Deck lights');
    expect(text).toContain('Courtyard: Bollards');
    expect(text).toContain('Block 3: Gel-filled junction 5 way');
    expect(text).toMatch(/T4\s+fitting:9-/);
    expect(text).toContain('Output current at the driver');
    expect(text).toContain('LOW'); // the far-fitting reading
    expect(text).toContain('As wired: safe to power up');
    expect(text).toContain('licensed electrician');
    expect(text).not.toMatch(/£|\bmargin\b|\bVAT\b/);
    // pictures of the first two pages to look at
    execFileSync('pdftoppm', ['-png', '-r', '70', '-f', '1', '-l', '2', file, join(ARTIFACTS_DIR, 'installer-pack-pdf')]);

    expect(problems.filter((p) => !/status of 401/.test(p))).toEqual([]);
  }, 180_000);
});
