/**
 * Quote totals: every line's amount, discounts, VAT per rate, total, cost, gross margin and
 * deposit, all in integer minor units. Order of work:
 * 1. gross = quantity (thousandths) x unit price, rounded half-up to a whole minor unit;
 * 2. line discount (percentage, rounded half-up; or fixed, capped at the gross);
 * 3. quote discount (percentage of the included lines, rounded half-up; or fixed, capped),
 *    shared across the included lines in proportion to their amounts by largest remainder,
 *    so VAT is charged on the discounted price and the shares add up to the discount;
 * 4. VAT by the firm's rounding (see vat.ts);
 * 5. deposit (percentage of the total, rounded half-up; or fixed, capped) and the balance.
 * Optional lines count only when selected; of each pick-one group exactly one should be
 * selected. Lines that are not counted still show their own amounts so an estimator or
 * homeowner can see what an option would add.
 */
import { finding, type Finding } from '../findings';
import { allocateMinor } from './allocate';
import { assertNonNegativeInteger, MoneyInputError } from './integer-math';
import { LineIdRegister } from './line-id-register';
import { extendMinor } from './quantity';
import { applyBasisPoints, BASIS_POINTS, marginOf } from './rates';
import { lineVatTenths, vatByRate, VAT_ROUNDINGS, type VatRateTotal, type VatRounding } from './vat';

export type Discount = { kind: 'percent'; bp: number } | { kind: 'fixed'; amountMinor: number };
export type Deposit = { kind: 'percent'; bp: number } | { kind: 'fixed'; amountMinor: number };

export interface QuoteLineInput {
  /** Unique within the quote. */
  id: string;
  /** Exact quantity in thousandths: 12.5 m -> 12500, 3 fittings -> 3000. */
  quantityMilli: number;
  /** Sell price per unit ex VAT, minor units. */
  unitPriceMinor: number;
  /** Cost per unit, minor units; missing costs count as zero (and are reported). */
  unitCostMinor?: number;
  /** VAT rate in basis points: 2000 = 20 %. */
  vatRateBp: number;
  discount?: Discount;
  /** An optional extra: counted only when `selected` is true. */
  optional?: boolean;
  /** A pick-one group: of the lines sharing this key exactly one should be `selected`. */
  alternativeGroup?: string;
  /** For optional lines and alternatives: picked or not. Ignored on ordinary lines. */
  selected?: boolean;
}

export interface QuoteInput {
  lines: readonly QuoteLineInput[];
  /** The firm's VAT rounding choice (HMRC VAT Notice 700 §17.5). */
  vatRounding: VatRounding;
  /** A discount on the whole quote. */
  discount?: Discount;
  /** Deposit asked on acceptance, of the total including VAT. */
  deposit?: Deposit;
}

export interface QuoteLineTotal {
  id: string;
  /** Counted in the totals (ordinary lines, selected optional lines, chosen alternatives). */
  included: boolean;
  grossMinor: number;
  lineDiscountMinor: number;
  /** This line's share of the quote discount; 0 when not included. */
  quoteDiscountMinor: number;
  /** Ex VAT after both discounts. */
  netMinor: number;
  vatRateBp: number;
  /** VAT on this line in tenths of a minor unit as the line rounding gives it; null in
   * invoice-level rounding and for lines not included. */
  vatTenths: number | null;
  costMinor: number;
  marginMinor: number;
}

export interface DepositSplit {
  depositMinor: number;
  balanceMinor: number;
}

export interface QuoteTotals {
  lines: QuoteLineTotal[];
  /** Sum of the included lines' gross amounts. */
  grossMinor: number;
  lineDiscountMinor: number;
  quoteDiscountMinor: number;
  /** Total ex VAT. */
  netMinor: number;
  /** Highest rate first; adds up to `vatMinor`. */
  vatByRate: VatRateTotal[];
  vatMinor: number;
  /** netMinor + vatMinor. */
  totalMinor: number;
  costMinor: number;
  /** netMinor - costMinor. */
  grossMarginMinor: number;
  /** Gross margin as basis points of the net; null when the net is zero. */
  grossMarginBp: number | null;
  deposit: DepositSplit | null;
  findings: Finding[];
}

const isCount = (v: unknown): v is number => typeof v === 'number' && Number.isSafeInteger(v) && v >= 0;

