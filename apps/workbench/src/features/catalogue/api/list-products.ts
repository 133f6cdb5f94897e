import { ProductListResponse } from '@gloaming/contracts';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { catalogueKeys, type ProductListState } from './catalogue-keys';

/** GET /api/products filtered by kind, search and active flag, one page at a time. */
export function fetchProducts(query: ProductListState, signal?: AbortSignal): Promise<ProductListResponse> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== '') params.set(key, String(value));
  return apiRequest(`/products?${params.toString()}`, { schema: ProductListResponse, signal });
}

export const productsQueryOptions = (query: ProductListState) =>
  queryOptions({ queryKey: catalogueKeys.list(query), queryFn: ({ signal }) => fetchProducts(query, signal), placeholderData: keepPreviousData });

export function useProducts(query: ProductListState) {
  return useQuery(productsQueryOptions(query));
}
