import {
  CircuitParams,
  CircuitSuggestionsRequest,
  CreateCircuitRequest,
  RevisionParams,
  UpdateCircuitRequest,
  type CircuitDeleteResponse,
  type CircuitListResponse,
  type CircuitSaveResponse,
  type CircuitSuggestionsResponse,
} from '@gloaming/contracts';
import { Circuit, type Organization, Product, newId, readCircuits, type EntityManager } from '@gloaming/db';
import { evaluateCircuit, suggestForCircuit } from '@gloaming/engine';
import type { ModuleDeps } from '../../app-deps';
import { conflict } from '../../http/problem';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { arrayJsonText, sendJsonText, withJsonText } from '../../http/json-text';
import { validatedBody } from '../../http/validate';
import { recordAcceptances } from './acceptance-events';
import { presentProduct } from '../catalogue/presenter';
import { loadQuoteWithFirm, loadRevision, readQuoteForFirm, readRevisionOf } from '../quotes/service';
import {
  assertDraft,
  circuitDesign,
  circuitSettings,
  circuitViewJson,
  firmProducts,
  listCircuits,
  loadCircuit,
  presentCircuit,
  presentRevisionState,
  productRefs,
  productsForDesign,
  rederiveRevision,
  storedResult,
} from './service';

/** Circuits drive priced lines: owners and estimators (the installer's read-only view comes with the pack). */
const circuitStaff = allowRoles('owner', 'estimator');

async function scoped(em: EntityManager, organizationId: string, quoteId: string, revisionNumber: number) {
  const quote = await loadQuoteWithFirm(em, organizationId, quoteId);
  const revision = await loadRevision(em, quote, revisionNumber);
  return { quote, revision, firm: quote.organization as Organization };
}

