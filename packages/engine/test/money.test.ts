import { describe, expect, it } from 'vitest';
import {
  allocateMinor,
  computeQuoteTotals,
  divRound,
  extendMinor,
  formatBasisPoints,
  formatMoney,
  formatQuantityMilli,
  marginFromMarkup,
  marginOf,
  markupFromMargin,
  markupOf,
  MoneyInputError,
  mulDiv,
  parseMoney,
  parseQuantity,
  priceFromMargin,
  priceFromMarkup,
  quantityMilli,
  UK_VAT_RATES_BP,
  vatInInclusiveMinor,
  type QuoteLineInput,
  type VatRounding,
} from '../src/money';
import { isEngineInputError } from '../src/units/engine-input-error';

const line = (id: string, over: Partial<QuoteLineInput> = {}): QuoteLineInput => ({
  id,
  quantityMilli: 1000,
  unitPriceMinor: 100,
  vatRateBp: UK_VAT_RATES_BP.standard,
  unitCostMinor: 0,
  ...over,
});

describe('HMRC VAT Notice 700 §17.5 rounding', () => {
  // REFERENCES "Money" [derived]: three lines of £0.99 at 20 %: per-line nearest penny 0.60;
  // invoice-level 0.594 -> 0.59.
  const threeLines = [line('a', { unitPriceMinor: 99 }), line('b', { unitPriceMinor: 99 }), line('c', { unitPriceMinor: 99 })];
  const vatFor = (vatRounding: VatRounding) => computeQuoteTotals({ lines: threeLines, vatRounding }).vatMinor;

  it('per line to the nearest penny: 19.8p -> 20p each, 60p in all', () => {
    const t = computeQuoteTotals({ lines: threeLines, vatRounding: 'line-nearest-1p' });
    expect(t.lines.map((l) => l.vatTenths)).toEqual([200, 200, 200]);
    expect(t.vatMinor).toBe(60);
    expect(t.totalMinor).toBe(297 + 60);
  });

  it('on the invoice total rounded down to a whole penny: 59.4p -> 59p', () => {
    expect(vatFor('invoice-down-1p')).toBe(59);
  });

  it('per line rounded down to 0.1p keeps 19.8p each; the 59.4p total is rounded down to 59p', () => {
    const t = computeQuoteTotals({ lines: threeLines, vatRounding: 'line-down-0.1p' });
    expect(t.lines.map((l) => l.vatTenths)).toEqual([198, 198, 198]);
    expect(t.vatMinor).toBe(59);
  });

  it('per line to the nearest 0.5p: 19.8p -> 20.0p each', () => {
    expect(vatFor('line-nearest-0.5p')).toBe(60);
  });

  // HMRC VAT Notice 700 §17.5 examples: 86.89p rounds down to 86.8p; 86.5p rounds to 87p (nearest 1p).
  it('follows the notice examples for one line', () => {
    // a line whose VAT is exactly 86.89p cannot arise from whole-penny nets at 20 % (multiples
    // of 0.2p), so use 86.8p (net 434p) and 86.5p at 5 % (net 1730p).
    const at = (net: number, rate: number, r: VatRounding) =>
      computeQuoteTotals({ lines: [line('x', { unitPriceMinor: net, vatRateBp: rate })], vatRounding: r }).lines[0]!.vatTenths;
    expect(at(434, 2000, 'line-down-0.1p')).toBe(868);
    expect(at(1730, 500, 'line-nearest-1p')).toBe(870); // 86.5p -> 87p, halves up
    expect(at(1730, 500, 'line-nearest-0.5p')).toBe(865);
    expect(at(1729, 500, 'line-down-0.1p')).toBe(864); // 86.45p -> 86.4p
  });

  it('splits VAT by rate and the rates add up to the total', () => {
    // 20 % on 99p = 19.8p, 5 % on 99p = 4.95p; invoice total 24.75p -> 24p.
    const t = computeQuoteTotals({
      lines: [line('s', { unitPriceMinor: 99 }), line('r', { unitPriceMinor: 99, vatRateBp: 500 }), line('z', { vatRateBp: 0 })],
      vatRounding: 'invoice-down-1p',
    });
    expect(t.vatMinor).toBe(24);
    expect(t.vatByRate).toEqual([
      { rateBp: 2000, netMinor: 99, vatMinor: 19 },
      { rateBp: 500, netMinor: 99, vatMinor: 5 }, // 0.95p is the larger fraction, so it takes the penny
      { rateBp: 0, netMinor: 100, vatMinor: 0 },
    ]);
  });
});

