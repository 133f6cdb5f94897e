export const sendingKeys = {
  all: ['quote-sending'] as const,
  revision: (quoteId: string, revisionId: string) => [...sendingKeys.all, quoteId, revisionId] as const,
  state: (quoteId: string, revisionId: string) => [...sendingKeys.revision(quoteId, revisionId), 'state'] as const,
  preview: (quoteId: string, revisionId: string, message: string) =>
    [...sendingKeys.revision(quoteId, revisionId), 'preview', message] as const,
};

export const revisionPath = (quoteId: string, revisionId: string) =>
  `/quotes/${encodeURIComponent(quoteId)}/revisions/${encodeURIComponent(revisionId)}`;

/** The PDF as the homeowner receives it; a same-origin link the browser downloads. */
export const quotePdfUrl = (quoteId: string, revisionId: string) => `/api${revisionPath(quoteId, revisionId)}/pdf`;
