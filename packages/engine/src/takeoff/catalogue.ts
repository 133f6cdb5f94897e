import { finding, type Finding } from '../findings';
import { PRODUCT_CATEGORIES, type TakeoffProduct } from './circuit';
import { shown } from './input-guards';

/**
 * Products by id, with findings for malformed or duplicated entries (first one wins). A
 * product without a name is shown by its id.
 */
export function indexCatalogue(products: readonly TakeoffProduct[]): { byId: Map<string, TakeoffProduct>; findings: Finding[] } {
  const byId = new Map<string, TakeoffProduct>();
  const findings: Finding[] = [];
  if (products === undefined) return { byId, findings };
  if (!Array.isArray(products)) {
    findings.push(finding('catalogue-invalid', 'error', 'The catalogue must be a list of products.'));
    return { byId, findings };
  }
  products.forEach((p, i) => {
    if (typeof p !== 'object' || p === null || typeof p.id !== 'string' || p.id === '') {
      findings.push(
        finding('catalogue-product-invalid', 'error', `Catalogue entry ${i + 1} has no product id.`, {
          subject: `catalogue:${i}`,
        }),
      );
      return;
    }
    if (!PRODUCT_CATEGORIES.includes(p.category)) {
      findings.push(
        finding('catalogue-product-invalid', 'error', `Product "${p.id}" has an unknown category "${shown(p.category)}".`, {
          subject: `product:${p.id}`,
        }),
      );
      return;
    }
    if (byId.has(p.id)) {
      findings.push(
        finding(
          'catalogue-duplicate-id',
          'warning',
          `Product id "${p.id}" appears twice in the catalogue; the first entry is used.`,
          {
            subject: `product:${p.id}`,
          },
        ),
      );
      return;
    }
    let product = p;
    if (typeof p.name !== 'string' || p.name === '') product = { ...product, name: p.id };
    if (p.fittingKind !== undefined && typeof p.fittingKind !== 'string') {
      findings.push(
        finding(
          'catalogue-product-invalid',
          'warning',
          `Product "${p.id}" has a fitting kind that is not text; it is treated as unspecified.`,
          {
            subject: `product:${p.id}`,
          },
        ),
      );
      product = { ...product };
      delete product.fittingKind;
    }
    for (const key of ['unitCostMinor', 'unitPriceMinor'] as const) {
      const v = p[key];
      if (v !== undefined && !(typeof v === 'number' && Number.isSafeInteger(v) && v >= 0)) {
        findings.push(
          finding(
            'catalogue-price-invalid',
            'warning',
            `Product "${p.id}" has a ${key === 'unitCostMinor' ? 'cost' : 'price'} that is not a whole number of minor units (${shown(v)}); it is treated as missing.`,
            {
              subject: `product:${p.id}`,
            },
          ),
        );
        product = { ...product };
        delete product[key];
      }
    }
    byId.set(p.id, product);
  });
  return { byId, findings };
}
