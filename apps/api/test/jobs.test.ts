/**
 * Jobs and the installer's pack: who reads them (owner, estimator, installer of the firm),
 * that no response to them carries a price, cost or margin, the as-wired schedule with the
 * wiring advice, commissioning readings, and the pack PDF.
 * Trade rules behind the figures: the series rule of thumb and one terminal per joint
 * (common practice, the block planner); 10 % cable slack (common practice, the takeoff's
 * default); driver current ± 5 % and forward voltage ± 10 % (common practice).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  JobListResponse,
  JobPackResponse,
  SaveAsWiredResponse,
  SaveCommissioningResponse,
  type AsWiredBlock,
  type CcCircuitDesign,
  type CvCircuitDesign,
  type InstallerProduct,
} from '@gloaming/contracts';
import { Circuit, Product, newId } from '@gloaming/db';
import { evaluateCircuit, type DesignProduct } from '@gloaming/engine';
import { presentProduct } from '../src/modules/catalogue/presenter';
import { circuitSettings, rederiveRevision, storedResult } from '../src/modules/circuits/service';
import { startTestServer, type TestServer } from './harness';
import { createJobFixture } from './job-fixtures';
import { binary, pdfPages, pdfText } from './support/pdf-text';

let t: TestServer;
let installer: Awaited<ReturnType<TestServer['signIn']>>;
let estimator: Awaited<ReturnType<TestServer['signIn']>>;
let owner: Awaited<ReturnType<TestServer['signIn']>>;
let installerB: Awaited<ReturnType<TestServer['signIn']>>;
let job: Awaited<ReturnType<typeof createJobFixture>>;
let jobB: Awaited<ReturnType<typeof createJobFixture>>;
let draft: Awaited<ReturnType<typeof createJobFixture>>;
let won: Awaited<ReturnType<typeof createJobFixture>>;

beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
  job = await createJobFixture(t.orm.em.fork(), t.firmA, 'approved');
  won = await createJobFixture(t.orm.em.fork(), t.firmA, 'won');
  draft = await createJobFixture(t.orm.em.fork(), t.firmA, 'sent');
  jobB = await createJobFixture(t.orm.em.fork(), t.firmB, 'approved');
  installer = await t.signIn('installer');
  estimator = await t.signIn('estimator');
  owner = await t.signIn('owner');
  installerB = await t.signIn('installer', 'B');
});
afterAll(async () => t.close());

/** Every key anywhere in a JSON value. */
function keysOf(value: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(value)) for (const v of value) keysOf(v, out);
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) {
      out.add(k);
      keysOf(v, out);
    }
  return out;
}
const PRICE_KEY = /minor|price|cost|margin|markup|vat|deposit|^totals?$/i;

function expectNoPrices(body: unknown) {
  expect([...keysOf(body)].filter((k) => PRICE_KEY.test(k))).toEqual([]);
  // the fixture's prices (spike £39.00 / cost £21.00, driver £52.00 / £28.00, flex £1.60 / £0.90, block £11.00 / £6.00)
  const text = JSON.stringify(body);
  for (const amount of ['3900', '2100', '5200', '2800', '1100', '£']) expect(text).not.toContain(amount);
}



/** The designed schedule as the page starts it: each block's terminals as planned. */
async function designedBlocks(): Promise<AsWiredBlock[]> {
  const res = await installer.get(`/api/jobs/${job.quote.id}`);
  const pack = JobPackResponse.parse(res.body);
  const products: DesignProduct[] = pack.products.map(
    (p: InstallerProduct) => ({ ...p, costMinor: 0, listPriceMinor: 0 }) as DesignProduct,
  );
  const plan = evaluateCircuit(pack.circuits[0]!.design as CcCircuitDesign, products, { profile: pack.profile }).blocks!;
  return plan.blocks.map((b) => ({ terminals: b.terminals.map((x) => ({ conductors: [...x.conductors] })) }));
}

