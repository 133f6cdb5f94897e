/** Amounts are integers in the currency's minor unit (REFERENCES.md, payments). */
const currencies = new Set(Intl.supportedValuesOf('currency').map((c) => c.toLowerCase()));

export const isCurrency = (code: string): boolean => currencies.has(code.toLowerCase());

/** "£12.34" for (1234, 'gbp'); zero-decimal currencies such as JPY keep their integer. */
export function formatAmount(minor: number, currency: string): string {
  const format = new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(minor / 10 ** digits);
}
