import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';

const p = defineEntity.properties;

export const PRODUCT_KINDS = ['fitting', 'driver', 'cv-supply', 'cable', 'connector-block', 'accessory', 'labour'] as const;
export type ProductKind = (typeof PRODUCT_KINDS)[number];

/**
 * A catalogue item of the firm. Kind-specific electrical data (forward voltages, windows,
 * cross-sections, terminals...) lives in `spec`, validated by the contracts' schema for the
 * kind. Matched on import by (supplier, supplierCode).
 */
export const Product = defineEntity({
  name: 'Product',
  tableName: 'products',
  uniques: [{ properties: ['organization', 'supplier', 'supplierCode'] }],
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    kind: p.string().$type<ProductKind>().index(),
    supplier: p.string(),
    supplierCode: p.string(),
    name: p.string(),
    description: p.text().default(''),
    unit: p.string().default('each'),
    costMinor: p.integer().default(0),
    listPriceMinor: p.integer().default(0),
    active: p.boolean().onCreate(() => true),
    spec: p.json<Record<string, unknown>>().onCreate(() => ({})),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Product = InferEntity<typeof Product>;
