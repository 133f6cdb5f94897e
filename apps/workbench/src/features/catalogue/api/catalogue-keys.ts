export interface ProductListState {
  kind: string;
  search: string;
  active: 'active' | 'inactive' | 'all';
  sort: 'name' | 'supplierCode' | 'listPriceMinor' | 'updatedAt';
  direction: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export const catalogueKeys = {
  all: ['catalogue'] as const,
  lists: () => [...catalogueKeys.all, 'list'] as const,
  list: (query: ProductListState) => [...catalogueKeys.lists(), query] as const,
  imports: () => [...catalogueKeys.all, 'import'] as const,
  importJob: (id: string) => [...catalogueKeys.imports(), id] as const,
};
