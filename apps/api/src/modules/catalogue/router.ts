import { DeactivateProductRequest, IdParams, ProductInput, ProductListQuery, ProductUpdate } from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { parseBody } from '../../http/parse-body';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { presentProduct } from './presenter';
import { createProduct, deactivateProduct, findFirmProduct, listProducts, updateProduct } from './service';

/** Estimators and owners keep the catalogue; installers never see prices. */
export const catalogueStaff = allowRoles('owner', 'estimator');

export function productsRouter(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/products', registry, [
    route({
      method: 'get',
      path: '/',
      summary: 'Catalogue products: kind, search, active filters and pages',
      policy: catalogueStaff,
      schemas: { query: ProductListQuery },
      handler: async ({ res, em, input, auth }) => {
        const [products, total] = await listProducts(em, auth.organizationId, input.query);
        res.json({ products: products.map(presentProduct), total, page: input.query.page, pageSize: input.query.pageSize });
      },
    }),
    route({
      method: 'post',
      path: '/',
      summary: 'Add a product to the catalogue',
      policy: catalogueStaff,
      schemas: { body: ProductInput },
      handler: async ({ res, em, input, auth }) => {
        res.status(201).json({ product: presentProduct(await createProduct(em, auth.organizationId, input.body)) });
      },
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One catalogue product',
      policy: catalogueStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        res.json({ product: presentProduct(await findFirmProduct(em, auth.organizationId, input.params.id)) });
      },
    }),
    route({
      method: 'put',
      path: '/:id',
      summary: 'Edit a product (optimistic locking by version)',
      policy: catalogueStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const product = await findFirmProduct(em, auth.organizationId, input.params.id);
        await updateProduct(em, product, parseBody(req, ProductUpdate));
        res.json({ product: presentProduct(product) });
      },
    }),
    route({
      method: 'post',
      path: '/:id/deactivate',
      summary: 'Take a product out of use (kept for old quotes)',
      policy: catalogueStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const product = await findFirmProduct(em, auth.organizationId, input.params.id);
        await deactivateProduct(em, product, parseBody(req, DeactivateProductRequest).version);
        res.json({ product: presentProduct(product) });
      },
    }),
  ]);
}
