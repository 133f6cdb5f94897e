import { CustomerListResponse, CustomerResponse } from '@gloaming/contracts';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from './quote-keys';

/** GET /api/customers?search=: for the new-quote picker (the customers feature owns the full list). */
export async function searchCustomers(search: string, signal?: AbortSignal): Promise<CustomerListResponse> {
  const params = new URLSearchParams({ search, pageSize: '8', sort: 'name' });
  return apiRequest(`/customers?${params.toString()}`, { schema: CustomerListResponse, signal });
}

export function useCustomerSearch(search: string) {
  return useQuery({ queryKey: quoteKeys.customerSearch(search), queryFn: ({ signal }) => searchCustomers(search, signal), placeholderData: keepPreviousData });
}

/** GET /api/customers/:id: the customer's sites for the picker. */
export async function fetchCustomer(id: string, signal?: AbortSignal): Promise<CustomerResponse> {
  return apiRequest(`/customers/${encodeURIComponent(id)}`, { schema: CustomerResponse, signal });
}

export function useCustomerSites(id: string | null) {
  return useQuery({ queryKey: quoteKeys.customer(id ?? ''), queryFn: ({ signal }) => fetchCustomer(id ?? '', signal), enabled: id !== null });
}
