import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const ARTIFACTS_DIR = resolve(dirname(fileURLToPath(import.meta.url)), '../artifacts');

export interface BrowserSession {
  browser: Browser;
  newPage(viewport?: { width: number; height: number }): Promise<{ page: Page; context: BrowserContext; problems: string[] }>;
  close(): Promise<void>;
}

/**
 * Debian's Chromium, headless, with a fresh profile (playwright makes a new temporary
 * user-data-dir for every launch) and no background traffic. Every page
 * records console errors, CSP violations and failed requests into `problems`.
 */
export async function launchBrowser(): Promise<BrowserSession> {
  const profile = mkdtempSync(join(tmpdir(), 'gloaming-chromium-'));
  process.env.XDG_CONFIG_HOME ??= join(profile, 'config');
  process.env.XDG_CACHE_HOME ??= join(profile, 'cache');
  const browser = await chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  return {
    browser,
    async newPage(viewport = { width: 1280, height: 800 }) {
      const context = await browser.newContext({ viewport });
      const page = await context.newPage();
      const problems: string[] = [];
      page.on('console', (msg) => {
        if (msg.type() === 'error') problems.push(`console: ${msg.text()}`);
      });
      page.on('pageerror', (err) => problems.push(`page error: ${err.message}`));
      return { page, context, problems };
    },
    async close() {
      await browser.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export const screenshotPath = (name: string) => join(ARTIFACTS_DIR, `${name}.png`);
