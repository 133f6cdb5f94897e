/**
 * Property tests for money: totals equal the sum of their parts, a split never loses or
 * invents a penny, and every figure agrees with decimal.js (an independent decimal library,
 * REFERENCES "Money" lists it as an oracle) working the same rules in decimal arithmetic.
 */
import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  allocateMinor,
  computeQuoteTotals,
  MoneyInputError,
  mulDiv,
  VAT_ROUNDINGS,
  type Discount,
  type IntegerRounding,
  type QuoteInput,
  type QuoteLineInput,
} from '../src/money';

const D = Decimal.clone({ precision: 60 });
const decimalMode: Record<IntegerRounding, Decimal.Rounding> = {
  'half-up': D.ROUND_HALF_UP,
  'half-even': D.ROUND_HALF_EVEN,
  down: D.ROUND_DOWN,
  up: D.ROUND_UP,
};
const round = (x: Decimal, mode: IntegerRounding) => x.toDecimalPlaces(0, decimalMode[mode]).toNumber() + 0; // +0: no -0

const discountArb: fc.Arbitrary<Discount> = fc.oneof(
  fc.record({ kind: fc.constant('percent' as const), bp: fc.integer({ min: 0, max: 10_000 }) }),
  fc.record({ kind: fc.constant('fixed' as const), amountMinor: fc.integer({ min: 0, max: 500_000 }) }),
);

const lineArb = (i: number): fc.Arbitrary<QuoteLineInput> =>
  fc.record(
    {
      id: fc.constant(`l${i}`),
      quantityMilli: fc.integer({ min: 0, max: 5_000_000 }),
      unitPriceMinor: fc.integer({ min: 0, max: 2_000_000 }),
      unitCostMinor: fc.integer({ min: 0, max: 2_000_000 }),
      vatRateBp: fc.constantFrom(2000, 500, 0, 1750),
      discount: discountArb,
      optional: fc.boolean(),
      alternativeGroup: fc.constantFrom('finish', 'lamp'),
      selected: fc.boolean(),
    },
    { requiredKeys: ['id', 'quantityMilli', 'unitPriceMinor', 'vatRateBp'] },
  );

const quoteArb: fc.Arbitrary<QuoteInput> = fc
  .integer({ min: 0, max: 25 })
  .chain((n) => fc.tuple(...Array.from({ length: n }, (_, i) => lineArb(i))))
  // a line is optional or an alternative, not both
  .map((lines) => lines.map((l) => (l.optional && l.alternativeGroup ? { ...l, alternativeGroup: undefined } : l)))
  .chain((lines) =>
    fc.record(
      {
        lines: fc.constant(lines),
        vatRounding: fc.constantFrom(...VAT_ROUNDINGS),
        discount: discountArb,
        deposit: discountArb,
      },
      { requiredKeys: ['lines', 'vatRounding'] },
    ),
  );

/** The same rules in decimal.js: extension, discounts, largest-remainder share, VAT, deposit. */
function oracle(q: QuoteInput) {
  const nets: Decimal[] = [];
  const rates: number[] = [];
  const firstChosen = new Map<string, string>();
  for (const l of q.lines)
    if (l.alternativeGroup && l.selected && !firstChosen.has(l.alternativeGroup)) firstChosen.set(l.alternativeGroup, l.id);
  for (const l of q.lines) {
    if (l.optional && !l.selected) continue;
    if (l.alternativeGroup && firstChosen.get(l.alternativeGroup) !== l.id) continue;
    const gross = round(new D(l.quantityMilli).div(1000).mul(l.unitPriceMinor), 'half-up');
    let disc = 0;
    if (l.discount?.kind === 'percent') disc = round(new D(gross).mul(l.discount.bp).div(10_000), 'half-up');
    if (l.discount?.kind === 'fixed') disc = Math.min(gross, l.discount.amountMinor);
    nets.push(new D(gross - disc));
    rates.push(l.vatRateBp);
  }
  const pre = nets.reduce((s, x) => s.add(x), new D(0));
  let qd = 0;
  if (q.discount?.kind === 'percent') qd = round(pre.mul(q.discount.bp).div(10_000), 'half-up');
  if (q.discount?.kind === 'fixed') qd = Math.min(pre.toNumber(), q.discount.amountMinor);
  if (qd > 0) {
    // shares by largest remainder; remainders as exact integers (qd x net mod total)
    const rems = nets.map((x) => new D(qd).mul(x).mod(pre));
    const floors = nets.map((x, i) => new D(qd).mul(x).sub(rems[i]!).div(pre));
    let left = qd - floors.reduce((s, x) => s + x.toNumber(), 0);
    const order = rems.map((x, i) => i).sort((a, b) => rems[b]!.cmp(rems[a]!) || a - b);
    for (const i of order) {
      if (left === 0) break;
      floors[i] = floors[i]!.add(1);
      left--;
    }
    for (let i = 0; i < nets.length; i++) nets[i] = nets[i]!.sub(floors[i]!);
  }
  const net = nets.reduce((s, x) => s.add(x), new D(0)).toNumber();
  let vat = new D(0);
  for (let i = 0; i < nets.length; i++) {
    const exact = nets[i]!.mul(rates[i]!).div(10_000);
    switch (q.vatRounding) {
      case 'line-nearest-1p':
        vat = vat.add(exact.toDecimalPlaces(0, D.ROUND_HALF_UP));
        break;
      case 'line-nearest-0.5p':
        vat = vat.add(exact.mul(2).toDecimalPlaces(0, D.ROUND_HALF_UP).div(2));
        break;
      case 'line-down-0.1p':
        vat = vat.add(exact.toDecimalPlaces(1, D.ROUND_DOWN));
        break;
      case 'invoice-down-1p':
        vat = vat.add(exact);
        break;
    }
  }
  const vatMinor = vat.floor().toNumber();
  const total = net + vatMinor;
  let deposit: number | null = null;
  if (q.deposit?.kind === 'percent') deposit = round(new D(total).mul(q.deposit.bp).div(10_000), 'half-up');
  if (q.deposit?.kind === 'fixed') deposit = Math.min(total, q.deposit.amountMinor);
  return { net, vatMinor, total, deposit };
}

