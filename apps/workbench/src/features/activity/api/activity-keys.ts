export type ActivityFilters = { actorId?: string | undefined; kind?: 'quote' | 'firm' | undefined };

export const activityKeys = {
  all: ['activity'] as const,
  firm: (f: ActivityFilters) => [...activityKeys.all, 'firm', f.actorId ?? '', f.kind ?? ''] as const,
  quote: (quoteId: string) => [...activityKeys.all, 'quote', quoteId] as const,
};
