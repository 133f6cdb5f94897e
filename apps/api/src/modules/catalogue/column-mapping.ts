import { IMPORT_FIELD_INFO, IMPORT_FIELDS, ProductKind, type ColumnMapping, type ImportField } from '@gloaming/contracts';
import { ImportMapping, Organization, type EntityManager } from '@gloaming/db';

/** Stored under this key beside the columns: the kind for rows without a kind column. */
const DEFAULT_KIND_KEY = 'defaultKind';

const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

/** Header spellings seen on price lists for the commercial fields (our own list). */
const SYNONYMS: Partial<Record<ImportField, string[]>> = {
  supplierCode: ['code', 'sku', 'partno', 'partnumber', 'productcode', 'itemcode', 'ref', 'reference', 'artikelnummer', 'catno'],
  name: ['name', 'product', 'productname', 'title', 'item'],
  description: ['description', 'desc', 'details'],
  unit: ['unit', 'uom', 'per'],
  cost: ['cost', 'trade', 'tradeprice', 'net', 'netprice', 'buy', 'buyprice', 'price'],
  listPrice: ['list', 'listprice', 'rrp', 'retail', 'sell', 'sellprice'],
  kind: ['kind', 'type', 'category'],
  ipCode: ['ip', 'iprating', 'ipcode'],
};

/** A first guess from the header names. */
export function guessMapping(headers: readonly string[]): ColumnMapping['columns'] {
  const columns: ColumnMapping['columns'] = {};
  const taken = new Set<string>();
  for (const field of IMPORT_FIELDS) {
    const names = [squash(field), squash(IMPORT_FIELD_INFO[field].label), ...(SYNONYMS[field] ?? [])];
    const header = headers.find((h) => !taken.has(h) && names.includes(squash(h)));
    if (header) {
      columns[field] = header;
      taken.add(header);
    }
  }
  return columns;
}

/** The mapping remembered for this supplier, limited to the columns this file has. */
export async function rememberedMapping(em: EntityManager, organizationId: string, supplier: string, headers: readonly string[]) {
  const stored = await em.findOne(ImportMapping, { organization: organizationId, supplier });
  if (!stored) return null;
  const columns: ColumnMapping['columns'] = {};
  for (const field of IMPORT_FIELDS) {
    const header = stored.columns[field];
    if (header && headers.includes(header)) columns[field] = header;
  }
  const kind = ProductKind.safeParse(stored.columns[DEFAULT_KIND_KEY]);
  return { columns, defaultKind: kind.success ? kind.data : ('fitting' as const) };
}

export async function rememberMapping(em: EntityManager, organizationId: string, supplier: string, mapping: ColumnMapping) {
  const columns: Record<string, string> = { [DEFAULT_KIND_KEY]: mapping.defaultKind };
  for (const [field, header] of Object.entries(mapping.columns)) if (header) columns[field] = header;
  const stored = await em.findOne(ImportMapping, { organization: organizationId, supplier });
  if (stored) stored.columns = columns;
  else em.create(ImportMapping, { organization: em.getReference(Organization, organizationId), supplier, columns });
  await em.flush();
}
