import { CustomerResponse, type Customer, type CustomerInput } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { customerKeys } from './customer-keys';

/** POST /api/customers: a customer with at least one site. */
export async function createCustomer(input: CustomerInput): Promise<Customer> {
  const { customer } = await apiRequest('/customers', { method: 'POST', body: input, schema: CustomerResponse });
  return customer;
}

export function useCreateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCustomer,
    onSuccess: (customer) => {
      queryClient.setQueryData(customerKeys.detail(customer.id), customer);
      return queryClient.invalidateQueries({ queryKey: customerKeys.lists() });
    },
  });
}
