import { RevokeLinksResponse } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from '../../quotes/api/quote-keys';
import { revisionPath, sendingKeys } from './sending-keys';

/** POST …/revoke: every portal link of the revision stops working. */
export async function revokeLinks(quoteId: string, revisionId: string): Promise<RevokeLinksResponse> {
  return apiRequest(`${revisionPath(quoteId, revisionId)}/revoke`, { method: 'POST', body: {}, schema: RevokeLinksResponse });
}

export function useRevokeLinks(quoteId: string, revisionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => revokeLinks(quoteId, revisionId),
    onSuccess: (result) => {
      queryClient.setQueryData(sendingKeys.state(quoteId, revisionId), result.sending);
      return queryClient.invalidateQueries({ queryKey: quoteKeys.events(quoteId) });
    },
  });
}
