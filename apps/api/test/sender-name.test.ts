/**
 * Mail a firm sends its customers carries the firm's e-mail sender name as the From display
 * name (its name when the sender name is blank), from the configured address; mail from
 * Gloaming itself (a password reset) keeps the configured From. Read from the From header as
 * the SMTP catcher received it.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FirmSettingsResponse } from '@gloaming/contracts';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote } from './estimate-fixture';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

const base = (q: { quote: { id: string }; revision: { id: string } }) => `/api/quotes/${q.quote.id}/revisions/${q.revision.id}`;
// the harness keeps the default MAIL_FROM (config/env.ts): "Gloaming <no-reply@gloaming.invalid>"
const CONFIGURED_ADDRESS = 'no-reply@gloaming.invalid';

async function setSenderName(name: string) {
  const owner = await t.signIn('owner');
  const { settings, version } = FirmSettingsResponse.parse((await owner.get('/api/organization/settings').expect(200)).body);
  await owner.put('/api/organization/settings').send({ version, settings: { ...settings, emailSenderName: name } }).expect(200);
  return settings.name;
}

async function sendTo(email: string) {
  const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email });
  const estimator = await t.signIn('estimator');
  await estimator.post(`${base(g)}/send`).send({ message: '' }).expect(201);
  return t.catcher.waitFor((m) => m.to.includes(email));
}

describe('the From of quote e-mails', () => {
  it('shows the firm’s e-mail sender name, from the configured address', async () => {
    await setSenderName('Nightjar Lamps & Gardens');
    const mail = await sendTo('sender-name@home.example');
    expect(mail.fromName).toBe('Nightjar Lamps & Gardens');
    expect(mail.from).toBe(CONFIGURED_ADDRESS);
  });

  it('uses the firm’s name when the sender name is blank', async () => {
    const firmName = await setSenderName('');
    const mail = await sendTo('blank-sender@home.example');
    expect(mail.fromName).toBe(firmName);
    expect(mail.from).toBe(CONFIGURED_ADDRESS);
  });

  it('leaves Gloaming’s own mail (a password reset) with the configured From', async () => {
    await setSenderName('Nightjar Lamps & Gardens');
    const email = t.firmA.users.estimator.email;
    await request(t.app).post('/api/password-resets').send({ email }).expect(202);
    const mail = await t.catcher.waitFor((m) => m.to.includes(email) && /password/i.test(m.subject));
    expect(mail.fromName).toBe('Gloaming');
    expect(mail.from).toBe(CONFIGURED_ADDRESS);
  });
});
