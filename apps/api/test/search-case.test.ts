import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CustomerListResponse, ProductListResponse, QuoteListResponse } from '@gloaming/contracts';
import { Customer, Product, Site } from '@gloaming/db';
import { startTestServer, testPostgresUrl, type TestServer } from './harness';

/**
 * Searches ignore letter case on both databases: SQLite's LIKE already does for ASCII,
 * PostgreSQL's needs ILIKE. Under `npm run test:postgres` this is the check that it got it.
 * A % or _ in the search is taken literally on both.
 */
let t: TestServer;
let customerId: string;
let siteId: string;
beforeAll(async () => {
  t = await startTestServer();
  const em = t.orm.em.fork();
  const customer = em.create(Customer, { organization: t.firmA.firm, name: 'Odile Fairweather', email: 'odile@fairweather.example', phone: null });
  const site = em.create(Site, { organization: t.firmA.firm, customer, label: 'Home', addressLines: '3 Weir Lane\nLowbridge', postcode: 'LB4 7WL' });
  em.create(Customer, { organization: t.firmA.firm, name: 'Hallam_Rees 50% Trust', email: null, phone: null });
  em.create(Customer, { organization: t.firmA.firm, name: 'Hallam Rees 50 Trust', email: null, phone: null });
  em.create(Product, {
    organization: t.firmA.firm,
    kind: 'accessory',
    supplier: 'Larkspur Supply',
    supplierCode: 'LS-GEL-10',
    name: 'Gel-Filled Crimp (pack of 10)',
    active: true,
    spec: {},
  });
  await em.flush();
  customerId = customer.id;
  siteId = site.id;
});
afterAll(async () => t.close());

describe(`case-insensitive search (${testPostgresUrl ? 'PostgreSQL' : 'SQLite'})`, () => {
  it('finds customers, products and quotes whatever the case typed', async () => {
    const estimator = await t.signIn('estimator');
    for (const typed of ['fairweather', 'FAIRWEATHER', 'lb4 7wl']) {
      const list = CustomerListResponse.parse((await estimator.get('/api/customers').query({ search: typed }).expect(200)).body);
      expect(list.customers.map((c) => c.name)).toEqual(['Odile Fairweather']);
    }
    for (const typed of ['gel-filled', 'ls-gel', 'LARKSPUR']) {
      const list = ProductListResponse.parse((await estimator.get('/api/products').query({ search: typed }).expect(200)).body);
      expect(list.products.map((p) => p.name)).toEqual(['Gel-Filled Crimp (pack of 10)']);
    }
    await estimator.post('/api/quotes').send({ customerId, siteId }).expect(201);
    for (const typed of ['odile', 'WEIR LANE', 'lb4']) {
      const list = QuoteListResponse.parse((await estimator.get('/api/quotes').query({ q: typed }).expect(200)).body);
      expect(list.quotes).toHaveLength(1);
    }
    // a % or _ typed is the character itself, never a wildcard
    for (const [typed, found] of [
      ['50%', ['Hallam_Rees 50% Trust']],
      ['m_r', ['Hallam_Rees 50% Trust']],
      ['50 trust', ['Hallam Rees 50 Trust']],
      ['%', ['Hallam_Rees 50% Trust']],
    ] as const) {
      const list = CustomerListResponse.parse((await estimator.get('/api/customers').query({ search: typed }).expect(200)).body);
      expect(list.customers.map((c) => c.name), typed).toEqual(found);
    }
    // and a search that matches nothing still finds nothing
    const none = CustomerListResponse.parse((await estimator.get('/api/customers').query({ search: 'fairwether' }).expect(200)).body);
    expect(none.customers).toEqual([]);
  });
});
