import { useCallback, useEffect, useState } from 'react';
import type { PortalQuoteView } from '@gloaming/contracts';
import { isApiError } from '../../../lib/api-error';
import type { QuoteUpdate } from '../quote-update';
import { takeEarlyQuote } from './early-quote';
import { fetchQuote } from './fetch-quote';

export type QuoteLoad =
  | { status: 'pending' }
  | { status: 'error'; error: unknown }
  | { status: 'ready'; quote: PortalQuoteView };

/** A dropped connection or a server fault is tried again, twice; the api's refusal (a bad link) is final. */
export const shouldRetry = (failures: number, error: unknown) =>
  failures < 3 && (!isApiError(error) || error.status === 0 || error.status >= 500);
/** 1 s before the second try, 2 s before the third. */
export const retryDelayMs = (failures: number) => Math.min(1000 * 2 ** (failures - 1), 30_000);

/**
 * The quote for a link: the one the entry module already fetched when there is one, else one
 * GET (each GET records a view, so the page never refetches on its own). `update` applies the
 * api's answers to the quote on screen.
 */
export function useQuote(token: string, initial: PortalQuoteView | undefined): { load: QuoteLoad; update: QuoteUpdate } {
  const [load, setLoad] = useState<QuoteLoad>(initial ? { status: 'ready', quote: initial } : { status: 'pending' });
  const needsFetch = load.status === 'pending';

  useEffect(() => {
    if (!needsFetch) return;
    const controller = new AbortController();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const attempt = (failures: number) => {
      const answer = (failures === 0 ? takeEarlyQuote(token) : undefined) ?? fetchQuote(token, controller.signal);
      answer.then(
        (quote) => {
          if (!controller.signal.aborted) setLoad({ status: 'ready', quote });
        },
        (error: unknown) => {
          if (controller.signal.aborted) return;
          if (shouldRetry(failures + 1, error)) timer = setTimeout(() => attempt(failures + 1), retryDelayMs(failures + 1));
          else setLoad({ status: 'error', error });
        },
      );
    };
    attempt(0);
    return () => {
      controller.abort();
      clearTimeout(timer);
    };
  }, [token, needsFetch]);

  const update = useCallback<QuoteUpdate>(
    (change) => setLoad((current) => (current.status === 'ready' ? { status: 'ready', quote: change(current.quote) } : current)),
    [],
  );
  return { load, update };
}
