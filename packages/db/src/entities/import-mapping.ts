import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';

const p = defineEntity.properties;

/** The column mapping last used for a supplier's price list, offered again next time. */
export const ImportMapping = defineEntity({
  name: 'ImportMapping',
  tableName: 'import_mappings',
  uniques: [{ properties: ['organization', 'supplier'] }],
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    supplier: p.string(),
    /** Catalogue field -> CSV column header. */
    columns: p.json<Record<string, string>>(),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type ImportMapping = InferEntity<typeof ImportMapping>;
