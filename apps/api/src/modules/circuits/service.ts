/**
 * Circuits of a quote revision. Every save checks the design with the engine (the same
 * `evaluateCircuit` the workbench runs live), stores the result, and rewrites the revision's
 * derived estimate lines and totals in the same flush, so the revision's version moves with
 * it and the grid's optimistic lock stays true.
 */
import {
  checkSettingsOf,
  CircuitDesign as CircuitDesignSchema,
  CircuitResult,
  type CircuitCheckSettings,
  type CircuitDesign,
  type CircuitView,
  type Product as ProductView,
} from '@gloaming/contracts';
import { Circuit, Organization, readProducts, type CircuitRow, type QuoteRevision, type EntityManager } from '@gloaming/db';
import { evaluateCircuit, type CircuitEvaluation, type CircuitSettings, type CodeProfileId } from '@gloaming/engine';
import { storedJsonText, withJsonText, type JsonText } from '../../http/json-text';
import { conflict, notFound } from '../../http/problem';
import { presentProduct } from '../catalogue/presenter';
import { priceRevision, revisionContent, revisionSettings, storedTotals } from '../quotes/service';
import { regenerateDerivedLines } from './derived-lines';

/**
 * The code profile of a revision made before firms had design settings: US rules for a US
 * locale, else the UK/IEC profile (how those revisions were checked).
 */
export function profileFor(firm: Pick<Organization, 'locale'>): CodeProfileId {
  return firm.locale === 'en-US' ? 'us-nec' : 'uk-iec';
}

/**
 * What a revision's circuit checks go by: its own design settings (code profile, driver
 * headroom, voltage-drop limit, IP minimums), snapshotted when it was made, so a sent revision
 * keeps being checked as it was. The workbench gets the same object (CircuitListResponse).
 */
export function circuitSettings(revision: Pick<QuoteRevision, 'id' | 'settings'>, firm: Pick<Organization, 'locale'>): CircuitSettings & CircuitCheckSettings {
  return checkSettingsOf(revisionSettings(revision).design, profileFor(firm));
}

/** The stored design, parsed with the contract (stored JSON that no longer parses is a server fault). */
export function circuitDesign(circuit: Pick<Circuit, 'id' | 'design'>): CircuitDesign {
  const parsed = CircuitDesignSchema.safeParse(circuit.design);
  if (!parsed.success) throw new Error(`Circuit ${circuit.id} holds a design that does not match the contract.`);
  return parsed.data;
}

/** Every product id a design names, with the field it sits in (for a clear 404). */
export function productRefs(design: CircuitDesign): { id: string; path: string }[] {
  const refs: { id: string; path: string }[] = [];
  const add = (id: string | null, path: string) => {
    if (id !== null) refs.push({ id, path: `body.design.${path}` });
  };
  if (design.kind === 'constant-current') {
    add(design.driverProductId, 'driverProductId');
    design.fittings.forEach((f, i) => add(f.productId, `fittings.${i}.productId`));
    if (design.driverLead) add(design.driverLead.cableProductId, 'driverLead.cableProductId');
    design.links.forEach((l, i) => add(l.cableProductId, `links.${i}.cableProductId`));
    design.extensions.forEach((e, i) => add(e.cableProductId, `extensions.${i}.cableProductId`));
    add(design.connectorBlockProductId, 'connectorBlockProductId');
  } else {
    add(design.supplyProductId, 'supplyProductId');
    design.runs.forEach((r, i) => {
      add(r.cableProductId, `runs.${i}.cableProductId`);
      r.fittings.forEach((f, k) => add(f.productId, `runs.${i}.fittings.${k}.productId`));
    });
  }
  return refs;
}

/** The firm's products with these ids, as the contracts present them. */
export async function firmProducts(em: EntityManager, organizationId: string, ids: Iterable<string>): Promise<ProductView[]> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return [];
  // plain rows: products are only shown and fed to the engine here, never changed
  return (await readProducts(em, organizationId, unique)).map(presentProduct);
}