describe('VAT inside a VAT-inclusive price', () => {
  // gov.uk (REFERENCES "Money"): the VAT fraction of a VAT-inclusive price at 20 % is 1/6.
  it('takes 1/6 at 20 %', () => {
    expect(vatInInclusiveMinor(120, 2000)).toBe(20);
    expect(vatInInclusiveMinor(10_000, 2000)).toBe(1667); // 1666.67p
    expect(vatInInclusiveMinor(10_000, 2000, 'down')).toBe(1666);
    expect(vatInInclusiveMinor(10_500, 500)).toBe(500); // 5 %: 5/105
  });
});

describe('float traps stay exact', () => {
  // REFERENCES "Money": Math.round(1.005*100)/100 === 1; (2.675).toFixed(2) === "2.67".
  it('1.005 x 100 rounds half-up to 101, not 100', () => {
    expect(Math.round(1.005 * 100)).toBe(100); // the trap itself
    expect(mulDiv(1005, 100, 1000, 'half-up')).toBe(101);
  });
  it('2.675 units at £1 is £2.68 (half-up), not £2.67', () => {
    expect((2.675).toFixed(2)).toBe('2.67'); // the trap itself
    const q = parseQuantity('2.675');
    expect(q).toEqual({ ok: true, value: 2675 });
    expect(extendMinor(2675, 100)).toBe(268);
  });
  it('ten lines of 10p add up to exactly £1.00', () => {
    const lines = Array.from({ length: 10 }, (_, i) => line(`l${i}`, { unitPriceMinor: 10 }));
    expect(computeQuoteTotals({ lines, vatRounding: 'line-nearest-1p' }).netMinor).toBe(100);
  });
  it('12.5 m at £1.99 is £24.875 -> £24.88', () => {
    expect(quantityMilli(12.5)).toBe(12500);
    expect(extendMinor(12500, 199)).toBe(2488);
  });
});

describe('integer rounding', () => {
  it.each([
    // [n, d, half-up, half-even, down, up]
    [5, 2, 3, 2, 2, 3],
    [7, 2, 4, 4, 3, 4],
    [-5, 2, -3, -2, -2, -3],
    [1, 3, 0, 0, 0, 1],
    [2, 3, 1, 1, 0, 1],
    [6, 3, 2, 2, 2, 2],
  ])('%i / %i', (n, d, hu, he, dn, up) => {
    expect(divRound(n, d, 'half-up')).toBe(hu);
    expect(divRound(n, d, 'half-even')).toBe(he);
    expect(divRound(n, d, 'down')).toBe(dn);
    expect(divRound(n, d, 'up')).toBe(up);
  });
  it('stays exact past 2^53 in intermediates (bigint path)', () => {
    // 9e15 x 3 / 7 = 3857142857142857.142..., computed exactly
    expect(mulDiv(9_000_000_000_000_000 / 1000, 3000, 7, 'down')).toBe(3857142857142857);
    expect(mulDiv(Number.MAX_SAFE_INTEGER, 2, 4, 'half-up')).toBe(4503599627370496); // .5 rounds up
  });
  it('refuses a result beyond the safe range with a clear error', () => {
    expect(() => mulDiv(Number.MAX_SAFE_INTEGER, 3, 1, 'down')).toThrow(MoneyInputError);
    expect(() => divRound(1.5, 1, 'down')).toThrow(/whole number/);
  });
});

describe('markup and margin', () => {
  // Definitions: markup on cost, margin on price; 50 % markup is a third margin.
  it('converts between them', () => {
    expect(marginFromMarkup(5000)).toBe(3333);
    expect(markupFromMargin(2500)).toBe(3333);
    expect(markupFromMargin(5000)).toBe(10000);
    expect(marginFromMarkup(10000)).toBe(5000);
  });
  it('prices from cost', () => {
    expect(priceFromMarkup(1000, 5000)).toBe(1500);
    expect(priceFromMargin(1000, 5000)).toBe(2000);
    expect(priceFromMargin(1000, 3000)).toBe(1429); // 1428.57 -> 1429
    expect(marginOf(2000, 1000)).toBe(5000);
    expect(markupOf(2000, 1000)).toBe(10000);
    expect(marginOf(0, 10)).toBeNull();
  });
  it('refuses a margin of 100 % or more', () => {
    expect(() => priceFromMargin(1000, 10000)).toThrow(/below 100 %/);
  });
});

