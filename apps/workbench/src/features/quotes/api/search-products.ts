import { ProductListResponse } from '@gloaming/contracts';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from './quote-keys';

/** GET /api/products?search=: active catalogue products for the grid's type-ahead picker. */
export async function searchProducts(search: string, signal?: AbortSignal): Promise<ProductListResponse> {
  const params = new URLSearchParams({ search, pageSize: '12', active: 'active', sort: 'name' });
  return apiRequest(`/products?${params.toString()}`, { schema: ProductListResponse, signal });
}

export function useProductSearch(search: string, enabled: boolean) {
  return useQuery({
    queryKey: quoteKeys.productSearch(search),
    queryFn: ({ signal }) => searchProducts(search, signal),
    enabled,
    placeholderData: keepPreviousData,
    staleTime: 30_000,
  });
}
