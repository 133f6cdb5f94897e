import { createHash } from 'node:crypto';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { dateFromSql, dateParam, raw, RateLimitCounter, type Database } from '@gloaming/db';

/** Rows to sweep: every this many increments, windows that have ended are deleted. */
const SWEEP_EVERY = 200;
/** Longer keys (a very long e-mail typed at sign-in) are stored by their hash. */
const MAX_KEY_LENGTH = 200;

/**
 * express-rate-limit's Store over the database (table rate_limit_counters), so every api
 * process on one PostgreSQL database counts the same hits: a limit reached through one
 * process applies on the others. One atomic upsert per hit (INSERT ... ON CONFLICT DO UPDATE,
 * the same SQL on SQLite and PostgreSQL) starts a fresh window when the stored one has ended.
 */
export class DatabaseRateLimitStore implements Store {
  /** Counts are shared by every instance on the database, not local to this one. */
  readonly localKeys = false;
  readonly prefix: string;
  private windowMs = 60_000;
  private increments = 0;

  constructor(
    private readonly orm: Database,
    /** The limiter's name: limiters never share counts unless they share a name. */
    name: string,
  ) {
    if (!/^[a-z0-9-]+$/.test(name)) throw new Error(`Rate limiter names are lower-case words with dashes: ${name}`);
    this.prefix = `${name}:`;
  }

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private keyOf(key: string): string {
    const full = `${this.prefix}${key}`;
    return full.length <= MAX_KEY_LENGTH ? full : `${this.prefix}sha256:${createHash('sha256').update(key).digest('hex')}`;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await this.orm.em.fork().findOne(RateLimitCounter, { key: this.keyOf(key), resetAt: { $gt: new Date() } });
    return row ? { totalHits: row.hits, resetTime: row.resetAt } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const em = this.orm.em.fork();
    const now = new Date();
    const resetAt = new Date(now.getTime() + this.windowMs);
    const rows = await em.getConnection().execute<{ hits: unknown; reset_at: unknown }[]>(
      `insert into rate_limit_counters ("key", hits, reset_at) values (?, 1, ?)
       on conflict ("key") do update set
         hits = case when rate_limit_counters.reset_at <= ? then 1 else rate_limit_counters.hits + 1 end,
         reset_at = case when rate_limit_counters.reset_at <= ? then excluded.reset_at else rate_limit_counters.reset_at end
       returning hits, reset_at`,
      [this.keyOf(key), dateParam(em, resetAt), dateParam(em, now), dateParam(em, now)],
      'all',
    );
    const row = rows[0];
    if (!row) throw new Error('The rate-limit upsert returned no row.');
    if (++this.increments % SWEEP_EVERY === 0) await em.nativeDelete(RateLimitCounter, { resetAt: { $lte: now } });
    return { totalHits: Number(row.hits), resetTime: dateFromSql(row.reset_at) ?? resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.orm.em
      .fork()
      .nativeUpdate(
        RateLimitCounter,
        { key: this.keyOf(key), resetAt: { $gt: new Date() } },
        { hits: raw('case when hits > 0 then hits - 1 else 0 end') },
      );
  }

  async resetKey(key: string): Promise<void> {
    await this.orm.em.fork().nativeDelete(RateLimitCounter, { key: this.keyOf(key) });
  }

  async resetAll(): Promise<void> {
    await this.orm.em.fork().nativeDelete(RateLimitCounter, { key: { $like: `${this.prefix}%` } });
  }
}

/**
 * Where the rate limiters keep their counts: `'memory'` (express-rate-limit's own store, one
 * process) or `'database'` (shared by every process on the database).
 */
export type RateLimitStoreKind = 'memory' | 'database';

/** A store for the named limiter, or undefined for express-rate-limit's memory store. */
export type RateLimitStores = (name: string) => Store | undefined;

export function rateLimitStores(orm: Database, kind: RateLimitStoreKind): RateLimitStores {
  return (name) => (kind === 'database' ? new DatabaseRateLimitStore(orm, name) : undefined);
}
