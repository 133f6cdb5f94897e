import { createContext, useContext } from 'react';
import type { PortalQuoteView } from '@gloaming/contracts';

/** Applies an answer from the api to the quote on screen (approving, declining, a question sent). */
export type QuoteUpdate = (change: (quote: PortalQuoteView) => PortalQuoteView) => void;

export const QuoteUpdateContext = createContext<QuoteUpdate | null>(null);

export function useQuoteUpdate(): QuoteUpdate {
  const update = useContext(QuoteUpdateContext);
  if (!update) throw new Error('useQuoteUpdate is used outside the quote page.');
  return update;
}
