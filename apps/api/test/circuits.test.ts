/**
 * Circuits per quote revision: validation, tenancy, roles, the optimistic lock, the engine's
 * check stored on save (and equal to what the browser computes), and the derived estimate lines.
 * Figures: IEC 60228 Table 3, class 5 plain 1.5 mm² = 13.3 ohm/km at 20 °C; the UK/IEC profile
 * works the drop at 70 °C, factor 1.1965 [derived]; a string's voltage is the sum of its forward
 * voltages (definition); 10 % cable slack rounded up to whole metres is the takeoff's default
 * (common practice).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CircuitListResponse,
  CircuitSaveResponse,
  CircuitSuggestionsResponse,
  QuoteDetailResponse,
  estimateQuoteInput,
  type CircuitDesign,
  type EstimateLine,
} from '@gloaming/contracts';
import { Product } from '@gloaming/db';
import { computeQuoteTotals, evaluateCircuit } from '@gloaming/engine';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';
import { createCircuitProducts, sixSpikeDesign, type CircuitProducts } from './circuit-fixtures';
import { loadQuoteForFirm, loadRevision, markRevisionSent } from '../src/modules/quotes/service';

let t: TestServer;
let estimator: Awaited<ReturnType<TestServer['signIn']>>;
let owner: Awaited<ReturnType<TestServer['signIn']>>;
let installer: Awaited<ReturnType<TestServer['signIn']>>;
let quoteA: string;
let quoteB: string;
let pA: CircuitProducts;
let pB: CircuitProducts;

beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
  quoteA = (await createQuoteFixture(t.orm.em.fork(), t.firmA, 'Ada Thornfield')).quote.id;
  quoteB = (await createQuoteFixture(t.orm.em.fork(), t.firmB, 'Bram Otterley')).quote.id;
  pA = await createCircuitProducts(t.orm.em.fork(), t.firmA);
  pB = await createCircuitProducts(t.orm.em.fork(), t.firmB);
  estimator = await t.signIn('estimator');
  owner = await t.signIn('owner');
  installer = await t.signIn('installer');
});
afterAll(async () => t.close());

const circuitsUrl = (quote: string, n = 1) => `/api/quotes/${quote}/revisions/${n}/circuits`;

async function quoteDetail(id = quoteA) {
  const res = await estimator.get(`/api/quotes/${id}`);
  expect(res.status).toBe(200);
  return QuoteDetailResponse.parse(res.body);
}

function derivedLines(detail: QuoteDetailResponse, circuitId: string): EstimateLine[] {
  return detail.revision.content.sections.flatMap((s) => s.lines).filter((l) => l.circuitId === circuitId);
}

/** The string's drop: I x loop, loop = 2 x length x 13.3 ohm/km x 1.1965 (IEC 60228 Table 3; 70 °C derived). */
const dropV = (currentA: number, routeM: number) => currentA * 2 * routeM * 0.0133 * 1.1965;

