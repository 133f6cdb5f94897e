import { afterEach, describe, expect, it } from 'vitest';
import { OptimisticLockError } from '@mikro-orm/core';
import { Organization, User, DEMO_ACCOUNTS, migrationsOutOfDate, seedDemoIfEmpty, verifyPassword } from '../src';
import { createFirm, openTestDatabase } from '../src/testing';

let close: (() => Promise<void>) | undefined;
afterEach(async () => {
  await close?.();
  close = undefined;
});

async function fresh() {
  const db = await openTestDatabase();
  close = db.close;
  return db.orm;
}

describe('database', () => {
  it('runs in WAL mode with foreign keys enforced', async () => {
    const orm = await fresh();
    const conn = orm.em.fork().getConnection();
    const [journal] = await conn.execute<{ journal_mode: string }[]>('pragma journal_mode');
    const [fk] = await conn.execute<{ foreign_keys: number }[]>('pragma foreign_keys');
    expect(journal?.journal_mode).toBe('wal');
    expect(fk?.foreign_keys).toBe(1);
    await expect(
      conn.execute(
        `insert into users (id, organization_id, email, name, role, active, created_at, version) values ('u1', 'no-such-firm', 'a@b.c', 'A', 'owner', 1, 0, 1)`,
      ),
    ).rejects.toThrow(/FOREIGN KEY/);
  });

  it('has migrations that match the entities', async () => {
    const orm = await fresh();
    expect(await migrationsOutOfDate(orm)).toBe(false);
  });

  it('seeds the demo firm once and never over an existing database', async () => {
    const orm = await fresh();
    expect(await seedDemoIfEmpty(orm)).toBe(true);
    expect(await seedDemoIfEmpty(orm)).toBe(false);
    const em = orm.em.fork();
    expect(await em.count(Organization, {})).toBe(1);
    const users = await em.find(User, {}, { orderBy: { email: 'asc' } });
    expect(users.map((u) => u.email).sort()).toEqual(DEMO_ACCOUNTS.map((a) => a.email).sort());
    const owner = users.find((u) => u.role === 'owner')!;
    const ownerAccount = DEMO_ACCOUNTS.find((a) => a.role === 'owner')!;
    expect(owner.passwordHash).toMatch(/^\$argon2id\$/);
    expect(await verifyPassword(owner.passwordHash!, ownerAccount.password)).toBe(true);
    expect(await verifyPassword(owner.passwordHash!, 'wrong')).toBe(false);
  });

  it('refuses a stale write to an organization (optimistic locking)', async () => {
    const orm = await fresh();
    const { firm } = await createFirm(orm.em.fork());
    const a = orm.em.fork();
    const b = orm.em.fork();
    const fa = await a.findOneOrFail(Organization, firm.id);
    const fb = await b.findOneOrFail(Organization, firm.id);
    fa.name = 'First save';
    await a.flush();
    fb.name = 'Second save';
    await expect(b.flush()).rejects.toBeInstanceOf(OptimisticLockError);
    const reread = await orm.em.fork().findOneOrFail(Organization, firm.id);
    expect(reread.name).toBe('First save');
  });
});
