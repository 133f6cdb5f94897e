#!/usr/bin/env node
// The system tools the tests use, installed when missing (root with apt-get) so
// `npm ci && npm test` passes on a fresh machine: Debian's Chromium for the browser tests
// (never a browser download of its own) and poppler-utils' pdftoppm, which turns the PDFs the
// browser tests download into pictures to look at.
import { execSync } from 'node:child_process';
import { existsSync } from 'node:fs';

const chromium = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

function onPath(command) {
  try {
    execSync(`command -v ${command}`, { stdio: 'ignore', shell: '/bin/sh' });
    return true;
  } catch {
    return false;
  }
}

/** Debian package name -> whether it is already there, and how to tell a user without root. */
const tools = [
  { pkg: 'chromium', present: () => existsSync(chromium), what: `Chromium not found at ${chromium} (or set CHROMIUM_PATH)` },
  { pkg: 'poppler-utils', present: () => onPath('pdftoppm'), what: 'pdftoppm not found' },
];
const missing = tools.filter((t) => !t.present());
if (missing.length === 0) process.exit(0);

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
if (!isRoot || !onPath('apt-get')) {
  for (const t of missing) console.error(`${t.what}. Install Debian's package: sudo apt-get install ${t.pkg}`);
  process.exit(1);
}
const pkgs = missing.map((t) => t.pkg).join(' ');
console.log(`Installing Debian packages for the tests (one time): ${pkgs}…`);
execSync(`apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq ${pkgs}`, { stdio: 'inherit', shell: '/bin/sh' });
const still = missing.filter((t) => !t.present());
if (still.length > 0) {
  for (const t of still) console.error(`apt-get finished but: ${t.what}.`);
  process.exit(1);
}
