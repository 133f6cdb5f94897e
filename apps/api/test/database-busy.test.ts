import sqlite3 from 'sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CustomerListResponse } from '@gloaming/contracts';
import { openDatabase } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';

/**
 * When another process holds SQLite's write lock longer than the busy timeout, a write fails
 * with "database is locked" (on PostgreSQL: another transaction holds a lock on the table
 * longer than the lock timeout). That is not the client's fault and not a crash: the api
 * answers 503 with Retry-After, and nothing half-written is left behind.
 */
let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({}, { busyTimeoutMs: 150 });
});
afterAll(async () => t.close());

function run(db: sqlite3.Database, sql: string): Promise<void> {
  return new Promise((resolve, reject) => db.exec(sql, (err) => (err ? reject(err) : resolve())));
}

/** Another connection takes the write lock: SQLite's database lock, or PostgreSQL's lock on the customers table. */
async function holdWriteLock(): Promise<{ release(): Promise<void> }> {
  if (t.dialect === 'postgresql') {
    const other = await openDatabase({ url: t.databaseUrl! });
    const trx = await other.em.getConnection().getKnex().transaction();
    await trx.raw('lock table customers in access exclusive mode');
    return {
      async release() {
        await trx.rollback();
        await other.close(true);
      },
    };
  }
  const other = new sqlite3.Database(t.databaseFile);
  await run(other, 'PRAGMA busy_timeout = 0; BEGIN EXCLUSIVE;');
  return {
    async release() {
      await run(other, 'ROLLBACK;');
      await new Promise<void>((resolve) => other.close(() => resolve()));
    },
  };
}

describe('a database held busy by another writer', () => {
  it('answers 503 problem+json with Retry-After, then works once the lock is gone', async () => {
    const estimator = await t.signIn('estimator');
    const body = {
      name: 'Odile Fairweather',
      email: 'odile@example.test',
      phone: '01632 960 456',
      notes: '',
      sites: [{ label: 'Home', addressLines: '3 Weir Lane\nLowbridge', postcode: 'LB4 7WL', accessNotes: '' }],
    };

    const lock = await holdWriteLock();
    try {
      const res = await estimator.post('/api/customers').send(body);
      expect(res.status).toBe(503);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.headers['retry-after']).toBe('1');
      expect(res.body.type).toBe('/problems/busy');
    } finally {
      await lock.release();
    }

    const list = CustomerListResponse.parse((await estimator.get('/api/customers?search=Fairweather').expect(200)).body);
    expect(list.customers).toHaveLength(0);
    await estimator.post('/api/customers').send(body).expect(201);
    const after = CustomerListResponse.parse((await estimator.get('/api/customers?search=Fairweather').expect(200)).body);
    expect(after.customers).toHaveLength(1);
  });
});
