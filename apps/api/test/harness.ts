import request from 'supertest';
import { afterEach, beforeEach } from 'vitest';
import type { Role } from '@gloaming/contracts';
import { startMailCatcher, type MailCatcher } from '@gloaming/fakes';
import { createFirm, openTestDatabase, type FirmFixture } from '@gloaming/db/testing';
import { createApp, type GloamingApp } from '../src/app';
import { loadConfig, type AppConfig } from '../src/config/env';
import { createSmtpMailer } from '../src/mail/mailer';

export interface TestServer extends GloamingApp {
  config: AppConfig;
  catcher: MailCatcher;
  firmA: FirmFixture;
  firmB: FirmFixture;
  orm: Awaited<ReturnType<typeof openTestDatabase>>['orm'];
  /** Which database this server runs on: SQLite, or PostgreSQL when DATABASE_URL is set. */
  dialect: 'sqlite' | 'postgresql';
  /** Path of the SQLite file (SQLite only). */
  databaseFile: string;
  /** URL of this server's own PostgreSQL database (PostgreSQL only). */
  databaseUrl?: string;
  /** A supertest agent signed in as `role` of firm A (or B). Keeps its cookie. */
  signIn(role: Role, firm?: 'A' | 'B'): Promise<ReturnType<typeof request.agent>>;
  close(): Promise<void>;
}

/**
 * What the server logged as an error during the running test. Tests make errors on purpose, so
 * they are kept quiet; when a test fails they are printed with it, so a failure seen only on a
 * CI machine still shows the server's own reason (a rolled-back import, a busy database).
 */
const serverErrors: string[] = [];
const quietLogger = {
  info: () => {},
  error: (msg: string, err?: unknown) => {
    const code = (err as { code?: unknown } | undefined)?.code;
    const detail =
      err instanceof Error
        ? `${err.name}${code ? ` (${String(code)})` : ''}: ${err.message.length > 400 ? `…${err.message.slice(-400)}` : err.message}`
        : err === undefined
          ? ''
          : String(err);
    serverErrors.push(detail ? `${msg}: ${detail}` : msg);
  },
};
beforeEach(() => {
  serverErrors.length = 0;
});
afterEach(({ task }) => {
  if (task.result?.state === 'fail' && serverErrors.length)
    console.error(`The server logged during "${task.name}":\n${serverErrors.join('\n')}`);
});

/**
 * The PostgreSQL server the suite runs against (`npm run test:postgres` sets DATABASE_URL to a
 * throwaway server), or undefined for the SQLite default.
 */
export const testPostgresUrl: string | undefined = process.env.DATABASE_URL || undefined;

/**
 * createApp on a fresh database of its own (a temp SQLite file, or a new PostgreSQL database
 * on the DATABASE_URL server, dropped on close), two firms, and a real SMTP catcher.
 */
export async function startTestServer(
  env: Record<string, string> = {},
  database: { busyTimeoutMs?: number } = {},
): Promise<TestServer> {
  const db = await openTestDatabase({ ...database, ...(testPostgresUrl ? { postgresUrl: testPostgresUrl } : {}) });
  const catcher = await startMailCatcher();
  const config = loadConfig({
    NODE_ENV: 'test',
    PORT: '0',
    PUBLIC_URL: 'http://gloaming.test',
    SMTP_PORT: String(catcher.smtpPort),
    GLOAMING_FAKES: 'false',
    DATA_DIR: db.dir,
    ...(db.url ? { DATABASE_URL: db.url } : {}),
    ...env,
  });
  const mailer = createSmtpMailer(config.mail);
  const built = createApp({ orm: db.orm, config, mailer, logger: quietLogger });
  const firmA = await createFirm(db.orm.em.fork(), 'Firm A Lighting');
  const firmB = await createFirm(db.orm.em.fork(), 'Firm B Lighting');
  return {
    ...built,
    config,
    catcher,
    firmA,
    firmB,
    orm: db.orm,
    dialect: db.dialect,
    databaseFile: db.file,
    ...(db.url ? { databaseUrl: db.url } : {}),
    async signIn(role, firm = 'A') {
      const f = firm === 'A' ? firmA : firmB;
      const agent = request.agent(built.app);
      const res = await agent.post('/api/session').send({ email: f.users[role].email, password: f.password });
      if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return agent;
    },
    async close() {
      await built.outbox.idle();
      mailer.close();
      await catcher.close();
      await db.close();
    },
  };
}

/** The token from a link in an e-mail body (`...?token=XYZ`). */
export function tokenFromMail(text: string): string {
  const match = /token=([A-Za-z0-9_-]+)/.exec(text);
  if (!match) throw new Error(`no token link in: ${text}`);
  return match[1]!;
}
