/**
 * A circuit's error stops the quote going out until it is fixed or accepted with a reason;
 * accepting and withdrawing are events in the quote's history (not status changes).
 * The errors come from the engine: 700 mA through a fitting rated 350 mA is over its rating
 * (common practice: the rating is the maximum), and a driver whose current is not the one the
 * fittings are set to is a mismatch.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CircuitSaveResponse, Problem, QuoteEventsResponse, SendPreviewResponse } from '@gloaming/contracts';
import { QuoteEvent } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote } from './estimate-fixture';
import { createCircuitProducts, sixSpikeDesign, type CircuitProducts } from './circuit-fixtures';

let t: TestServer;
let p: CircuitProducts;
beforeAll(async () => {
  t = await startTestServer({ GLOAMING_SIGNIN_MAX_PER_IP: '10000', GLOAMING_SIGNIN_MAX_PER_ACCOUNT: '10000' });
  p = await createCircuitProducts(t.orm.em.fork(), t.firmA);
});
afterAll(async () => t.close());

describe('sending with circuit errors', () => {
  it('refuses while an error is unaccepted, records each acceptance and withdrawal, then sends', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email: 'blocked-send@home.example' });
    const agent = await t.signIn('estimator');
    const sendUrl = `/api/quotes/${g.quote.id}/revisions/${g.revision.id}`;
    const circuitsUrl = `/api/quotes/${g.quote.id}/revisions/1/circuits`;

    // the 700 mA driver on fittings set to (and rated for) 350 mA
    const created = await agent
      .post(circuitsUrl)
      .send({ area: 'Front path', name: 'Path string', design: sixSpikeDesign(p, { driverProductId: p.driver700.id }) });
    expect(created.status).toBe(201);
    let circuit = CircuitSaveResponse.parse(created.body).circuit;
    const errors = circuit.result.findings.filter((f) => f.severity === 'error');
    expect(errors.map((f) => f.code)).toContain('driver-current-mismatch');
    expect(errors.filter((f) => f.code === 'current-above-rating')).toHaveLength(6);

    const refused = await agent.post(`${sendUrl}/send`).send({});
    expect(refused.status).toBe(422);
    expect(refused.headers['content-type']).toContain('application/problem+json');
    const problem = Problem.parse(refused.body);
    expect(problem.type).toBe('/problems/quote-not-ready');
    expect(problem.detail).toContain(`${errors.length} circuit errors not accepted yet`);
    expect(problem.blockers).toHaveLength(errors.length);
    const mismatch = problem.blockers!.find((b) => b.circuit?.findingCode === 'driver-current-mismatch');
    expect(mismatch).toMatchObject({
      code: 'circuit-error',
      pointer: `/api/quotes/${g.quote.id}/revisions/1/circuits/${circuit.id}`,
      circuit: { id: circuit.id, name: 'Path string', area: 'Front path', subject: 'driver' },
    });
    expect(mismatch!.message).toContain('Circuit “Front path: Path string”');
    expect(mismatch!.message).toContain('This driver gives 700 mA');
    expect(problem.errors!.map((e) => e.path)).toContain(`circuits.${circuit.id}.driver.driver-current-mismatch`);
    // the body's own "acknowledged" codes do not wave circuit errors through: only a reason on the circuit does
    expect(
      (await agent.post(`${sendUrl}/send`).send({ acknowledged: ['driver-current-mismatch', 'current-above-rating'] })).status,
    ).toBe(422);
    const preview = SendPreviewResponse.parse((await agent.get(`${sendUrl}/send-preview`)).body);
    expect(preview.blockers.map((b) => b.circuit?.findingCode).sort()).toEqual(errors.map((f) => f.code).sort());

    // accept every error with a reason
    const acks = errors.map((f) => ({
      code: f.code,
      subject: f.subject ?? null,
      reason: 'Customer supplies a 700 mA set; fittings swapped on site',
    }));
    const accepted = await agent.put(`${circuitsUrl}/${circuit.id}`).send({
      version: circuit.version,
      area: circuit.area,
      name: circuit.name,
      design: { ...circuit.design, acknowledgements: acks },
    });
    expect(accepted.status).toBe(200);
    circuit = CircuitSaveResponse.parse(accepted.body).circuit;
    expect(circuit.result.blockingCount).toBe(0);

    const history = QuoteEventsResponse.parse((await agent.get(`/api/quotes/${g.quote.id}/events`)).body).events;
    const acceptedEvents = history.filter((e) => e.type === 'finding-accepted');
    expect(acceptedEvents).toHaveLength(errors.length);
    expect(acceptedEvents.find((e) => e.data.code === 'driver-current-mismatch')).toMatchObject({
      actor: { id: t.firmA.users.estimator.id },
      revisionNumber: 1,
      data: {
        circuitId: circuit.id,
        circuitName: 'Path string',
        area: 'Front path',
        subject: 'driver',
        reason: 'Customer supplies a 700 mA set; fittings swapped on site',
      },
    });
    const detail = await agent.get(`/api/quotes/${g.quote.id}`);
    expect(detail.body.quote.status).toBe('draft'); // accepting is not a status step

    // withdraw one: it blocks again, and the withdrawal is in the history
    const withdrawn = await agent.put(`${circuitsUrl}/${circuit.id}`).send({
      version: circuit.version,
      area: circuit.area,
      name: circuit.name,
      design: { ...circuit.design, acknowledgements: acks.filter((a) => a.code !== 'driver-current-mismatch') },
    });
    expect(withdrawn.status).toBe(200);
    circuit = CircuitSaveResponse.parse(withdrawn.body).circuit;
    const again = await agent.post(`${sendUrl}/send`).send({});
    expect(again.status).toBe(422);
    expect(Problem.parse(again.body).blockers!.map((b) => b.circuit?.findingCode)).toEqual(['driver-current-mismatch']);
    const em = t.orm.em.fork();
    const types = (await em.find(QuoteEvent, { quote: g.quote.id }, { orderBy: { at: 'asc' } })).map((e) => e.type);
    expect(types.filter((x) => x === 'finding-withdrawn')).toHaveLength(1);

    // a saved design with no change to its acceptances writes no event
    const countBefore = await em.count(QuoteEvent, { quote: g.quote.id });
    const renamed = await agent.put(`${circuitsUrl}/${circuit.id}`).send({
      version: circuit.version,
      area: circuit.area,
      name: 'Path string A',
      design: circuit.design,
    });
    expect(renamed.status).toBe(200);
    circuit = CircuitSaveResponse.parse(renamed.body).circuit;
    expect(await t.orm.em.fork().count(QuoteEvent, { quote: g.quote.id })).toBe(countBefore);

    // fixing it (the right driver) clears it without any acceptance
    const fixed = await agent.put(`${circuitsUrl}/${circuit.id}`).send({
      version: circuit.version,
      area: circuit.area,
      name: circuit.name,
      design: { ...circuit.design, driverProductId: p.driver350.id, acknowledgements: [] },
    });
    expect(fixed.status).toBe(200);
    expect(CircuitSaveResponse.parse(fixed.body).circuit.result.blockingCount).toBe(0);
    const sent = await agent.post(`${sendUrl}/send`).send({});
    expect(sent.status).toBe(201);
    const finalTypes = (await t.orm.em.fork().find(QuoteEvent, { quote: g.quote.id }, { orderBy: { at: 'asc' } })).map(
      (e) => e.type,
    );
    expect(finalTypes.filter((x) => x === 'finding-withdrawn')).toHaveLength(errors.length); // all taken back when fixed
    expect(finalTypes.at(-1)).toBe('sent');
  });

  it('sends once the errors are accepted', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email: 'accepted-send@home.example' });
    const agent = await t.signIn('owner');
    const design = sixSpikeDesign(p, { driverProductId: p.driver700.id });
    const first = await agent.post(`/api/quotes/${g.quote.id}/revisions/1/circuits`).send({ area: 'Terrace', name: '', design });
    const circuit = CircuitSaveResponse.parse(first.body).circuit;
    const acks = circuit.result.findings
      .filter((f) => f.severity === 'error')
      .map((f) => ({ code: f.code, subject: f.subject ?? null, reason: 'Agreed with the owner' }));
    const saved = await agent
      .put(`/api/quotes/${g.quote.id}/revisions/1/circuits/${circuit.id}`)
      .send({ version: circuit.version, area: 'Terrace', name: '', design: { ...design, acknowledgements: acks } });
    expect(saved.status).toBe(200);
    const sent = await agent.post(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/send`).send({});
    expect(sent.status).toBe(201);
    const events = QuoteEventsResponse.parse((await agent.get(`/api/quotes/${g.quote.id}/events`)).body).events;
    expect(events.filter((e) => e.type === 'finding-accepted').every((e) => e.actor?.id === t.firmA.users.owner.id)).toBe(true);
  });
});