describe('discounts, options, alternatives, deposit', () => {
  it('applies a line discount then a quote discount shared across lines', () => {
    const t = computeQuoteTotals({
      lines: [
        line('a', { quantityMilli: 2000, unitPriceMinor: 5000, unitCostMinor: 3000, discount: { kind: 'percent', bp: 1000 } }),
        line('b', { quantityMilli: 1000, unitPriceMinor: 1001, unitCostMinor: 500 }),
      ],
      discount: { kind: 'fixed', amountMinor: 1001 },
      vatRounding: 'line-nearest-1p',
    });
    // a: gross 10000, less 10 % = 9000; b: 1001. Quote discount 1001 split 9000:1001.
    const [a, b] = t.lines;
    expect(a!.lineDiscountMinor).toBe(1000);
    expect(a!.quoteDiscountMinor + b!.quoteDiscountMinor).toBe(1001);
    expect(a!.quoteDiscountMinor).toBe(901); // 1001 x 9000/10001 = 900.8 -> 900, + the spare penny
    expect(t.netMinor).toBe(9000 + 1001 - 1001);
    expect(t.costMinor).toBe(6500);
    expect(t.grossMarginMinor).toBe(9000 - 6500);
    expect(t.vatMinor).toBe(t.lines.reduce((s, l) => s + (l.vatTenths ?? 0), 0) / 10);
  });

  it('counts optional lines only when selected and reports what they would add', () => {
    const lines = [line('base', { unitPriceMinor: 10000 }), line('extra', { unitPriceMinor: 2500, optional: true })];
    const off = computeQuoteTotals({ lines, vatRounding: 'line-nearest-1p' });
    expect(off.netMinor).toBe(10000);
    expect(off.lines[1]).toMatchObject({ included: false, netMinor: 2500, vatTenths: null });
    const on = computeQuoteTotals({ lines: [lines[0]!, { ...lines[1]!, selected: true }], vatRounding: 'line-nearest-1p' });
    expect(on.netMinor).toBe(12500);
  });

  it('counts exactly one alternative of a pick-one group', () => {
    const lines = [
      line('brass', { unitPriceMinor: 9000, alternativeGroup: 'finish', selected: true }),
      line('steel', { unitPriceMinor: 6000, alternativeGroup: 'finish' }),
    ];
    const t = computeQuoteTotals({ lines, vatRounding: 'line-nearest-1p' });
    expect(t.netMinor).toBe(9000);
    expect(t.findings.filter((f) => f.severity === 'error')).toEqual([]);

    const none = computeQuoteTotals({ lines: lines.map((l) => ({ ...l, selected: false })), vatRounding: 'line-nearest-1p' });
    expect(none.netMinor).toBe(0);
    expect(none.findings.map((f) => f.code)).toContain('alternative-none-chosen');

    const both = computeQuoteTotals({ lines: lines.map((l) => ({ ...l, selected: true })), vatRounding: 'line-nearest-1p' });
    expect(both.netMinor).toBe(9000);
    expect(both.findings.map((f) => f.code)).toContain('alternative-several-chosen');
  });

  it('takes a deposit as a percentage or fixed amount and the balance makes up the total', () => {
    const lines = [line('a', { unitPriceMinor: 83334 })]; // total 83334 + 16667 = 100001
    const pct = computeQuoteTotals({ lines, vatRounding: 'line-nearest-1p', deposit: { kind: 'percent', bp: 3000 } });
    expect(pct.totalMinor).toBe(100001);
    expect(pct.deposit).toEqual({ depositMinor: 30000, balanceMinor: 70001 });
    const fixed = computeQuoteTotals({ lines, vatRounding: 'line-nearest-1p', deposit: { kind: 'fixed', amountMinor: 200000 } });
    expect(fixed.deposit).toEqual({ depositMinor: 100001, balanceMinor: 0 });
    expect(fixed.findings.map((f) => f.code)).toContain('deposit-capped');
  });

  it('caps discounts larger than what they apply to', () => {
    const t = computeQuoteTotals({
      lines: [line('a', { discount: { kind: 'fixed', amountMinor: 500 } }), line('b')],
      discount: { kind: 'fixed', amountMinor: 10_000 },
      vatRounding: 'invoice-down-1p',
    });
    expect(t.lines[0]!.lineDiscountMinor).toBe(100);
    expect(t.netMinor).toBe(0);
    expect(t.findings.map((f) => f.code)).toEqual(expect.arrayContaining(['line-discount-capped', 'quote-discount-capped']));
  });

  it('rejects malformed input with a clear error naming the field', () => {
    const bad = (over: Partial<QuoteLineInput>) => () =>
      computeQuoteTotals({ lines: [line('a', over)], vatRounding: 'line-nearest-1p' });
    expect(bad({ unitPriceMinor: 9.99 })).toThrow(/lines\[0\]\.unitPriceMinor/);
    expect(bad({ quantityMilli: -1000 })).toThrow(/must not be negative/);
    expect(bad({ optional: true, alternativeGroup: 'g' })).toThrow(/one or the other/);
    expect(() => computeQuoteTotals({ lines: [line('a'), line('a')], vatRounding: 'line-nearest-1p' })).toThrow(/used twice/);
    expect(() => computeQuoteTotals({ lines: [], vatRounding: 'nearest' as VatRounding })).toThrow(MoneyInputError);
  });

  it('its errors are EngineInputErrors carrying an error finding for the field', () => {
    try {
      computeQuoteTotals({ lines: [line('a', { vatRateBp: 20.5 })], vatRounding: 'line-nearest-1p' });
      expect.unreachable();
    } catch (e) {
      expect(isEngineInputError(e)).toBe(true);
      expect((e as MoneyInputError).finding).toMatchObject({
        code: 'not-safe-integer',
        severity: 'error',
        subject: 'lines[0].vatRateBp',
      });
    }
  });

  it('gives JSON-serialisable results', () => {
    const t = computeQuoteTotals({
      lines: [line('a', { optional: true }), line('b', { alternativeGroup: 'g', selected: true })],
      vatRounding: 'invoice-down-1p',
      deposit: { kind: 'percent', bp: 2500 },
    });
    expect(JSON.parse(JSON.stringify(t))).toEqual(t);
  });

  it('reports lines without a cost', () => {
    const t = computeQuoteTotals({ lines: [line('a', { unitCostMinor: undefined })], vatRounding: 'line-nearest-1p' });
    expect(t.findings.map((f) => f.code)).toContain('cost-missing');
    // an unselected option without a cost does not touch the margin, so it is not reported
    const opt = computeQuoteTotals({
      lines: [line('a'), line('b', { unitCostMinor: undefined, optional: true })],
      vatRounding: 'line-nearest-1p',
    });
    expect(opt.findings).toEqual([]);
  });
});

