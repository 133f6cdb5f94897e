import { Circuit, Product, newId, type EntityManager } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import type { CcCircuitDesign } from '@gloaming/contracts';
import { presentProduct } from '../src/modules/catalogue/presenter';
import { circuitSettings, rederiveRevision, storedResult } from '../src/modules/circuits/service';
import { currentRevision, loadQuoteForFirm } from '../src/modules/quotes/service';
import { evaluateCircuit } from '@gloaming/engine';

/**
 * Invented catalogue products a circuit needs: a 350 mA spike fitting (3.0 V at 350 mA,
 * 3.2 V at 500 mA), 350 mA and 700 mA drivers, 1.5 mm² class 5 two-core flex, a six-way gel box.
 */
export async function createCircuitProducts(em: EntityManager, f: FirmFixture) {
  const make = (
    kind: Product['kind'],
    supplierCode: string,
    name: string,
    costMinor: number,
    listPriceMinor: number,
    spec: Record<string, unknown>,
    unit = 'each',
  ) =>
    em.create(Product, {
      organization: f.firm,
      kind,
      supplier: 'Owlbrook Trade',
      supplierCode,
      name,
      costMinor,
      listPriceMinor,
      unit,
      spec,
    });
  const spike = make('fitting', 'OW-SP3', 'Fernlight spike 3 W', 2100, 3900, {
    driveMode: 'constant-current',
    ratings: [
      { currentA: 0.35, forwardVoltageV: 3.0, lumens: 180 },
      { currentA: 0.5, forwardVoltageV: 3.2, lumens: 240 },
    ],
    ipCode: 'IP66',
  });
  const driver350 = make('driver', 'OW-D350', 'Lantern driver 350 mA 20 W', 2800, 5200, {
    currentA: 0.35,
    voltageWindowV: { minV: 6, maxV: 48 },
    maxPowerW: 20,
    efficiencyPct: 88,
    ipCode: 'IP66',
    dimming: 'none',
  });
  const driver700 = make('driver', 'OW-D700', 'Lantern driver 700 mA 30 W', 3000, 5600, {
    currentA: 0.7,
    voltageWindowV: { minV: 9, maxV: 42 },
    maxPowerW: 30,
    efficiencyPct: 88,
    ipCode: 'IP66',
    dimming: 'none',
  });
  const cable = make(
    'cable',
    'OW-F15',
    'Two-core flex 1.5 mm²',
    90,
    160,
    { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
    'm',
  );
  const block = make('connector-block', 'OW-G6', 'Six-way gel box', 600, 1100, {
    terminals: 6,
    entries: 6,
    conductorsPerTerminal: 2,
    ipCode: 'IP68',
  });
  await em.flush();
  return { spike, driver350, driver700, cable, block };
}

export type CircuitProducts = Awaited<ReturnType<typeof createCircuitProducts>>;

/** Six spikes at 350 mA over two six-way blocks on the 350 mA driver, 10 m lead and an 8 m link. */
export function sixSpikeDesign(p: CircuitProducts, over: Partial<CcCircuitDesign> = {}): CcCircuitDesign {
  return {
    kind: 'constant-current',
    driverProductId: p.driver350.id,
    driverLocation: 'driver-outdoors',
    fittings: Array.from({ length: 6 }, (_, i) => ({
      id: `f${i + 1}`,
      productId: p.spike.id,
      label: `Path light ${i + 1}`,
      location: 'exposed-outdoor' as const,
      driveCurrentA: 0.35,
    })),
    driverLead: { cableProductId: p.cable.id, lengthM: 10, method: 'buried-trench' },
    links: [{ cableProductId: p.cable.id, lengthM: 8, method: 'buried-trench' }],
    extensions: [],
    connectorBlockProductId: p.block.id,
    assignment: null,
    acknowledgements: [],
    ...over,
  };
}

/** A saved circuit on the quote's current revision, checked and derived as the api does. */
export async function createCircuitFixture(em: EntityManager, f: FirmFixture, quoteId: string) {
  const products = await createCircuitProducts(em, f);
  const quote = await loadQuoteForFirm(em, f.firm.id, quoteId);
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
  await em.flush();
  return { circuit, products, revision };
}
