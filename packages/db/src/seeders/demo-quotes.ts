import {
  estimateQuoteInput,
  type EstimateContent,
  type EstimateLine,
  type ProductInput,
  type RevisionSettings,
} from '@gloaming/contracts';
import { computeQuoteTotals, priceFromMarkup, type QuoteTotals } from '@gloaming/engine';

/**
 * The demo firm's quotes, written as areas of catalogue items by supplier code; the seeder
 * turns them into estimate documents priced as the grid prices a picked product (cost plus
 * the firm's markup) and totals them with the engine. `history` is how far each one got:
 * each step is an event, `daysAgo` before the seed.
 */
export interface DemoQuoteLine {
  code: string;
  quantity: number;
  note?: string;
  optional?: boolean;
  /** Pick-one group; `selected` says which member is in the total. */
  group?: string;
  selected?: boolean;
}

export type DemoQuoteStep = 'created' | 'sent' | 'viewed' | 'approved';

export interface DemoQuote {
  customer: string;
  site: number;
  estimator: string;
  title: string;
  introduction: string;
  areas: { name: string; lines: DemoQuoteLine[] }[];
  discountBp: number | null;
  history: { step: DemoQuoteStep; daysAgo: number }[];
}

export const DEMO_QUOTES: readonly DemoQuote[] = [
  {
    customer: 'ashdown',
    site: 0,
    estimator: 'tomasz@nightjar.example',
    title: 'Pond, path and specimen trees',
    introduction: 'Warm white throughout, as we discussed on site. The pond spots sit below the waterline on their own driver.',
    areas: [
      {
        name: 'Front path',
        lines: [
          { code: 'FTL-PL2', quantity: 6 },
          { code: 'FTL-D500', quantity: 1 },
          { code: 'FTL-C2-15', quantity: 38 },
          { code: 'FTL-J3', quantity: 6 },
          { code: 'LAB-FIT', quantity: 6 },
          { code: 'LAB-TRN', quantity: 22, note: 'Along the lawn edge; turf relaid.' },
        ],
      },
      {
        name: 'Pond',
        lines: [
          { code: 'FTL-UW2', quantity: 3 },
          { code: 'FTL-D350', quantity: 1 },
          { code: 'FTL-ENC', quantity: 1 },
          { code: 'FTL-C2-15', quantity: 15 },
          { code: 'LAB-FIT', quantity: 3 },
          { code: 'LAB-DRV', quantity: 1 },
        ],
      },
      {
        name: 'Specimen trees',
        lines: [
          { code: 'FTL-UP5', quantity: 3, group: 'Tree uplights', selected: true },
          {
            code: 'FTL-SP3',
            quantity: 3,
            group: 'Tree uplights',
            selected: false,
            note: 'Smaller spike spots, easier to move as the trees grow.',
          },
          { code: 'FTL-D700', quantity: 1 },
          { code: 'FTL-SPK', quantity: 3 },
          { code: 'FTL-C2-25', quantity: 26 },
          { code: 'LAB-FIT', quantity: 3 },
        ],
      },
    ],
    discountBp: null,
    history: [{ step: 'created', daysAgo: 2 }],
  },
  {
    customer: 'okafor',
    site: 0,
    estimator: 'priya@nightjar.example',
    title: 'Terrace steps and wall',
    introduction: 'Low-glare step lights on 24 V and a wash along the rear wall, with a dimmable option.',
    areas: [
      {
        name: 'Terrace steps',
        lines: [
          { code: 'FTL-ST24', quantity: 8 },
          { code: 'FTL-PS24-100', quantity: 1 },
          { code: 'FTL-C2-15', quantity: 30 },
          { code: 'FTL-JB4', quantity: 2 },
          { code: 'LAB-FIT', quantity: 8 },
          { code: 'LAB-DRV', quantity: 1 },
        ],
      },
      {
        name: 'Rear wall',
        lines: [
          { code: 'FTL-WL3', quantity: 4 },
          { code: 'FTL-D700', quantity: 1 },
          { code: 'FTL-C2-15', quantity: 24 },
          { code: 'FTL-J3', quantity: 4 },
          { code: 'LAB-FIT', quantity: 4 },
          { code: 'FTL-D700D', quantity: 1, optional: true, note: 'Dimmable driver instead, for a wall-plate dimmer indoors.' },
        ],
      },
    ],
    discountBp: 500,
    history: [
      { step: 'created', daysAgo: 9 },
      { step: 'sent', daysAgo: 8 },
    ],
  },
  {
    customer: 'whitlow',
    site: 0,
    estimator: 'tomasz@nightjar.example',
    title: 'Courtyard and bollards',
    introduction: 'Bollards on 12 V around the courtyard and deck lights at the entrances of the three lets.',
    areas: [
      {
        name: 'Courtyard',
        lines: [
          { code: 'FTL-BL12', quantity: 6 },
          { code: 'FTL-PS12-60', quantity: 1 },
          { code: 'FTL-C2-25R', quantity: 1 },
          { code: 'FTL-J5', quantity: 2 },
          { code: 'FTL-DUCT', quantity: 40 },
          { code: 'LAB-TRN', quantity: 40 },
          { code: 'LAB-FIT', quantity: 6 },
        ],
      },
      {
        name: 'Entrances',
        lines: [
          { code: 'FTL-DK1', quantity: 9 },
          { code: 'FTL-D350', quantity: 1 },
          { code: 'FTL-C2-15', quantity: 35 },
          { code: 'FTL-GLD', quantity: 1 },
          { code: 'LAB-FIT', quantity: 9 },
          { code: 'LAB-NIT', quantity: 1 },
        ],
      },
    ],
    discountBp: null,
    history: [
      { step: 'created', daysAgo: 21 },
      { step: 'sent', daysAgo: 20 },
      { step: 'viewed', daysAgo: 18 },
      { step: 'approved', daysAgo: 16 },
    ],
  },
];

