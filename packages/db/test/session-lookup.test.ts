import { afterEach, describe, expect, it } from 'vitest';
import { findSessionWithUser, Session } from '../src';
import { createFirm, openTestDatabase } from '../src/testing';

let close: (() => Promise<void>) | undefined;
afterEach(async () => {
  await close?.();
  close = undefined;
});

describe('findSessionWithUser', () => {
  it('reads a session with its user and firm as plain, typed values', async () => {
    const db = await openTestDatabase();
    close = db.close;
    const em = db.orm.em.fork();
    const { firm, users } = await createFirm(em, 'Lookup Lighting');
    const expiresAt = new Date('2027-01-02T03:04:05.678Z');
    em.create(Session, { id: 'sess-1', user: users.estimator, organization: firm, expiresAt });
    await em.flush();
    const stored = await em.fork().findOneOrFail(Session, { id: 'sess-1' });

    const found = await findSessionWithUser(db.orm.em.fork(), 'sess-1');
    expect(found).toEqual({
      sessionId: 'sess-1',
      expiresAt,
      createdAt: stored.createdAt,
      sessionOrganizationId: firm.id,
      user: {
        id: users.estimator.id,
        email: users.estimator.email,
        name: users.estimator.name,
        role: 'estimator',
        active: true,
        organizationId: firm.id,
        organizationName: 'Lookup Lighting',
      },
    });
    expect(found!.expiresAt).toBeInstanceOf(Date);

    users.estimator.active = false;
    await em.flush();
    expect((await findSessionWithUser(db.orm.em.fork(), 'sess-1'))!.user.active).toBe(false);
    expect(await findSessionWithUser(db.orm.em.fork(), 'no-such-session')).toBeNull();
  });
});
