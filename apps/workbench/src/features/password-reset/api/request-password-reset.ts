import { Accepted, type PasswordResetRequest } from '@gloaming/contracts';
import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';

/** POST /api/password-resets. The answer is the same whether or not the address has an account. */
export function requestPasswordReset(request: PasswordResetRequest): Promise<Accepted> {
  return apiRequest('/password-resets', { method: 'POST', body: request, schema: Accepted });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