describe('GET /api/jobs', () => {
  it("lists the firm's approved, deposit-paid and won jobs for an installer, never a sent quote or another firm's", async () => {
    const res = await installer.get('/api/jobs');
    expect(res.status).toBe(200);
    const body = JobListResponse.parse(res.body);
    const ids = body.jobs.map((j) => j.id).sort();
    expect(ids).toEqual([job.quote.id, won.quote.id].sort());
    expect(ids).not.toContain(draft.quote.id);
    expect(ids).not.toContain(jobB.quote.id);
    const mine = body.jobs.find((j) => j.id === job.quote.id)!;
    expect(mine).toMatchObject({
      status: 'approved',
      customerName: 'Hollis Wren',
      circuitCount: 1,
      siteAddress: ['4 Larch Row', 'Eastwick'],
    });
    expectNoPrices(res.body);
  });

  it('answers estimators and owners the same, and nobody signed out', async () => {
    expect((await estimator.get('/api/jobs')).status).toBe(200);
    expect((await owner.get('/api/jobs')).status).toBe(200);
    const { default: request } = await import('supertest');
    expect((await request(t.app).get('/api/jobs')).status).toBe(401);
  });
});

describe('GET /api/jobs/:id (the pack)', () => {
  it('gives the installer the pick list by circuit and by bench/van, the design and the expected readings, with no prices', async () => {
    const res = await installer.get(`/api/jobs/${job.quote.id}`);
    expect(res.status).toBe(200);
    const pack = JobPackResponse.parse(res.body);
    expectNoPrices(res.body);
    const c = pack.circuits[0]!;
    expect(c).toMatchObject({
      area: 'Front path',
      name: 'Path string',
      kind: 'constant-current',
      powerName: 'Lantern driver 350 mA 20 W',
    });
    const q = Object.fromEntries(c.pick.items.map((i) => [i.code || i.name, i.quantity]));
    // six spikes over two six-way blocks: block 1 takes four (five joints and the link), block 2 the other two
    expect(q).toMatchObject({ 'OW-SP3': 6, 'OW-D350': 1, 'OW-G6': 2 });
    // 10 m lead and 8 m link, plus 10 % slack
    expect(c.pick.cuts.map((k) => [k.label, k.cutM])).toEqual([
      ['Driver lead (driver to block 1)', 11],
      ['Link 1 (block 1 to block 2)', 8.8],
    ]);
    expect(pack.loads.map((g) => g.place)).toEqual(['bench', 'van']);
    expect(pack.loads[0]!.cableTotals).toEqual([
      { productId: job.products.cable.id, code: 'OW-F15', name: 'Two-core flex 1.5 mm²', totalM: 19.8 },
    ]);
    const readings = Object.fromEntries(c.commissioning.readings.map((r) => [r.key, r]));
    expect(readings['output-current']).toMatchObject({ expected: 0.35, min: 0.333, max: 0.368, status: 'not-entered' });
    // six spikes at 3.0 V: 18 V of forward voltage, plus the cable drop
    expect(readings['output-voltage']!.expected!).toBeGreaterThan(18);
    expect(pack.caution).toContain('licensed electrician');
    expect(c.asWired).toBeNull();
  });

  it('is a 404 for a quote that is not approved and for another firm’s job', async () => {
    expect((await installer.get(`/api/jobs/${draft.quote.id}`)).status).toBe(404);
    expect((await installer.get(`/api/jobs/${jobB.quote.id}`)).status).toBe(404);
    expect((await installerB.get(`/api/jobs/${job.quote.id}`)).status).toBe(404);
    expect((await installerB.get(`/api/jobs/${jobB.quote.id}`)).status).toBe(200);
  });

  it('keeps estimates from installers: they cannot read or edit the quote, its revision or its circuits', async () => {
    expect((await installer.get(`/api/quotes/${job.quote.id}`)).status).toBe(403);
    expect((await installer.get(`/api/quotes/${job.quote.id}/revisions/1`)).status).toBe(403);
    expect((await installer.put(`/api/quotes/${job.quote.id}/revisions/1`).send({})).status).toBe(403);
    expect((await installer.get(`/api/quotes/${job.quote.id}/revisions/1/circuits`)).status).toBe(403);
    expect((await installer.get(`/api/quotes/${job.quote.id}/revisions/${job.revision.id}/pdf`)).status).toBe(403);
  });
});

