import { Accepted, type PasswordResetComplete } from '@gloaming/contracts';
import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';

/** POST /api/password-resets/complete: sets the new password with the e-mailed single-use token. */
export function completePasswordReset(request: PasswordResetComplete): Promise<Accepted> {
  return apiRequest('/password-resets/complete', { method: 'POST', body: request, schema: Accepted });
}

export function useCompletePasswordReset() {
  return useMutation({ mutationFn: completePasswordReset });
}
