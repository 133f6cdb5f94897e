/**
 * Jobs as the installer sees them. Every shape here is built field by field (never by
 * spreading an entity or a product view), so a price, cost or margin cannot ride along:
 * the api tests read every job response for them.
 */
import {
  formatQuoteNumber,
  type InstallerProduct,
  type JobStatus,
  type JobSummary,
  type Product as ProductView,
} from '@gloaming/contracts';
import type { Quote } from '@gloaming/db';

export function presentInstallerProduct(p: ProductView): InstallerProduct {
  const base = { id: p.id, supplier: p.supplier, supplierCode: p.supplierCode, name: p.name, unit: p.unit };
  switch (p.kind) {
    case 'fitting':
      return { kind: p.kind, ...base, spec: p.spec };
    case 'driver':
      return { kind: p.kind, ...base, spec: p.spec };
    case 'cv-supply':
      return { kind: p.kind, ...base, spec: p.spec };
    case 'cable':
      return { kind: p.kind, ...base, spec: p.spec };
    case 'connector-block':
      return { kind: p.kind, ...base, spec: p.spec };
    case 'accessory':
      return { kind: p.kind, ...base, spec: p.spec };
    case 'labour':
      return { kind: p.kind, ...base, spec: p.spec };
  }
}

export function presentJobSummary(quote: Quote, revisionNumber: number, circuitCount: number): JobSummary {
  const site = quote.site ?? null;
  return {
    id: quote.id,
    reference: formatQuoteNumber(quote.number),
    title: quote.title,
    status: quote.status as JobStatus,
    customerName: quote.customer.name,
    siteLabel: site?.label ?? '',
    siteAddress: site ? site.addressLines.split('\n').filter((l) => l.trim() !== '') : [],
    postcode: site?.postcode ?? '',
    revisionNumber,
    circuitCount,
    updatedAt: quote.updatedAt.toISOString(),
  };
}
