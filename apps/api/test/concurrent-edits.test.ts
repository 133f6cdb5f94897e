import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QuoteDetailResponse, type EstimateContent } from '@gloaming/contracts';
import { User, hashPassword } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';
import { gardenEstimate } from './estimate-fixture';

/**
 * Two estimators editing the same revision at the same moment: real requests race through
 * the api (not one after the other). Exactly one save wins; every other save made on the same
 * version gets 409 with a clear message, and what is stored is precisely the winner's estimate
 * (no lost update, no mixture). And one account signing in from several places at once.
 */
let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
});
afterAll(async () => t.close());

async function secondEstimator() {
  const em = t.orm.em.fork();
  const email = `second-estimator-${Date.now()}@firm.test`;
  em.create(User, {
    organization: t.firmA.firm.id,
    email,
    name: 'Second Estimator',
    role: 'estimator',
    passwordHash: await hashPassword(t.firmA.password),
  });
  await em.flush();
  const agent = request.agent(t.app);
  await agent.post('/api/session').send({ email, password: t.firmA.password }).expect(200);
  return agent;
}

function edited(base: EstimateContent, who: string, n: number): EstimateContent {
  const doc = structuredClone(base);
  doc.sections[0]!.name = `${who} #${n}`;
  doc.sections[0]!.lines[0]!.description = `${who} #${n}: ${doc.sections[0]!.lines[0]!.description}`;
  return doc;
}

describe('two estimators saving the same revision at once', () => {
  it('lets exactly one save win per version, refuses the rest with 409, and stores the winner intact', async () => {
    const first = await t.signIn('estimator');
    const second = await secondEstimator();
    const { quote } = await createQuoteFixture(t.orm.em.fork(), t.firmA);
    const opened = QuoteDetailResponse.parse((await first.get(`/api/quotes/${quote.id}`).expect(200)).body);
    const base = gardenEstimate();

    for (let round = 0; round < 5; round++) {
      const current = QuoteDetailResponse.parse((await first.get(`/api/quotes/${quote.id}`).expect(200)).body);
      const attempts = Array.from({ length: 8 }, (_, i) => {
        const [agent, who] = i % 2 === 0 ? [first, 'first'] : [second, 'second'];
        const doc = edited(base, who, round * 10 + i);
        return agent
          .put(`/api/quotes/${quote.id}/revisions/${current.revision.number}`)
          .send({ version: current.revision.version, content: doc })
          .then((res) => ({ res, doc }));
      });
      const results = await Promise.all(attempts);
      const won = results.filter((r) => r.res.status === 200);
      const refused = results.filter((r) => r.res.status === 409);
      expect(won).toHaveLength(1);
      expect(refused).toHaveLength(results.length - 1);
      for (const r of refused) {
        expect(r.res.headers['content-type']).toMatch(/application\/problem\+json/);
        expect(r.res.body.detail).toMatch(/Someone else saved/);
      }
      const stored = QuoteDetailResponse.parse((await second.get(`/api/quotes/${quote.id}`).expect(200)).body);
      expect(stored.revision.content).toEqual(won[0]!.doc);
      expect(stored.revision.version).toBeGreaterThan(current.revision.version);
    }
    expect(opened.revision.number).toBe(1);
  });

  it('signs one account in from several places at the same moment: every sign-in succeeds', async () => {
    const { email } = t.firmA.users.estimator;
    const attempts = await Promise.all(
      Array.from({ length: 8 }, () => request(t.app).post('/api/session').send({ email, password: t.firmA.password })),
    );
    expect(attempts.map((r) => r.status)).toEqual(Array(8).fill(200));
    const user = await t.orm.em.fork().findOneOrFail(User, { email });
    expect(user.lastSignInAt).toBeInstanceOf(Date);
  });
});
