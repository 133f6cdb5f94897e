/**
 * Material lines as estimate lines for money: the bridge from takeoff to the quote grid.
 */
import { finding, type Finding } from '../findings';
import type { QuoteLineInput } from '../money/quote-totals';
import type { MaterialLine } from './takeoff';

export interface MaterialQuoteOptions {
  /** VAT rate for every material line, basis points (e.g. 2000). */
  vatRateBp: number;
  /** Prefix for line ids (default `material:`); the product id follows. */
  idPrefix?: string;
}

/** One quote line per material line; a product without a sell price is priced at zero and reported. */
export function materialQuoteLines(
  lines: readonly MaterialLine[],
  options: MaterialQuoteOptions,
): { lines: QuoteLineInput[]; findings: Finding[] } {
  const prefix = options.idPrefix ?? 'material:';
  const findings: Finding[] = [];
  const out = lines.map((l): QuoteLineInput => {
    if (l.unitPriceMinor === null) {
      findings.push(
        finding(
          'price-missing',
          'warning',
          `"${l.name}" has no sell price in the catalogue; it is on the estimate at zero until one is set.`,
          {
            subject: `product:${l.productId}`,
          },
        ),
      );
    }
    const q: QuoteLineInput = {
      id: `${prefix}${l.productId}`,
      quantityMilli: l.quantityMilli,
      unitPriceMinor: l.unitPriceMinor ?? 0,
      vatRateBp: options.vatRateBp,
    };
    if (l.unitCostMinor !== null) q.unitCostMinor = l.unitCostMinor;
    return q;
  });
  return { lines: out, findings };
}
