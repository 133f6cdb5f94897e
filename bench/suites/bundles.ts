/**
 * Bundles: the gzip size of each app's initial JavaScript and CSS, read from its built
 * index.html (module scripts, modulepreload links and stylesheets; lazy chunks and fonts are
 * not initial). Gzip at zlib's default level 6, which is what a server compressing on the fly
 * typically uses. The target is on JavaScript and CSS together.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { kb, unavailable, type BenchRow, type Suite } from '../support/report';
import { repoRoot } from '../support/paths';

const APPS = [
  { app: 'workbench', dist: 'apps/workbench/dist', base: '/', targetKb: 350 },
  { app: 'portal', dist: 'apps/portal/dist', base: '/portal/', targetKb: 150 },
] as const;

/** The files index.html loads before anything else: module scripts, modulepreloads, stylesheets. */
export function initialAssets(html: string): { js: string[]; css: string[] } {
  const js = new Set<string>();
  const css = new Set<string>();
  for (const m of html.matchAll(/<script\b[^>]*\btype="module"[^>]*\bsrc="([^"]+)"/g)) js.add(m[1]!);
  for (const m of html.matchAll(/<link\b[^>]*\brel="modulepreload"[^>]*\bhref="([^"]+)"/g)) js.add(m[1]!);
  for (const m of html.matchAll(/<link\b[^>]*\brel="stylesheet"[^>]*\bhref="([^"]+)"/g)) css.add(m[1]!);
  return { js: [...js], css: [...css] };
}

export const bundlesSuite: Suite = async () => {
  const rows: BenchRow[] = [];
  for (const { app, dist, base, targetKb } of APPS) {
    const index = join(repoRoot, dist, 'index.html');
    if (!existsSync(index)) {
      rows.push(unavailable('bundles', `${app}: initial JS + CSS, gzip`, `< ${targetKb} KB`, `${dist}/index.html is missing (not built)`));
      continue;
    }
    const { js, css } = initialAssets(readFileSync(index, 'utf8'));
    const size = (urls: string[]) =>
      urls.reduce((sum, url) => {
        const file = join(repoRoot, dist, url.startsWith(base) ? url.slice(base.length) : url);
        return sum + gzipSync(readFileSync(file)).length;
      }, 0);
    const jsBytes = size(js);
    const cssBytes = size(css);
    const total = jsBytes + cssBytes;
    rows.push({
      suite: 'bundles',
      case: `${app}: initial JS + CSS, gzip`,
      figure: kb(total),
      value: total / 1024,
      unit: 'KB',
      target: `< ${targetKb} KB`,
      met: total / 1024 < targetKb,
      note: `JS ${kb(jsBytes)} in ${js.length} file(s), CSS ${kb(cssBytes)} in ${css.length} file(s)`,
    });
  }
  return rows;
};
