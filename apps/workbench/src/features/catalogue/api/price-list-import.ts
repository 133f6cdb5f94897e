import { ImportJobResponse, PreviewResponse, PriceListUploadResponse, type ColumnMapping, type ImportJob } from '@gloaming/contracts';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { catalogueKeys } from './catalogue-keys';

/** POST /api/product-imports (multipart): the file's columns and a suggested mapping. */
export function uploadPriceList({ supplier, file }: { supplier: string; file: File }): Promise<PriceListUploadResponse> {
  const body = new FormData();
  body.set('supplier', supplier);
  body.set('file', file);
  return apiRequest('/product-imports', { method: 'POST', body, schema: PriceListUploadResponse });
}

/** POST /api/product-imports/:id/preview: the first rows checked against the mapping. */
export function previewImport({ jobId, mapping }: { jobId: string; mapping: ColumnMapping }): Promise<PreviewResponse> {
  return apiRequest(`/product-imports/${encodeURIComponent(jobId)}/preview`, { method: 'POST', body: mapping, schema: PreviewResponse });
}

/** POST /api/product-imports/:id/run: starts the import; poll the job for progress. */
export async function runImport({ jobId, mapping }: { jobId: string; mapping: ColumnMapping }): Promise<ImportJob> {
  return (await apiRequest(`/product-imports/${encodeURIComponent(jobId)}/run`, { method: 'POST', body: mapping, schema: ImportJobResponse })).job;
}

/** GET /api/product-imports/:id */
export async function fetchImportJob(id: string, signal?: AbortSignal): Promise<ImportJob> {
  return (await apiRequest(`/product-imports/${encodeURIComponent(id)}`, { schema: ImportJobResponse, signal })).job;
}

/** Polls twice a second while the import runs, then stops. */
export const importJobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: catalogueKeys.importJob(id),
    queryFn: ({ signal }) => fetchImportJob(id, signal),
    refetchInterval: (query) => (query.state.data?.state === 'running' ? 500 : false),
    staleTime: 0,
  });

export function useImportJob(id: string | undefined) {
  return useQuery({ ...importJobQueryOptions(id ?? ''), enabled: Boolean(id) });
}

export const rejectionsCsvUrl = (jobId: string) => `/api/product-imports/${encodeURIComponent(jobId)}/rejections.csv`;

export const useUploadPriceList = () => useMutation({ mutationFn: uploadPriceList });
export const usePreviewImport = () => useMutation({ mutationFn: previewImport });

export function useRunImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runImport,
    onSuccess: (job) => {
      queryClient.setQueryData(catalogueKeys.importJob(job.id), job);
      return queryClient.invalidateQueries({ queryKey: catalogueKeys.lists() });
    },
  });
}
