import { CustomerListResponse, type CustomerListQuery } from '@gloaming/contracts';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { customerKeys } from './customer-keys';

/** GET /api/customers with search, sort, contact filter and page in the query string. */
export function fetchCustomers(query: CustomerListQuery, signal?: AbortSignal): Promise<CustomerListResponse> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined && value !== '') params.set(key, String(value));
  return apiRequest(`/customers?${params.toString()}`, { schema: CustomerListResponse, signal });
}

export const customersQueryOptions = (query: CustomerListQuery) =>
  queryOptions({
    queryKey: customerKeys.list(query),
    queryFn: ({ signal }) => fetchCustomers(query, signal),
    placeholderData: keepPreviousData,
  });

export function useCustomers(query: CustomerListQuery) {
  return useQuery(customersQueryOptions(query));
}
