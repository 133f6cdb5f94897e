/**
 * The demo's approved job carries circuits, so the installer's pack has something to show.
 * Trade rules: one terminal per joint and a link needing one more (common practice, the
 * block planner): nine fittings on five-way junctions go three to a block; 9 × 3.1 V = 27.9 V
 * of forward voltage sits inside a 3-48 V window (definition of a series string).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { CircuitResult, EstimateContent } from '@gloaming/contracts';
import { Circuit, Product, Quote, QuoteRevision, seedDemoIfEmpty } from '../src';
import { openTestDatabase } from '../src/testing';

const closers: (() => Promise<void>)[] = [];
afterEach(async () => {
  while (closers.length) await closers.pop()!();
});

describe('demo installer job', () => {
  it('gives the approved quote a checked constant-current string and constant-voltage run from the products it sold', async () => {
    const db = await openTestDatabase();
    closers.push(db.close);
    expect(await seedDemoIfEmpty(db.orm)).toBe(true);
    const em = db.orm.em.fork();
    const quote = await em.findOneOrFail(Quote, { status: 'approved', title: 'Courtyard and bollards' });
    const revision = await em.findOneOrFail(QuoteRevision, { quote, number: 1 });
    expect(revision.state).toBe('sent');
    const circuits = await em.find(Circuit, { revision }, { orderBy: { position: 'asc' } });
    expect(circuits.map((c) => [c.area, c.kind])).toEqual([
      ['Entrances', 'constant-current'],
      ['Courtyard', 'constant-voltage'],
    ]);
    for (const c of circuits) expect(CircuitResult.parse(c.result).ok, c.area).toBe(true);
    const cc = CircuitResult.parse(circuits[0]!.result).evaluation as {
      blocks: { blocks: { fittings: number[] }[] };
      series: { stringForwardVoltageV: number };
      wiring: { ok: boolean };
    };
    expect(cc.blocks.blocks.map((b) => b.fittings.length)).toEqual([3, 3, 3]);
    expect(cc.series.stringForwardVoltageV).toBeCloseTo(27.9, 6);
    expect(cc.wiring.ok).toBe(true);

    // every product a circuit names is one the approved quote lists, in no greater number
    const content = EstimateContent.parse(revision.content);
    const sold = new Map<string, number>();
    for (const s of content.sections)
      for (const l of s.lines) {
        const code = l.productCode ?? '';
        sold.set(code, (sold.get(code) ?? 0) + l.quantityMilli / 1000);
      }
    const products = new Map((await em.find(Product, { organization: quote.organization })).map((p) => [p.id, p.supplierCode]));
    const used = new Map<string, number>();
    const count = (id: string | null) => id && used.set(products.get(id)!, (used.get(products.get(id)!) ?? 0) + 1);
    for (const c of circuits) {
      const d = c.design as {
        fittings?: { productId: string }[];
        runs?: { fittings: { productId: string }[] }[];
        driverProductId?: string;
        supplyProductId?: string;
      };
      for (const f of d.fittings ?? []) count(f.productId);
      for (const r of d.runs ?? []) for (const f of r.fittings) count(f.productId);
      count(d.driverProductId ?? null);
      count(d.supplyProductId ?? null);
    }
    expect(used).toEqual(
      new Map([
        ['FTL-DK1', 9],
        ['FTL-D350', 1],
        ['FTL-BL12', 6],
        ['FTL-PS12-60', 1],
      ]),
    );
    for (const [code, n] of used) expect(sold.get(code), code).toBeGreaterThanOrEqual(n);
  }, 60_000);
});
