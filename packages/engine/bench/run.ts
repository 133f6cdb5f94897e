/**
 * `npm run bench` (engine): imports every file in bench/cases, runs its cases and prints
 * one JSON line per case. Each case file default-exports a function returning results.
 */
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { BenchResult } from './harness';

const here = dirname(fileURLToPath(import.meta.url));
const dir = join(here, 'cases');
const files = readdirSync(dir).filter((f) => f.endsWith('.bench.ts')).sort();
const filter = process.argv[2];
const all: BenchResult[] = [];
for (const file of files) {
  if (filter && !file.includes(filter)) continue;
  const mod = (await import(pathToFileURL(join(dir, file)).href)) as { default: () => BenchResult[] };
  for (const r of mod.default()) {
    all.push(r);
    console.log(JSON.stringify({ suite: 'engine', ...r }));
  }
}
if (all.length === 0) console.log(JSON.stringify({ suite: 'engine', note: 'no cases found' }));
