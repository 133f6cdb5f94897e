import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ProductListResponse, ProductResponse, type ProductInput } from '@gloaming/contracts';
import { startTestServer, type TestServer } from './harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
});
afterAll(async () => t.close());

const paths = (body: { errors?: { path: string }[] }) => (body.errors ?? []).map((e) => e.path);

const common = { supplier: 'Lanternfield Trade', unit: 'each', description: '', active: true };

/** One product of every kind, with invented names and typical trade values. */
const EXAMPLES: ProductInput[] = [
  {
    ...common,
    kind: 'fitting',
    supplierCode: 'LF-SPK-3',
    name: 'Brass spike spot 3 W',
    costMinor: 1840,
    listPriceMinor: 3450,
    // 3 W at 700 mA drops about 4.3 V (Vf = P / I, REFERENCES "LEDs and drivers" [derived])
    spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.7, powerW: 3 }, { currentA: 0.35, forwardVoltageV: 2.9 }], beamAngleDeg: 36, colourTemperatureK: 2700, lumens: 210, ipCode: 'ip67', tail: { lengthM: 1.5, conductor: { kind: 'metric', areaMm2: 0.75, conductorClass: 5, coating: 'plain' } } },
  },
  { ...common, kind: 'fitting', supplierCode: 'LF-WSH-24', name: 'Wall wash 24 V', costMinor: 2900, listPriceMinor: 5200, spec: { driveMode: 'constant-voltage', nominalVoltageV: 24, powerW: 6, ipCode: 'IP65' } },
  {
    ...common,
    kind: 'driver',
    supplierCode: 'LF-DRV-700',
    name: '700 mA driver 9-42 V',
    costMinor: 2150,
    listPriceMinor: 3900,
    spec: { currentA: 0.7, voltageWindowV: { minV: 9, maxV: 42 }, powerWindowW: { minW: 6.3, maxW: 29.4 }, maxPowerW: 29.4, efficiencyPct: 88, ipCode: 'IP67', dimming: 'none' },
  },
  { ...common, kind: 'cv-supply', supplierCode: 'LF-PSU-24-60', name: '24 V 60 W supply', costMinor: 2600, listPriceMinor: 4700, spec: { outputVoltageV: 24, ratedPowerW: 60, ipCode: 'IP67' } },
  { ...common, kind: 'cable', unit: 'm', supplierCode: 'LF-CAB-2C15', name: '2-core 1.5 mm² flex', costMinor: 95, listPriceMinor: 180, spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' }, cutLengthM: 50 } },
  { ...common, kind: 'cable', unit: 'm', supplierCode: 'LF-CAB-14AWG', name: '14 AWG low-voltage cable', costMinor: 110, listPriceMinor: 200, spec: { cores: 2, conductor: { kind: 'awg', gauge: 14, stranding: 'stranded' }, statedOhmPerKm: 10.3 } },
  { ...common, kind: 'connector-block', supplierCode: 'LF-BLK-6', name: 'Gel block 6-way', costMinor: 640, listPriceMinor: 1200, spec: { terminals: 6, entries: 4, conductorsPerTerminal: 2, ipCode: 'IP68' } },
  { ...common, kind: 'accessory', supplierCode: 'LF-STK-10', name: 'Ground stake 250 mm', costMinor: 120, listPriceMinor: 300, spec: {} },
  { ...common, kind: 'labour', unit: 'hour', supplierCode: 'LAB-FIT', name: 'Fit and aim a spike spot', costMinor: 0, listPriceMinor: 0, spec: { minutes: 20 } },
];

