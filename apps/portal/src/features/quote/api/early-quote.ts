import type { PortalQuoteView } from '@gloaming/contracts';
import { fetchQuote } from './fetch-quote';

/**
 * The quote's GET, started by the entry module before React and the page's code have
 * downloaded, so the answer travels while the code does. The page takes it once (useQuote);
 * a retry (or any later fetch) goes to the network as usual.
 */
let early: { token: string; answer: Promise<PortalQuoteView> } | null = null;

/** Starts the GET; the promise settles (never rejects) with the quote, or undefined when it failed. */
export function startQuoteFetch(token: string): Promise<PortalQuoteView | undefined> {
  const answer = fetchQuote(token);
  early = { token, answer };
  // A failure is reported (or tried again) where the page takes the answer, not here.
  return answer.catch(() => undefined);
}

export function takeEarlyQuote(token: string): Promise<PortalQuoteView> | undefined {
  if (early?.token !== token) return undefined;
  const { answer } = early;
  early = null;
  return answer;
}
