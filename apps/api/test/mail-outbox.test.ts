/**
 * The e-mail outbox under a mail server that is down, comes back, and a restart: sends answer
 * "queued" and lose nothing; retries back off exponentially; a restarted process (two, even)
 * delivers each pending message exactly once; a message past its last attempt is marked failed
 * and the workbench's sending state says so.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startMailCatcher, type MailCatcher } from '@gloaming/fakes';
import { OutboxMessage, openDatabase, PortalToken, QuoteRevision, type Database } from '@gloaming/db';
import { createFirm, openTestDatabase, type FirmFixture, type TestDatabase } from '@gloaming/db/testing';
import { createApp, type GloamingApp } from '../src/app';
import { loadConfig, type AppConfig } from '../src/config/env';
import { createSmtpMailer, type MailTransport, type OutgoingMail } from '../src/mail/mailer';
import { retryDelayMs, startOutboxWorker, type OutboxPolicy } from '../src/mail/outbox';
import { createGardenQuote } from './estimate-fixture';

const quiet = { info: () => {}, error: () => {} };
const FAST: Partial<OutboxPolicy> = { retryBaseMs: 150, retryMaxMs: 5_000, maxAttempts: 6 };

let db: TestDatabase;
let firm: FirmFixture;
let smtpPort: number;

beforeAll(async () => {
  db = await openTestDatabase();
  firm = await createFirm(db.orm.em.fork(), 'Outbox Lighting');
  // a free port for the catcher, which these tests stop and start again on the same port
  const probe = await startMailCatcher();
  smtpPort = probe.smtpPort;
  await probe.close();
});
afterAll(async () => db.close());

function configFor(): AppConfig {
  return loadConfig({
    NODE_ENV: 'test',
    PORT: '0',
    PUBLIC_URL: 'http://gloaming.test',
    SMTP_PORT: String(smtpPort),
    GLOAMING_FAKES: 'false',
    DATA_DIR: db.dir,
  });
}

/** The SMTP transport, noting when each hand-over began and how it ended. */
function recordingTransport(config: AppConfig) {
  const smtp = createSmtpMailer(config.mail);
  const attempts: { at: number; to: string; ok: boolean }[] = [];
  const transport: MailTransport = {
    async send(mail: OutgoingMail) {
      const at = Date.now();
      try {
        await smtp.send(mail);
        attempts.push({ at, to: mail.to, ok: true });
      } catch (err) {
        attempts.push({ at, to: mail.to, ok: false });
        throw err;
      }
    },
    close: () => smtp.close(),
  };
  return { transport, attempts };
}

/** One api "process": its own connection to the shared SQLite file, its own outbox. */
async function startProcess(policy: Partial<OutboxPolicy> = FAST) {
  const orm: Database = await openDatabase({ file: db.file });
  const config = configFor();
  const { transport, attempts } = recordingTransport(config);
  const built: GloamingApp = createApp({ orm, config, mailer: transport, logger: quiet, outboxPolicy: policy });
  return {
    built,
    orm,
    attempts,
    async signIn(role: 'owner' | 'estimator') {
      const agent = request.agent(built.app);
      const res = await agent.post('/api/session').send({ email: firm.users[role].email, password: firm.password });
      expect(res.status).toBe(200);
      return agent;
    },
    async stop() {
      await built.outbox.idle();
      transport.close();
      await orm.close(true);
    },
  };
}

const sendPath = (g: { quote: { id: string }; revision: { id: string } }) =>
  `/api/quotes/${g.quote.id}/revisions/${g.revision.id}`;

