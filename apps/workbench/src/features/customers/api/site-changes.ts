import { SiteResponse, type CustomerSite, type SiteInput, type SiteUpdate } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, noContent } from '../../../lib/http-client';
import { customerKeys } from './customer-keys';

const sitesPath = (customerId: string) => `/customers/${encodeURIComponent(customerId)}/sites`;

/** POST /api/customers/:id/sites */
export async function addSite({ customerId, input }: { customerId: string; input: SiteInput }): Promise<CustomerSite> {
  return (await apiRequest(sitesPath(customerId), { method: 'POST', body: input, schema: SiteResponse })).site;
}

/** PATCH /api/customers/:id/sites/:siteId with the site's version. */
export async function updateSite({ customerId, siteId, input }: { customerId: string; siteId: string; input: SiteUpdate }): Promise<CustomerSite> {
  return (await apiRequest(`${sitesPath(customerId)}/${encodeURIComponent(siteId)}`, { method: 'PATCH', body: input, schema: SiteResponse })).site;
}

/** DELETE /api/customers/:id/sites/:siteId (refused for the last site). */
export async function removeSite({ customerId, siteId }: { customerId: string; siteId: string }): Promise<void> {
  await apiRequest(`${sitesPath(customerId)}/${encodeURIComponent(siteId)}`, { method: 'DELETE', schema: noContent });
}

function useSiteMutation<V extends { customerId: string }, R>(fn: (vars: V) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (_result, vars) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: customerKeys.detail(vars.customerId) }),
        queryClient.invalidateQueries({ queryKey: customerKeys.lists() }),
      ]),
  });
}

export const useAddSite = () => useSiteMutation(addSite);
export const useUpdateSite = () => useSiteMutation(updateSite);
export const useRemoveSite = () => useSiteMutation(removeSite);