/** A catalogue item as an estimate line: cost plus the firm's markup, as the grid prices a picked product. */
export function demoLine(id: string, product: ProductInput, line: DemoQuoteLine, settings: RevisionSettings): EstimateLine {
  const priced = product.costMinor > 0;
  return {
    id,
    productId: null, // set by the seeder once the product exists
    productCode: product.supplierCode,
    description: product.name,
    quantityMilli: Math.round(line.quantity * 1000),
    unit: (product.unit ?? 'each').slice(0, 16),
    unitCostMinor: product.costMinor,
    pricingMode: priced ? 'markup' : 'fixed',
    pricingBp: settings.markupPercentBp,
    unitPriceMinor: priced ? priceFromMarkup(product.costMinor, settings.markupPercentBp) : product.listPriceMinor,
    vatRateBp: settings.defaultVatRateBp,
    discount: null,
    optional: line.optional ?? false,
    alternativeGroup: line.group ?? null,
    selected: line.group ? (line.selected ?? false) : !(line.optional ?? false),
    note: line.note ?? '',
    circuitId: null,
    overridden: false,
  };
}

/** The estimate document of a demo quote; ids are derived from its number so every seed is the same. */
export function demoEstimate(
  number: number,
  quote: DemoQuote,
  products: ReadonlyMap<string, { input: ProductInput; id: string }>,
  settings: RevisionSettings,
): EstimateContent {
  return {
    sections: quote.areas.map((area, a) => ({
      id: `demo-q${number}-a${a + 1}`,
      name: area.name,
      lines: area.lines.map((l, i) => {
        const product = products.get(l.code);
        if (!product) throw new Error(`Demo quote ${number} names ${l.code}, which is not in the demo catalogue.`);
        return { ...demoLine(`demo-q${number}-a${a + 1}-l${i + 1}`, product.input, l, settings), productId: product.id };
      }),
    })),
    discount: quote.discountBp ? { kind: 'percent', bp: quote.discountBp } : null,
    deposit: settings.depositPercentBp > 0 ? { kind: 'percent', bp: settings.depositPercentBp } : null,
    introduction: quote.introduction,
  };
}

export function demoTotals(content: EstimateContent, settings: RevisionSettings): QuoteTotals {
  return computeQuoteTotals(estimateQuoteInput(content, settings));
}
