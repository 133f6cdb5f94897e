import { Circuit, Product, type Quote, newId, type EntityManager } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import { evaluateCircuit } from '@gloaming/engine';
import { presentProduct } from '../src/modules/catalogue/presenter';
import { circuitSettings, rederiveRevision, storedResult } from '../src/modules/circuits/service';
import { currentRevision, loadQuoteForFirm } from '../src/modules/quotes/service';
import { createCircuitProducts, sixSpikeDesign, type CircuitProducts } from './circuit-fixtures';
import { createQuoteFixture } from './quote-fixtures';

/** The firm's circuit products (the invented Owlbrook range), made once per firm. */
async function circuitProductsFor(em: EntityManager, f: FirmFixture): Promise<CircuitProducts> {
  const find = (supplierCode: string) => em.findOne(Product, { organization: f.firm.id, supplierCode });
  const spike = await find('OW-SP3');
  if (!spike) return createCircuitProducts(em, f);
  return {
    spike,
    driver350: (await find('OW-D350'))!,
    driver700: (await find('OW-D700'))!,
    cable: (await find('OW-F15'))!,
    block: (await find('OW-G6'))!,
  };
}

/**
 * An approved job: a quote whose revision 1 was sent and approved, with the six-spike path
 * string (two six-way blocks) as its circuit. `status` may be any quote status, to test the
 * ones that are not jobs.
 */
export async function createJobFixture(em: EntityManager, f: FirmFixture, status: Quote['status'] = 'approved') {
  const products = await circuitProductsFor(em, f);
  const { quote: created } = await createQuoteFixture(em, f, 'Hollis Wren');
  const quote = await loadQuoteForFirm(em, f.firm.id, created.id);
  const revision = await currentRevision(em, quote);
  const design = sixSpikeDesign(products);
  const views = Object.values(products).map(presentProduct);
  const circuit = em.create(Circuit, {
    id: newId(),
    organization: f.firm,
    revision,
    area: 'Front path',
    name: 'Path string',
    kind: design.kind,
    position: 0,
    design,
    result: storedResult(evaluateCircuit(design, views, circuitSettings(revision, f.firm))),
  });
  await rederiveRevision(em, revision, [circuit]);
  quote.title = 'Path lights';
  quote.status = status;
  revision.state = status === 'draft' ? 'draft' : 'sent';
  revision.sentAt = status === 'draft' ? null : new Date();
  await em.flush();
  return { quote, revision, circuit, products };
}
