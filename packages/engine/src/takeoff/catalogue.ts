import { finding, type Finding } from '../findings';
import { PRODUCT_CATEGORIES, type TakeoffProduct } from './circuit';

/** Products by id, with findings for malformed or duplicated entries (first one wins). */
export function indexCatalogue(products: readonly TakeoffProduct[]): { byId: Map<string, TakeoffProduct>; findings: Finding[] } {
  const byId = new Map<string, TakeoffProduct>();
  const findings: Finding[] = [];
  if (!Array.isArray(products)) {
    findings.push(finding('catalogue-invalid', 'error', 'The catalogue must be a list of products.'));
    return { byId, findings };
  }
  products.forEach((p, i) => {
    if (typeof p !== 'object' || p === null || typeof p.id !== 'string' || p.id === '') {
      findings.push(finding('catalogue-product-invalid', 'error', `Catalogue entry ${i + 1} has no product id.`, { subject: `catalogue:${i}` }));
      return;
    }
    if (!PRODUCT_CATEGORIES.includes(p.category)) {
      findings.push(
        finding('catalogue-product-invalid', 'error', `Product "${p.id}" has an unknown category "${String(p.category)}".`, {
          subject: `product:${p.id}`,
        }),
      );
      return;
    }
    if (byId.has(p.id)) {
      findings.push(
        finding('catalogue-duplicate-id', 'warning', `Product id "${p.id}" appears twice in the catalogue; the first entry is used.`, {
          subject: `product:${p.id}`,
        }),
      );
      return;
    }
    byId.set(p.id, p);
  });
  return { byId, findings };
}
