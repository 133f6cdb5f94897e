import iconv from 'iconv-lite';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ImportJobResponse, MAX_PRICE_LIST_BYTES, PreviewResponse, PriceListUploadResponse, ProductListResponse, type ColumnMapping } from '@gloaming/contracts';
import { ImportJob, Product } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
});
afterAll(async () => t.close());

type Agent = ReturnType<typeof request.agent>;

async function upload(agent: Agent, supplier: string, bytes: Buffer | string, fileName = 'prices.csv') {
  const res = await agent.post('/api/product-imports').field('supplier', supplier).attach('file', Buffer.from(bytes), fileName);
  if (res.status !== 201) throw new Error(`upload ${res.status} ${JSON.stringify(res.body)}`);
  return PriceListUploadResponse.parse(res.body);
}

async function runToEnd(agent: Agent, jobId: string, mapping: ColumnMapping, onPoll?: () => Promise<void>) {
  await agent.post(`/api/product-imports/${jobId}/run`).send(mapping).expect(202);
  for (;;) {
    const { job } = ImportJobResponse.parse((await agent.get(`/api/product-imports/${jobId}`).expect(200)).body);
    if (job.state === 'done' || job.state === 'failed') return job;
    if (onPoll) await onPoll();
    else await new Promise((r) => setTimeout(r, 20));
  }
}

const LIST = [
  'Code,Name,Trade £,RRP,IP,Drive mA,Watts',
  'SP-100,Copper spike spot,18.40,34.50,IP67,700,3',
  'SP-101,Copper spike spot wide,19.10,35.00,IP67,700,3',
  'SP-102,Broken row spot,eighteen,34.50,IP67,700,3',
  '=HYPERLINK("x"),Formula looking row,,,,,',
].join('\r\n');

const FITTING_MAPPING: ColumnMapping = {
  defaultKind: 'fitting',
  columns: { supplierCode: 'Code', name: 'Name', cost: 'Trade £', listPrice: 'RRP', ipCode: 'IP', driveCurrentMa: 'Drive mA', powerW: 'Watts' },
};

