import { FiguresResponse, type FiguresQuery } from '@gloaming/contracts';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { figuresKeys } from './figures-keys';

/** GET /api/figures (owner only): the period's figures beside the period before it. */
export async function fetchFigures(q: FiguresQuery, signal?: AbortSignal) {
  const params = new URLSearchParams({ period: q.period ?? 'last-12-months' });
  if (q.period === 'custom') {
    if (q.from) params.set('from', q.from);
    if (q.to) params.set('to', q.to);
  }
  return apiRequest(`/figures?${params.toString()}`, { schema: FiguresResponse, ...(signal ? { signal } : {}) });
}

export const figuresQueryOptions = (q: FiguresQuery) =>
  queryOptions({
    queryKey: figuresKeys.period(q),
    queryFn: ({ signal }) => fetchFigures(q, signal),
    placeholderData: keepPreviousData,
  });

export function useFigures(q: FiguresQuery) {
  return useQuery(figuresQueryOptions(q));
}