export function circuitsRouter(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/:id/revisions/:revisionNumber/circuits',
      summary: 'The circuits of a quote revision with their stored checks and the products they name',
      policy: circuitStaff,
      schemas: { params: RevisionParams },
      handler: async ({ res, em, input, auth }) => {
        // plain rows: nothing here is changed, and the stored results pass through unparsed
        const quote = await readQuoteForFirm(em, auth.organizationId, input.params.id);
        const revision = await readRevisionOf(em, quote, input.params.revisionNumber);
        const circuits = await readCircuits(em, revision.id);
        const designs = circuits.map(circuitDesign); // parsed once, for the products and the views
        const checkSettings = circuitSettings(revision, quote.organization);
        const products = await firmProducts(
          em,
          auth.organizationId,
          designs.flatMap((d) => productRefs(d).map((r) => r.id)),
        );
        sendJsonText(
          res,
          withJsonText<CircuitListResponse, 'circuits'>(
            { products, revision: presentRevisionState(revision), profile: checkSettings.profile, checkSettings },
            'circuits',
            arrayJsonText(circuits.map((c, i) => circuitViewJson(c, designs[i]))),
          ),
        );
      },
    }),
    route({
      method: 'post',
      path: '/:id/revisions/:revisionNumber/circuits',
      summary: 'Add a circuit to a draft revision: checked with the engine, derived lines regenerated',
      policy: circuitStaff,
      schemas: { params: RevisionParams },
      handler: async ({ req, res, em, input, auth }) => {
        const { quote, revision, firm } = await scoped(em, auth.organizationId, input.params.id, input.params.revisionNumber);
        const { area, name, design } = validatedBody(req, CreateCircuitRequest);
        assertDraft(revision);
        const products = await productsForDesign(em, auth.organizationId, design);
        const existing = await listCircuits(em, revision);
        const circuit = em.create(Circuit, {
          id: newId(), // the derived lines name it before the flush
          organization: revision.organization,
          revision,
          area,
          name,
          kind: design.kind,
          position: existing.reduce((n, c) => Math.max(n, c.position + 1), 0),
          design,
          result: storedResult(evaluateCircuit(design, products, circuitSettings(revision, firm))),
        });
        await rederiveRevision(em, revision, [...existing, circuit]);
        recordAcceptances(em, quote, revision, circuit, null, design, { id: auth.user.id });
        await em.flush();
        const body: CircuitSaveResponse = {
          circuit: presentCircuit(circuit),
          products,
          revision: presentRevisionState(revision),
        };
        res.status(201).json(body);
      },
    }),
    route({
      method: 'put',
      path: '/:id/revisions/:revisionNumber/circuits/:circuitId',
      summary: 'Save a circuit (optimistic lock on version): rechecked, derived lines regenerated, overrides kept',
      policy: circuitStaff,
      schemas: { params: CircuitParams },
      handler: async ({ req, res, em, input, auth }) => {
        const { quote, revision, firm } = await scoped(em, auth.organizationId, input.params.id, input.params.revisionNumber);
        const circuit = await loadCircuit(em, revision, input.params.circuitId);
        const { version, area, name, position, design } = validatedBody(req, UpdateCircuitRequest);
        assertDraft(revision);
        if (circuit.version !== version)
          throw conflict(
            `Someone else saved this circuit after you opened it (your copy is version ${version}, the saved one is ${circuit.version}). Reload to see theirs.`,
          );
        if (design.kind !== circuit.kind)
          throw conflict('A circuit keeps its kind; add a new circuit of the other kind instead.');
        const products = await productsForDesign(em, auth.organizationId, design);
        const previous = circuitDesign(circuit);
        circuit.area = area;
        circuit.name = name;
        if (position !== undefined) circuit.position = position;
        circuit.design = design;
        circuit.result = storedResult(evaluateCircuit(design, products, circuitSettings(revision, firm)));
        await rederiveRevision(em, revision, await listCircuits(em, revision));
        recordAcceptances(em, quote, revision, circuit, previous, design, { id: auth.user.id });
        await em.flush();
        const body: CircuitSaveResponse = {
          circuit: presentCircuit(circuit),
          products,
          revision: presentRevisionState(revision),
        };
        res.json(body);
      },
    }),
    route({
      method: 'delete',
      path: '/:id/revisions/:revisionNumber/circuits/:circuitId',
      summary: 'Remove a circuit and its derived lines from a draft revision',
      policy: circuitStaff,
      schemas: { params: CircuitParams },
      handler: async ({ res, em, input, auth }) => {
        const { revision } = await scoped(em, auth.organizationId, input.params.id, input.params.revisionNumber);
        const circuit = await loadCircuit(em, revision, input.params.circuitId);
        assertDraft(revision);
        em.remove(circuit);
        await rederiveRevision(
          em,
          revision,
          (await listCircuits(em, revision)).filter((c) => c.id !== circuit.id),
        );
        await em.flush();
        const body: CircuitDeleteResponse = { revision: presentRevisionState(revision) };
        res.json(body);
      },
    }),
    route({
      method: 'post',
      path: '/:id/revisions/:revisionNumber/circuit-suggestions',
      summary: "Drivers from the firm's catalogue that fit a constant-current design, and a split when none does",
      policy: circuitStaff,
      schemas: { params: RevisionParams },
      handler: async ({ req, res, em, input, auth }) => {
        const { revision, firm } = await scoped(em, auth.organizationId, input.params.id, input.params.revisionNumber);
        const { design } = validatedBody(req, CircuitSuggestionsRequest);
        const products = await productsForDesign(em, auth.organizationId, design);
        const drivers = (
          await em.find(
            Product,
            { organization: auth.organizationId, kind: 'driver', active: true },
            { orderBy: { name: 'asc' } },
          )
        ).map(presentProduct);
        const s = suggestForCircuit(design, products, drivers, circuitSettings(revision, firm));
        const named = new Set([
          ...s.drivers.map((d) => d.productId),
          ...s.rejected.map((r) => r.productId),
          ...(s.split?.strings.map((x) => x.productId) ?? []),
        ]);
        const body: CircuitSuggestionsResponse = { ...s, products: drivers.filter((d) => named.has(d.id)) };
        res.json(body);
      },
    }),
  ]);
}
