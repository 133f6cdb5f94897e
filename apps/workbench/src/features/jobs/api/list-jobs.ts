import { JobListResponse } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { jobKeys } from './job-keys';

/** GET /api/jobs: the firm's approved jobs, without prices. */
export function fetchJobs(signal?: AbortSignal): Promise<JobListResponse> {
  return apiRequest('/jobs', { schema: JobListResponse, signal });
}

export const jobsQueryOptions = () => queryOptions({ queryKey: jobKeys.list(), queryFn: ({ signal }) => fetchJobs(signal) });

export function useJobs() {
  return useQuery(jobsQueryOptions());
}
