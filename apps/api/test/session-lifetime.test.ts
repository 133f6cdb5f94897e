import { afterAll, afterEach, beforeAll, describe, it, vi } from 'vitest';
import { startTestServer, type TestServer } from './harness';

/**
 * Session lifetimes: a session ends after the idle window without use (each use slides it
 * on), and after the absolute limit from sign-in however busy it is. Only Date is faked, so
 * sockets and timers run for real. Idle 48 h and absolute 5 days here (the defaults are
 * 14 days and 30 days; see .env.example).
 */
let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SESSION_IDLE_HOURS: '48', GLOAMING_SESSION_MAX_DAYS: '5' });
});
afterAll(async () => t.close());
afterEach(() => vi.useRealTimers());

const HOUR = 3_600_000;
function at(ms: number) {
  vi.useFakeTimers({ toFake: ['Date'], now: ms });
}

describe('session lifetimes', () => {
  it('ends a session left unused beyond the idle window', async () => {
    const start = Date.now();
    at(start);
    const agent = await t.signIn('estimator');
    await agent.get('/api/session').expect(200);
    at(start + 47 * HOUR);
    await agent.get('/api/session').expect(200); // used within the window: slides on
    at(start + 47 * HOUR + 47 * HOUR);
    await agent.get('/api/session').expect(200); // still within 48 h of the last use
    at(start + 47 * HOUR + 47 * HOUR + 49 * HOUR);
    await agent.get('/api/session').expect(401); // 49 h unused
  });

  it('ends a session at the absolute limit from sign-in, however often it is used', async () => {
    const start = Date.now();
    at(start);
    const agent = await t.signIn('owner');
    for (let hours = 20; hours < 5 * 24; hours += 20) {
      at(start + hours * HOUR);
      await agent.get('/api/session').expect(200);
    }
    at(start + 5 * 24 * HOUR + HOUR);
    await agent.get('/api/session').expect(401);
    // and the session is gone from the database, not just refused
    at(start + HOUR);
    await agent.get('/api/session').expect(401);
  });
});
