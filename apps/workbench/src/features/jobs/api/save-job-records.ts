import {
  SaveAsWiredResponse,
  SaveCommissioningResponse,
  type JobPackResponse,
  type SaveAsWiredRequest,
  type SaveCommissioningRequest,
} from '@gloaming/contracts';
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { jobPath } from './get-job-pack';
import { jobKeys } from './job-keys';

const circuitPath = (jobId: string, circuitId: string) => `${jobPath(jobId)}/circuits/${encodeURIComponent(circuitId)}`;

/** PUT /api/jobs/:id/circuits/:circuitId/as-wired (409 when the version is stale). */
export function saveAsWired(jobId: string, circuitId: string, request: SaveAsWiredRequest): Promise<SaveAsWiredResponse> {
  return apiRequest(`${circuitPath(jobId, circuitId)}/as-wired`, { method: 'PUT', body: request, schema: SaveAsWiredResponse });
}

/** PUT /api/jobs/:id/circuits/:circuitId/commissioning (409 when the version is stale). */
export function saveCommissioning(
  jobId: string,
  circuitId: string,
  request: SaveCommissioningRequest,
): Promise<SaveCommissioningResponse> {
  return apiRequest(`${circuitPath(jobId, circuitId)}/commissioning`, {
    method: 'PUT',
    body: request,
    schema: SaveCommissioningResponse,
  });
}

function patchCircuit(
  client: QueryClient,
  jobId: string,
  circuitId: string,
  patch: Partial<JobPackResponse['circuits'][number]>,
) {
  client.setQueryData<JobPackResponse>(jobKeys.pack(jobId), (old) =>
    old ? { ...old, circuits: old.circuits.map((c) => (c.id === circuitId ? { ...c, ...patch } : c)) } : old,
  );
}

export function useSaveAsWired(jobId: string, circuitId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (request: SaveAsWiredRequest) => saveAsWired(jobId, circuitId, request),
    onSuccess: (saved) => patchCircuit(client, jobId, circuitId, { asWired: saved.asWired }),
  });
}

export function useSaveCommissioning(jobId: string, circuitId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (request: SaveCommissioningRequest) => saveCommissioning(jobId, circuitId, request),
    onSuccess: (saved) => patchCircuit(client, jobId, circuitId, { commissioning: saved.commissioning }),
  });
}
