import { RefundDepositResponse, type RefundDepositRequest } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { quoteKeys } from '../../quotes/api/quote-keys';
import { depositKeys, quoteDepositsPath } from './deposit-keys';

/** POST /quotes/:id/deposits/:paymentId/refund (owner): through the payment provider. */
export async function refundDeposit(quoteId: string, paymentId: string, request: RefundDepositRequest): Promise<RefundDepositResponse> {
  return apiRequest(`${quoteDepositsPath(quoteId)}/${encodeURIComponent(paymentId)}/refund`, {
    method: 'POST',
    body: request,
    schema: RefundDepositResponse,
  });
}

export function useRefundDeposit(quoteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ paymentId, request }: { paymentId: string; request: RefundDepositRequest }) =>
      refundDeposit(quoteId, paymentId, request),
    onSettled: async () => {
      // a refund (or a refusal because someone else refunded first) changes the list and the history
      await queryClient.invalidateQueries({ queryKey: depositKeys.quote(quoteId) });
      await queryClient.invalidateQueries({ queryKey: quoteKeys.events(quoteId) });
    },
  });
}
