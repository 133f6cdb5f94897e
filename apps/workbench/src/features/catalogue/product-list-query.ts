import { PRODUCT_KINDS } from '@gloaming/contracts';
import type { ProductListState } from './api/catalogue-keys';

export const PRODUCT_PAGE_SIZE = 25;
const SORTS = ['name', 'supplierCode', 'listPriceMinor', 'updatedAt'] as const;

/** The list's state from the address bar: ?kind=driver&q=700&show=all&sort=name&dir=asc&page=2 */
export function productQueryFromSearch(params: URLSearchParams): ProductListState {
  const kind = PRODUCT_KINDS.find((k) => k === params.get('kind')) ?? 'fitting';
  const show = params.get('show');
  const page = Number.parseInt(params.get('page') ?? '1', 10);
  return {
    kind,
    search: (params.get('q') ?? '').slice(0, 200),
    active: show === 'inactive' || show === 'all' ? show : 'active',
    sort: SORTS.find((s) => s === params.get('sort')) ?? 'name',
    direction: params.get('dir') === 'desc' ? 'desc' : 'asc',
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: PRODUCT_PAGE_SIZE,
  };
}
