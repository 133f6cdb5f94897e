#!/usr/bin/env node
// Browser tests drive Debian's Chromium. Install it when missing (root with apt-get), so
// `npm ci && npm test` passes on a fresh machine. Never downloads a browser of its own.
import { execSync } from 'node:child_process';
import { existsSync } from 'node:fs';

const path = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
if (existsSync(path)) process.exit(0);

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
function hasApt() {
  try {
    execSync('command -v apt-get', { stdio: 'ignore', shell: '/bin/sh' });
    return true;
  } catch {
    return false;
  }
}
if (!isRoot || !hasApt()) {
  console.error(`Chromium not found at ${path}. Install Debian's package (sudo apt-get install chromium) or set CHROMIUM_PATH.`);
  process.exit(1);
}
console.log('Installing Debian chromium for the browser tests (one time)…');
execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium', { stdio: 'inherit', shell: '/bin/sh' });
if (!existsSync(path)) {
  console.error(`apt-get finished but ${path} is still missing.`);
  process.exit(1);
}
