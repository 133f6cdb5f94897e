import { formatBasisPoints, formatMoney, formatQuantityMilli } from '@gloaming/engine';

/** Money, rates, quantities and dates as the firm's locale writes them. */
export function formatters(currency: string, locale: string) {
  const dates = new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
  return {
    money: (minor: number) => formatMoney(minor, currency, locale),
    rate: (bp: number) => formatBasisPoints(bp, locale),
    quantity: (milli: number, unit: string) => `${formatQuantityMilli(milli)}${unit ? ` ${unit}` : ''}`,
    date: (iso: string) => dates.format(new Date(iso)),
  };
}
export type Formatters = ReturnType<typeof formatters>;
