export const circuitKeys = {
  all: ['circuits'] as const,
  revision: (quoteId: string, revisionNumber: number) => [...circuitKeys.all, quoteId, revisionNumber] as const,
  suggestions: (quoteId: string, revisionNumber: number) => [...circuitKeys.all, quoteId, revisionNumber, 'suggestions'] as const,
};
