import {
  CircuitDeleteResponse,
  CircuitSaveResponse,
  type CircuitListResponse,
  type CreateCircuitRequest,
  type UpdateCircuitRequest,
} from '@gloaming/contracts';
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from '../../quotes/api/quote-keys';
import { circuitKeys } from './circuit-keys';
import { circuitsPath } from './list-circuits';

/** POST /api/quotes/:id/revisions/:n/circuits */
export function createCircuit(
  quoteId: string,
  revisionNumber: number,
  request: CreateCircuitRequest,
): Promise<CircuitSaveResponse> {
  return apiRequest(`${circuitsPath(quoteId, revisionNumber)}/circuits`, {
    method: 'POST',
    body: request,
    schema: CircuitSaveResponse,
  });
}

/** PUT /api/quotes/:id/revisions/:n/circuits/:circuitId (409 when the version is stale). */
export function updateCircuit(
  quoteId: string,
  revisionNumber: number,
  circuitId: string,
  request: UpdateCircuitRequest,
): Promise<CircuitSaveResponse> {
  return apiRequest(`${circuitsPath(quoteId, revisionNumber)}/circuits/${encodeURIComponent(circuitId)}`, {
    method: 'PUT',
    body: request,
    schema: CircuitSaveResponse,
  });
}

/** DELETE /api/quotes/:id/revisions/:n/circuits/:circuitId: the circuit and its derived lines. */
export function deleteCircuit(quoteId: string, revisionNumber: number, circuitId: string): Promise<CircuitDeleteResponse> {
  return apiRequest(`${circuitsPath(quoteId, revisionNumber)}/circuits/${encodeURIComponent(circuitId)}`, {
    method: 'DELETE',
    schema: CircuitDeleteResponse,
  });
}

/** A saved circuit into the cached list, then the quote refetched: its derived lines and version moved. */
function afterSave(client: QueryClient, quoteId: string, revisionNumber: number, saved: CircuitSaveResponse) {
  client.setQueryData<CircuitListResponse>(circuitKeys.revision(quoteId, revisionNumber), (old) => {
    if (!old) return old;
    const others = old.circuits.filter((c) => c.id !== saved.circuit.id);
    const known = new Set(saved.products.map((p) => p.id));
    return {
      ...old,
      circuits: [...others, saved.circuit].sort((a, b) => a.position - b.position),
      products: [...old.products.filter((p) => !known.has(p.id)), ...saved.products],
      revision: saved.revision,
    };
  });
  void client.invalidateQueries({ queryKey: quoteKeys.detail(quoteId) });
}

export function useCreateCircuit(quoteId: string, revisionNumber: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateCircuitRequest) => createCircuit(quoteId, revisionNumber, request),
    onSuccess: (saved) => afterSave(client, quoteId, revisionNumber, saved),
  });
}

export function useUpdateCircuit(quoteId: string, revisionNumber: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ circuitId, request }: { circuitId: string; request: UpdateCircuitRequest }) =>
      updateCircuit(quoteId, revisionNumber, circuitId, request),
    onSuccess: (saved) => afterSave(client, quoteId, revisionNumber, saved),
  });
}

export function useDeleteCircuit(quoteId: string, revisionNumber: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (circuitId: string) => deleteCircuit(quoteId, revisionNumber, circuitId),
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: circuitKeys.revision(quoteId, revisionNumber) });
      void client.invalidateQueries({ queryKey: quoteKeys.detail(quoteId) });
    },
  });
}
