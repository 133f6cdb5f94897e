/**
 * Start Gloaming: validate the configuration, open and migrate the SQLite database under
 * DATA_DIR (seeding the demo firm into a new one), start the local fakes outside
 * production, then serve the api, the workbench and the portal. Shuts down cleanly on
 * SIGINT/SIGTERM.
 */
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import type { Server } from 'node:http';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEMO_ACCOUNTS, DEMO_FIRM, migrate, openDatabase, seedDemoIfEmpty } from '@gloaming/db';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config/env';
import { createSmtpMailer } from './mail/mailer';

const here = dirname(fileURLToPath(import.meta.url));
const appsDir = resolve(here, '../..');

function readVersion(): string {
  try {
    return (JSON.parse(readFileSync(join(appsDir, 'api', 'package.json'), 'utf8')) as { version: string }).version;
  } catch {
    return '0.0.0';
  }
}

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig(process.env, readVersion());
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(78);
    }
    throw err;
  }

  mkdirSync(config.dataDir, { recursive: true });
  const isNewDatabase = !existsSync(config.databaseFile);
  const orm = await openDatabase({ file: config.databaseFile });
  const applied = await migrate(orm);
  const seeded = config.seedDemo ? await seedDemoIfEmpty(orm) : false;

  let stopFakes: (() => Promise<void>) | undefined;
  let inboxUrl: string | undefined;
  if (config.startFakes) {
    const { startMailCatcher } = await import('@gloaming/fakes');
    const catcher = await startMailCatcher({ host: '127.0.0.1', smtpPort: config.mail.port, webPort: config.inboxPort });
    stopFakes = () => catcher.close();
    inboxUrl = `http://127.0.0.1:${catcher.webPort}/`;
  }

  const mailer = createSmtpMailer(config.mail);
  const { app } = createApp({
    orm,
    config,
    mailer,
    frontEnds: { workbenchDir: join(appsDir, 'workbench', 'dist'), portalDir: join(appsDir, 'portal', 'dist') },
  });

  const server: Server = await new Promise((resolveListen, reject) => {
    const s = app.listen(config.port, config.host, () => resolveListen(s));
    s.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  const base = config.publicUrl.includes(`:${config.port}`) ? config.publicUrl.replace(`:${config.port}`, `:${port}`) : config.publicUrl;

  const lines = [
    '',
    `Gloaming ${config.version} is running (${config.env}).`,
    `  Workbench  ${base}/`,
    `  Portal     ${base}/portal/`,
    `  Health     ${base}/api/health`,
    ...(inboxUrl ? [`  Inbox      ${inboxUrl}  (local SMTP catcher: every e-mail lands here)`] : []),
    `  Database   ${config.databaseFile}${isNewDatabase ? ' (new)' : ''}${applied.length ? `, ${applied.length} migration(s) applied` : ''}${seeded ? ', demo firm seeded' : ''}`,
  ];
  if (config.seedDemo) {
    lines.push('', `Demo sign-ins (${DEMO_FIRM.name}, invented):`);
    for (const a of DEMO_ACCOUNTS) lines.push(`  ${a.role.padEnd(10)} ${a.email.padEnd(28)} ${a.password}`);
  }
  console.log(lines.join('\n') + '\n');

  let closing = false;
  const shutdown = async (signal: string) => {
    if (closing) return;
    closing = true;
    console.log(`${signal}: shutting down…`);
    server.closeIdleConnections();
    const timer = setTimeout(() => server.closeAllConnections(), 5000);
    await new Promise<void>((r) => server.close(() => r()));
    clearTimeout(timer);
    mailer.close();
    await stopFakes?.();
    await orm.close(true);
    process.exit(0);
  };
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error('Gloaming failed to start:', err);
  process.exit(1);
});