/** The field name of a discount: a line's (by index) or the quote's own. Built only on error. */
function discountField(where: string | number): string {
  return typeof where === 'number' ? `lines[${where}].discount` : where;
}

/** Validate a discount or deposit (no per-line garbage: messages are built only when something is wrong). */
function checkDiscount(d: Discount, where: string | number): void {
  if (typeof d !== 'object' || d === null) {
    const field = discountField(where);
    throw new MoneyInputError('bad-kind', field, `${field} must be { kind: "percent", bp } or { kind: "fixed", amountMinor }.`);
  }
  if (d.kind === 'percent') {
    if (!isCount(d.bp)) assertNonNegativeInteger(d.bp, `${discountField(where)}.bp`);
    if (d.bp > BASIS_POINTS) {
      const field = discountField(where);
      throw new MoneyInputError('percent-over-100', `${field}.bp`, `${field} cannot be more than 100 %; got ${d.bp / 100} %.`);
    }
  } else if (d.kind === 'fixed') {
    if (!isCount(d.amountMinor)) assertNonNegativeInteger(d.amountMinor, `${discountField(where)}.amountMinor`);
  } else {
    const field = discountField(where);
    throw new MoneyInputError('bad-kind', `${field}.kind`, `${field}.kind must be "percent" or "fixed".`);
  }
}

/** Amount a discount or deposit takes off `baseMinor` (a fixed one is capped at the base). */
function takeFrom(baseMinor: number, d: Discount | Deposit): number {
  if (d.kind === 'percent') return applyBasisPoints(baseMinor, d.bp, 'half-up');
  return d.amountMinor > baseMinor ? baseMinor : d.amountMinor;
}

/** Was a fixed discount or deposit larger than what it applies to? */
function capped(baseMinor: number, d: Discount | Deposit): boolean {
  return d.kind === 'fixed' && d.amountMinor > baseMinor;
}

