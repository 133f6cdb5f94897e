import { CustomerResponse, type Customer, type CustomerUpdate } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { customerKeys } from './customer-keys';

/** PATCH /api/customers/:id with the version the edit was based on (409 when stale). */
export async function updateCustomer({ id, input }: { id: string; input: CustomerUpdate }): Promise<Customer> {
  const { customer } = await apiRequest(`/customers/${encodeURIComponent(id)}`, { method: 'PATCH', body: input, schema: CustomerResponse });
  return customer;
}

export function useUpdateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateCustomer,
    onSuccess: (customer) => {
      queryClient.setQueryData(customerKeys.detail(customer.id), customer);
      return queryClient.invalidateQueries({ queryKey: customerKeys.lists() });
    },
  });
}