describe('price-list import', () => {
  it('previews row errors, imports good rows, rejects a bad one with its reason, and offers the rejects as safe CSV', async () => {
    const estimator = await t.signIn('estimator');
    const up = await upload(estimator, 'Kestrel Lighting Supply', LIST);
    expect(up.headers).toEqual(['Code', 'Name', 'Trade £', 'RRP', 'IP', 'Drive mA', 'Watts']);
    expect(up.delimiter).toBe(',');
    expect(up.job).toMatchObject({ state: 'uploaded', totalRows: 4 });
    expect(up.mappingRemembered).toBe(false);
    // guessed from the header names
    expect(up.suggestedMapping.columns).toMatchObject({ supplierCode: 'Code', name: 'Name', listPrice: 'RRP', ipCode: 'IP' });

    const preview = PreviewResponse.parse((await estimator.post(`/api/product-imports/${up.job.id}/preview`).send(FITTING_MAPPING).expect(200)).body);
    expect(preview.rows.map((r) => r.outcome)).toEqual(['create', 'create', 'reject', 'reject']);
    expect(preview.rows[2]!.errors[0]!.message).toMatch(/Cost \(column “Trade £”\): “eighteen” is not an amount of money/);

    const job = await runToEnd(estimator, up.job.id, FITTING_MAPPING);
    expect(job).toMatchObject({ state: 'done', createdCount: 2, updatedCount: 0, rejectedCount: 2, processedRows: 4 });
    expect(job.rejections.map((r) => r.row)).toEqual([4, 5]);

    const list = ProductListResponse.parse((await estimator.get('/api/products?search=SP-10').expect(200)).body);
    const spot = list.products.find((p) => p.supplierCode === 'SP-100');
    expect(spot).toMatchObject({ kind: 'fitting', costMinor: 1840, listPriceMinor: 3450, supplier: 'Kestrel Lighting Supply' });
    expect(spot?.kind === 'fitting' && spot.spec.driveMode === 'constant-current' && spot.spec.ratings[0]).toEqual({ currentA: 0.7, powerW: 3 });

    const csv = await estimator.get(`/api/product-imports/${up.job.id}/rejections.csv`).expect(200);
    expect(csv.headers['content-type']).toContain('text/csv');
    expect(csv.headers['content-disposition']).toContain('attachment');
    const lines = csv.text.replace(/^\ufeff/, '').trim().split('\r\n');
    expect(lines[0]).toBe('Row,Reason,Code,Name,Trade £,RRP,IP,Drive mA,Watts');
    expect(lines[1]).toMatch(/^4,.*eighteen/);
    // a cell a spreadsheet would run as a formula is prefixed with a single quote
    expect(lines[2]).toContain(`"'=HYPERLINK(""x"")"`);

    // a finished import cannot be run again
    await estimator.post(`/api/product-imports/${up.job.id}/run`).send(FITTING_MAPPING).expect(409);
  });

  it('remembers the mapping per supplier and updates rows matched by supplier + code', async () => {
    const owner = await t.signIn('owner');
    const first = await upload(owner, 'Heron Wholesale', 'Ref;Item;Net;List\nHW-1;Gel crimp;0,35;0,80\n');
    const mapping: ColumnMapping = { defaultKind: 'accessory', columns: { supplierCode: 'Ref', name: 'Item', cost: 'Net', listPrice: 'List' } };
    await runToEnd(owner, first.job.id, mapping);

    const second = await upload(owner, 'Heron Wholesale', 'Ref;Item;Net;List\nHW-1;Gel crimp (new pack);0,40;0,90\nHW-2;Cable tie;0,05;0,15\n');
    expect(second.mappingRemembered).toBe(true);
    expect(second.suggestedMapping).toEqual(mapping);
    const job = await runToEnd(owner, second.job.id, second.suggestedMapping);
    expect(job).toMatchObject({ createdCount: 1, updatedCount: 1, rejectedCount: 0 });
    const crimp = ProductListResponse.parse((await owner.get('/api/products?search=HW-1').expect(200)).body).products;
    expect(crimp).toHaveLength(1);
    expect(crimp[0]).toMatchObject({ name: 'Gel crimp (new pack)', costMinor: 40, listPriceMinor: 90, version: 2 });

    // the same code from another supplier is a different product
    const other = await upload(owner, 'Osprey Direct', 'Ref;Item;Net;List\nHW-1;Osprey crimp;0,30;0,70\n');
    expect(other.mappingRemembered).toBe(false);
    expect((await runToEnd(owner, other.job.id, mapping)).createdCount).toBe(1);
  });

  it('reads a Latin-1 file and a semicolon-delimited file with decimal commas', async () => {
    const estimator = await t.signIn('estimator');
    const latin1 = iconv.encode('Code,Name,Cost,List\nLT-1,Lampe façade crème,12.00,20.00\n', 'latin1');
    expect(latin1.includes(Buffer.from('ç', 'utf8'))).toBe(false);
    const up = await upload(estimator, 'Café Lumière', latin1);
    expect(up.sampleRows[0]![1]).toBe('Lampe façade crème');
    expect(up.encoding).toMatch(/ISO-8859-1|windows-1252/i);

    const semi = await upload(estimator, 'Rotkehlchen GmbH', 'Artikelnummer;Bezeichnung;Preis;Liste\nRK-1;Erdspieß;1.234,50;2.000,00\n');
    expect(semi.delimiter).toBe(';');
    expect(semi.headers).toEqual(['Artikelnummer', 'Bezeichnung', 'Preis', 'Liste']);
    const job = await runToEnd(estimator, semi.job.id, {
      defaultKind: 'accessory',
      columns: { supplierCode: 'Artikelnummer', name: 'Bezeichnung', cost: 'Preis', listPrice: 'Liste' },
    });
    expect(job.createdCount).toBe(1);
    const rk = ProductListResponse.parse((await estimator.get('/api/products?search=RK-1').expect(200)).body).products[0];
    // 1.234,50 with a comma decimal mark is 1234.50 (common practice in continental price lists)
    expect(rk).toMatchObject({ name: 'Erdspieß', costMinor: 123450, listPriceMinor: 200000 });
  });

  it('refuses an oversize file with 413, a missing file or supplier with 400, and other firms or installers', async () => {
    const estimator = await t.signIn('estimator');
    const big = Buffer.alloc(MAX_PRICE_LIST_BYTES + 1024, 'a');
    const tooBig = await estimator.post('/api/product-imports').field('supplier', 'Big').attach('file', big, 'big.csv');
    expect(tooBig.status).toBe(413);
    expect(tooBig.headers['content-type']).toContain('application/problem+json');

    const noFile = await estimator.post('/api/product-imports').field('supplier', 'Nofile').expect(400);
    expect(noFile.body.errors.map((e: { path: string }) => e.path)).toEqual(['body.file']);
    const noSupplier = await estimator.post('/api/product-imports').attach('file', Buffer.from('a,b\n1,2\n'), 'x.csv').expect(400);
    expect(noSupplier.body.errors.map((e: { path: string }) => e.path)).toEqual(['body.supplier']);
    const headerOnly = await estimator.post('/api/product-imports').field('supplier', 'S').attach('file', Buffer.from('a,b\n'), 'x.csv').expect(400);
    expect(headerOnly.body.detail).toMatch(/no products under it/);

    const up = await upload(estimator, 'Private Supplier', 'Code,Name,Cost,List\nPS-1,Thing,1,2\n');
    const badKind = await estimator.post(`/api/product-imports/${up.job.id}/preview`).send({ defaultKind: 'lamp', columns: { supplierCode: 'Code', name: 'Name' } }).expect(400);
    expect(badKind.body.errors.map((e: { path: string }) => e.path)).toEqual(['body.defaultKind']);
    const noCode = await estimator.post(`/api/product-imports/${up.job.id}/preview`).send({ defaultKind: 'accessory', columns: { name: 'Name' } }).expect(400);
    expect(noCode.body.errors.map((e: { path: string }) => e.path)).toEqual(['body.columns.supplierCode']);
    const unknownColumn = await estimator.post(`/api/product-imports/${up.job.id}/preview`).send({ defaultKind: 'accessory', columns: { supplierCode: 'Code', name: 'Nope' } }).expect(400);
    expect(unknownColumn.body.errors).toEqual([{ path: 'body.columns.name', message: 'The file has no column “Nope”.' }]);

    const other = await t.signIn('estimator', 'B');
    await other.get(`/api/product-imports/${up.job.id}`).expect(404);
    await other.post(`/api/product-imports/${up.job.id}/run`).send({ defaultKind: 'accessory', columns: { supplierCode: 'Code', name: 'Name' } }).expect(404);
    await other.get(`/api/product-imports/${up.job.id}/rejections.csv`).expect(404);
    const installer = await t.signIn('installer');
    await installer.post('/api/product-imports').field('supplier', 'X').attach('file', Buffer.from('a\n1\n'), 'x.csv').expect(403);
  });

  it('reports an import cut off by a server restart as failed, with nothing changed', async () => {
    const estimator = await t.signIn('estimator');
    const up = await upload(estimator, 'Restart Supplies', 'Code,Name,Cost,List\nRS-1,Thing,1,2\n');
    // what a restart leaves behind: the row says running, but no import is running in this process
    await t.orm.em.fork().nativeUpdate(ImportJob, { id: up.job.id }, { state: 'running' });
    const { job } = ImportJobResponse.parse((await estimator.get(`/api/product-imports/${up.job.id}`).expect(200)).body);
    expect(job.state).toBe('failed');
    expect(job.error).toMatch(/restarted while this import was running/);
    expect(await t.orm.em.fork().count(Product, { supplier: 'Restart Supplies' })).toBe(0);
  });

  it('rolls everything back when the import fails part-way', async () => {
    const estimator = await t.signIn('estimator');
    const first = await upload(estimator, 'Wren Parts', 'Code,Name,Cost,List\nWR-1,Original,1.00,2.00\n');
    const mapping: ColumnMapping = { defaultKind: 'accessory', columns: { supplierCode: 'Code', name: 'Name', cost: 'Cost', listPrice: 'List' } };
    await runToEnd(estimator, first.job.id, mapping);

    const rows = ['Code,Name,Cost,List', 'WR-1,Renamed,9.00,9.00'];
    for (let i = 2; i <= 1500; i++) rows.push(`WR-${i},Part ${i},1.00,2.00`);
    const up = await upload(estimator, 'Wren Parts', rows.join('\n'));
    // a real database error on row 1200, after earlier chunks were already written in the transaction
    const conn = t.orm.em.fork().getConnection();
    if (t.dialect === 'postgresql') {
      await conn.execute(
        `create function fail_mid_import() returns trigger language plpgsql as $$ begin if new.supplier_code = 'WR-1200' then raise exception 'forced failure for the rollback test'; end if; return new; end $$`,
      );
      await conn.execute('create trigger fail_mid_import before insert on products for each row execute function fail_mid_import()');
    } else {
      await conn.execute(`create trigger fail_mid_import before insert on products when new.supplier_code = 'WR-1200' begin select raise(abort, 'forced failure for the rollback test'); end`);
    }
    try {
      const job = await runToEnd(estimator, up.job.id, mapping);
      expect(job.state).toBe('failed');
      expect(job.error).toMatch(/nothing was changed/);
      expect(job.createdCount).toBe(0);
    } finally {
      await conn.execute(t.dialect === 'postgresql' ? 'drop trigger fail_mid_import on products' : 'drop trigger fail_mid_import');
    }
    const em = t.orm.em.fork();
    expect(await em.count(Product, { supplier: 'Wren Parts' })).toBe(1);
    expect((await em.findOneOrFail(Product, { supplier: 'Wren Parts', supplierCode: 'WR-1' })).name).toBe('Original');
  });

  it('imports 20,000 rows while GET /api/health keeps answering', async () => {
    const estimator = await t.signIn('estimator');
    const rows = ['Code,Name,Cost,List,Kind,Minutes'];
    for (let i = 1; i <= 20_000; i++) rows.push(i % 2 ? `BULK-${i},Bulk part ${i},0.${String(i % 100).padStart(2, '0')},1.50,accessory,` : `BULK-${i},Labour step ${i},0,0,labour,${(i % 50) + 1}`);
    const up = await upload(estimator, 'Bulk Depot', rows.join('\n'));
    expect(up.job.totalRows).toBe(20_000);
    const healthTimes: number[] = [];
    const progress: number[] = [];
    const job = await runToEnd(
      estimator,
      up.job.id,
      { defaultKind: 'accessory', columns: { supplierCode: 'Code', name: 'Name', cost: 'Cost', listPrice: 'List', kind: 'Kind', minutes: 'Minutes' } },
      async () => {
        const t0 = performance.now();
        await request(t.app).get('/api/health').expect(200);
        healthTimes.push(performance.now() - t0);
        const { job: now } = ImportJobResponse.parse((await estimator.get(`/api/product-imports/${up.job.id}`)).body);
        progress.push(now.processedRows);
      },
    );
    expect(job).toMatchObject({ state: 'done', createdCount: 20_000, rejectedCount: 0 });
    // health answered several times while the import was still running, and progress moved
    expect(healthTimes.length).toBeGreaterThan(3);
    expect(new Set(progress).size).toBeGreaterThan(2);
    console.log(`20,000-row import: ${healthTimes.length} health checks during it, slowest ${Math.max(...healthTimes).toFixed(0)} ms`);
    expect(await t.orm.em.fork().count(Product, { supplier: 'Bulk Depot', kind: 'labour' })).toBe(10_000);
  }, 180_000);
});