async function waitUntil(check: () => Promise<boolean>, timeoutMs: number, label: string): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for: ${label}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe('mail server down, then back', () => {
  let catcher: MailCatcher | undefined;
  afterAll(async () => catcher?.close());

  it('answers "queued", keeps the message, retries with growing gaps and delivers once the server is back', async () => {
    const p = await startProcess();
    try {
      const g = await createGardenQuote(db.orm.em.fork(), firm, { email: 'down-then-up@home.example' });
      const agent = await p.signIn('estimator');

      // nothing listens on the SMTP port: the send is recorded and its e-mail queued
      const res = await agent.post(`${sendPath(g)}/send`).send({});
      expect(res.status).toBe(201);
      expect(res.body.delivery).toBe('queued');
      expect(res.body.sending.state).toBe('sent');
      expect(res.body.sending.links).toHaveLength(1);
      expect(res.body.sending.links[0]).toMatchObject({ delivery: 'queued', deliveryAttempts: 1 });

      const em = db.orm.em.fork();
      const link = await em.findOneOrFail(PortalToken, { revision: g.revision.id });
      const row = await em.findOneOrFail(OutboxMessage, { reference: link.id });
      expect(row).toMatchObject({ status: 'pending', attempts: 1, kind: 'quote', to: 'down-then-up@home.example' });
      expect(row.lastError).toBeTruthy();
      expect(row.attachments).toHaveLength(1);
      expect(Buffer.from(row.attachments[0]!.contentBase64, 'base64').subarray(0, 5).toString()).toBe('%PDF-');
      expect((await em.findOneOrFail(QuoteRevision, g.revision.id)).state).toBe('sent');

      // the worker retries while the server stays down: gaps follow base·2^(n−1)
      const stopWorker = startOutboxWorker(p.built.outbox, quiet, 40);
      await waitUntil(async () => p.attempts.length >= 4, 15_000, 'four failed attempts');
      catcher = await startMailCatcher({ smtpPort });
      const mail = await catcher.waitFor((m) => m.to.includes('down-then-up@home.example'), 15_000);
      await stopWorker();

      expect(mail.attachments[0]).toMatchObject({ contentType: 'application/pdf' });
      const tries = p.attempts.filter((a) => a.to === 'down-then-up@home.example');
      const gaps = tries.slice(1).map((a, i) => a.at - tries[i]!.at);
      console.log(
        `outbox back-off: ${tries.length} hand-overs, gaps ${gaps.map((g) => `${g} ms`).join(', ')} (base ${FAST.retryBaseMs} ms, doubling)`,
      );
      // each gap is at least the policy's delay for that attempt (the worker's 40 ms tick adds to
      // it), and those floors double: 150 → 300 → 600 → 1200 ms. Upper bounds are not checked: a
      // busy machine may run a round late, which is not the policy's doing.
      gaps.forEach((gap, i) => expect(gap).toBeGreaterThanOrEqual(retryDelayMs({ ...FAST } as OutboxPolicy, i + 1) - 5));
      expect(retryDelayMs({ ...FAST } as OutboxPolicy, 3)).toBe(4 * retryDelayMs({ ...FAST } as OutboxPolicy, 1));
      expect(tries.at(-1)!.ok).toBe(true);
      expect(tries.filter((a) => a.ok)).toHaveLength(1);

      const after = await db.orm.em.fork().findOneOrFail(OutboxMessage, row.id);
      expect(after.status).toBe('sent');
      expect(after.sentAt).toBeInstanceOf(Date);
      const state = await agent.get(`${sendPath(g)}/sending`);
      expect(state.body.sending.links[0]).toMatchObject({ delivery: 'sent', deliveryAttempts: tries.length });
      expect(catcher.messages().filter((m) => m.to.includes('down-then-up@home.example'))).toHaveLength(1);
    } finally {
      await p.stop();
    }
  }, 60_000);

  it('answers "sent" when the mail server takes the message at once', async () => {
    catcher ??= await startMailCatcher({ smtpPort });
    const p = await startProcess();
    try {
      const g = await createGardenQuote(db.orm.em.fork(), firm, { email: 'at-once@home.example' });
      const agent = await p.signIn('estimator');
      const res = await agent.post(`${sendPath(g)}/send`).send({});
      expect(res.status).toBe(201);
      // "sent" only if the server answered within the request's short wait; never "failed"
      expect(['sent', 'queued']).toContain(res.body.delivery);
      await catcher.waitFor((m) => m.to.includes('at-once@home.example'), 10_000);
      await p.built.outbox.idle();
      const state = await agent.get(`${sendPath(g)}/sending`);
      expect(state.body.sending.links[0]).toMatchObject({ delivery: 'sent', deliveryAttempts: 1 });
      console.log(`outbox: send answered "${res.body.delivery}" with the mail server up`);
    } finally {
      await p.stop();
    }
  }, 60_000);
});

