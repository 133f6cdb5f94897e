import type { ProductInputParsed, ProductListQuery } from '@gloaming/contracts';
import { containsIgnoringCase, Organization, Product, type EntityManager } from '@gloaming/db';
import type { z } from 'zod';
import { conflict, notFound } from '../../http/problem';
import { assertVersion } from '../customers/service';

type ListQuery = z.output<typeof ProductListQuery>;

export async function findFirmProduct(em: EntityManager, organizationId: string, id: string): Promise<Product> {
  const product = await em.findOne(Product, { id, organization: organizationId });
  if (!product) throw notFound('That product');
  return product;
}

export async function listProducts(em: EntityManager, organizationId: string, query: ListQuery) {
  const text = query.search;
  const search = text
    ? { $or: ['name', 'supplier_code', 'supplier', 'description'].map((column) => containsIgnoringCase(em, column, text)) }
    : {};
  const kind = query.kind ? { kind: query.kind } : {};
  const active = query.active === 'all' ? {} : { active: query.active === 'active' };
  return em.findAndCount(
    Product,
    { $and: [{ organization: organizationId }, kind, active, search] },
    { orderBy: { [query.sort]: query.direction, id: 'asc' }, limit: query.pageSize, offset: (query.page - 1) * query.pageSize },
  );
}

async function assertCodeFree(em: EntityManager, organizationId: string, input: ProductInputParsed, exceptId?: string) {
  const clash = await em.findOne(Product, { organization: organizationId, supplier: input.supplier, supplierCode: input.supplierCode });
  if (clash && clash.id !== exceptId)
    throw conflict(`${input.supplier} code ${input.supplierCode} is already in the catalogue as “${clash.name}”. Edit that product instead.`);
}

export async function createProduct(em: EntityManager, organizationId: string, input: ProductInputParsed): Promise<Product> {
  await assertCodeFree(em, organizationId, input);
  const product = em.create(Product, { organization: em.getReference(Organization, organizationId), ...input });
  await em.flush();
  return product;
}

export async function updateProduct(em: EntityManager, product: Product, input: ProductInputParsed & { version: number }) {
  assertVersion(`“${product.name}”`, product.version, input.version);
  await assertCodeFree(em, product.organization.id, input, product.id);
  const { version: _version, ...fields } = input;
  em.assign(product, fields);
  await em.flush();
}

export async function deactivateProduct(em: EntityManager, product: Product, version: number) {
  assertVersion(`“${product.name}”`, product.version, version);
  product.active = false;
  await em.flush();
}
