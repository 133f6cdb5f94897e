import { FigurePeriod, type FiguresQuery } from '@gloaming/contracts';

/** The period in the address bar: ?period=last-3-months, or custom with from/to. */
export function figuresQueryFrom(search: URLSearchParams): FiguresQuery {
  const period = FigurePeriod.safeParse(search.get('period'));
  const p = period.success ? period.data : 'last-12-months';
  if (p !== 'custom') return { period: p };
  return { period: p, from: search.get('from') ?? '', to: search.get('to') ?? '' };
}
