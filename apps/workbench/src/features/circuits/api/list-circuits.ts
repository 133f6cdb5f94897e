import { CircuitListResponse } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { circuitKeys } from './circuit-keys';

export const circuitsPath = (quoteId: string, revisionNumber: number) =>
  `/quotes/${encodeURIComponent(quoteId)}/revisions/${revisionNumber}`;

/** GET /api/quotes/:id/revisions/:n/circuits: the circuits, their stored checks and the products they name. */
export function fetchCircuits(quoteId: string, revisionNumber: number, signal?: AbortSignal): Promise<CircuitListResponse> {
  return apiRequest(`${circuitsPath(quoteId, revisionNumber)}/circuits`, { schema: CircuitListResponse, signal });
}

export const circuitsQueryOptions = (quoteId: string, revisionNumber: number) =>
  queryOptions({
    queryKey: circuitKeys.revision(quoteId, revisionNumber),
    queryFn: ({ signal }) => fetchCircuits(quoteId, revisionNumber, signal),
  });

export function useCircuits(quoteId: string, revisionNumber: number) {
  return useQuery(circuitsQueryOptions(quoteId, revisionNumber));
}
