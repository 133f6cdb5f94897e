import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

interface AxeResult {
  violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[];
}

let source: Promise<string> | undefined;

/**
 * axe-core's serious and critical violations on the page as it stands, one line each (empty
 * when there are none). The page's context needs `bypassCSP` only if its policy would refuse
 * the injected source.
 */
export async function seriousViolations(page: Page): Promise<string[]> {
  source ??= readFile(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
  await page.evaluate(await source);
  const result = (await page.evaluate(() =>
    (window as unknown as { axe: { run: () => Promise<unknown> } }).axe.run(),
  )) as AxeResult;
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}