describe('PUT /api/jobs/:id/circuits/:circuitId/as-wired', () => {
  const url = () => `/api/jobs/${job.quote.id}/circuits/${job.circuit.id}/as-wired`;

  it('records a wrong termination, says it is not safe and exactly what to move, and keeps it with the job', async () => {
    const blocks = await designedBlocks();
    // block 2 holds fittings 5 and 6: T1 link core 1 (B) + 5 +, T2 5 − + 6 +, T3 6 − + link core 2 (B).
    // The installer lands fitting 6's − on T2 with its own + (the return on the + joint).
    expect(blocks[1]!.terminals.map((x) => x.conductors)).toEqual([
      ['link:1/core:1/end:B', 'fitting:5+'],
      ['fitting:5-', 'fitting:6+'],
      ['fitting:6-', 'link:1/core:2/end:B'],
    ]);
    blocks[1]!.terminals[2]!.conductors = ['link:1/core:2/end:B'];
    blocks[1]!.terminals[1]!.conductors.push('fitting:6-');
    const res = await installer.put(url()).send({ version: null, blocks });
    expect(res.status).toBe(200);
    const { asWired } = SaveAsWiredResponse.parse(res.body);
    expect(asWired.advice.safeToPowerUp).toBe(false);
    expect(asWired.advice.changes).toEqual([
      expect.objectContaining({
        kind: 'move',
        subject: 'block:2/terminal:2',
        conductor: 'fitting:6-',
        to: { block: 2, terminal: 3 },
        message:
          'Block 2 terminal 2: fitting 6 (Path light 6) − lands here, on the joint for fitting 5 (Path light 5) − and fitting 6 (Path light 6) +; move it to block 2 terminal 3 (with link cable 1 core 2 (end B)).',
      }),
    ]);
    expect(asWired.advice.byTerminal['block:2/terminal:2']).toContain(asWired.advice.changes[0]!.message);
    expect(asWired.recordedBy).toBe(t.firmA.users.installer.name || t.firmA.users.installer.email);
    const pack = JobPackResponse.parse((await installer.get(`/api/jobs/${job.quote.id}`)).body);
    expect(pack.circuits[0]!.asWired?.version).toBe(asWired.version);
    expect(pack.circuits[0]!.asWired?.advice.safeToPowerUp).toBe(false);

    // a stale version is a conflict; the fix, saved on the current version, is safe
    expect((await installer.put(url()).send({ version: null, blocks })).status).toBe(409);
    const fixed = await designedBlocks();
    const ok = await estimator.put(url()).send({ version: asWired.version, blocks: fixed });
    expect(ok.status).toBe(200);
    const saved = SaveAsWiredResponse.parse(ok.body).asWired;
    expect(saved.advice.safeToPowerUp).toBe(true);
    expect(saved.advice.changes).toEqual([]);
    expect((await owner.put(url()).send({ version: saved.version, blocks: fixed })).status).toBe(200);
  });

  it('answers bad input with field errors, an unknown circuit with 404, another firm with 404', async () => {
    const bad = await installer.put(url()).send({ version: null, blocks: [{ terminals: 'T1' }] });
    expect(bad.status).toBe(400);
    expect(bad.headers['content-type']).toContain('application/problem+json');
    expect(JSON.stringify(bad.body)).toContain('body.blocks.0.terminals');
    expect((await installer.put(`/api/jobs/${job.quote.id}/circuits/${won.circuit.id}/as-wired`).send({})).status).toBe(404);
    expect((await installerB.put(url()).send({ version: null, blocks: [] })).status).toBe(404);
    expect((await installer.put(`/api/jobs/${draft.quote.id}/circuits/${draft.circuit.id}/as-wired`).send({})).status).toBe(404);
  });
});

