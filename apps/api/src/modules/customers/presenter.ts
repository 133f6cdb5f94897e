import type { Customer as CustomerView, CustomerSite, CustomerSummary } from '@gloaming/contracts';
import type { Customer, Site } from '@gloaming/db';

export function presentSite(site: Site): CustomerSite {
  return {
    id: site.id,
    label: site.label,
    addressLines: site.addressLines,
    postcode: site.postcode,
    accessNotes: site.accessNotes,
    version: site.version,
  };
}

export function presentCustomer(customer: Customer, sites: readonly Site[]): CustomerView {
  return {
    id: customer.id,
    name: customer.name,
    email: customer.email ?? null,
    phone: customer.phone ?? null,
    notes: customer.notes,
    sites: sites.map(presentSite),
    createdAt: customer.createdAt.toISOString(),
    updatedAt: customer.updatedAt.toISOString(),
    version: customer.version,
  };
}

export function presentCustomerSummary(customer: Customer, sites: readonly Site[]): CustomerSummary {
  return {
    id: customer.id,
    name: customer.name,
    email: customer.email ?? null,
    phone: customer.phone ?? null,
    siteCount: sites.length,
    firstPostcode: sites[0]?.postcode ?? '',
    updatedAt: customer.updatedAt.toISOString(),
  };
}
