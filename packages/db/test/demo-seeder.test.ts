import { afterEach, describe, expect, it } from 'vitest';
import {
  EstimateContent,
  ProductInput,
  RevisionSettings,
  estimateQuoteInput,
  PRODUCT_KINDS as CONTRACT_KINDS,
} from '@gloaming/contracts';
import { computeQuoteTotals } from '@gloaming/engine';
import { Customer, PRODUCT_KINDS, Product, Quote, QuoteEvent, QuoteRevision, Site, contentHash, seedDemoIfEmpty } from '../src';
import { DEMO_PRODUCTS } from '../src/seeders/demo-catalogue';
import { DEMO_CUSTOMERS } from '../src/seeders/demo-customers';
import { openTestDatabase } from '../src/testing';

const closers: (() => Promise<void>)[] = [];
afterEach(async () => {
  while (closers.length) await closers.pop()!();
});

async function seeded() {
  const db = await openTestDatabase();
  closers.push(db.close);
  expect(await seedDemoIfEmpty(db.orm)).toBe(true);
  return db.orm.em.fork();
}

/** The document without the product ids, which are new on every seed. */
const withoutIds = (content: EstimateContent) =>
  content.sections.map((s) => ({ ...s, lines: s.lines.map(({ productId: _p, ...l }) => l) }));

describe('demo seeder', () => {
  it('gives a new firm a catalogue of every kind, each product valid for the catalogue form', async () => {
    const em = await seeded();
    const products = await em.find(Product, {}, { orderBy: { supplierCode: 'asc' } });
    expect(products.length).toBeGreaterThanOrEqual(28);
    expect(new Set(products.map((p) => p.kind))).toEqual(new Set(PRODUCT_KINDS));
    expect([...CONTRACT_KINDS].sort()).toEqual([...PRODUCT_KINDS].sort());
    for (const p of products)
      expect(ProductInput.safeParse({ ...p, description: p.description, spec: p.spec }).success, p.supplierCode).toBe(true);
    const fittings = products
      .filter((p) => p.kind === 'fitting')
      .map((p) => p.spec as { driveMode: string; ratings?: { currentA: number }[]; nominalVoltageV?: number });
    const currents = new Set(fittings.flatMap((f) => f.ratings?.map((r) => r.currentA) ?? []));
    for (const mA of [0.35, 0.5, 0.7]) expect(currents.has(mA)).toBe(true);
    expect(new Set(fittings.filter((f) => f.driveMode === 'constant-voltage').map((f) => f.nominalVoltageV))).toEqual(
      new Set([12, 24]),
    );
    const areas = new Set(
      products.filter((p) => p.kind === 'cable').map((p) => (p.spec as { conductor: { areaMm2: number } }).conductor.areaMm2),
    );
    expect(areas).toEqual(new Set([1.5, 2.5]));
    // a constant-current fitting's power at its drive current is I x Vf: 0.35 A x 8.9 V = 3.1 W, a "3 W" spot
    const spot = products.find((p) => p.supplierCode === 'FTL-SP3')!.spec as {
      ratings: { currentA: number; forwardVoltageV: number }[];
    };
    expect(spot.ratings[0]!.currentA * spot.ratings[0]!.forwardVoltageV).toBeCloseTo(3.1, 1);
    // a driver's power window is its current times its voltage window: 0.7 A x 42 V = 29.4 W
    const d700 = products.find((p) => p.supplierCode === 'FTL-D700')!.spec as {
      currentA: number;
      voltageWindowV: { maxV: number };
      maxPowerW: number;
    };
    expect(d700.currentA * d700.voltageWindowV.maxV).toBeCloseTo(d700.maxPowerW, 6);
  });

  it('adds customers with sites and quotes at each stage, totalled by the engine', async () => {
    const em = await seeded();
    // the hand-written customers and quotes (the demo year's, numbered from 1001, are tested in demo-year.test.ts)
    const handWritten = { name: { $in: DEMO_CUSTOMERS.map((c) => c.name) } };
    expect(await em.count(Customer, handWritten)).toBe(6);
    expect(await em.count(Site, { customer: handWritten })).toBe(7);
    const quotes = await em.find(Quote, { number: { $lte: 1000 } }, { orderBy: { number: 'asc' }, populate: ['customer'] });
    expect(quotes.map((q) => [q.number, q.status])).toEqual([
      [1, 'draft'],
      [2, 'sent'],
      [3, 'approved'],
    ]);
    for (const q of quotes) {
      const revision = await em.findOneOrFail(QuoteRevision, { quote: q.id, number: 1 });
      const content = EstimateContent.parse(revision.content);
      const settings = RevisionSettings.parse(revision.settings);
      const engine = computeQuoteTotals(estimateQuoteInput(content, settings));
      expect(revision.totals).toMatchObject({
        totalMinor: engine.totalMinor,
        netMinor: engine.netMinor,
        costMinor: engine.costMinor,
      });
      expect(q.valueMinor).toBe(engine.totalMinor);
      expect(engine.totalMinor).toBeGreaterThan(0);
      expect(engine.findings.filter((f) => f.severity === 'error')).toEqual([]);
      // the firm's default deposit (30 %) on every quote
      expect(content.deposit).toEqual({ kind: 'percent', bp: settings.depositPercentBp });
      for (const line of content.sections.flatMap((s) => s.lines))
        expect(await em.count(Product, { id: line.productId! })).toBe(1);
      if (q.status === 'draft') {
        expect(revision.state).toBe('draft');
        expect(revision.contentHash).toBeNull();
      } else {
        expect(revision.state).toBe('sent');
        expect(revision.contentHash).toBe(contentHash(revision.content));
        expect(q.validUntil!.getTime() - q.sentAt!.getTime()).toBe(settings.quoteValidityDays * 24 * 3600_000);
        expect(q.validUntil!.getTime()).toBeGreaterThan(Date.now()); // still open for the homeowner
      }
    }
    // cost plus the firm's 35 % markup: the path light costs £31.20, so it is priced at £42.12
    const first = EstimateContent.parse((await em.findOneOrFail(QuoteRevision, { quote: quotes[0]!.id })).content);
    const path = first.sections[0]!.lines[0]!;
    expect([path.description, path.unitCostMinor, path.unitPriceMinor, path.quantityMilli]).toEqual([
      'Thistle path light 2 W',
      3120,
      4212,
      6000,
    ]);
    // the approved quote's history, oldest first
    const events = await em.find(QuoteEvent, { quote: quotes[2]!.id }, { orderBy: { at: 'asc' } });
    expect(events.map((e) => e.type)).toEqual(['created', 'sent', 'viewed', 'approved']);
  });

  it('seeds the same estimates every time', async () => {
    const a = await seeded();
    const b = await seeded();
    const docs = async (em: typeof a) =>
      (await em.find(QuoteRevision, { quote: { number: { $lte: 1000 } } }, { orderBy: { quote: { number: 'asc' } } })).map((r) => ({
        content: withoutIds(EstimateContent.parse(r.content)),
        totals: r.totals,
      }));
    expect(await docs(a)).toEqual(await docs(b));
    expect((await docs(a)).length).toBe(3);
    expect(DEMO_PRODUCTS.length).toBe(await a.count(Product, {}));
  });
});
