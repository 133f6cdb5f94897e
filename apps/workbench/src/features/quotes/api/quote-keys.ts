import type { QuoteListQuery } from '@gloaming/contracts';

export type QuoteListFilters = Partial<Pick<QuoteListQuery, 'status' | 'estimatorId' | 'q' | 'page' | 'pageSize'>>;

export const quoteKeys = {
  all: ['quotes'] as const,
  lists: () => [...quoteKeys.all, 'list'] as const,
  list: (filters: QuoteListFilters) => [...quoteKeys.lists(), filters] as const,
  detail: (id: string) => [...quoteKeys.all, 'detail', id] as const,
  revision: (id: string, number: number) => [...quoteKeys.all, 'detail', id, 'revision', number] as const,
  events: (id: string) => [...quoteKeys.all, 'detail', id, 'events'] as const,
  customerSearch: (search: string) => [...quoteKeys.all, 'customer-search', search] as const,
  customer: (id: string) => [...quoteKeys.all, 'customer', id] as const,
  productSearch: (search: string) => [...quoteKeys.all, 'product-search', search] as const,
};
