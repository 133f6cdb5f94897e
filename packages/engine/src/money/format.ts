/**
 * Currency text, only at the edges (display and typed input). Formatting builds an exact
 * decimal string from the integer and hands it to Intl.NumberFormat, so no float ever
 * touches an amount.
 */
import { assertSafeInteger } from './integer-math';
import { parseScaledDecimal, type DecimalParseResult } from './quantity';

const formatters = new Map<string, Intl.NumberFormat>();

function formatter(key: string, make: () => Intl.NumberFormat): Intl.NumberFormat {
  let f = formatters.get(key);
  if (!f) {
    f = make();
    formatters.set(key, f);
  }
  return f;
}

/** Number of minor-unit digits Intl uses for a currency (GBP 2, JPY 0, BHD 3). */
export function currencyDigits(currency: string): number {
  const f = formatter(`digits|${currency}`, () => new Intl.NumberFormat('en', { style: 'currency', currency }));
  return f.resolvedOptions().maximumFractionDigits ?? 2;
}

/** Minor units -> exact decimal string: 123456 (GBP) -> "1234.56". */
export function minorToDecimalString(amountMinor: number, digits: number): string {
  assertSafeInteger(amountMinor, 'amountMinor');
  const negative = amountMinor < 0;
  const abs = Math.abs(amountMinor).toString();
  if (digits === 0) return `${negative ? '-' : ''}${abs}`;
  const padded = abs.padStart(digits + 1, '0');
  return `${negative ? '-' : ''}${padded.slice(0, -digits)}.${padded.slice(-digits)}`;
}

/** Format minor units as currency text: formatMoney(123456) -> "£1,234.56". */
export function formatMoney(amountMinor: number, currency = 'GBP', locale = 'en-GB'): string {
  const digits = currencyDigits(currency);
  const text = minorToDecimalString(amountMinor, digits) as `${number}`;
  const f = formatter(
    `money|${locale}|${currency}`,
    () =>
      new Intl.NumberFormat(locale, {
        style: 'currency',
        currency,
        minimumFractionDigits: digits,
        maximumFractionDigits: digits,
      }),
  );
  return f.format(text);
}

/** Format basis points as a percentage: 2000 -> "20%", 1250 -> "12.5%". */
export function formatBasisPoints(bp: number, locale = 'en-GB'): string {
  assertSafeInteger(bp, 'bp');
  const text = minorToDecimalString(bp, 4) as `${number}`; // bp / 10000 as a fraction
  const f = formatter(`percent|${locale}`, () => new Intl.NumberFormat(locale, { style: 'percent', maximumFractionDigits: 2 }));
  return f.format(text);
}

/**
 * Typed amount -> minor units, exactly: "1234.5" -> 123450 for GBP. A leading currency
 * symbol or thousands separators must be stripped by the caller; more decimals than the
 * currency has are refused rather than rounded.
 */
export function parseMoney(text: string, currency = 'GBP'): DecimalParseResult {
  return parseScaledDecimal(text, currencyDigits(currency), `an amount in ${currency}`);
}