/** A design may only name this firm's products: another firm's (or no) product is a 404 naming the field. */
export async function productsForDesign(
  em: EntityManager,
  organizationId: string,
  design: CircuitDesign,
): Promise<ProductView[]> {
  const refs = productRefs(design);
  const products = await firmProducts(
    em,
    organizationId,
    refs.map((r) => r.id),
  );
  const known = new Set(products.map((p) => p.id));
  const missing = refs.find((r) => !known.has(r.id));
  if (missing) throw notFound(`The product named at ${missing.path}`);
  return products;
}

export function storedResult(evaluation: CircuitEvaluation): CircuitResult {
  // Through JSON once, so what is stored and what is returned are the same (no undefined, no NaN).
  const evaluationJson = JSON.parse(JSON.stringify(evaluation)) as CircuitResult['evaluation'];
  return {
    ok: evaluation.ok,
    blockingCount: evaluation.blockingCount,
    findings: evaluation.findings.map((f) => ({ ...f })),
    evaluation: evaluationJson,
  };
}

function circuitViewWithout(
  circuit: Omit<CircuitRow, 'resultJson'>,
  design: CircuitDesign = circuitDesign(circuit),
): Omit<CircuitView, 'result'> {
  return {
    id: circuit.id,
    revisionId: circuit.revision.id,
    area: circuit.area,
    name: circuit.name,
    kind: circuit.kind,
    position: circuit.position,
    design,
    version: circuit.version,
    createdAt: circuit.createdAt.toISOString(),
    updatedAt: circuit.updatedAt.toISOString(),
  };
}

export function presentCircuit(circuit: Circuit): CircuitView {
  return { ...circuitViewWithout(circuit), result: CircuitResult.parse(circuit.result) };
}

/**
 * The same view as JSON text from a plain row (readCircuits): the engine's stored result
 * passed through as stored (it is the output of `storedResult`, checked when it was saved).
 * The design is parsed, as the contract fills in what older designs lack; a caller that has
 * already parsed it passes it in.
 */
export function circuitViewJson(circuit: CircuitRow, design: CircuitDesign = circuitDesign(circuit)): JsonText<CircuitView> {
  return withJsonText<CircuitView, 'result'>(circuitViewWithout(circuit, design), 'result', storedJsonText(circuit.resultJson));
}

export function presentRevisionState(revision: Pick<QuoteRevision, 'id' | 'number' | 'state' | 'version'>) {
  return { id: revision.id, number: revision.number, state: revision.state, version: revision.version };
}

export async function listCircuits(em: EntityManager, revision: QuoteRevision): Promise<Circuit[]> {
  return em.find(Circuit, { revision: revision.id }, { orderBy: { position: 'asc', createdAt: 'asc' } });
}

export async function loadCircuit(em: EntityManager, revision: QuoteRevision, circuitId: string): Promise<Circuit> {
  const circuit = await em.findOne(Circuit, { id: circuitId, revision: revision.id, organization: revision.organization.id });
  if (!circuit) throw notFound('That circuit');
  return circuit;
}

export function assertDraft(revision: QuoteRevision): void {
  if (revision.state !== 'draft')
    throw conflict(
      `Revision ${revision.number} was sent and is frozen. Choose “Revise” on the quote to make a new draft, then change its circuits.`,
    );
}

/**
 * Rewrite the revision's derived lines from all its circuits and reprice it. Persisted, not
 * flushed: the caller flushes with the circuit change so both land together.
 */
export async function rederiveRevision(em: EntityManager, revision: QuoteRevision, circuits: readonly Circuit[]): Promise<void> {
  const settings = revisionSettings(revision);
  const designs = circuits.map((c) => ({ circuit: c, design: circuitDesign(c) }));
  const products = await firmProducts(
    em,
    revision.organization.id,
    designs.flatMap((d) => productRefs(d.design).map((r) => r.id)),
  );
  const firm = await em.findOneOrFail(Organization, revision.organization.id);
  const evalSettings = circuitSettings(revision, firm);
  const content = regenerateDerivedLines(
    revisionContent(revision),
    designs.map(({ circuit, design }) => ({
      id: circuit.id,
      area: circuit.area,
      name: circuit.name,
      design,
      evaluation: evaluateCircuit(design, products, evalSettings),
    })),
    products,
    settings,
  );
  const totals = storedTotals(priceRevision(content, settings));
  revision.content = content;
  revision.totals = totals;
  revision.quote.valueMinor = totals.totalMinor;
  revision.quote.updatedAt = new Date();
}
