export const quoteKeys = {
  all: ['portal-quote'] as const,
  view: (token: string) => [...quoteKeys.all, token] as const,
};
