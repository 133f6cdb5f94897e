/**
 * Start Gloaming: validate the configuration, open and migrate the SQLite database under
 * DATA_DIR (seeding the demo firm into a new one), start the local fakes (mail catcher,
 * payment-provider fake) outside production, then serve the api, the workbench and the
 * portal. Shuts down cleanly on SIGINT/SIGTERM.
 */
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import type { Server } from 'node:http';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEMO_ACCOUNTS, DEMO_FIRM, migrate, openDatabase, seedDemoIfEmpty, withoutPassword } from '@gloaming/db';
import type { PaymentFake } from '@gloaming/fakes';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config/env';
import { createSmtpMailer } from './mail/mailer';
import { startOutboxWorker } from './mail/outbox';
import { startExpirySweep } from './modules/portal/expiry-sweep';

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
  const isNewDatabase = !config.databaseUrl && !existsSync(config.databaseFile);
  const orm = await openDatabase(config.databaseUrl ? { url: config.databaseUrl } : { file: config.databaseFile });
  const applied = await migrate(orm);
  const seeded = config.seedDemo ? await seedDemoIfEmpty(orm) : false;

  let stopFakes: (() => Promise<void>) | undefined;
  let inboxUrl: string | undefined;
  let paymentFake: PaymentFake | undefined;
  if (config.startFakes) {
    const { startMailCatcher, startPaymentFake } = await import('@gloaming/fakes');
    const catcher = await startMailCatcher({ host: '127.0.0.1', smtpPort: config.mail.port, webPort: config.inboxPort });
    inboxUrl = `http://127.0.0.1:${catcher.webPort}/`;
    const fake = await startPaymentFake({
      host: '127.0.0.1',
      port: config.paymentsFakePort,
      secretKey: config.payments.secretKey,
      webhookSecret: config.payments.webhookSecret,
    }).catch(async (err: unknown) => {
      await catcher.close();
      throw err;
    });
    paymentFake = fake;
    // With GLOAMING_PAYMENTS_FAKE_PORT=0 the fake took a free port: point the SDK at it.
    const api = config.payments.api;
    if (api && api.host === '127.0.0.1' && api.port === config.paymentsFakePort) {
      config.payments.api = { ...api, port: fake.port };
    }
    stopFakes = async () => {
      await fake.close();
      await catcher.close();
    };
  }

  const mailer = createSmtpMailer(config.mail);
  const { app, drain, outbox } = createApp({
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
  const base = config.publicUrl.includes(`:${config.port}`)
    ? config.publicUrl.replace(`:${config.port}`, `:${port}`)
    : config.publicUrl;
  // The fake delivers webhooks straight to this process on loopback, whatever PUBLIC_URL says.
  const loopback = ['0.0.0.0', '::', ''].includes(config.host) ? '127.0.0.1' : config.host;
  paymentFake?.setWebhookUrl(`http://${loopback.includes(':') ? `[${loopback}]` : loopback}:${port}/api/payments/webhook`);

  const lines = [
    '',
    `Gloaming ${config.version} is running (${config.env}).`,
    `  Workbench  ${base}/`,
    `  Portal     ${base}/portal/`,
    `  Health     ${base}/api/health`,
    ...(inboxUrl ? [`  Inbox      ${inboxUrl}  (local SMTP catcher: every e-mail lands here)`] : []),
    ...(paymentFake ? [`  Payments   ${paymentFake.url}/  (local payment-provider fake: test cards, no real money)`] : []),
    `  Database   ${config.databaseUrl ? `PostgreSQL ${withoutPassword(config.databaseUrl)}` : config.databaseFile}${isNewDatabase ? ' (new)' : ''}${applied.length ? `, ${applied.length} migration(s) applied` : ''}${seeded ? ', demo firm seeded' : ''}`,
  ];
  if (config.seedDemo) {
    lines.push('', `Demo sign-ins (${DEMO_FIRM.name}, invented):`);
    for (const a of DEMO_ACCOUNTS) lines.push(`  ${a.role.padEnd(10)} ${a.email.padEnd(28)} ${a.password}`);
  }
  console.log(lines.join('\n') + '\n');

  const stopExpirySweep = startExpirySweep(orm, console);
  // E-mail: pending messages (a restart's leftovers included) go out now, retries every few seconds.
  const stopOutbox = startOutboxWorker(outbox, console);

  let closing = false;
  const shutdown = async (signal: string) => {
    if (closing) return;
    closing = true;
    // New requests get 503 from here on; running ones finish; the listener stops accepting.
    drain();
    server.closeIdleConnections();
    const timer = setTimeout(() => server.closeAllConnections(), 5000);
    const closed = new Promise<void>((r) => server.close(() => r()));
    // said once the listener is closed, so whoever reads it can count on new connections being refused
    console.log(`${signal}: shutting down…`);
    await closed;
    clearTimeout(timer);
    stopExpirySweep();
    await stopOutbox();
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
