import { ProductResponse, type DeactivateProductRequest, type Product, type ProductInput, type ProductUpdate } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { catalogueKeys } from './catalogue-keys';

/** POST /api/products */
export async function createProduct(input: ProductInput): Promise<Product> {
  return (await apiRequest('/products', { method: 'POST', body: input, schema: ProductResponse })).product;
}

/** PUT /api/products/:id with the version the edit was based on. */
export async function updateProduct({ id, input }: { id: string; input: ProductUpdate }): Promise<Product> {
  return (await apiRequest(`/products/${encodeURIComponent(id)}`, { method: 'PUT', body: input, schema: ProductResponse })).product;
}

/** POST /api/products/:id/deactivate */
export async function deactivateProduct({ id, input }: { id: string; input: DeactivateProductRequest }): Promise<Product> {
  return (await apiRequest(`/products/${encodeURIComponent(id)}/deactivate`, { method: 'POST', body: input, schema: ProductResponse })).product;
}

function useCatalogueMutation<V, R>(fn: (vars: V) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: catalogueKeys.lists() }) });
}

export const useCreateProduct = () => useCatalogueMutation(createProduct);
export const useUpdateProduct = () => useCatalogueMutation(updateProduct);
export const useDeactivateProduct = () => useCatalogueMutation(deactivateProduct);
