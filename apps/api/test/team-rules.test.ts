/**
 * Team rules: the owner changes roles and deactivates people; a deactivated person's sessions
 * end at once; a role change ends the person's sessions (the acting owner's own is rotated);
 * the firm's last owner who can sign in cannot be demoted or deactivated.
 */
import type request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { ActivityResponse, TeamMemberResponse } from '@gloaming/contracts';
import { Session, User } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';

let t: TestServer;
beforeEach(async () => {
  t = await startTestServer();
});
afterEach(async () => t.close());

const cookieOf = (res: request.Response) => String(res.headers['set-cookie'] ?? '');

describe('changing a role', () => {
  it('moves an estimator to installer; their open sessions end, and the change is in the activity log', async () => {
    const owner = await t.signIn('owner');
    const estimator = await t.signIn('estimator');
    await estimator.get('/api/quotes').expect(200);
    const res = await owner.patch(`/api/users/${t.firmA.users.estimator.id}`).send({ role: 'installer' }).expect(200);
    expect(TeamMemberResponse.parse(res.body).user.role).toBe('installer');
    await estimator.get('/api/session').expect(401);
    expect(await t.orm.em.fork().count(Session, { user: t.firmA.users.estimator.id })).toBe(0);
    // signing in again gives the new role's rights: quotes are no longer theirs to see
    const again = await t.signIn('estimator');
    await again.get('/api/quotes').expect(403);
    const log = ActivityResponse.parse((await owner.get('/api/activity').expect(200)).body);
    expect(log.entries[0]).toMatchObject({ kind: 'firm', type: 'role-changed', summary: expect.stringMatching(/from estimator to installer/) });
  });

  it('refuses to demote the last owner who can sign in (409), and allows it once there is another owner', async () => {
    const owner = await t.signIn('owner');
    const self = t.firmA.users.owner.id;
    const refused = await owner.patch(`/api/users/${self}`).send({ role: 'estimator' }).expect(409);
    expect(refused.body.detail).toMatch(/only owner/);
    // an invited owner without a password does not count
    const invited = await owner.post('/api/invites').send({ email: 'second@firm-a.test', name: 'Second Owner', role: 'owner' }).expect(201);
    await owner.patch(`/api/users/${self}`).send({ role: 'estimator' }).expect(409);
    expect(invited.body.user.status).toBe('invited');
    // promote the estimator: now the first owner may step down, and their own session is rotated
    await owner.patch(`/api/users/${t.firmA.users.estimator.id}`).send({ role: 'owner' }).expect(200);
    const before = cookieOf(await owner.get('/api/session').expect(200));
    const stepDown = await owner.patch(`/api/users/${self}`).send({ role: 'estimator' }).expect(200);
    expect(cookieOf(stepDown)).toMatch(/gloaming_session=[^;]+/);
    expect(cookieOf(stepDown)).not.toBe(before);
    const me = await owner.get('/api/session').expect(200);
    expect(me.body.user.role).toBe('estimator');
    await owner.get('/api/users').expect(403);
  });

  it('another firm’s person is a 404; an empty change is a 400 with the field path', async () => {
    const owner = await t.signIn('owner');
    await owner.patch(`/api/users/${t.firmB.users.estimator.id}`).send({ role: 'installer' }).expect(404);
    const empty = await owner.patch(`/api/users/${t.firmA.users.estimator.id}`).send({}).expect(400);
    expect(empty.body.errors.map((e: { path: string }) => e.path)).toEqual(['body.role']);
    const bad = await owner.patch(`/api/users/${t.firmA.users.estimator.id}`).send({ role: 'admin' }).expect(400);
    expect(bad.body.errors[0].path).toBe('body.role');
  });
});

describe('deactivating', () => {
  it('ends the person’s sessions at once and stops sign-in; reactivating lets them back', async () => {
    const owner = await t.signIn('owner');
    const installer = await t.signIn('installer');
    await installer.get('/api/session').expect(200);
    const res = await owner.patch(`/api/users/${t.firmA.users.installer.id}`).send({ active: false }).expect(200);
    expect(res.body.user.status).toBe('deactivated');
    await installer.get('/api/session').expect(401);
    await expect(t.signIn('installer')).rejects.toThrow(/401/);
    await owner.post(`/api/users/${t.firmA.users.installer.id}/invite`).expect(409);
    await owner.patch(`/api/users/${t.firmA.users.installer.id}`).send({ active: true }).expect(200);
    await (await t.signIn('installer')).get('/api/session').expect(200);
  });

  it('refuses to deactivate the last owner, including oneself', async () => {
    const owner = await t.signIn('owner');
    const res = await owner.patch(`/api/users/${t.firmA.users.owner.id}`).send({ active: false }).expect(409);
    expect(res.body.detail).toMatch(/only owner/);
    const stored = await t.orm.em.fork().findOneOrFail(User, t.firmA.users.owner.id);
    expect(stored.active).toBe(true);
    await owner.get('/api/session').expect(200);
  });
});
