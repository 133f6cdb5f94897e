import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Problem, SessionResponse } from '@gloaming/contracts';
import { User } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '3', GLOAMING_SIGNIN_MAX_PER_IP: '50' });
});
afterAll(async () => t.close());

describe('health', () => {
  it('answers 200 JSON with version and database status', async () => {
    const res = await request(t.app).get('/api/health').expect(200).expect('content-type', /json/);
    expect(res.body).toMatchObject({ status: 'ok', version: '0.0.0', database: { status: 'ok', pendingMigrations: 0 } });
  });
});

describe('sign-in', () => {
  it('signs in, returns the user with its role, sets an HttpOnly SameSite=Lax cookie, and signs out', async () => {
    const agent = request.agent(t.app);
    const res = await agent.post('/api/session').send({ email: t.firmA.users.estimator.email.toUpperCase(), password: t.firmA.password }).expect(200);
    const body = SessionResponse.parse(res.body);
    expect(body.user).toMatchObject({ role: 'estimator', email: t.firmA.users.estimator.email, organization: { name: 'Firm A Lighting' } });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/gloaming_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // development and test run over plain http

    const me = await agent.get('/api/session').expect(200);
    expect(me.body.user.id).toBe(body.user.id);

    await agent.delete('/api/session').expect(204);
    const after = await agent.get('/api/session').expect(401);
    expect(Problem.parse(after.body).type).toBe('/problems/unauthenticated');
  });

  it('gives one clear message for a wrong password and for an unknown account', async () => {
    const wrong = await request(t.app).post('/api/session').send({ email: t.firmB.users.owner.email, password: 'not-the-password' }).expect(401);
    const unknown = await request(t.app).post('/api/session').send({ email: 'nobody@nowhere.test', password: 'whatever-it-is' }).expect(401);
    expect(wrong.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(wrong.body.detail).toBe(unknown.body.detail);
    expect(wrong.body.detail).toMatch(/do not match/);
  });

  it('rotates the session id on every sign-in: the old cookie stops working', async () => {
    const agent = request.agent(t.app);
    const first = await agent.post('/api/session').send({ email: t.firmA.users.owner.email, password: t.firmA.password }).expect(200);
    const oldCookie = String(first.headers['set-cookie']).split(';')[0]!;
    await agent.post('/api/session').send({ email: t.firmA.users.owner.email, password: t.firmA.password }).expect(200);
    await request(t.app).get('/api/session').set('Cookie', oldCookie).expect(401);
    await agent.get('/api/session').expect(200);
  });

  it('throttles repeated failures for one account with a clear 429 and Retry-After', async () => {
    const email = t.firmA.users.installer.email;
    for (let i = 0; i < 3; i++) await request(t.app).post('/api/session').send({ email, password: 'wrong-password' }).expect(401);
    const blocked = await request(t.app).post('/api/session').send({ email, password: t.firmA.password }).expect(429);
    expect(blocked.body.detail).toMatch(/Too many failed sign-in attempts for this account/);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect(blocked.body.retryAfterSeconds).toBeGreaterThan(0);
    // another account from the same client is unaffected
    await request(t.app).post('/api/session').send({ email: t.firmB.users.installer.email, password: t.firmB.password }).expect(200);
  });

  it('refuses a deactivated user and ends their sessions at once', async () => {
    const agent = await t.signIn('estimator', 'B');
    await agent.get('/api/session').expect(200);
    const em = t.orm.em.fork();
    const user = await em.findOneOrFail(User, t.firmB.users.estimator.id);
    user.active = false;
    await em.flush();
    await agent.get('/api/session').expect(401);
    await request(t.app).post('/api/session').send({ email: user.email, password: t.firmB.password }).expect(401);
    user.active = true;
    await em.flush();
  });
});

describe('bad input', () => {
  it('answers malformed JSON, wrong types and missing fields with 400 problem+json and field paths', async () => {
    const malformed = await request(t.app).post('/api/session').set('content-type', 'application/json').send('{"email":').expect(400);
    expect(malformed.body.type).toBe('/problems/malformed-json');
    const wrongTypes = await request(t.app).post('/api/session').send({ email: 42, password: ['x'] }).expect(400);
    expect(wrongTypes.body.errors.map((e: { path: string }) => e.path).sort()).toEqual(['body.email', 'body.password']);
    const missing = await request(t.app).post('/api/session').send({}).expect(400);
    expect(missing.body.errors.map((e: { path: string }) => e.path).sort()).toEqual(['body.email', 'body.password']);
    const huge = await request(t.app).post('/api/session').send({ email: `${'a'.repeat(300)}@x.test`, password: 'x' }).expect(400);
    expect(huge.body.errors[0].path).toBe('body.email');
  });

  it('refuses a body over the size limit with 413, not a crash', async () => {
    const res = await request(t.app).post('/api/session').set('content-type', 'application/json').send(`{"email":"${'a'.repeat(1_100_000)}"}`).expect(413);
    expect(res.body.type).toBe('/problems/payload-too-large');
  });

  it('answers an unknown api path with a 404 problem', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(res.body).toMatchObject({ status: 404, type: '/problems/no-such-route' });
  });

  it('validates path ids before touching the database', async () => {
    const agent = await t.signIn('owner');
    const res = await agent.get('/api/users/not-a-uuid').expect(400);
    expect(res.body.errors[0].path).toBe('params.id');
  });
});

describe('cross-site requests', () => {
  it('refuses a state-changing request whose Origin is another site', async () => {
    const res = await request(t.app)
      .post('/api/session')
      .set('Origin', 'https://evil.example')
      .send({ email: t.firmA.users.owner.email, password: t.firmA.password })
      .expect(403);
    expect(res.body.type).toBe('/problems/cross-site-request');
  });

  it('accepts the configured public origin', async () => {
    await request(t.app)
      .post('/api/session')
      .set('Origin', 'http://gloaming.test')
      .send({ email: t.firmA.users.owner.email, password: t.firmA.password })
      .expect(200);
  });
});