describe('catalogue products', () => {
  it('creates one of every kind and reads each back with its spec', async () => {
    const estimator = await t.signIn('estimator');
    for (const example of EXAMPLES) {
      const res = await estimator.post('/api/products').send(example);
      expect(res.status, `${example.kind} ${JSON.stringify(res.body)}`).toBe(201);
      const { product } = ProductResponse.parse(res.body);
      expect(product).toMatchObject({ kind: example.kind, supplierCode: example.supplierCode, version: 1, active: true });
      const again = ProductResponse.parse((await estimator.get(`/api/products/${product.id}`).expect(200)).body);
      expect(again.product.spec).toEqual(product.spec);
    }
    const fitting = ProductListResponse.parse((await estimator.get('/api/products?kind=fitting&search=spike').expect(200)).body);
    expect(fitting.products).toHaveLength(1);
    // IP codes are stored upper-case (IEC 60529 writes them IP67)
    expect(fitting.products[0]!.kind === 'fitting' && fitting.products[0]!.spec.ipCode).toBe('IP67');
  });

  it('edits with optimistic locking, refuses a duplicate supplier code, and deactivates', async () => {
    const owner = await t.signIn('owner');
    const base = { ...common, kind: 'accessory' as const, supplierCode: 'LF-SEAL-1', name: 'Seal kit', costMinor: 300, listPriceMinor: 600, spec: {} };
    const { product } = ProductResponse.parse((await owner.post('/api/products').send(base).expect(201)).body);
    const dup = await owner.post('/api/products').send({ ...base, name: 'Another' }).expect(409);
    expect(dup.body.detail).toMatch(/LF-SEAL-1 is already in the catalogue/);

    const edited = await owner.put(`/api/products/${product.id}`).send({ ...base, listPriceMinor: 650, version: 1 }).expect(200);
    expect(edited.body.product).toMatchObject({ listPriceMinor: 650, version: 2 });
    const stale = await owner.put(`/api/products/${product.id}`).send({ ...base, listPriceMinor: 1, version: 1 }).expect(409);
    expect(stale.body.detail).toMatch(/changed by someone else/);

    await owner.post(`/api/products/${product.id}/deactivate`).send({ version: 2 }).expect(200);
    const active = ProductListResponse.parse((await owner.get('/api/products?search=LF-SEAL').expect(200)).body);
    expect(active.products).toHaveLength(0);
    const inactive = ProductListResponse.parse((await owner.get('/api/products?search=LF-SEAL&active=inactive').expect(200)).body);
    expect(inactive.products.map((p) => p.id)).toEqual([product.id]);
  });

  it('answers bad specs and bad input with problem+json field paths', async () => {
    const estimator = await t.signIn('estimator');
    const missing = await estimator.post('/api/products').send({}).expect(400);
    expect(missing.headers['content-type']).toContain('application/problem+json');
    expect(paths(missing.body)).toEqual(['body.kind']);

    const fitting = EXAMPLES[0]!;
    // a rating needs its forward voltage or its power (P = Vf · I)
    const noVf = await estimator.post('/api/products').send({ ...fitting, supplierCode: 'X1', spec: { driveMode: 'constant-current', ratings: [{ currentA: 0.35 }], ipCode: 'IP67' } }).expect(400);
    expect(paths(noVf.body)).toEqual(['body.spec.ratings.0.forwardVoltageV']);

    // IEC 60529: the first digit runs 0-6, so IP76 is not a code; IP6 is incomplete
    for (const ipCode of ['IP76', 'IP6', 'sixty-five']) {
      const bad = await estimator.post('/api/products').send({ ...fitting, supplierCode: 'X2', spec: { driveMode: 'constant-voltage', nominalVoltageV: 12, powerW: 2, ipCode } }).expect(400);
      expect(paths(bad.body)).toEqual(['body.spec.ipCode']);
    }

    const driver = EXAMPLES[2]!;
    const window = await estimator.post('/api/products').send({ ...driver, supplierCode: 'X3', spec: { ...(driver.spec as object), voltageWindowV: { minV: 42, maxV: 9 } } }).expect(400);
    expect(paths(window.body)).toEqual(['body.spec.voltageWindowV.minV']);

    const wrongTypes = await estimator.post('/api/products').send({ ...EXAMPLES[7]!, costMinor: '12.50', listPriceMinor: 1.5, active: 'yes' }).expect(400);
    expect(paths(wrongTypes.body)).toEqual(expect.arrayContaining(['body.costMinor', 'body.listPriceMinor', 'body.active']));

    const huge = await estimator.post('/api/products').send({ ...EXAMPLES[7]!, name: 'n'.repeat(201), costMinor: 1e12 }).expect(400);
    expect(paths(huge.body)).toEqual(expect.arrayContaining(['body.name', 'body.costMinor']));

    const cable = await estimator.post('/api/products').send({ ...EXAMPLES[4]!, supplierCode: 'X4', spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 3 } } }).expect(400);
    expect(paths(cable.body)).toEqual(['body.spec.conductor.conductorClass']);

    const { product } = ProductResponse.parse((await estimator.post('/api/products').send({ ...EXAMPLES[7]!, supplierCode: 'X5' }).expect(201)).body);
    const noVersion = await estimator.put(`/api/products/${product.id}`).send(EXAMPLES[7]).expect(400);
    expect(paths(noVersion.body)).toEqual(['body.version']);
    const badDeactivate = await estimator.post(`/api/products/${product.id}/deactivate`).send({ version: -3 }).expect(400);
    expect(paths(badDeactivate.body)).toEqual(['body.version']);
    await estimator.get('/api/products/12').expect(400);
    const query = await estimator.get('/api/products?kind=lamp&pageSize=0').expect(400);
    expect(paths(query.body)).toEqual(expect.arrayContaining(['query.kind', 'query.pageSize']));
  });

  it("keeps firms apart (404) and installers out (403)", async () => {
    const a = await t.signIn('estimator');
    const { product } = ProductResponse.parse((await a.post('/api/products').send({ ...EXAMPLES[7]!, supplierCode: 'FIRM-A-ONLY' }).expect(201)).body);
    const b = await t.signIn('estimator', 'B');
    await b.get(`/api/products/${product.id}`).expect(404);
    await b.put(`/api/products/${product.id}`).send({ ...EXAMPLES[7]!, version: 1 }).expect(404);
    await b.post(`/api/products/${product.id}/deactivate`).send({ version: 1 }).expect(404);
    const listB = ProductListResponse.parse((await b.get('/api/products?search=FIRM-A-ONLY').expect(200)).body);
    expect(listB.total).toBe(0);
    const installer = await t.signIn('installer');
    await installer.get('/api/products').expect(403);
    await installer.post('/api/products').send(EXAMPLES[7]).expect(403);
  });
});
