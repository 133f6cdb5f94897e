import type { Options } from 'express-rate-limit';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { RateLimitCounter } from '@gloaming/db';
import { openTestDatabase } from '@gloaming/db/testing';
import { DatabaseRateLimitStore } from '../src/auth/rate-limit-store';
import { testPostgresUrl } from './harness';

/**
 * The database-backed rate-limit store, on whichever database the suite runs on (SQLite by
 * default, PostgreSQL under `npm run test:postgres`). Two store instances on one database
 * stand for two api processes: they must see one count.
 */
const WINDOW_MS = 15 * 60_000;
let db: Awaited<ReturnType<typeof openTestDatabase>>;
beforeAll(async () => {
  db = await openTestDatabase(testPostgresUrl ? { postgresUrl: testPostgresUrl } : {});
});
afterAll(async () => db.close());
afterEach(() => vi.useRealTimers());

function store(name: string): DatabaseRateLimitStore {
  const s = new DatabaseRateLimitStore(db.orm, name);
  // express-rate-limit calls init with its options; only windowMs matters to the store.
  s.init({ windowMs: WINDOW_MS } as Options);
  return s;
}

describe(`database rate-limit store (${testPostgresUrl ? 'PostgreSQL' : 'SQLite'})`, () => {
  it('counts hits in one window, shared by two instances of the same limiter', async () => {
    vi.useFakeTimers({ toFake: ['Date'], now: new Date('2026-03-02T09:00:00.000Z') });
    const a = store('shared');
    const b = store('shared');
    const first = await a.increment('203.0.113.7');
    expect(first.totalHits).toBe(1);
    expect(first.resetTime?.toISOString()).toBe('2026-03-02T09:15:00.000Z');
    expect((await b.increment('203.0.113.7')).totalHits).toBe(2);
    expect((await a.increment('203.0.113.7')).totalHits).toBe(3);
    // the window does not slide with each hit
    vi.setSystemTime(new Date('2026-03-02T09:10:00.000Z'));
    const fourth = await b.increment('203.0.113.7');
    expect(fourth.totalHits).toBe(4);
    expect(fourth.resetTime?.toISOString()).toBe('2026-03-02T09:15:00.000Z');
    expect(await a.get('203.0.113.7')).toEqual({ totalHits: 4, resetTime: new Date('2026-03-02T09:15:00.000Z') });
  });

  it('starts a fresh window once the stored one has ended', async () => {
    vi.useFakeTimers({ toFake: ['Date'], now: new Date('2026-03-02T10:00:00.000Z') });
    const a = store('fresh');
    await a.increment('client');
    await a.increment('client');
    vi.setSystemTime(new Date('2026-03-02T10:15:00.000Z')); // exactly the reset time: window over
    expect(await a.get('client')).toBeUndefined();
    const again = await a.increment('client');
    expect(again).toEqual({ totalHits: 1, resetTime: new Date('2026-03-02T10:30:00.000Z') });
  });

  it('keeps limiters with different names apart, and decrements and resets one key', async () => {
    const ip = store('by-ip');
    const account = store('by-account');
    await ip.increment('same-key');
    await ip.increment('same-key');
    expect((await account.increment('same-key')).totalHits).toBe(1);
    await ip.decrement('same-key');
    expect((await ip.get('same-key'))?.totalHits).toBe(1);
    await ip.decrement('same-key');
    await ip.decrement('same-key'); // never below zero
    expect((await ip.get('same-key'))?.totalHits).toBe(0);
    await account.resetKey('same-key');
    expect(await account.get('same-key')).toBeUndefined();
    expect(await ip.get('same-key')).toBeDefined();
  });

  it('counts parallel hits exactly (one atomic upsert each)', async () => {
    const a = store('parallel');
    const b = store('parallel');
    const results = await Promise.all(Array.from({ length: 24 }, (_, i) => (i % 2 ? a : b).increment('burst')));
    expect(results.map((r) => r.totalHits).sort((x, y) => x - y)).toEqual(Array.from({ length: 24 }, (_, i) => i + 1));
    expect((await a.get('burst'))?.totalHits).toBe(24);
  });

  it('stores a very long key by its hash, still counted per key', async () => {
    const a = store('long');
    const long = `account:${'x'.repeat(300)}@example.test`;
    const other = `account:${'x'.repeat(300)}@example.tesu`;
    await a.increment(long);
    expect((await a.increment(long)).totalHits).toBe(2);
    expect((await a.increment(other)).totalHits).toBe(1);
    const keys = (await db.orm.em.fork().find(RateLimitCounter, { key: { $like: 'long:%' } })).map((r) => r.key);
    expect(keys).toHaveLength(2);
    for (const k of keys) expect(k.length).toBeLessThanOrEqual(200);
  });

  it('refuses a limiter name that could collide with another prefix', () => {
    expect(() => new DatabaseRateLimitStore(db.orm, 'Sign In:')).toThrow(/lower-case words with dashes/);
  });
});
