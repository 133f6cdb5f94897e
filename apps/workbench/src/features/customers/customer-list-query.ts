import { CUSTOMER_CONTACT_FILTERS, CUSTOMER_SORTS, type CustomerContactFilter, type CustomerListQuery } from '@gloaming/contracts';

export const CUSTOMER_PAGE_SIZE = 25;

type Sort = (typeof CUSTOMER_SORTS)[number];

/** The list's state lives in the address bar, so a loader can prefetch it and a link can share it. */
export interface CustomerListState extends CustomerListQuery {
  search: string;
  sort: Sort;
  direction: 'asc' | 'desc';
  contact: CustomerContactFilter;
  page: number;
  pageSize: number;
}

export function customerQueryFromSearch(search: URLSearchParams): CustomerListState {
  const sort = CUSTOMER_SORTS.find((s) => s === search.get('sort')) ?? 'name';
  const contact = CUSTOMER_CONTACT_FILTERS.find((c) => c === search.get('contact')) ?? 'all';
  const page = Number.parseInt(search.get('page') ?? '1', 10);
  return {
    search: (search.get('q') ?? '').slice(0, 200),
    sort: sort satisfies Sort,
    direction: search.get('dir') === 'desc' ? 'desc' : 'asc',
    contact: contact satisfies CustomerContactFilter,
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: CUSTOMER_PAGE_SIZE,
  };
}
