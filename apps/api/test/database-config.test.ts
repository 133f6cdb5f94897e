import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../src/config/env';

/** Which database and which rate-limit store the api picks from its environment. */
describe('database settings', () => {
  it('runs on the SQLite file under DATA_DIR with per-process rate limits when DATABASE_URL is unset or empty', () => {
    for (const env of [{ DATA_DIR: '/srv/gloaming' }, { DATA_DIR: '/srv/gloaming', DATABASE_URL: '' }]) {
      const c = loadConfig(env);
      expect(c.databaseUrl).toBeUndefined();
      expect(c.databaseFile).toBe('/srv/gloaming/gloaming.sqlite');
      expect(c.rateLimitStore).toBe('memory');
    }
  });

  it('runs on PostgreSQL with rate limits in the database when DATABASE_URL is a postgres URL', () => {
    const c = loadConfig({ DATABASE_URL: 'postgresql://gloaming:pw@db.internal:5432/gloaming' });
    expect(c.databaseUrl).toBe('postgresql://gloaming:pw@db.internal:5432/gloaming');
    expect(c.rateLimitStore).toBe('database');
    expect(loadConfig({ DATABASE_URL: 'postgres://db.internal/gloaming', GLOAMING_RATE_LIMIT_STORE: 'memory' }).rateLimitStore).toBe('memory');
    expect(loadConfig({ GLOAMING_RATE_LIMIT_STORE: 'database' }).rateLimitStore).toBe('database');
  });

  it('refuses another kind of URL or store with the setting named', () => {
    expect(() => loadConfig({ DATABASE_URL: 'mysql://db.internal/gloaming' })).toThrow(ConfigError);
    expect(() => loadConfig({ DATABASE_URL: 'mysql://db.internal/gloaming' })).toThrow(/DATABASE_URL: must be a postgres:\/\/ or postgresql:\/\/ URL/);
    expect(() => loadConfig({ GLOAMING_RATE_LIMIT_STORE: 'redis' })).toThrow(/GLOAMING_RATE_LIMIT_STORE/);
  });
});
