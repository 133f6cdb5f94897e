import { CustomerResponse, type Customer } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { customerKeys } from './customer-keys';

/** GET /api/customers/:id: the customer with every site. */
export async function fetchCustomer(id: string, signal?: AbortSignal): Promise<Customer> {
  const { customer } = await apiRequest(`/customers/${encodeURIComponent(id)}`, { schema: CustomerResponse, signal });
  return customer;
}

export const customerQueryOptions = (id: string) =>
  queryOptions({ queryKey: customerKeys.detail(id), queryFn: ({ signal }) => fetchCustomer(id, signal) });

export function useCustomer(id: string) {
  return useQuery(customerQueryOptions(id));
}
