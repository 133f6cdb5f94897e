/**
 * A bare api process for the crash-durability test: opens the SQLite file named in argv[2],
 * migrates, listens on a free loopback port and prints `PORT <n>`. The test kills it with
 * SIGKILL while requests are in flight.
 */
import { dirname } from 'node:path';
import type { AddressInfo } from 'node:net';
import { migrate, openDatabase } from '@gloaming/db';
import { createApp } from '../../src/app';
import { loadConfig } from '../../src/config/env';
import { createSmtpMailer } from '../../src/mail/mailer';

const file = process.argv[2];
if (!file) throw new Error('usage: crash-child.ts <sqlite file>');
const orm = await openDatabase({ file });
await migrate(orm);
const config = loadConfig({
  NODE_ENV: 'test',
  PORT: '0',
  PUBLIC_URL: 'http://127.0.0.1',
  GLOAMING_FAKES: 'false',
  GLOAMING_SEED_DEMO: 'false',
  SMTP_PORT: '9',
  DATA_DIR: dirname(file),
  GLOAMING_SIGNIN_MAX_PER_IP: '100000',
  GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '100000',
});
const { app } = createApp({ orm, config, mailer: createSmtpMailer(config.mail), logger: { info: () => {}, error: () => {} } });
const server = app.listen(0, '127.0.0.1', () => {
  process.stdout.write(`PORT ${(server.address() as AddressInfo).port}\n`);
});
