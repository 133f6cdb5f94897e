import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QuoteDetailResponse } from '@gloaming/contracts';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote } from './estimate-fixture';

/** Responses are gzipped for a client that asks (RFC 9110 §8.4 Content-Encoding), and only then. */
let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

describe('response compression', () => {
  it('gzips a quote for a client that accepts gzip, and sends it plain to one that does not', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email: 'gzip@compression.example' });
    const staff = await t.signIn('estimator');
    const zipped = await staff.get(`/api/quotes/${g.quote.id}`).set('Accept-Encoding', 'gzip').expect(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers['vary']).toMatch(/Accept-Encoding/i);
    const plain = await staff.get(`/api/quotes/${g.quote.id}`).set('Accept-Encoding', 'identity').expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    // the same document either way (supertest has inflated the gzipped one)
    expect(QuoteDetailResponse.parse(zipped.body)).toEqual(QuoteDetailResponse.parse(plain.body));
  });

  it('leaves small answers alone (under 1 KB, not worth a gzip header)', async () => {
    const res = await (await t.signIn('estimator')).get('/api/health').set('Accept-Encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
  });
});
