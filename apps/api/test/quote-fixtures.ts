import { Customer, Site, type EntityManager } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import { createQuote } from '../src/modules/quotes/service';

/** A customer with one site, and a fresh quote for them drafted by the firm's estimator. */
export async function createQuoteFixture(em: EntityManager, f: FirmFixture, customerName = 'Ada Thornfield') {
  const customer = em.create(Customer, { organization: f.firm, name: customerName, email: null, phone: null });
  const site = em.create(Site, { organization: f.firm, customer, label: 'Home', addressLines: '4 Larch Row\nEastwick', postcode: 'EW1 4LR' });
  await em.flush();
  const quote = await createQuote(em, f.firm.id, f.users.estimator.id, { customerId: customer.id, siteId: site.id });
  return { customer, site, quote };
}