describe('PUT /api/jobs/:id/circuits/:circuitId/commissioning', () => {
  const url = () => `/api/jobs/${won.quote.id}/circuits/${won.circuit.id}/commissioning`;

  it('saves readings against the job and flags the ones out of range', async () => {
    const res = await installer.put(url()).send({
      version: null,
      readings: { 'output-current': 0.351, 'output-voltage': 18.4, 'far-fitting-voltage': 2.2, 'insulation-resistance': 150 },
      checks: { 'polarity-checked': true, 'seals-checked': true, 'not-a-check': true },
      note: 'Spike 6 moved 300 mm to clear the tap.',
    });
    expect(res.status).toBe(200);
    const { commissioning } = SaveCommissioningResponse.parse(res.body);
    const status = Object.fromEntries(commissioning.readings.map((r) => [r.key, r.status]));
    expect(status).toMatchObject({
      'output-current': 'in-range',
      'far-fitting-voltage': 'low',
      'insulation-resistance': 'in-range',
    });
    expect(commissioning.flagged).toBeGreaterThanOrEqual(1);
    expect(commissioning.findings.some((f) => f.code === 'reading-out-of-range' && f.message.includes('2.2 V is below'))).toBe(
      true,
    );
    expect(commissioning.checks.filter((c) => c.done).map((c) => c.key)).toEqual(['polarity-checked', 'seals-checked']);
    expect(commissioning.complete).toBe(false);
    const pack = JobPackResponse.parse((await installer.get(`/api/jobs/${won.quote.id}`)).body);
    expect(pack.circuits[0]!.commissioning).toMatchObject({
      note: 'Spike 6 moved 300 mm to clear the tap.',
      version: commissioning.version,
    });
    expectNoPrices(pack);

    // the owner corrects the reading on the latest version
    const again = await owner.put(url()).send({
      version: commissioning.version,
      readings: { 'far-fitting-voltage': 3.05 },
      checks: {},
      note: '',
    });
    expect(again.status).toBe(200);
    expect(
      SaveCommissioningResponse.parse(again.body).commissioning.readings.find((r) => r.key === 'far-fitting-voltage')!.status,
    ).toBe('in-range');
    expect((await estimator.put(url()).send({ version: 1, readings: {}, checks: {} })).status).toBe(409);
  });

  it('refuses a negative or non-numeric reading with the field named', async () => {
    const res = await installer.put(url()).send({ version: null, readings: { 'output-voltage': -3 }, checks: {} });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toContain('cannot be negative');
    const text = await installer.put(url()).send({ version: null, readings: { 'output-voltage': 'twelve' }, checks: {} });
    expect(text.status).toBe(400);
  });
});