describe('money properties', () => {
  it('totals equal the sum of their parts', () => {
    fc.assert(
      fc.property(quoteArb, (q) => {
        const t = computeQuoteTotals(q);
        const inc = t.lines.filter((l) => l.included);
        const sum = (f: (l: (typeof inc)[number]) => number) => inc.reduce((s, l) => s + f(l), 0);
        expect(t.netMinor).toBe(sum((l) => l.netMinor));
        expect(t.grossMinor).toBe(sum((l) => l.grossMinor));
        expect(t.quoteDiscountMinor).toBe(sum((l) => l.quoteDiscountMinor));
        expect(t.grossMinor - t.lineDiscountMinor - t.quoteDiscountMinor).toBe(t.netMinor);
        expect(t.vatByRate.reduce((s, r) => s + r.vatMinor, 0)).toBe(t.vatMinor);
        expect(t.vatByRate.reduce((s, r) => s + r.netMinor, 0)).toBe(t.netMinor);
        expect(t.totalMinor).toBe(t.netMinor + t.vatMinor);
        expect(t.grossMarginMinor).toBe(t.netMinor - t.costMinor);
        for (const g of ['finish', 'lamp']) {
          const members = t.lines.filter((l, i) => q.lines[i]!.alternativeGroup === g);
          if (members.length > 0) expect(members.filter((l) => l.included).length).toBeLessThanOrEqual(1);
        }
        for (const l of t.lines) expect(l.netMinor).toBeGreaterThanOrEqual(0);
        if (t.deposit) expect(t.deposit.depositMinor + t.deposit.balanceMinor).toBe(t.totalMinor);
      }),
      { numRuns: 400 },
    );
  });

  it('agrees with decimal.js on net, VAT, total and deposit', () => {
    fc.assert(
      fc.property(quoteArb, (q) => {
        const t = computeQuoteTotals(q);
        const o = oracle(q);
        expect({ net: t.netMinor, vatMinor: t.vatMinor, total: t.totalMinor, deposit: t.deposit?.depositMinor ?? null }).toEqual(
          o,
        );
      }),
      { numRuns: 400 },
    );
  });

  it('a deposit or staged split never loses or invents a penny', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -Number.MAX_SAFE_INTEGER, max: Number.MAX_SAFE_INTEGER }),
        fc
          .array(fc.oneof(fc.integer({ min: 0, max: 1_000_000_000 }), fc.integer({ min: 0, max: 3 })), {
            minLength: 1,
            maxLength: 40,
          })
          .filter((w) => w.some((x) => x > 0)),
        (amount, weights) => {
          const parts = allocateMinor(amount, weights);
          expect(parts.reduce((s, p) => s + BigInt(p), 0n)).toBe(BigInt(amount));
          const total = weights.reduce((s, w) => s + w, 0);
          // same as a plain largest-remainder with a full sort (ties to the earlier part)
          // remainders as exact decimal integers (|amount| x w mod total), so ties compare exactly
          const rems = weights.map((w) => new D(Math.abs(amount)).mul(w).mod(total));
          const naive = weights.map((w, i) => new D(Math.abs(amount)).mul(w).sub(rems[i]!).div(total).toNumber());
          let left = Math.abs(amount) - naive.reduce((s, x) => s + x, 0);
          const order = rems.map((x, i) => i).sort((x, y) => rems[y]!.cmp(rems[x]!) || x - y);
          for (const i of order) if (left-- > 0) naive[i]! += 1;
          expect(parts).toEqual(naive.map((x) => (amount < 0 ? -x + 0 : x)));
          parts.forEach((p, i) => {
            // each part is within one minor unit of its exact share (decimal.js)
            const exact = new D(amount).mul(weights[i]!).div(total);
            expect(exact.sub(p).abs().lt(1)).toBe(true);
            if (weights[i] === 0) expect(p).toBe(0);
          });
        },
      ),
      { numRuns: 500 },
    );
  });

  it('breaks equal remainders toward the earlier part, even past 2^53 (found by the property above)', () => {
    // 5023404406777070 x [1, 3, 2, 8] / 14: remainders 6, 4, 12, 6; two pennies left -> parts 3 and 1
    expect(allocateMinor(5023404406777070, [1, 3, 2, 8])).toEqual([
      358814600484077, 1076443801452229, 717629200968153, 2870516803872611,
    ]);
  });

  it('mulDiv matches decimal.js for every rounding mode, past 2^53 too', () => {
    const big = fc.integer({ min: -Number.MAX_SAFE_INTEGER, max: Number.MAX_SAFE_INTEGER });
    fc.assert(
      fc.property(
        big,
        fc.integer({ min: -100_000, max: 100_000 }),
        fc.integer({ min: 1, max: 1_000_000_000 }),
        fc.constantFrom<IntegerRounding>('half-up', 'half-even', 'down', 'up'),
        (a, b, d, mode) => {
          const exact = round(new D(a).mul(b).div(d), mode);
          if (!Number.isSafeInteger(exact)) {
            expect(() => mulDiv(a, b, d, mode)).toThrow(/too large/);
          } else {
            expect(mulDiv(a, b, d, mode)).toBe(exact);
          }
        },
      ),
      { numRuns: 2000 },
    );
  });
});

