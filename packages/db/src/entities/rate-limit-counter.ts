import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/**
 * One rate limiter's count for one client (an IP, an account) in the current window, shared
 * by every api process on the database. `key` is the limiter's prefix and the client's key;
 * a row whose window has ended counts as zero and is reused or swept.
 */
export const RateLimitCounter = defineEntity({
  name: 'RateLimitCounter',
  tableName: 'rate_limit_counters',
  properties: {
    key: p.string().primary(),
    hits: p.integer(),
    resetAt: p.datetime().index(),
  },
});
export type RateLimitCounter = InferEntity<typeof RateLimitCounter>;
