import { ActivityResponse } from '@gloaming/contracts';
import { infiniteQueryOptions, keepPreviousData, useInfiniteQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { activityKeys, type ActivityFilters } from './activity-keys';

export const ACTIVITY_PAGE_SIZE = 50;

/** Where the next page starts: the last entry seen (its time and id), or null for the newest. */
export type ActivityCursor = { before: string; beforeId: string | null } | null;

const cursorAfter = (last: ActivityResponse): ActivityCursor =>
  last.nextBefore ? { before: last.nextBefore, beforeId: last.nextBeforeId } : null;

function query(cursor: ActivityCursor, extra: Record<string, string | undefined> = {}) {
  const params = new URLSearchParams({ limit: String(ACTIVITY_PAGE_SIZE) });
  if (cursor) {
    params.set('before', cursor.before);
    if (cursor.beforeId) params.set('beforeId', cursor.beforeId);
  }
  for (const [k, v] of Object.entries(extra)) if (v) params.set(k, v);
  return params.toString();
}

/** GET /api/activity (owner only): the firm's log, newest first, a page after `cursor`. */
export async function fetchFirmActivity(filters: ActivityFilters, cursor: ActivityCursor, signal?: AbortSignal) {
  return apiRequest(`/activity?${query(cursor, { actorId: filters.actorId, kind: filters.kind })}`, {
    schema: ActivityResponse,
    ...(signal ? { signal } : {}),
  });
}

/** GET /api/quotes/:id/activity (owner only): one quote's log. */
export async function fetchQuoteActivity(quoteId: string, cursor: ActivityCursor, signal?: AbortSignal) {
  return apiRequest(`/quotes/${quoteId}/activity?${query(cursor)}`, { schema: ActivityResponse, ...(signal ? { signal } : {}) });
}

export const firmActivityQueryOptions = (filters: ActivityFilters) =>
  infiniteQueryOptions({
    queryKey: activityKeys.firm(filters),
    queryFn: ({ pageParam, signal }) => fetchFirmActivity(filters, pageParam, signal),
    initialPageParam: null as ActivityCursor,
    getNextPageParam: cursorAfter,
    placeholderData: keepPreviousData,
  });

export const quoteActivityQueryOptions = (quoteId: string) =>
  infiniteQueryOptions({
    queryKey: activityKeys.quote(quoteId),
    queryFn: ({ pageParam, signal }) => fetchQuoteActivity(quoteId, pageParam, signal),
    initialPageParam: null as ActivityCursor,
    getNextPageParam: cursorAfter,
  });

export function useFirmActivity(filters: ActivityFilters) {
  return useInfiniteQuery(firmActivityQueryOptions(filters));
}

export function useQuoteActivity(quoteId: string, enabled = true) {
  return useInfiniteQuery({ ...quoteActivityQueryOptions(quoteId), enabled });
}
