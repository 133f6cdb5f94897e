export const depositKeys = {
  all: ['deposits'] as const,
  quote: (quoteId: string) => [...depositKeys.all, quoteId] as const,
};

export const quoteDepositsPath = (quoteId: string) => `/quotes/${encodeURIComponent(quoteId)}/deposits`;
