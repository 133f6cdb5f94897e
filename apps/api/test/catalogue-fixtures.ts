import { Customer, ImportJob, Product, Site, type EntityManager } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import { LocalFileStorage, newStorageKey } from '../src/storage/storage';

/** A customer with one site, a product, and an uploaded (not yet run) price list, for one firm. */
export async function createCatalogueFixture(em: EntityManager, f: FirmFixture, dataDir: string) {
  const customer = em.create(Customer, { organization: f.firm, name: 'Imogen Ashby', email: 'imogen@ashby.example', phone: null });
  const site = em.create(Site, { organization: f.firm, customer, label: 'Home', addressLines: '9 Quillet Lane\nWestmere', postcode: 'WM2 9QL' });
  const product = em.create(Product, {
    organization: f.firm,
    kind: 'accessory',
    supplier: 'Fixture Supplies',
    supplierCode: 'FX-1',
    name: 'Gel-filled crimp (pack of 10)',
    costMinor: 250,
    listPriceMinor: 450,
    spec: {},
  });
  const storageKey = newStorageKey(`org/${f.firm.id}/price-lists`, 'csv');
  await new LocalFileStorage(dataDir).put(storageKey, Buffer.from('Code,Name,Cost\nFX-2,Cable tie,0.10\n'));
  const job = em.create(ImportJob, {
    organization: f.firm,
    user: f.users.estimator,
    supplier: 'Fixture Supplies',
    fileName: 'fixture.csv',
    storageKey,
    state: 'uploaded',
    totalRows: 1,
  });
  await em.flush();
  return { customer, site, product, job };
}
