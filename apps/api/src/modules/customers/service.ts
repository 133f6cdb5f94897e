import { MAX_SITES_PER_CUSTOMER, type CustomerInput, type CustomerListQuery, type CustomerUpdate, type SiteInput, type SiteUpdate } from '@gloaming/contracts';
import { Customer, containsIgnoringCase, Organization, Quote, Site, type EntityManager } from '@gloaming/db';
import type { z } from 'zod';
import { conflict, notFound } from '../../http/problem';

type Out<T extends z.ZodType> = z.output<T>;
type ListQuery = Out<typeof CustomerListQuery>;

/** A stale edit: the version the client saw is not the one stored. */
export function assertVersion(what: string, stored: number, sent: number): void {
  if (stored !== sent)
    throw conflict(`${what} was changed by someone else after you opened it. Reload to see their changes, then make yours again.`);
}

export async function findFirmCustomer(em: EntityManager, organizationId: string, id: string): Promise<Customer> {
  const customer = await em.findOne(Customer, { id, organization: organizationId });
  if (!customer) throw notFound('That customer');
  return customer;
}

export function sitesOf(em: EntityManager, customer: Customer): Promise<Site[]> {
  return em.find(Site, { customer }, { orderBy: { createdAt: 'asc', id: 'asc' } });
}

export async function listCustomers(em: EntityManager, organizationId: string, query: ListQuery) {
  const text = query.search;
  const siteMatches = text
    ? await em.find(
        Site,
        {
          organization: organizationId,
          $or: ['postcode', 'address_lines', 'label'].map((column) => containsIgnoringCase(em, column, text)),
        },
        { fields: ['customer'], limit: 1000 },
      )
    : [];
  const search = text
    ? {
        $or: [
          ...['name', 'email', 'phone'].map((column) => containsIgnoringCase(em, column, text)),
          { id: { $in: siteMatches.map((s) => s.customer.id) } },
        ],
      }
    : {};
  const contact = query.contact === 'with-email' ? { email: { $ne: null } } : query.contact === 'without-email' ? { email: null } : {};
  const [customers, total] = await em.findAndCount(Customer, { $and: [{ organization: organizationId }, search, contact] }, {
    orderBy: { [query.sort]: query.direction, id: 'asc' },
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const sites = customers.length
    ? await em.find(Site, { customer: { $in: customers.map((c) => c.id) } }, { orderBy: { createdAt: 'asc', id: 'asc' } })
    : [];
  const sitesByCustomer = new Map<string, Site[]>();
  for (const site of sites) sitesByCustomer.set(site.customer.id, [...(sitesByCustomer.get(site.customer.id) ?? []), site]);
  return { customers: customers.map((c) => ({ customer: c, sites: sitesByCustomer.get(c.id) ?? [] })), total };
}

export async function createCustomer(em: EntityManager, organizationId: string, input: Out<typeof CustomerInput>) {
  const organization = em.getReference(Organization, organizationId);
  const customer = em.create(Customer, {
    organization,
    name: input.name,
    email: input.email,
    phone: input.phone,
    notes: input.notes,
  });
  const sites = input.sites.map((site) => em.create(Site, { organization, customer, ...site }));
  await em.flush();
  return { customer, sites };
}

export async function updateCustomer(em: EntityManager, customer: Customer, input: Out<typeof CustomerUpdate>) {
  assertVersion(`${customer.name}`, customer.version, input.version);
  em.assign(customer, { name: input.name, email: input.email, phone: input.phone, notes: input.notes });
  await em.flush();
}

export async function addSite(em: EntityManager, customer: Customer, input: Out<typeof SiteInput>): Promise<Site> {
  const count = await em.count(Site, { customer });
  if (count >= MAX_SITES_PER_CUSTOMER) throw conflict(`A customer has at most ${MAX_SITES_PER_CUSTOMER} sites.`);
  const site = em.create(Site, { organization: customer.organization, customer, ...input });
  await em.flush();
  return site;
}

export async function findCustomerSite(em: EntityManager, customer: Customer, siteId: string): Promise<Site> {
  const site = await em.findOne(Site, { id: siteId, customer });
  if (!site) throw notFound('That site');
  return site;
}

export async function updateSite(em: EntityManager, site: Site, input: Out<typeof SiteUpdate>): Promise<void> {
  assertVersion('This site', site.version, input.version);
  const { version: _version, ...fields } = input;
  em.assign(site, fields);
  await em.flush();
}

export async function removeSite(em: EntityManager, customer: Customer, site: Site): Promise<void> {
  const count = await em.count(Site, { customer });
  if (count <= 1) throw conflict('A customer keeps at least one site. Add the new address first, then remove this one.');
  const quotes = await em.count(Quote, { site });
  if (quotes > 0) throw conflict(`This site has ${quotes === 1 ? 'a quote' : `${quotes} quotes`} against it, so it stays on the customer's record.`);
  em.remove(site);
  await em.flush();
}
