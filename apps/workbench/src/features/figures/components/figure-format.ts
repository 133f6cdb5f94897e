import type { CsvCell } from '../../../lib/csv';

/** Formatters for one firm's currency and locale; CSV cells carry the same numbers unformatted. */
export function figureFormat(locale: string, currency: string) {
  const money = new Intl.NumberFormat(locale, { style: 'currency', currency });
  const count = new Intl.NumberFormat(locale);
  const pct = new Intl.NumberFormat(locale, { style: 'percent', maximumFractionDigits: 1 });
  const days = new Intl.NumberFormat(locale, { maximumFractionDigits: 1 });
  return {
    money: (minor: number | null) => (minor === null ? '–' : money.format(minor / 100)),
    moneyCsv: (minor: number | null): CsvCell => (minor === null ? null : minor / 100),
    count: (n: number) => count.format(n),
    rate: (bp: number | null) => (bp === null ? '–' : pct.format(bp / 10_000)),
    rateCsv: (bp: number | null): CsvCell => (bp === null ? null : Math.round(bp / 10) / 10),
    days: (d: number | null) => (d === null ? '–' : `${days.format(d)} d`),
    month: (key: string) =>
      new Intl.DateTimeFormat(locale, { month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
        new Date(`${key}-01T00:00:00Z`),
      ),
    date: (iso: string) =>
      new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(iso)),
  };
}
export type FigureFormat = ReturnType<typeof figureFormat>;
