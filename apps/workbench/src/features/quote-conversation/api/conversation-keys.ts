export const conversationKeys = {
  all: ['quote-conversation'] as const,
  quote: (quoteId: string) => [...conversationKeys.all, quoteId] as const,
  messages: (quoteId: string) => [...conversationKeys.quote(quoteId), 'messages'] as const,
  decision: (quoteId: string) => [...conversationKeys.quote(quoteId), 'decision'] as const,
};

export const quotePath = (quoteId: string) => `/quotes/${encodeURIComponent(quoteId)}`;

/** The homeowner acts from their link at any time: look again every so often while the page is open. */
export const HOMEOWNER_POLL_MS = 15_000;
