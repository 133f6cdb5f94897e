import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TeamResponse } from '@gloaming/contracts';
import { AuthToken } from '@gloaming/db';
import { startTestServer, tokenFromMail, type TestServer } from './harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

describe('invitations', () => {
  it('owner invites by e-mail; the invitee sets a password through the link and is signed in with the role', async () => {
    const owner = await t.signIn('owner');
    const res = await owner.post('/api/invites').send({ email: 'New.Estimator@Firm-A.test', name: 'Nia Okafor', role: 'estimator' }).expect(201);
    expect(res.body.user).toMatchObject({ email: 'new.estimator@firm-a.test', role: 'estimator', status: 'invited' });

    const mail = await t.catcher.waitFor((m) => m.to.includes('new.estimator@firm-a.test'));
    expect(mail.subject).toContain('Firm A Lighting');
    expect(mail.text).toContain('http://gloaming.test/accept-invite?token=');
    const token = tokenFromMail(mail.text);

    // only the hash is stored
    const stored = await t.orm.em.fork().find(AuthToken, { purpose: 'invite' });
    expect(stored.some((s) => s.tokenHash === token)).toBe(false);
    expect(stored.every((s) => /^[0-9a-f]{64}$/.test(s.tokenHash))).toBe(true);

    const invitee = request.agent(t.app);
    const accepted = await invitee.post('/api/invites/accept').send({ token, password: 'a-long-enough-password' }).expect(200);
    expect(accepted.body.user).toMatchObject({ role: 'estimator', organization: { name: 'Firm A Lighting' } });
    await invitee.get('/api/session').expect(200);

    // single use
    const again = await request(t.app).post('/api/invites/accept').send({ token, password: 'a-long-enough-password' }).expect(410);
    expect(again.body.detail).toMatch(/already been used or is not valid/);

    const team = TeamResponse.parse((await owner.get('/api/users').expect(200)).body);
    expect(team.users.find((u) => u.email === 'new.estimator@firm-a.test')?.status).toBe('active');
    // firm B's people never appear in firm A's list
    expect(team.users.some((u) => u.email === t.firmB.users.owner.email)).toBe(false);
  });

  it('refuses an e-mail that already has an account, and a weak password on accept', async () => {
    const owner = await t.signIn('owner');
    const dup = await owner.post('/api/invites').send({ email: t.firmB.users.installer.email, name: 'X', role: 'installer' }).expect(409);
    expect(dup.body.detail).toMatch(/already has a Gloaming account/);
    const weak = await request(t.app).post('/api/invites/accept').send({ token: 'a'.repeat(43), password: 'short' }).expect(400);
    expect(weak.body.errors.map((e: { path: string }) => e.path)).toEqual(['body.password']);
  });

  it('resends an invitation to someone who has not accepted yet', async () => {
    const owner = await t.signIn('owner');
    const created = await owner.post('/api/invites').send({ email: 'late@firm-a.test', name: 'Late Person', role: 'installer' }).expect(201);
    await t.catcher.waitFor((m) => m.to.includes('late@firm-a.test'));
    await owner.post(`/api/users/${created.body.user.id}/invite`).expect(202);
    await expect.poll(() => t.catcher.messages().filter((m) => m.to.includes('late@firm-a.test')).length).toBe(2);
    await owner.post(`/api/users/${t.firmA.users.estimator.id}/invite`).expect(409);
  });
});

describe('password reset', () => {
  it('e-mails a single-use link; the new password works and every old session ends', async () => {
    const email = t.firmB.users.owner.email;
    const oldSession = await t.signIn('owner', 'B');
    const res = await request(t.app).post('/api/password-resets').send({ email }).expect(202);
    expect(res.body.message).toMatch(/If that e-mail belongs to an active account/);
    const mail = await t.catcher.waitFor((m) => m.to.includes(email) && m.subject.includes('Reset'));
    const token = tokenFromMail(mail.text);
    expect(mail.text).toContain('http://gloaming.test/reset-password?token=');

    await request(t.app).post('/api/password-resets/complete').send({ token, password: 'brand-new-password-1' }).expect(200);
    await oldSession.get('/api/session').expect(401);
    await request(t.app).post('/api/session').send({ email, password: t.firmB.password }).expect(401);
    await request(t.app).post('/api/session').send({ email, password: 'brand-new-password-1' }).expect(200);
    await request(t.app).post('/api/password-resets/complete').send({ token, password: 'another-password-2' }).expect(410);
  });

  it('answers an unknown e-mail exactly like a known one and sends nothing', async () => {
    const before = t.catcher.messages().length;
    const res = await request(t.app).post('/api/password-resets').send({ email: 'stranger@nowhere.test' }).expect(202);
    expect(res.body.message).toMatch(/If that e-mail belongs to an active account/);
    await new Promise((r) => setTimeout(r, 200));
    expect(t.catcher.messages().length).toBe(before);
  });

  it('refuses an expired link with a clear message', async () => {
    const email = t.firmA.users.installer.email;
    await request(t.app).post('/api/password-resets').send({ email }).expect(202);
    const mail = await t.catcher.waitFor((m) => m.to.includes(email) && m.subject.includes('Reset'));
    const token = tokenFromMail(mail.text);
    const em = t.orm.em.fork();
    await em.nativeUpdate(AuthToken, { purpose: 'password-reset', user: t.firmA.users.installer.id }, { expiresAt: new Date(Date.now() - 1000) });
    const res = await request(t.app).post('/api/password-resets/complete').send({ token, password: 'brand-new-password-1' }).expect(410);
    expect(res.body.detail).toMatch(/expired/);
  });
});
