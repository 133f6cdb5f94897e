/**
 * The circuit checks go by the revision's design settings (code profile, driver headroom,
 * voltage-drop limit, IP minimums), snapshotted from the firm when the revision was made; the
 * circuit list hands the browser the same settings, so its live check equals the stored one.
 * Figures: the spikes are IP66; IEC 60529 IP66 does not include the immersion of IP67, and the
 * engine's default minimum for an exposed outdoor fitting is IP65 (common practice).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CircuitListResponse, CircuitSaveResponse, FirmSettingsResponse, QuoteDetailResponse } from '@gloaming/contracts';
import { evaluateCircuit } from '@gloaming/engine';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';
import { createCircuitProducts, sixSpikeDesign, type CircuitProducts } from './circuit-fixtures';

let t: TestServer;
let owner: Awaited<ReturnType<TestServer['signIn']>>;
let products: CircuitProducts;
let before: { id: string; customerId: string };

beforeAll(async () => {
  t = await startTestServer();
  const { quote } = await createQuoteFixture(t.orm.em.fork(), t.firmA, 'Ada Thornfield');
  before = { id: quote.id, customerId: quote.customer.id };
  products = await createCircuitProducts(t.orm.em.fork(), t.firmA);
  owner = await t.signIn('owner');
});
afterAll(async () => t.close());

const circuitsUrl = (quote: string) => `/api/quotes/${quote}/revisions/1/circuits`;
const ipShort = (evaluation: unknown) =>
  (evaluation as { findings: { code: string; subject?: string }[] }).findings.filter((f) => f.code === 'fitting-ip-short-of-location').map((f) => f.subject);

describe('circuit checks use the revision’s design settings', () => {
  it('a new quote is checked with the firm’s new IP minimums, headroom and profile; an older one keeps its own', async () => {
    const { settings, version } = FirmSettingsResponse.parse((await owner.get('/api/organization/settings').expect(200)).body);
    const design = { ...settings.design, ipMinimums: { 'exposed-outdoor': 'IP67' }, driverHeadroomBp: 2000, voltageDropLimitBp: 400, codeProfile: 'us-nec' as const };
    await owner.put('/api/organization/settings').send({ version, settings: { ...settings, design } }).expect(200);
    const created = QuoteDetailResponse.parse((await owner.post('/api/quotes').send({ customerId: before.customerId }).expect(201)).body);

    const fresh = CircuitListResponse.parse((await owner.get(circuitsUrl(created.quote.id)).expect(200)).body);
    expect(fresh.checkSettings).toEqual({ profile: 'us-nec', headroomMarginPct: 20, dropLimitPct: 4, ipOverrides: { 'exposed-outdoor': 'IP67' } });
    expect(fresh.profile).toBe('us-nec');
    const saved = CircuitSaveResponse.parse(
      (await owner.post(circuitsUrl(created.quote.id)).send({ area: 'Front path', name: 'Strict', design: sixSpikeDesign(products) }).expect(201)).body,
    );
    expect(ipShort(saved.circuit.result.evaluation)).toEqual(['fitting:1', 'fitting:2', 'fitting:3', 'fitting:4', 'fitting:5', 'fitting:6']);

    // the browser's live check with the settings the list gives equals the stored one
    const list = CircuitListResponse.parse((await owner.get(circuitsUrl(created.quote.id)).expect(200)).body);
    const c = list.circuits[0]!;
    expect(JSON.parse(JSON.stringify(evaluateCircuit(c.design, list.products, list.checkSettings)))).toEqual(c.result.evaluation);
    // and would not with the profile alone (the firm's IP minimum is what flags the spikes)
    expect(ipShort(evaluateCircuit(c.design, list.products, { profile: list.profile }))).toEqual([]);

    // the quote made before the change keeps the firm's old settings: UK/IEC, IP65 outdoors
    const old = CircuitListResponse.parse((await owner.get(circuitsUrl(before.id)).expect(200)).body);
    expect(old.checkSettings).toEqual({ profile: 'uk-iec', headroomMarginPct: 10, dropLimitPct: 5, ipOverrides: {} });
    const oldSaved = CircuitSaveResponse.parse(
      (await owner.post(circuitsUrl(before.id)).send({ area: 'Front path', name: 'As before', design: sixSpikeDesign(products) }).expect(201)).body,
    );
    expect(ipShort(oldSaved.circuit.result.evaluation)).toEqual([]);
  });
});
