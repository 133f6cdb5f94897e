import { DepositCheckoutResponse, PortalDepositResponse, Problem, type PortalDepositState } from '@gloaming/contracts';

/** What went wrong, in words for the homeowner (the api's problem detail when it sent one). */
export class DepositRequestError extends Error {
  constructor(
    message: string,
    readonly status: number,
  ) {
    super(message);
    this.name = 'DepositRequestError';
  }
}

const depositPath = (token: string) => `/api/portal/${encodeURIComponent(token)}/deposit`;

async function send<T>(path: string, init: RequestInit, parse: (body: unknown) => T | undefined): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, { ...init, headers: { Accept: 'application/json, application/problem+json', ...init.headers }, credentials: 'same-origin' });
  } catch {
    throw new DepositRequestError('We could not reach the server. Check your connection and try again.', 0);
  }
  const body: unknown = await response.json().catch(() => undefined);
  if (!response.ok) {
    const problem = Problem.safeParse(body);
    throw new DepositRequestError(problem.success && problem.data.detail ? problem.data.detail : 'Something went wrong. Please try again.', response.status);
  }
  const parsed = parse(body);
  if (parsed === undefined) throw new DepositRequestError('The server sent an answer we did not understand. Please try again.', response.status);
  return parsed;
}

/** GET …/deposit (optionally for the checkout session the browser came back from). */
export function fetchDepositState(token: string, sessionId?: string, signal?: AbortSignal): Promise<PortalDepositState> {
  const query = sessionId ? `?${new URLSearchParams({ session: sessionId }).toString()}` : '';
  return send(`${depositPath(token)}${query}`, signal ? { signal } : {}, (b) => {
    const r = PortalDepositResponse.safeParse(b);
    return r.success ? r.data.deposit : undefined;
  });
}

/** POST …/deposit/checkout: the provider's payment page to go to. The amount is the server's. */
export function startDepositCheckout(token: string): Promise<DepositCheckoutResponse> {
  return send(`${depositPath(token)}/checkout`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: '{}' }, (b) => {
    const r = DepositCheckoutResponse.safeParse(b);
    return r.success ? r.data : undefined;
  });
}

/** Leave for the provider's hosted payment page. A seam for tests. */
export const navigation = {
  go(url: string): void {
    window.location.assign(url);
  },
};
