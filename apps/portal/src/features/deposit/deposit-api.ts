import type { DepositCheckoutResponse, PortalDepositResponse, PortalDepositState } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../lib/http-client';

const depositPath = (token: string) => `/portal/${encodeURIComponent(token)}/deposit`;

/**
 * GET …/deposit (optionally for the checkout session the browser came back from). Failures
 * reject with the portal's ApiError, whose `detail` is a sentence for the homeowner.
 */
export async function fetchDepositState(token: string, sessionId?: string, signal?: AbortSignal): Promise<PortalDepositState> {
  const query = sessionId ? `?${new URLSearchParams({ session: sessionId }).toString()}` : '';
  const { deposit } = await apiRequest(`${depositPath(token)}${query}`, {
    schema: answerWith<PortalDepositResponse>('deposit'),
    ...(signal ? { signal } : {}),
  });
  return deposit;
}

/** POST …/deposit/checkout: the provider's payment page to go to. The amount is the server's. */
export function startDepositCheckout(token: string): Promise<DepositCheckoutResponse> {
  return apiRequest(`${depositPath(token)}/checkout`, { method: 'POST', body: {}, schema: answerWith<DepositCheckoutResponse>('url') });
}

/** Leave for the provider's hosted payment page. A seam for tests. */
export const navigation = {
  go(url: string): void {
    window.location.assign(url);
  },
};