describe('allocate', () => {
  // REFERENCES "Money": dinero.js allocate, £1000.01 split 30/70 -> 300.00 / 700.01.
  it('£1000.01 split 30/70 gives £300.00 / £700.01', () => {
    expect(allocateMinor(100001, [30, 70])).toEqual([30000, 70001]);
  });
  it('splits a penny three ways without inventing any', () => {
    expect(allocateMinor(100, [1, 1, 1])).toEqual([34, 33, 33]);
    expect(allocateMinor(-100, [1, 1, 1])).toEqual([-34, -33, -33]);
  });
  it('refuses all-zero weights', () => {
    expect(() => allocateMinor(100, [0, 0])).toThrow(/every weight is zero/);
  });
});

describe('formatting and parsing at the edges', () => {
  it('formats with Intl', () => {
    expect(formatMoney(123456)).toBe('£1,234.56');
    expect(formatMoney(-5)).toBe('-£0.05');
    expect(formatMoney(1234, 'JPY', 'en-GB')).toBe('JP¥1,234');
    expect(formatMoney(Number.MAX_SAFE_INTEGER)).toBe('£90,071,992,547,409.91');
    expect(formatBasisPoints(2000)).toBe('20%');
    expect(formatBasisPoints(1250)).toBe('12.5%');
    expect(formatQuantityMilli(12500)).toBe('12.5');
    expect(formatQuantityMilli(3000)).toBe('3');
  });
  it('parses typed amounts exactly and refuses extra decimals', () => {
    expect(parseMoney('1234.5')).toEqual({ ok: true, value: 123450 });
    expect(parseMoney('0.1')).toEqual({ ok: true, value: 10 });
    expect(parseMoney('1.005').ok).toBe(false);
    expect(parseMoney('12abc').ok).toBe(false);
    expect(parseQuantity('.25')).toEqual({ ok: true, value: 250 });
    expect(() => quantityMilli(0.0001)).toThrow(/three decimal places/);
  });
});
