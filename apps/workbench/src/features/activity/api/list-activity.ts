import { ActivityResponse } from '@gloaming/contracts';
import { infiniteQueryOptions, keepPreviousData, useInfiniteQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { activityKeys, type ActivityFilters } from './activity-keys';

export const ACTIVITY_PAGE_SIZE = 50;

function query(before: string | null, extra: Record<string, string | undefined> = {}) {
  const params = new URLSearchParams({ limit: String(ACTIVITY_PAGE_SIZE) });
  if (before) params.set('before', before);
  for (const [k, v] of Object.entries(extra)) if (v) params.set(k, v);
  return params.toString();
}

/** GET /api/activity (owner only): the firm's log, newest first, a page before `before`. */
export async function fetchFirmActivity(filters: ActivityFilters, before: string | null, signal?: AbortSignal) {
  return apiRequest(`/activity?${query(before, { actorId: filters.actorId, kind: filters.kind })}`, {
    schema: ActivityResponse,
    ...(signal ? { signal } : {}),
  });
}

/** GET /api/quotes/:id/activity (owner only): one quote's log. */
export async function fetchQuoteActivity(quoteId: string, before: string | null, signal?: AbortSignal) {
  return apiRequest(`/quotes/${quoteId}/activity?${query(before)}`, { schema: ActivityResponse, ...(signal ? { signal } : {}) });
}

export const firmActivityQueryOptions = (filters: ActivityFilters) =>
  infiniteQueryOptions({
    queryKey: activityKeys.firm(filters),
    queryFn: ({ pageParam, signal }) => fetchFirmActivity(filters, pageParam, signal),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextBefore,
    placeholderData: keepPreviousData,
  });

export const quoteActivityQueryOptions = (quoteId: string) =>
  infiniteQueryOptions({
    queryKey: activityKeys.quote(quoteId),
    queryFn: ({ pageParam, signal }) => fetchQuoteActivity(quoteId, pageParam, signal),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextBefore,
  });

export function useFirmActivity(filters: ActivityFilters) {
  return useInfiniteQuery(firmActivityQueryOptions(filters));
}

export function useQuoteActivity(quoteId: string, enabled = true) {
  return useInfiniteQuery({ ...quoteActivityQueryOptions(quoteId), enabled });
}