describe('GET /api/jobs/:id/pack.pdf', () => {
  it('renders the pack with the pick list, the terminal schedule, the readings and the caution, and no prices', async () => {
    const res = await installer.get(`/api/jobs/${job.quote.id}/pack.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toContain('application/pdf');
    expect(res.headers['content-disposition']).toContain('-installers-pack.pdf');
    const text = await pdfText(res.body as Buffer);
    expect(text).toContain('Installer’s pack');
    expect(text).toContain('Pick list');
    expect(text).toContain('Lantern driver 350 mA 20 W');
    expect(text).toContain('Block 1');
    expect(text).toMatch(/T1\s+driver\+/);
    expect(text).toContain('link:1/core:2/end:B');
    expect(text).toContain('Output current at the driver');
    expect(text).toContain('licensed electrician');
    // the as-wired record saved above: the last save was the corrected schedule
    expect(text).toContain('As wired: safe to power up');
    expect(text).not.toMatch(/£|\bcost\b|\bmargin\b|\bVAT\b/i);
    expect((await installerB.get(`/api/jobs/${job.quote.id}/pack.pdf`)).status).toBe(404);
  }, 30_000);
});

describe('GET /api/jobs/:id/pack.pdf, constant voltage', () => {
  // Trade rules: each fitting draws P / V (the usual design figure); a two-core loop is
  // 2 x length x R per metre; a hub's feeder carries every fitting, each spoke its own, a
  // daisy-chain segment every load beyond it (REFERENCES, voltage drop, derived); 1.5 mm² class 5
  // plain copper is 13.3 ohm/km at 20 °C (IEC 60228 Table 3), x 1.1965 at 70 °C (IEC 60228 Table 3, 70 °C derived).
  it('draws the run diagram: the supply, each run with its feeder and spans, each fitting with its voltage and drop', async () => {
    const em = t.orm.em.fork();
    const cvJob = await createJobFixture(em, t.firmA, 'won');
    const make = (supplierCode: string, name: string, kind: Product['kind'], spec: Record<string, unknown>) =>
      em.create(Product, {
        organization: t.firmA.firm.id,
        kind,
        supplier: 'Owlbrook Trade',
        supplierCode,
        name,
        costMinor: 1500,
        listPriceMinor: 2700,
        unit: 'each',
        spec,
      });
    const supply = make('OW-PS12', 'Moss 12 V 60 W supply', 'cv-supply', { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP67' });
    const bollard = make('OW-BL4', 'Stour bollard 4 W', 'fitting', {
      driveMode: 'constant-voltage',
      nominalVoltageV: 12,
      powerW: 4,
      ipCode: 'IP65',
    });
    await em.flush();
    const flex = cvJob.products.cable.id;
    const placed = (id: string, label: string, spanLengthM: number) => ({
      id,
      productId: bollard.id,
      label,
      location: 'exposed-outdoor' as const,
      spanLengthM,
    });
    const design: CvCircuitDesign = {
      kind: 'constant-voltage',
      supplyProductId: supply.id,
      supplyLocation: 'sheltered-outdoor',
      runs: [
        {
          id: 'yard',
          label: 'Courtyard',
          layout: 'hub',
          cableProductId: flex,
          method: 'in-duct',
          feederLengthM: 6,
          fittings: [placed('b1', 'Gate', 5), placed('b2', 'Bench', 4), placed('b3', 'Well', 6)],
        },
        {
          id: 'wall',
          label: 'Wall',
          layout: 'daisy-chain',
          cableProductId: flex,
          method: 'surface-clipped',
          feederLengthM: 0,
          fittings: [placed('w1', 'Arch', 3), placed('w2', 'Store', 3)],
        },
      ],
      acknowledgements: [],
    };
    const views = [...Object.values(cvJob.products), supply, bollard].map(presentProduct);
    const circuit = em.create(Circuit, {
      id: newId(),
      organization: t.firmA.firm,
      revision: cvJob.revision,
      area: 'Courtyard',
      name: 'Bollards',
      kind: design.kind,
      position: 1,
      design,
      result: storedResult(evaluateCircuit(design, views, circuitSettings(cvJob.revision, t.firmA.firm))),
    });
    await rederiveRevision(em, cvJob.revision, [cvJob.circuit, circuit]);
    await em.flush();

    const res = await installer.get(`/api/jobs/${cvJob.quote.id}/pack.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const text = (await pdfText(res.body as Buffer)).replace(/\s+/g, ' ');
    expect(text).toContain('+ conductor');
    expect(text).toContain('− conductor');
    expect(text).toContain('Supply');
    expect(text).toContain('Moss 12 V 60 W supply');
    expect(text).toContain('Run: Courtyard · hub');
    expect(text).toContain('Run: Wall · daisy chain');
    expect(text).toContain('feeder 6 m');
    expect(text).toContain('junction');
    for (const words of ['spoke 5 m', 'spoke 4 m', 'spoke 6 m', '3 m']) expect(text).toContain(words);
    for (const label of ['Gate', 'Bench', 'Well', 'Arch', 'Store']) expect(text).toContain(label);
    // 4 W / 12 V = 1/3 A a bollard; R = 0.0133 x 1.1965 ohm/m
    const r = 0.0133 * 1.1965;
    const amps = 4 / 12;
    const junction = 12 - 3 * amps * (2 * 6 * r);
    const hub = [5, 4, 6].map((m) => junction - amps * (2 * m * r));
    const arch = 12 - 2 * amps * (2 * 3 * r);
    const store = arch - amps * (2 * 3 * r);
    for (const v of [...hub, arch, store]) {
      expect(text).toContain(`${v.toFixed(2)} V`);
      expect(text).toContain(`drop ${(((12 - v) / 12) * 100).toFixed(1)} %`);
    }
    expect(text).not.toMatch(/£|\bcost\b|\bmargin\b|\bVAT\b/i);

    // each circuit starts a page of its own, in order, and the footer numbers every page of
    // the document (the pick list's pages and each circuit's) out of the same total
    const pages = await pdfPages(res.body as Buffer, { squeeze: true });
    expect(pages.length).toBeGreaterThanOrEqual(3);
    pages.forEach((page, i) => expect(page).toContain(`installer’s pack · no prices · page ${i + 1} of ${pages.length}`));
    const starts = pages.flatMap((page, i) => {
      const heading = /^Circuit (\d+)\. /.exec(page);
      return heading ? [{ page: i, circuit: Number(heading[1]) }] : [];
    });
    expect(starts.map((s) => s.circuit)).toEqual([1, 2]);
    expect(starts[0]!.page).toBeGreaterThan(0);
    expect(pages.filter((page) => /Circuit \d+\. /.test(page)).length).toBe(2);
  }, 30_000);
});
