export const photoKeys = {
  all: ['photos'] as const,
  quote: (quoteId: string) => [...photoKeys.all, 'quote', quoteId] as const,
};
