// Flat config for the whole monorepo. Import boundaries (see docs/architecture.md):
// front ends never import db or fakes; the engine imports nothing of ours and no I/O;
// apps never import each other.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

const nodeBuiltins = ['fs', 'path', 'http', 'https', 'net', 'child_process', 'os', 'crypto', 'url', 'worker_threads', 'stream', 'zlib', 'dns', 'tls', 'dgram', 'cluster', 'process', 'perf_hooks'];
const noNode = nodeBuiltins.flatMap((m) => [m, `node:${m}`]);

const restrict = (paths, patterns) => ({
  'no-restricted-imports': ['error', { paths: paths.map((name) => ({ name, message: 'Not allowed here by the layer rules (docs/architecture.md).' })), patterns }],
});

export default tseslint.config(
  { ignores: ['**/dist/**', '**/node_modules/**', '**/.turbo/**', 'data/**', 'coverage/**', 'tests/artifacts/**', 'bench/results/**', 'packages/db/src/migrations/Migration*.ts', 'packages/db/src/migrations-postgres/Migration*.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      '@typescript-eslint/no-explicit-any': 'error',
      eqeqeq: ['error', 'always'],
      'no-eval': 'error',
      'no-implied-eval': 'error',
      'no-new-func': 'error',
    },
  },
  {
    files: ['apps/workbench/**/*.{ts,tsx}', 'apps/portal/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...restrict(['@gloaming/db', '@gloaming/fakes', '@gloaming/api'], [
        { group: ['@gloaming/db/*', '@gloaming/fakes/*', '**/apps/api/**', '**/packages/db/**', '**/packages/fakes/**'], message: 'Front ends never import the database, the fakes or the api.' },
      ]),
    },
  },
  {
    files: ['apps/workbench/src/**/*.{ts,tsx}'],
    rules: restrict(['@gloaming/db', '@gloaming/fakes', '@gloaming/api', '@gloaming/portal'], [
      { group: ['@gloaming/db/*', '@gloaming/fakes/*', '**/apps/portal/**', '**/apps/api/**'], message: 'Apps never import each other; front ends never import db or fakes.' },
    ]),
  },
  {
    files: ['apps/portal/src/**/*.{ts,tsx}'],
    rules: restrict(['@gloaming/db', '@gloaming/fakes', '@gloaming/api', '@gloaming/workbench'], [
      { group: ['@gloaming/db/*', '@gloaming/fakes/*', '**/apps/workbench/**', '**/apps/api/**'], message: 'Apps never import each other; front ends never import db or fakes.' },
    ]),
  },
  {
    files: ['packages/engine/src/**/*.ts'],
    rules: restrict([...noNode, '@gloaming/contracts', '@gloaming/db', '@gloaming/fakes', 'zod', 'express', 'react'], [
      { group: ['@gloaming/*', '../../*', 'node:*'], message: 'The engine is pure: it imports nothing of ours and no I/O.' },
    ]),
  },
  {
    files: ['packages/contracts/src/**/*.ts'],
    rules: restrict([...noNode, '@gloaming/db', '@gloaming/fakes'], [
      { group: ['@gloaming/db/*', '@gloaming/fakes/*', '**/apps/**'], message: 'Contracts are shared by browsers: no I/O, no db.' },
    ]),
  },
  {
    files: ['packages/db/src/**/*.ts'],
    rules: restrict(['@gloaming/fakes', 'express'], [{ group: ['**/apps/**'], message: 'Packages never import apps.' }]),
  },
  {
    files: ['apps/api/src/**/*.ts'],
    rules: restrict(['@gloaming/workbench', '@gloaming/portal'], [{ group: ['**/apps/workbench/**', '**/apps/portal/**'], message: 'Apps never import each other.' }]),
  },
);
