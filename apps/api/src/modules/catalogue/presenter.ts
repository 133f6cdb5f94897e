import { type PRODUCT_KINDS as CONTRACT_KINDS, Product as ProductView } from '@gloaming/contracts';
import { type PRODUCT_KINDS as DB_KINDS, type ProductRow } from '@gloaming/db';

// The database and the contracts list the same kinds; this fails to compile if they drift.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const kindsAgree: Same<(typeof CONTRACT_KINDS)[number], (typeof DB_KINDS)[number]> = true;
void kindsAgree;

/**
 * Entity -> contract shape. The spec was validated against its kind's schema when it was
 * written; parsing again here keeps the response honest if a stored row was ever edited by hand.
 */
/** A Product entity or the plain row of readProducts. */
export function presentProduct(product: ProductRow): ProductView {
  return ProductView.parse({
    id: product.id,
    kind: product.kind,
    supplier: product.supplier,
    supplierCode: product.supplierCode,
    name: product.name,
    description: product.description,
    unit: product.unit,
    costMinor: product.costMinor,
    listPriceMinor: product.listPriceMinor,
    active: product.active,
    spec: product.spec,
    createdAt: product.createdAt.toISOString(),
    updatedAt: product.updatedAt.toISOString(),
    version: product.version,
  });
}
