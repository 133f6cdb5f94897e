import type { EstimateContent, EstimateLine } from '@gloaming/contracts';
import { Customer, QuoteRevision, type EntityManager } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import { createQuoteFixture } from './quote-fixtures';

/** An invented garden: two areas, an unselected optional extra and a pick-one pair of drivers. */
export const CUSTOMER_NAME = 'Marguerite Okonedo-Vale';
/** A unit cost no sell price uses: it must never appear in the homeowner's PDF. */
export const TELLTALE_COST_MINOR = 1717;

let n = 0;
function line(p: Partial<EstimateLine> & Pick<EstimateLine, 'description' | 'quantityMilli' | 'unitPriceMinor'>): EstimateLine {
  return {
    id: `l${++n}`,
    productId: null,
    unit: 'each',
    unitCostMinor: TELLTALE_COST_MINOR,
    pricingMode: 'fixed',
    pricingBp: 0,
    vatRateBp: 2000,
    discount: null,
    optional: false,
    alternativeGroup: null,
    selected: true,
    note: '',
    circuitId: null,
    overridden: false,
    ...p,
  };
}

export function gardenEstimate(): EstimateContent {
  return {
    introduction: 'Warm, low-glare light for the front path and the rear terrace, on two extra-low-voltage circuits.',
    discount: null,
    deposit: { kind: 'percent', bp: 3000 },
    sections: [
      {
        id: 's1',
        name: 'Front path',
        lines: [
          line({ description: 'Bollard path light, 3 W, 2700 K, IP65', quantityMilli: 6000, unitPriceMinor: 6800 }),
          line({ description: 'Two-core outdoor cable, 1.5 mm²', quantityMilli: 24000, unit: 'm', unitPriceMinor: 240 }),
          line({
            description: 'Installation: trenching, fixing and connecting',
            quantityMilli: 6000,
            unit: 'h',
            unitPriceMinor: 4500,
          }),
        ],
      },
      {
        id: 's2',
        name: 'Rear terrace',
        lines: [
          line({ description: 'Recessed deck light, 1 W, 2700 K, IP67', quantityMilli: 10000, unitPriceMinor: 2950 }),
          line({
            description: 'Tree uplighter with ground spike, 5 W',
            quantityMilli: 2000,
            unitPriceMinor: 8400,
            optional: true,
            selected: false,
          }),
          line({
            description: 'Constant-current driver 350 mA, 20 W, IP67',
            quantityMilli: 1000,
            unitPriceMinor: 9600,
            alternativeGroup: 'Terrace driver',
            selected: true,
          }),
          line({
            description: 'Dimmable driver 350 mA, 20 W, IP67, with remote',
            quantityMilli: 1000,
            unitPriceMinor: 14800,
            alternativeGroup: 'Terrace driver',
            selected: false,
          }),
        ],
      },
    ],
  };
}

/**
 * The garden's total, worked by hand (not by the engine): included lines 6 x £68.00 + 24 m x
 * £2.40 + 6 h x £45.00 + 10 x £29.50 + 1 x £96.00 = £1,126.60 net; VAT at the UK standard
 * rate of 20 % (gov.uk) is £225.32; total £1,351.92. Deposit 30 % = £405.576, half-up £405.58.
 */
export const GARDEN_TOTAL_TEXT = '£1,351.92';
export const GARDEN_DEPOSIT_TEXT = '£405.58';

/** A quote for the invented customer with the garden estimate in its draft revision. */
export async function createGardenQuote(
  em: EntityManager,
  firm: FirmFixture,
  opts: { email?: string | null; content?: EstimateContent } = {},
) {
  const fixture = await createQuoteFixture(em, firm, CUSTOMER_NAME);
  const customer = await em.findOneOrFail(Customer, fixture.customer.id);
  customer.email = opts.email === undefined ? 'marguerite@home.example' : opts.email;
  const revision = await em.findOneOrFail(QuoteRevision, { quote: fixture.quote.id, number: 1 });
  revision.content = { ...(opts.content ?? gardenEstimate()) };
  await em.flush();
  return { ...fixture, customer, revision };
}