describe('a restart with pending messages', () => {
  it('delivers each one exactly once, even with two processes running the worker', async () => {
    // process 1: mail server down; a quote send, an invitation and a password reset are queued
    const first = await startProcess({ ...FAST, retryBaseMs: 60_000 });
    const g = await createGardenQuote(db.orm.em.fork(), firm, { email: 'restart@home.example' });
    const owner = await first.signIn('owner');
    expect((await owner.post(`${sendPath(g)}/send`).send({})).body.delivery).toBe('queued');
    expect(
      (await owner.post('/api/invites').send({ email: 'restart.invitee@outbox.test', name: 'Ines Restart', role: 'estimator' }))
        .status,
    ).toBe(201);
    expect((await request(first.built.app).post('/api/password-resets').send({ email: firm.users.estimator.email })).status).toBe(
      202,
    );
    const wanted = ['restart@home.example', 'restart.invitee@outbox.test', firm.users.estimator.email];
    await waitUntil(
      async () => (await db.orm.em.fork().count(OutboxMessage, { to: { $in: wanted }, status: 'pending', attempts: 1 })) === 3,
      10_000,
      'three queued messages, each tried once',
    );
    await first.stop(); // the process ends with its messages still pending

    // the mail server is back; two processes start on the same database and run their workers
    const catcher = await startMailCatcher({ smtpPort });
    const a = await startProcess();
    const b = await startProcess();
    try {
      // make the retry due now, as after a long outage
      await db.orm.em.fork().nativeUpdate(OutboxMessage, { to: { $in: wanted } }, { nextAttemptAt: new Date(Date.now() - 1000) });
      // both processes' first rounds start together and see the same three due rows
      const [roundA, roundB] = await Promise.all([a.built.outbox.deliverDue(), b.built.outbox.deliverDue()]);
      const stops = [startOutboxWorker(a.built.outbox, quiet, 30), startOutboxWorker(b.built.outbox, quiet, 30)];
      await Promise.all(wanted.map((to) => catcher.waitFor((m) => m.to.includes(to), 15_000)));
      await new Promise((r) => setTimeout(r, 500)); // give a duplicate the time to show up
      await Promise.all(stops.map((stop) => stop()));
      console.log(`outbox restart: concurrent first rounds: A ${JSON.stringify(roundA)}, B ${JSON.stringify(roundB)}`);

      const counts = wanted.map((to) => catcher.messages().filter((m) => m.to.includes(to)).length);
      console.log(
        `outbox restart: ${wanted.length} pending messages, caught ${counts.join('/')} (want 1 each); hand-overs: process A ${a.attempts.length}, process B ${b.attempts.length}`,
      );
      expect(counts).toEqual([1, 1, 1]);
      expect(a.attempts.length + b.attempts.length).toBe(3);
      const rows = await db.orm.em.fork().find(OutboxMessage, { to: { $in: wanted } });
      expect(rows.map((r) => [r.status, r.attempts])).toEqual(rows.map(() => ['sent', 2]));
      expect(rows.map((r) => r.kind).sort()).toEqual(['invite', 'password-reset', 'quote']);
    } finally {
      await a.stop();
      await b.stop();
      await catcher.close();
    }
  }, 90_000);
});

describe('a message past its last attempt', () => {
  it('is marked failed, with the reason, and the sending state says "failed"', async () => {
    const p = await startProcess({ retryBaseMs: 20, retryMaxMs: 100, maxAttempts: 3 });
    try {
      const g = await createGardenQuote(db.orm.em.fork(), firm, { email: 'never@home.example' });
      const agent = await p.signIn('estimator');
      expect((await agent.post(`${sendPath(g)}/send`).send({})).body.delivery).toBe('queued');
      const stopWorker = startOutboxWorker(p.built.outbox, quiet, 20);
      const em = db.orm.em.fork();
      await waitUntil(
        async () => (await em.fork().findOne(OutboxMessage, { to: 'never@home.example', status: 'failed' })) !== null,
        15_000,
        'the message marked failed',
      );
      await new Promise((r) => setTimeout(r, 200)); // no further attempt after giving up
      await stopWorker();
      const row = await em.fork().findOneOrFail(OutboxMessage, { to: 'never@home.example' });
      expect(row.attempts).toBe(3);
      expect(row.lastError).toMatch(/ECONNREFUSED|connect/i);
      expect(p.attempts.filter((a) => a.to === 'never@home.example')).toHaveLength(3);
      const state = await agent.get(`${sendPath(g)}/sending`);
      expect(state.body.sending.links[0]).toMatchObject({ delivery: 'failed', deliveryAttempts: 3 });
    } finally {
      await p.stop();
    }
  }, 60_000);
});
