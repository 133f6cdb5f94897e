import type { EntityManager } from '@mikro-orm/core';
import { CircuitDesign, ProductInput } from '@gloaming/contracts';
import { evaluateCircuit, type DesignProduct } from '@gloaming/engine';
import { Circuit, Quote, QuoteRevision } from '../entities';
import { newId } from '../ids';
import type { DemoContext } from './demo-seeder';

/**
 * The approved demo job's circuits, so an installer signing in finds a pack to work from:
 * the nine pebble deck lights at the three entrances on one 350 mA driver (three five-way
 * gel junctions, one per entrance) and the six courtyard bollards on the 12 V supply, each on
 * its own spoke from a junction in the middle of the courtyard. The products are the ones the approved quote lists; the revision was sent
 * and approved, so its priced lines stay as the homeowner saw them.
 */
function designs(code: (supplierCode: string) => string): { area: string; name: string; design: CircuitDesign }[] {
  const entrances = ['Let 1', 'Let 2', 'Let 3'].flatMap((let_) => ['step', 'door', 'path'].map((spot) => ({ let_, spot })));
  return [
    {
      area: 'Entrances',
      name: 'Deck lights',
      design: CircuitDesign.parse({
        kind: 'constant-current',
        driverProductId: code('FTL-D350'),
        // under the porch roof of let 1, out of the rain
        driverLocation: 'sheltered-outdoor',
        fittings: entrances.map((e, i) => ({
          id: `dk${i + 1}`,
          productId: code('FTL-DK1'),
          label: `${e.let_} ${e.spot}`,
          // set into the deck boards and walked over
          location: 'in-ground-walk-over',
          driveCurrentA: 0.35,
        })),
        driverLead: { cableProductId: code('FTL-C2-15'), lengthM: 9, method: 'buried-trench' },
        links: [
          { cableProductId: code('FTL-C2-15'), lengthM: 12, method: 'buried-trench' },
          { cableProductId: code('FTL-C2-15'), lengthM: 11, method: 'buried-trench' },
        ],
        extensions: [],
        connectorBlockProductId: code('FTL-J5'),
        assignment: null,
        acknowledgements: [],
      }),
    },
    {
      area: 'Courtyard',
      name: 'Bollards',
      design: CircuitDesign.parse({
        kind: 'constant-voltage',
        supplyProductId: code('FTL-PS12-60'),
        // in the store, against the courtyard wall
        supplyLocation: 'sheltered-outdoor',
        runs: [
          {
            id: 'ring',
            label: 'Courtyard',
            layout: 'hub',
            cableProductId: code('FTL-C2-25R'),
            method: 'in-duct',
            feederLengthM: 6,
            fittings: ['Gate', 'Bench', 'Well', 'Arch', 'Store', 'Steps'].map((label, i) => ({
              id: `bl${i + 1}`,
              productId: code('FTL-BL12'),
              label,
              location: 'exposed-outdoor',
              spanLengthM: [5, 4, 6, 5, 4, 6][i]!,
            })),
          },
        ],
        acknowledgements: [],
      }),
    },
  ];
}

export async function demoInstallerJob(em: EntityManager, ctx: DemoContext): Promise<void> {
  const quote = await em.findOne(Quote, { organization: ctx.firm, status: 'approved' }, { orderBy: { number: 'asc' } });
  if (!quote) throw new Error('The demo has no approved quote to give circuits to.');
  const revision = await em.findOneOrFail(QuoteRevision, { quote, number: 1 });
  const code = (supplierCode: string) => {
    const p = ctx.products.get(supplierCode);
    if (!p) throw new Error(`The demo catalogue has no ${supplierCode}.`);
    return p.id;
  };
  const products: DesignProduct[] = [...ctx.products.values()].map(({ input, id }) => ({ ...ProductInput.parse(input), id }));
  designs(code).forEach(({ area, name, design }, position) => {
    const evaluation = evaluateCircuit(design, products, { profile: ctx.firm.locale === 'en-US' ? 'us-nec' : 'uk-iec' });
    em.create(Circuit, {
      id: newId(),
      organization: ctx.firm,
      revision,
      area,
      name,
      kind: design.kind,
      position,
      design,
      // as the api stores it: through JSON once
      result: {
        ok: evaluation.ok,
        blockingCount: evaluation.blockingCount,
        findings: evaluation.findings.map((f) => ({ ...f })),
        evaluation: JSON.parse(JSON.stringify(evaluation)) as Record<string, unknown>,
      },
    });
  });
}
