import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const benchDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
export const repoRoot = resolve(benchDir, '..');
export const resultsDir = join(benchDir, 'results');
