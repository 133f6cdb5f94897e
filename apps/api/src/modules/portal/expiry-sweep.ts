import type { Database } from '@gloaming/db';
import type { Logger } from '../../app-deps';
import { expireOverdueQuotes } from './service';

const HOUR_MS = 3600_000;

/**
 * Mark undecided quotes past their validity as expired: once now, then every hour. Each run
 * has its own entity manager fork. Returns a function that stops the timer (for shutdown).
 */
export function startExpirySweep(orm: Database, logger: Pick<Logger, 'info' | 'error'>, everyMs = HOUR_MS): () => void {
  const run = async () => {
    try {
      const n = await expireOverdueQuotes(orm.em.fork());
      if (n > 0) logger.info(`${n} quote(s) passed their validity date and are now expired.`);
    } catch (err) {
      logger.error('The hourly quote expiry check failed; it will run again in an hour', err);
    }
  };
  void run();
  const timer = setInterval(() => void run(), everyMs);
  timer.unref();
  return () => clearInterval(timer);
}
