import type { PortalQuoteView } from '@gloaming/contracts';
import { fetchQuote } from './fetch-quote';

/**
 * The quote's GET, started by the entry module before React and the page's code have
 * downloaded, so the answer travels while the code does. The quote query takes it once;
 * a retry (or any later fetch) goes to the network as usual.
 */
let early: { token: string; answer: Promise<PortalQuoteView> } | null = null;

export function startQuoteFetch(token: string): void {
  const answer = fetchQuote(token);
  // Its failure is reported where the query takes it; no unhandled rejection before then.
  answer.catch(() => undefined);
  early = { token, answer };
}

export function takeEarlyQuote(token: string): Promise<PortalQuoteView> | undefined {
  if (early?.token !== token) return undefined;
  const { answer } = early;
  early = null;
  return answer;
}
