import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CustomerListResponse, CustomerResponse } from '@gloaming/contracts';
import { startTestServer, type TestServer } from './harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
});
afterAll(async () => t.close());

const paths = (body: { errors?: { path: string }[] }) => (body.errors ?? []).map((e) => e.path);

const newCustomer = (name: string, extra: Record<string, unknown> = {}) => ({
  name,
  email: `${name.split(' ')[0]!.toLowerCase()}@example.test`,
  phone: '01632 960 123',
  notes: 'Prefers evening visits.',
  sites: [{ label: 'Home', addressLines: '12 Orchard Rise\nLowbridge', postcode: 'LB4 2OR', accessNotes: 'Side gate code 4412' }],
  ...extra,
});

describe('customers and sites', () => {
  it('creates a customer with a site, reads it back, and edits it with optimistic locking', async () => {
    const estimator = await t.signIn('estimator');
    const created = CustomerResponse.parse((await estimator.post('/api/customers').send(newCustomer('Rowena Castell')).expect(201)).body);
    expect(created.customer).toMatchObject({ name: 'Rowena Castell', email: 'rowena@example.test', version: 1 });
    expect(created.customer.sites).toHaveLength(1);
    const id = created.customer.id;

    const fetched = CustomerResponse.parse((await estimator.get(`/api/customers/${id}`).expect(200)).body);
    expect(fetched.customer.sites[0]!.postcode).toBe('LB4 2OR');

    const edited = await estimator.patch(`/api/customers/${id}`).send({ name: 'Rowena Castell-Hart', email: '', phone: null, notes: '', version: 1 }).expect(200);
    expect(edited.body.customer).toMatchObject({ name: 'Rowena Castell-Hart', email: null, phone: null, version: 2 });

    // a second person still holding version 1 is told clearly, and nothing of theirs is written
    const stale = await estimator.patch(`/api/customers/${id}`).send({ name: 'Someone else', version: 1 }).expect(409);
    expect(stale.headers['content-type']).toContain('application/problem+json');
    expect(stale.body.detail).toMatch(/changed by someone else after you opened it/);
    const after = await estimator.get(`/api/customers/${id}`).expect(200);
    expect(after.body.customer.name).toBe('Rowena Castell-Hart');
  });

  it('adds, edits and removes sites, never the last one', async () => {
    const owner = await t.signIn('owner');
    const { customer } = CustomerResponse.parse((await owner.post('/api/customers').send(newCustomer('Bartholomew Inkpen')).expect(201)).body);
    const only = customer.sites[0]!;
    const refused = await owner.delete(`/api/customers/${customer.id}/sites/${only.id}`).expect(409);
    expect(refused.body.detail).toMatch(/at least one site/);

    const added = await owner.post(`/api/customers/${customer.id}/sites`).send({ label: 'Holiday let', addressLines: 'The Boathouse, Mere Lane' }).expect(201);
    expect(added.body.site).toMatchObject({ label: 'Holiday let', postcode: '', version: 1 });
    const siteId: string = added.body.site.id;

    await owner.patch(`/api/customers/${customer.id}/sites/${siteId}`).send({ addressLines: 'The Boathouse, Mere Lane, Ashwater', version: 1 }).expect(200);
    const stale = await owner.patch(`/api/customers/${customer.id}/sites/${siteId}`).send({ addressLines: 'Old', version: 1 }).expect(409);
    expect(stale.body.detail).toMatch(/changed by someone else/);

    await owner.delete(`/api/customers/${customer.id}/sites/${only.id}`).expect(204);
    const left = await owner.get(`/api/customers/${customer.id}`).expect(200);
    expect(left.body.customer.sites.map((s: { id: string }) => s.id)).toEqual([siteId]);
  });

  it('lists with search, sort, filter and pages, and only ever the firm’s own customers', async () => {
    const estimator = await t.signIn('estimator');
    for (const name of ['Zillah Marchbanks', 'Anwen Peverell', 'Cosmo Rudd'])
      await estimator.post('/api/customers').send(newCustomer(name, name.startsWith('Cosmo') ? { email: null } : {})).expect(201);
    const other = await t.signIn('estimator', 'B');
    await other.post('/api/customers').send(newCustomer('Anwen Elsewhere')).expect(201);

    const search = CustomerListResponse.parse((await estimator.get('/api/customers?search=anwen').expect(200)).body);
    expect(search.customers.map((c) => c.name)).toEqual(['Anwen Peverell']);

    const byPostcode = CustomerListResponse.parse((await estimator.get('/api/customers?search=LB4').expect(200)).body);
    expect(byPostcode.total).toBeGreaterThanOrEqual(3);

    const desc = CustomerListResponse.parse((await estimator.get('/api/customers?sort=name&direction=desc&pageSize=2').expect(200)).body);
    expect(desc.customers.map((c) => c.name)[0]).toBe('Zillah Marchbanks');
    expect(desc.customers).toHaveLength(2);
    const page2 = CustomerListResponse.parse((await estimator.get('/api/customers?sort=name&direction=desc&pageSize=2&page=2').expect(200)).body);
    expect(page2.customers.map((c) => c.id)).not.toContain(desc.customers[0]!.id);

    const noEmail = CustomerListResponse.parse((await estimator.get('/api/customers?contact=without-email').expect(200)).body);
    expect(noEmail.customers.map((c) => c.name)).toContain('Cosmo Rudd');
    expect(noEmail.customers.every((c) => c.email === null)).toBe(true);
  });

  it('answers bad input with problem+json and field paths', async () => {
    const estimator = await t.signIn('estimator');
    const missing = await estimator.post('/api/customers').send({}).expect(400);
    expect(missing.headers['content-type']).toContain('application/problem+json');
    expect(paths(missing.body)).toEqual(expect.arrayContaining(['body.name', 'body.sites']));

    const wrongTypes = await estimator.post('/api/customers').send({ name: 42, email: 'not-an-email', sites: 'home' }).expect(400);
    expect(paths(wrongTypes.body)).toEqual(expect.arrayContaining(['body.name', 'body.email', 'body.sites']));

    const huge = await estimator.post('/api/customers').send(newCustomer('x'.repeat(500), { sites: Array.from({ length: 51 }, () => ({ addressLines: 'a' })) })).expect(400);
    expect(paths(huge.body)).toEqual(expect.arrayContaining(['body.name', 'body.sites']));

    const emptySite = await estimator.post('/api/customers').send(newCustomer('Valid Name', { sites: [{ addressLines: '   ' }] })).expect(400);
    expect(paths(emptySite.body)).toEqual(['body.sites.0.addressLines']);

    const badQuery = await estimator.get('/api/customers?page=0&pageSize=5000&sort=shoe').expect(400);
    expect(paths(badQuery.body)).toEqual(expect.arrayContaining(['query.page', 'query.pageSize', 'query.sort']));

    await estimator.get('/api/customers/not-a-uuid').expect(400);
    const { customer } = CustomerResponse.parse((await estimator.post('/api/customers').send(newCustomer('Ottoline Vane')).expect(201)).body);
    const noVersion = await estimator.patch(`/api/customers/${customer.id}`).send({ name: 'Ottoline' }).expect(400);
    expect(paths(noVersion.body)).toEqual(['body.version']);
    const siteId = customer.sites[0]!.id;
    const badSite = await estimator.post(`/api/customers/${customer.id}/sites`).send({ addressLines: 7, postcode: 'P'.repeat(40) }).expect(400);
    expect(paths(badSite.body)).toEqual(expect.arrayContaining(['body.addressLines', 'body.postcode']));
    const badSiteEdit = await estimator.patch(`/api/customers/${customer.id}/sites/${siteId}`).send({ addressLines: 'Somewhere', version: 'one' }).expect(400);
    expect(paths(badSiteEdit.body)).toEqual(['body.version']);
    const badSiteId = await estimator.delete(`/api/customers/${customer.id}/sites/nope`).expect(400);
    expect(paths(badSiteId.body)).toEqual(['params.siteId']);
    // a site id from another customer of the same firm is not this customer's site
    const { customer: other } = CustomerResponse.parse((await estimator.post('/api/customers').send(newCustomer('Other Person')).expect(201)).body);
    await estimator.delete(`/api/customers/${customer.id}/sites/${other.sites[0]!.id}`).expect(404);
  });

  it("answers 404 for another firm's customer and site, and 403 for installers", async () => {
    const a = await t.signIn('owner');
    const { customer } = CustomerResponse.parse((await a.post('/api/customers').send(newCustomer('Peregrine Lusk')).expect(201)).body);
    const b = await t.signIn('owner', 'B');
    const siteId = customer.sites[0]!.id;
    for (const res of [
      await b.get(`/api/customers/${customer.id}`),
      await b.patch(`/api/customers/${customer.id}`).send({ name: 'Taken over', version: 1 }),
      await b.post(`/api/customers/${customer.id}/sites`).send({ addressLines: 'x' }),
      await b.patch(`/api/customers/${customer.id}/sites/${siteId}`).send({ addressLines: 'x', version: 1 }),
      await b.delete(`/api/customers/${customer.id}/sites/${siteId}`),
    ]) {
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toContain('application/problem+json');
    }
    const installer = await t.signIn('installer');
    expect((await installer.get('/api/customers')).status).toBe(403);
    expect((await installer.post('/api/customers').send(newCustomer('Nobody'))).status).toBe(403);
    // the customer is untouched
    expect((await a.get(`/api/customers/${customer.id}`).expect(200)).body.customer.name).toBe('Peregrine Lusk');
  });
});