/** Everything a quote adds up to. Throws MoneyInputError for malformed input. */
export function computeQuoteTotals(input: QuoteInput): QuoteTotals {
  if (typeof input !== 'object' || input === null || !Array.isArray(input.lines)) {
    throw new MoneyInputError('bad-quote', 'lines', 'A quote needs a list of lines (it may be empty).');
  }
  const { lines, vatRounding } = input;
  if (!VAT_ROUNDINGS.includes(vatRounding)) {
    throw new MoneyInputError('bad-vat-rounding', 'vatRounding', `vatRounding must be one of ${VAT_ROUNDINGS.join(', ')}.`);
  }
  if (input.discount) checkDiscount(input.discount, 'discount');
  if (input.deposit) checkDiscount(input.deposit, 'deposit');
  const findings: Finding[] = [];
  const n = lines.length;
  const ids = new LineIdRegister(lines, n);
  const groups = new Map<string, number[]>();
  // Each line's output record is made in the first pass, with its figures before the quote
  // discount; the second pass touches only the records (never the input again), taking the
  // quote discount's share off the counted ones and working out their VAT. On a long
  // estimate that is what keeps the work linear: the input is read once, from start to end.
  const out = new Array<QuoteLineTotal>(n);
  /** The counted lines' nets before the quote discount: the weights its shares go by. */
  const includedNet = new Float64Array(n);
  let includedCount = 0;
  let missingCost = 0;
  let grossSum = 0;
  let lineDiscountSum = 0;
  let preQuoteNet = 0;

  for (let i = 0; i < n; i++) {
    const line = lines[i]!;
    if (typeof line !== 'object' || line === null) {
      throw new MoneyInputError(
        'bad-line',
        `lines[${i}]`,
        `lines[${i}] must be a line with an id, quantity, unit price and VAT rate.`,
      );
    }
    if (typeof line.id !== 'string' || line.id === '') {
      throw new MoneyInputError('missing-id', `lines[${i}].id`, `lines[${i}] needs an id.`);
    }
    const earlier = ids.add(line.id, i);
    if (earlier !== -1) {
      throw new MoneyInputError('duplicate-id', `lines[${i}].id`, `Line id "${line.id}" is used twice (lines ${earlier + 1} and ${i + 1}).`);
    }
    if (!isCount(line.quantityMilli)) assertNonNegativeInteger(line.quantityMilli, `lines[${i}].quantityMilli`);
    if (!isCount(line.unitPriceMinor)) assertNonNegativeInteger(line.unitPriceMinor, `lines[${i}].unitPriceMinor`);
    if (!isCount(line.vatRateBp)) assertNonNegativeInteger(line.vatRateBp, `lines[${i}].vatRateBp`);
    if (line.vatRateBp > BASIS_POINTS) {
      throw new MoneyInputError('percent-over-100', `lines[${i}].vatRateBp`, `lines[${i}] has a VAT rate over 100 %.`);
    }
    if (line.unitCostMinor !== undefined && !isCount(line.unitCostMinor))
      assertNonNegativeInteger(line.unitCostMinor, `lines[${i}].unitCostMinor`);
    if (line.discount) checkDiscount(line.discount, i);
    if (line.alternativeGroup !== undefined && (typeof line.alternativeGroup !== 'string' || line.alternativeGroup === '')) {
      throw new MoneyInputError(
        'bad-group',
        `lines[${i}].alternativeGroup`,
        `lines[${i}].alternativeGroup must be a non-empty name.`,
      );
    }
    if (line.optional && line.alternativeGroup !== undefined) {
      throw new MoneyInputError(
        'optional-and-alternative',
        `lines[${i}]`,
        `Line "${line.id}" is both optional and part of a pick-one group; make it one or the other.`,
      );
    }

    const grossMinor = extendMinor(line.quantityMilli, line.unitPriceMinor, 'half-up');
    let lineDiscountMinor = 0;
    if (line.discount) {
      lineDiscountMinor = takeFrom(grossMinor, line.discount);
      if (capped(grossMinor, line.discount)) {
        findings.push(
          finding(
            'line-discount-capped',
            'warning',
            `The discount on line "${line.id}" is more than the line; it has been limited to the line amount.`,
            {
              subject: `line:${line.id}`,
              values: { discountMinor: line.discount.kind === 'fixed' ? line.discount.amountMinor : 0, grossMinor },
            },
          ),
        );
      }
    }
    const costMinor = line.unitCostMinor === undefined ? 0 : extendMinor(line.quantityMilli, line.unitCostMinor, 'half-up');
    const netMinor = grossMinor - lineDiscountMinor;
    let included = true;
    if (line.alternativeGroup !== undefined) {
      const g = groups.get(line.alternativeGroup);
      if (g) g.push(i);
      else groups.set(line.alternativeGroup, [i]);
      included = line.selected === true;
    } else if (line.optional) {
      included = line.selected === true;
    }
    if (included) {
      includedNet[includedCount] = netMinor;
      includedCount++;
      if (line.unitCostMinor === undefined) missingCost++;
      grossSum += grossMinor;
      lineDiscountSum += lineDiscountMinor;
      preQuoteNet += netMinor;
    }
    out[i] = {
      id: line.id,
      included,
      grossMinor,
      lineDiscountMinor,
      quoteDiscountMinor: 0,
      netMinor,
      vatRateBp: line.vatRateBp,
      vatTenths: null,
      costMinor,
      marginMinor: netMinor - costMinor,
    };
  }

  let excludedLater = false;
  for (const [group, members] of groups) {
    const chosen: number[] = [];
    for (const i of members) if (out[i]!.included) chosen.push(i);
    if (chosen.length === 0) {
      findings.push(
        finding(
          'alternative-none-chosen',
          'error',
          `Pick one of the alternatives in "${group}"; none is chosen, so the group adds nothing yet.`,
          {
            subject: `group:${group}`,
            values: { alternatives: members.length },
          },
        ),
      );
    } else if (chosen.length > 1) {
      for (let c = 1; c < chosen.length; c++) out[chosen[c]!]!.included = false;
      excludedLater = true;
      findings.push(
        finding(
          'alternative-several-chosen',
          'error',
          `Only one alternative in "${group}" can be chosen; ${chosen.length} are. Only the first ("${lines[chosen[0]!]!.id}") is counted.`,
          {
            subject: `group:${group}`,
            values: { chosen: chosen.length },
          },
        ),
      );
    }
  }

  if (excludedLater) {
    // a pick-one group had several chosen: sum again over the lines still counted (rare)
    includedCount = 0;
    missingCost = 0;
    grossSum = 0;
    lineDiscountSum = 0;
    preQuoteNet = 0;
    for (let i = 0; i < n; i++) {
      const o = out[i]!;
      if (!o.included) continue;
      includedNet[includedCount] = o.netMinor;
      includedCount++;
      if (lines[i]!.unitCostMinor === undefined) missingCost++;
      grossSum += o.grossMinor;
      lineDiscountSum += o.lineDiscountMinor;
      preQuoteNet += o.netMinor;
    }
  }
  if (!Number.isSafeInteger(grossSum)) {
    throw new MoneyInputError('result-out-of-range', 'lines', 'The quote adds up to more than can be held exactly.');
  }

  let quoteDiscountMinor = 0;
  /** Each counted line's share of the quote discount, in line order; null when none. */
  let shares: number[] | null = null;
  if (input.discount) {
    quoteDiscountMinor = takeFrom(preQuoteNet, input.discount);
    if (capped(preQuoteNet, input.discount)) {
      findings.push(
        finding(
          'quote-discount-capped',
          'warning',
          'The discount on the quote is more than the quote; it has been limited to the quote amount.',
          {
            subject: 'quote',
            values: { netBeforeDiscountMinor: preQuoteNet },
          },
        ),
      );
    }
    if (quoteDiscountMinor > 0) {
      shares = allocateMinor(quoteDiscountMinor, includedNet.subarray(0, includedCount));
    }
  }

  const rates = new Map<number, { netMinor: number; vatTenths: number }>();
  let netMinor = 0;
  let costMinor = 0;
  // estimates run long stretches at one rate: look the rate up only when it changes
  let lastRateBp = -1;
  let r: { netMinor: number; vatTenths: number } | undefined;
  let k = 0; // index among the counted lines
  for (let i = 0; i < n; i++) {
    const o = out[i]!;
    if (!o.included) continue;
    let lineNet = o.netMinor;
    if (shares !== null) {
      const share = shares[k]!;
      k++;
      if (share !== 0) {
        lineNet -= share;
        o.quoteDiscountMinor = share;
        o.netMinor = lineNet;
        o.marginMinor = lineNet - o.costMinor;
      }
    }
    const rateBp = o.vatRateBp;
    const vatTenths = lineVatTenths(lineNet, rateBp, vatRounding);
    o.vatTenths = vatTenths;
    if (rateBp !== lastRateBp || r === undefined) {
      lastRateBp = rateBp;
      r = rates.get(rateBp);
      if (!r) {
        r = { netMinor: 0, vatTenths: 0 };
        rates.set(rateBp, r);
      }
    }
    r.netMinor += lineNet;
    if (vatTenths !== null) r.vatTenths += vatTenths;
    netMinor += lineNet;
    costMinor += o.costMinor;
  }
  const vat = vatByRate(rates, vatRounding);
  const totalMinor = netMinor + vat.vatMinor;
  if (!Number.isSafeInteger(totalMinor) || !Number.isSafeInteger(costMinor)) {
    throw new MoneyInputError('result-out-of-range', 'lines', 'The quote adds up to more than can be held exactly.');
  }

  let deposit: DepositSplit | null = null;
  if (input.deposit) {
    const depositMinor = takeFrom(totalMinor, input.deposit);
    if (capped(totalMinor, input.deposit)) {
      findings.push(
        finding(
          'deposit-capped',
          'warning',
          'The deposit asked is more than the quote total; it has been limited to the total.',
          {
            subject: 'deposit',
            values: { totalMinor },
          },
        ),
      );
    }
    deposit = { depositMinor, balanceMinor: totalMinor - depositMinor };
  }

  if (missingCost > 0) {
    findings.push(
      finding(
        'cost-missing',
        'info',
        `${missingCost} line(s) have no cost, so the gross margin counts them as costing nothing.`,
        {
          subject: 'quote',
          values: { lines: missingCost },
        },
      ),
    );
  }

  return {
    lines: out,
    grossMinor: grossSum,
    lineDiscountMinor: lineDiscountSum,
    quoteDiscountMinor,
    netMinor,
    vatByRate: vat.byRate,
    vatMinor: vat.vatMinor,
    totalMinor,
    costMinor,
    grossMarginMinor: netMinor - costMinor,
    grossMarginBp: marginOf(netMinor, costMinor),
    deposit,
    findings,
  };
}
