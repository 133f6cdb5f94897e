import { CustomerInput, CustomerListQuery, CustomerSiteParams, CustomerUpdate, IdParams, SiteInput, SiteUpdate } from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { parseBody } from '../../http/parse-body';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { presentCustomer, presentCustomerSummary, presentSite } from './presenter';
import {
  addSite,
  createCustomer,
  findCustomerSite,
  findFirmCustomer,
  listCustomers,
  removeSite,
  sitesOf,
  updateCustomer,
  updateSite,
} from './service';

/** Customers and their sites: owners and estimators; installers never see the customer book. */
const customerStaff = allowRoles('owner', 'estimator');

export function customersRouter(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/customers', registry, [
    route({
      method: 'get',
      path: '/',
      summary: 'Customers: search, sort, filter and pages',
      policy: customerStaff,
      schemas: { query: CustomerListQuery },
      handler: async ({ res, em, input, auth }) => {
        const { customers, total } = await listCustomers(em, auth.organizationId, input.query);
        res.json({
          customers: customers.map((c) => presentCustomerSummary(c.customer, c.sites)),
          total,
          page: input.query.page,
          pageSize: input.query.pageSize,
        });
      },
    }),
    route({
      method: 'post',
      path: '/',
      summary: 'Add a customer with their sites',
      policy: customerStaff,
      schemas: { body: CustomerInput },
      handler: async ({ res, em, input, auth }) => {
        const { customer, sites } = await createCustomer(em, auth.organizationId, input.body);
        res.status(201).json({ customer: presentCustomer(customer, sites) });
      },
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One customer with their sites',
      policy: customerStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const customer = await findFirmCustomer(em, auth.organizationId, input.params.id);
        res.json({ customer: presentCustomer(customer, await sitesOf(em, customer)) });
      },
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: "Edit a customer's details (optimistic locking by version)",
      policy: customerStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const customer = await findFirmCustomer(em, auth.organizationId, input.params.id);
        await updateCustomer(em, customer, parseBody(req, CustomerUpdate));
        res.json({ customer: presentCustomer(customer, await sitesOf(em, customer)) });
      },
    }),
    route({
      method: 'post',
      path: '/:id/sites',
      summary: 'Add a site to a customer',
      policy: customerStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const customer = await findFirmCustomer(em, auth.organizationId, input.params.id);
        res.status(201).json({ site: presentSite(await addSite(em, customer, parseBody(req, SiteInput))) });
      },
    }),
    route({
      method: 'patch',
      path: '/:id/sites/:siteId',
      summary: "Edit a customer's site (optimistic locking by version)",
      policy: customerStaff,
      schemas: { params: CustomerSiteParams },
      handler: async ({ req, res, em, input, auth }) => {
        const customer = await findFirmCustomer(em, auth.organizationId, input.params.id);
        const site = await findCustomerSite(em, customer, input.params.siteId);
        await updateSite(em, site, parseBody(req, SiteUpdate));
        res.json({ site: presentSite(site) });
      },
    }),
    route({
      method: 'delete',
      path: '/:id/sites/:siteId',
      summary: "Remove a customer's site (never the last one)",
      policy: customerStaff,
      schemas: { params: CustomerSiteParams },
      handler: async ({ res, em, input, auth }) => {
        const customer = await findFirmCustomer(em, auth.organizationId, input.params.id);
        const site = await findCustomerSite(em, customer, input.params.siteId);
        await removeSite(em, customer, site);
        res.status(204).end();
      },
    }),
  ]);
}