describe('circuits of a quote revision', () => {
  let circuitId: string;
  let circuitVersion: number;

  it('creates a circuit, stores the engine check, and the browser computes the same', async () => {
    const before = await quoteDetail();
    const res = await estimator
      .post(circuitsUrl(quoteA))
      .send({ area: 'Front path', name: 'Path string', design: sixSpikeDesign(pA) });
    expect(res.status).toBe(201);
    const saved = CircuitSaveResponse.parse(res.body);
    circuitId = saved.circuit.id;
    circuitVersion = saved.circuit.version;
    expect(saved.circuit.result.ok).toBe(true);
    const stored = saved.circuit.result.evaluation as {
      series: { stringForwardVoltageV: number; complianceVoltageV: number };
      blocks: { blocks: { fittings: number[] }[] };
    };
    expect(stored.series.stringForwardVoltageV).toBeCloseTo(6 * 3.0, 9); // sum of forward voltages
    expect(stored.series.complianceVoltageV).toBeCloseTo(18 + dropV(0.35, 18), 6);
    expect(stored.blocks.blocks.map((b) => b.fittings)).toEqual([
      [1, 2, 3, 4],
      [5, 6],
    ]);

    // The workbench's live check: the same function over what the list endpoint gives it.
    const list = CircuitListResponse.parse((await estimator.get(circuitsUrl(quoteA))).body);
    const c = list.circuits.find((x) => x.id === circuitId)!;
    const live = JSON.parse(JSON.stringify(evaluateCircuit(c.design, list.products, list.checkSettings))) as unknown;
    expect(live).toEqual(c.result.evaluation);
    // the revision moved on with its derived lines, so the grid's lock is the new version
    expect(saved.revision.version).toBeGreaterThan(before.revision.version);
    expect(list.revision.version).toBe(saved.revision.version);
  });

  it('derives the estimate lines from takeoff and labour, priced by the engine', async () => {
    const detail = await quoteDetail();
    const lines = derivedLines(detail, circuitId);
    const byProduct = new Map(lines.filter((l) => l.productId).map((l) => [l.productId, l]));
    expect(byProduct.get(pA.spike.id)?.quantityMilli).toBe(6000);
    expect(byProduct.get(pA.driver350.id)?.quantityMilli).toBe(1000);
    expect(byProduct.get(pA.block.id)?.quantityMilli).toBe(2000); // the two blocks of the schedule
    // 10 m + 8 m = 18 m, + 10 % slack = 19.8 m, up to whole metres = 20 m
    expect(byProduct.get(pA.cable.id)).toMatchObject({
      quantityMilli: 20_000,
      unit: 'm',
      unitPriceMinor: 160,
      unitCostMinor: 90,
    });
    expect(lines.some((l) => l.productId === null && l.description.startsWith('Labour'))).toBe(true);
    expect(detail.revision.content.sections.find((s) => s.name === 'Front path')).toBeDefined();
    const totals = computeQuoteTotals(estimateQuoteInput(detail.revision.content, detail.revision.settings));
    expect(detail.revision.totals?.totalMinor).toBe(totals.totalMinor);
    expect(detail.quote.valueMinor).toBe(totals.totalMinor);
  });

  it('keeps and flags a derived line the estimator overrode when the circuit changes', async () => {
    const detail = await quoteDetail();
    const spike = derivedLines(detail, circuitId).find((l) => l.productId === pA.spike.id)!;
    const content = {
      ...detail.revision.content,
      sections: detail.revision.content.sections.map((s) => ({
        ...s,
        lines: s.lines.map((l) =>
          l.id === spike.id ? { ...l, quantityMilli: 7000, unitPriceMinor: 3500, overridden: true } : l,
        ),
      })),
    };
    const put = await estimator.put(`/api/quotes/${quoteA}/revisions/1`).send({ version: detail.revision.version, content });
    expect(put.status).toBe(200);

    const res = await estimator.put(`${circuitsUrl(quoteA)}/${circuitId}`).send({
      version: circuitVersion,
      area: 'Front path',
      name: 'Path string',
      design: sixSpikeDesign(pA, { driverLead: { cableProductId: pA.cable.id, lengthM: 20, method: 'buried-trench' } }),
    });
    expect(res.status).toBe(200);
    const saved = CircuitSaveResponse.parse(res.body);
    circuitVersion = saved.circuit.version;
    const after = derivedLines(await quoteDetail(), circuitId);
    expect(after.find((l) => l.id === spike.id)).toMatchObject({ quantityMilli: 7000, unitPriceMinor: 3500, overridden: true });
    expect(after.filter((l) => l.productId === pA.spike.id)).toHaveLength(1);
    // 20 m + 8 m = 28 m, + 10 % = 30.8 m -> 31 m
    expect(after.find((l) => l.productId === pA.cable.id)?.quantityMilli).toBe(31_000);
    expect((saved.circuit.result.evaluation as { series: { complianceVoltageV: number } }).series.complianceVoltageV).toBeCloseTo(
      18 + dropV(0.35, 28),
      6,
    );
  });

  it('refuses a stale circuit version with 409 and changes nothing', async () => {
    const res = await estimator
      .put(`${circuitsUrl(quoteA)}/${circuitId}`)
      .send({ version: circuitVersion - 1, area: 'Somewhere else', name: '', design: sixSpikeDesign(pA) });
    expect(res.status).toBe(409);
    expect(res.headers['content-type']).toContain('application/problem+json');
    const list = CircuitListResponse.parse((await estimator.get(circuitsUrl(quoteA))).body);
    expect(list.circuits.find((c) => c.id === circuitId)?.area).toBe('Front path');
  });

  it('reports a wrong-current driver at the driver and keeps it out of the suggestions', async () => {
    const design = sixSpikeDesign(pA, { driverProductId: pA.driver700.id });
    const res = await owner.post(circuitsUrl(quoteA)).send({ area: 'Terrace', name: 'Wrong driver', design });
    expect(res.status).toBe(201);
    const saved = CircuitSaveResponse.parse(res.body);
    expect(saved.circuit.result.ok).toBe(false);
    expect(saved.circuit.result.findings.find((f) => f.code === 'driver-current-mismatch')).toMatchObject({
      severity: 'error',
      subject: 'driver',
    });

    const s = await estimator
      .post(`/api/quotes/${quoteA}/revisions/1/circuit-suggestions`)
      .send({ design: { ...design, driverProductId: null } });
    expect(s.status).toBe(200);
    const suggestions = CircuitSuggestionsResponse.parse(s.body);
    expect(suggestions.drivers.map((d) => d.productId)).toEqual([pA.driver350.id]);
    expect(suggestions.rejected.map((r) => r.productId)).toContain(pA.driver700.id);
    expect(suggestions.products.map((p) => p.id).sort()).toEqual([pA.driver350.id, pA.driver700.id].sort());

    const del = await estimator.delete(`${circuitsUrl(quoteA)}/${saved.circuit.id}`);
    expect(del.status).toBe(200);
  });

  it('answers bad input with 400 and the field paths', async () => {
    const design = sixSpikeDesign(pA);
    const bad = { ...design, fittings: design.fittings.map((f, i) => (i === 2 ? { ...f, driveCurrentA: -1 } : f)) };
    const res = await estimator.post(circuitsUrl(quoteA)).send({ area: '', design: bad });
    expect(res.status).toBe(400);
    const paths = (res.body.errors as { path: string }[]).map((e) => e.path);
    expect(paths).toContain('body.area');
    expect(paths).toContain('body.design.fittings.2.driveCurrentA');

    const wrongKind = await estimator.post(circuitsUrl(quoteA)).send({ area: 'Pond', design: { kind: 'three-phase' } });
    expect(wrongKind.status).toBe(400);
    expect((wrongKind.body.errors as { path: string }[])[0]?.path).toBe('body.design.kind');

    const dup = await estimator
      .post(circuitsUrl(quoteA))
      .send({ area: 'Pond', design: { ...design, fittings: [design.fittings[0], design.fittings[0]] } });
    expect(dup.status).toBe(400);
    expect((dup.body.errors as { path: string }[]).map((e) => e.path)).toContain('body.design.fittings.1.id');

    const huge = await estimator.post(circuitsUrl(quoteA)).send({
      area: 'Pond',
      design: { ...design, driverLead: { cableProductId: pA.cable.id, lengthM: 1e9, method: 'in-duct' } },
    });
    expect(huge.status).toBe(400);
    expect((huge.body.errors as { path: string }[]).map((e) => e.path)).toContain('body.design.driverLead.lengthM');
  });

  it("answers another firm's quote, circuit or product with 404", async () => {
    expect((await estimator.get(circuitsUrl(quoteB))).status).toBe(404);
    expect((await estimator.post(circuitsUrl(quoteB)).send({ area: 'Front path', design: sixSpikeDesign(pA) })).status).toBe(404);
    const foreignProduct = await estimator
      .post(circuitsUrl(quoteA))
      .send({ area: 'Front path', design: sixSpikeDesign(pA, { driverProductId: pB.driver350.id }) });
    expect(foreignProduct.status).toBe(404);
    expect(foreignProduct.body.detail).toContain('body.design.driverProductId');
    const theirs = await t.signIn('estimator', 'B');
    const created = await theirs.post(circuitsUrl(quoteB)).send({ area: 'Back lawn', design: sixSpikeDesign(pB) });
    expect(created.status).toBe(201);
    const theirId = (created.body as { circuit: { id: string } }).circuit.id;
    expect(
      (await estimator.put(`${circuitsUrl(quoteA)}/${theirId}`).send({ version: 1, area: 'x', design: sixSpikeDesign(pA) }))
        .status,
    ).toBe(404);
    expect((await estimator.delete(`${circuitsUrl(quoteA)}/${theirId}`)).status).toBe(404);
  });

  it('keeps installers out', async () => {
    expect((await installer.get(circuitsUrl(quoteA))).status).toBe(403);
    expect((await installer.post(circuitsUrl(quoteA)).send({ area: 'Front path', design: sixSpikeDesign(pA) })).status).toBe(403);
  });

  it('deletes a circuit with its derived lines, overridden ones too', async () => {
    const before = await quoteDetail();
    expect(derivedLines(before, circuitId).length).toBeGreaterThan(0);
    const res = await estimator.delete(`${circuitsUrl(quoteA)}/${circuitId}`);
    expect(res.status).toBe(200);
    const after = await quoteDetail();
    expect(derivedLines(after, circuitId)).toEqual([]);
    expect(after.revision.version).toBe((res.body as { revision: { version: number } }).revision.version);
    expect(after.revision.version).toBeGreaterThan(before.revision.version);
    expect(after.quote.valueMinor).toBe(
      computeQuoteTotals(estimateQuoteInput(after.revision.content, after.revision.settings)).totalMinor,
    );
  });

  it('checks a constant-voltage daisy chain on save: the voltage at each fitting', async () => {
    const em = t.orm.em.fork();
    const supply = em.create(Product, {
      organization: t.firmA.firm.id,
      kind: 'cv-supply',
      supplier: 'Owlbrook Trade',
      supplierCode: 'OW-P60',
      name: 'Moss 12 V 60 W supply',
      costMinor: 2000,
      listPriceMinor: 3500,
      spec: { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP67' },
    });
    const deck = em.create(Product, {
      organization: t.firmA.firm.id,
      kind: 'fitting',
      supplier: 'Owlbrook Trade',
      supplierCode: 'OW-DK6',
      name: 'Deck glow 6 W',
      costMinor: 900,
      listPriceMinor: 1800,
      spec: { driveMode: 'constant-voltage', nominalVoltageV: 12, powerW: 6, ipCode: 'IP67' },
    });
    await em.flush();
    const design: CircuitDesign = {
      kind: 'constant-voltage',
      supplyProductId: supply.id,
      supplyLocation: 'driver-outdoors',
      runs: [
        {
          id: 'deck',
          label: 'Deck edge',
          layout: 'daisy-chain',
          cableProductId: pA.cable.id,
          method: 'surface-clipped',
          feederLengthM: 0,
          fittings: ['a', 'b', 'c', 'd'].map((id) => ({
            id,
            productId: deck.id,
            label: '',
            location: 'under-decking' as const,
            spanLengthM: 5,
          })),
        },
      ],
      acknowledgements: [],
    };
    const res = await estimator.post(circuitsUrl(quoteA)).send({ area: 'Deck', name: 'Deck edge', design });
    expect(res.status).toBe(201);
    const saved = CircuitSaveResponse.parse(res.body);
    const cv = (saved.circuit.result.evaluation as { cv: { loadW: number; runs: { fittings: { voltageV: number }[] }[] } }).cv;
    // 6 W / 12 V = 0.5 A each; each 5 m span's loop 2 x 5 m x 13.3 ohm/km x 1.1965 (IEC 60228 Table 3, 70 °C derived);
    // a daisy-chain segment carries every load beyond it (REFERENCES, voltage drop, derived)
    const r = 2 * 5 * 0.0133 * 1.1965;
    const expected = [2, 1.5, 1, 0.5].reduce<number[]>((vs, amps) => [...vs, (vs.at(-1) ?? 12) - amps * r], []);
    cv.runs[0]!.fittings.forEach((f, i) => expect(f.voltageV).toBeCloseTo(expected[i]!, 6));
    expect(cv.loadW).toBeCloseTo(24, 9);
    const lines = derivedLines(await quoteDetail(), saved.circuit.id);
    // four 5 m spans = 20 m + 10 % = 22 m of cable; four fittings and the supply
    expect(lines.find((l) => l.productId === pA.cable.id)?.quantityMilli).toBe(22_000);
    expect(lines.find((l) => l.productId === deck.id)?.quantityMilli).toBe(4000);
    expect(lines.find((l) => l.productId === supply.id)?.quantityMilli).toBe(1000);
  });

  it('refuses to change the circuits of a sent revision', async () => {
    const em = t.orm.em.fork();
    const quote = await loadQuoteForFirm(em, t.firmA.firm.id, quoteA);
    await markRevisionSent(em, quote, await loadRevision(em, quote, 1), null);
    await em.flush();
    const design: CircuitDesign = sixSpikeDesign(pA);
    const res = await estimator.post(circuitsUrl(quoteA)).send({ area: 'Front path', design });
    expect(res.status).toBe(409);
  });

  it('gives a revised draft its own copies of the circuits, with the derived lines following them', async () => {
    const sentCircuits = CircuitListResponse.parse((await estimator.get(circuitsUrl(quoteA, 1))).body).circuits;
    expect(sentCircuits.length).toBeGreaterThan(0);
    const revised = await estimator.post(`/api/quotes/${quoteA}/revisions`).send({});
    expect(revised.status).toBeLessThan(300);
    const draft = CircuitListResponse.parse((await estimator.get(circuitsUrl(quoteA, 2))).body).circuits;
    expect(draft.map((c) => c.name)).toEqual(sentCircuits.map((c) => c.name));
    const oldIds = new Set(sentCircuits.map((c) => c.id));
    expect(draft.every((c) => !oldIds.has(c.id))).toBe(true);
    const detail = await quoteDetail();
    expect(detail.revision.number).toBe(2);
    const derived = detail.revision.content.sections.flatMap((s) => s.lines).filter((l) => l.circuitId);
    expect(derived.length).toBeGreaterThan(0);
    expect(derived.every((l) => draft.some((c) => c.id === l.circuitId))).toBe(true);

    // saving a copied circuit on the draft keeps its own derived lines, and the sent revision is untouched
    const first = draft[0]!;
    const before = derived.filter((l) => l.circuitId === first.id).length;
    const saved = await estimator
      .put(`${circuitsUrl(quoteA, 2)}/${first.id}`)
      .send({ area: first.area, name: `${first.name} (revised)`, design: first.design, version: first.version });
    expect(saved.status).toBe(200);
    expect(derivedLines(await quoteDetail(), first.id).length).toBe(before);
    const sentAgain = CircuitListResponse.parse((await estimator.get(circuitsUrl(quoteA, 1))).body).circuits;
    expect(sentAgain.map((c) => c.id)).toEqual(sentCircuits.map((c) => c.id));
  });
});
