import { JobPackResponse } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { jobKeys } from './job-keys';

export const jobPath = (jobId: string) => `/jobs/${encodeURIComponent(jobId)}`;

/** Where the browser downloads the pack PDF (same origin, the session cookie travels). */
export const jobPackPdfUrl = (jobId: string) => `/api${jobPath(jobId)}/pack.pdf`;

/** GET /api/jobs/:id: the installer's pack. */
export function fetchJobPack(jobId: string, signal?: AbortSignal): Promise<JobPackResponse> {
  return apiRequest(jobPath(jobId), { schema: JobPackResponse, signal });
}

export const jobPackQueryOptions = (jobId: string) =>
  queryOptions({ queryKey: jobKeys.pack(jobId), queryFn: ({ signal }) => fetchJobPack(jobId, signal) });

export function useJobPack(jobId: string) {
  return useQuery(jobPackQueryOptions(jobId));
}
