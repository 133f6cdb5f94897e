import type { Product, ProductKind } from '@gloaming/contracts';
import { useQueries } from '@tanstack/react-query';
import { productsQueryOptions } from '../../catalogue/api/list-products';

const CHOICE_KINDS = ['fitting', 'driver', 'cv-supply', 'cable', 'connector-block'] as const satisfies readonly ProductKind[];
export type ChoiceKind = (typeof CHOICE_KINDS)[number];

/** The firm's active products of each kind a circuit picks from (first 100 of each, by name). */
export function useCatalogueChoices(): { byKind: Record<ChoiceKind, Product[]>; loading: boolean } {
  const results = useQueries({
    queries: CHOICE_KINDS.map((kind) =>
      productsQueryOptions({ kind, search: '', active: 'active', sort: 'name', direction: 'asc', page: 1, pageSize: 100 }),
    ),
  });
  const byKind = Object.fromEntries(CHOICE_KINDS.map((k, i) => [k, results[i]?.data?.products ?? []])) as Record<
    ChoiceKind,
    Product[]
  >;
  return { byKind, loading: results.some((r) => r.isPending) };
}