describe('malformed quotes give a clear MoneyInputError, never a crash', () => {
  const junk = fc.oneof(
    fc.constant(undefined),
    fc.constant(null),
    fc.integer(),
    fc.double(),
    fc.string({ maxLength: 4 }),
    fc.boolean(),
    fc.dictionary(fc.string({ maxLength: 3 }), fc.integer(), { maxKeys: 2 }),
  );
  const maybe = <T>(a: fc.Arbitrary<T>) => fc.oneof(a, junk);
  const disc = maybe(
    fc.record({
      kind: maybe(fc.constantFrom('percent', 'fixed', 'other')),
      bp: maybe(fc.integer({ min: -5, max: 20_000 })),
      amountMinor: maybe(fc.integer({ min: -5, max: 500 })),
    }),
  );
  const lineArb2 = maybe(
    fc.record({
      id: maybe(fc.constantFrom('a', 'b', 'c')),
      quantityMilli: maybe(fc.integer({ min: -5, max: 5000 })),
      unitPriceMinor: maybe(fc.integer({ min: 0, max: 5000 })),
      unitCostMinor: maybe(fc.integer({ min: 0, max: 5000 })),
      vatRateBp: maybe(fc.constantFrom(2000, 500, 0, 20_000)),
      discount: disc,
      optional: maybe(fc.boolean()),
      alternativeGroup: maybe(fc.constantFrom('g')),
      selected: maybe(fc.boolean()),
    }),
  );
  it('throws only MoneyInputError', () => {
    fc.assert(
      fc.property(
        maybe(fc.array(lineArb2, { maxLength: 4 })),
        maybe(fc.constantFrom(...VAT_ROUNDINGS, 'nearest')),
        disc,
        disc,
        (lines, vatRounding, discount, deposit) => {
          try {
            const t = computeQuoteTotals({ lines, vatRounding, discount, deposit } as unknown as QuoteInput);
            expect(t.totalMinor).toBe(t.netMinor + t.vatMinor);
          } catch (e) {
            expect(e).toBeInstanceOf(MoneyInputError);
            expect((e as MoneyInputError).message.length).toBeGreaterThan(10);
          }
        },
      ),
      { numRuns: 1000 },
    );
  });
});
