import { PRODUCT_KIND_LABELS, PRODUCT_KINDS, type Product, type ProductKind } from '@gloaming/contracts';
import { formatMoney } from '@gloaming/engine';
import { createColumnHelper, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useMemo, useState, type KeyboardEvent } from 'react';
import { Link } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { DataTable } from '../../../components/ui/data-table';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useProducts } from '../api/list-products';
import { ProductForm } from './product-form';
import { specSummary } from './spec-summary';
import { productQueryFromSearch } from '../product-list-query';
import { useListSearchParams } from '../../../lib/list-search-params';
import { useSearchAsYouType } from '../../../lib/search-as-you-type';

const column = createColumnHelper<Product>();
const NO_PRODUCTS: Product[] = [];
const COLUMNS = [
  column.accessor('name', {
    header: 'Name',
    cell: (info) => (
      <div className="flex flex-col">
        <span className="font-medium text-ink">{info.getValue()}</span>
        <span className="text-caption text-ink-muted">{specSummary(info.row.original)}</span>
      </div>
    ),
  }),
  column.accessor('supplierCode', {
    header: 'Code',
    cell: (info) => (
      <div className="flex flex-col">
        <span className="font-mono text-caption">{info.getValue()}</span>
        <span className="text-micro text-ink-muted">{info.row.original.supplier}</span>
      </div>
    ),
  }),
  column.accessor('unit', { header: 'Unit', enableSorting: false }),
  column.accessor('costMinor', { header: 'Cost', enableSorting: false, cell: (info) => <span className="font-mono">{formatMoney(info.getValue(), 'GBP')}</span> }),
  column.accessor('listPriceMinor', { header: 'List price', cell: (info) => <span className="font-mono">{formatMoney(info.getValue(), 'GBP')}</span> }),
  column.accessor('active', {
    header: 'Status',
    enableSorting: false,
    cell: (info) => (info.getValue() ? <Badge tone="positive">In use</Badge> : <Badge tone="muted">Out of use</Badge>),
  }),
];

export function CataloguePage() {
  const user = useSignedInUser();
  const [params, update] = useListSearchParams();
  const query = productQueryFromSearch(params);
  const kind = query.kind as ProductKind;
  const products = useProducts(query);
  const [searchText, setSearchText] = useState(query.search);
  const [editing, setEditing] = useState<Product | 'new' | null>(null);

  useSearchAsYouType(searchText, query.search, (q) => update({ q, page: '1' }));

  const sorting: SortingState = useMemo(() => [{ id: query.sort, desc: query.direction === 'desc' }], [query.sort, query.direction]);
  const total = products.data?.total ?? 0;
  const table = useReactTable({
    data: products.data?.products ?? NO_PRODUCTS,
    columns: COLUMNS,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => row.id,
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    rowCount: total,
    state: { sorting, pagination: { pageIndex: query.page - 1, pageSize: query.pageSize } },
    onSortingChange: (updater) => {
      const first = (typeof updater === 'function' ? updater(sorting) : updater)[0];
      if (first) update({ sort: first.id, dir: first.desc ? 'desc' : 'asc', page: '1' });
    },
    onPaginationChange: (updater) => {
      const next = typeof updater === 'function' ? updater({ pageIndex: query.page - 1, pageSize: query.pageSize }) : updater;
      update({ page: String(next.pageIndex + 1) });
    },
  });

  // tabs follow the WAI-ARIA pattern: arrow keys move between kinds
  function onTabKey(event: KeyboardEvent<HTMLButtonElement>, index: number) {
    const delta = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    if (!delta) return;
    event.preventDefault();
    const next = PRODUCT_KINDS[(index + delta + PRODUCT_KINDS.length) % PRODUCT_KINDS.length]!;
    update({ kind: next, page: '1' });
    setEditing(null);
    document.getElementById(`kind-tab-${next}`)?.focus();
  }

  return (
    <>
      <title>{`Catalogue · ${user.organization.name} · Gloaming`}</title>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeader eyebrow={user.organization.name} title="Catalogue">
          Fittings, drivers, supplies, cable, blocks, sundries and labour, with trade cost and list price.
        </PageHeader>
        <div className="flex gap-3">
          <Link to="/catalogue/import" className="inline-flex h-11 items-center rounded-control bg-surface px-5 font-semibold text-dusk-800 ring-1 ring-mist-300 ring-inset hover:bg-dusk-50">
            Import a price list
          </Link>
          <button
            type="button"
            onClick={() => setEditing('new')}
            className="inline-flex h-11 items-center rounded-control bg-accent px-5 font-semibold text-accent-ink shadow-control hover:bg-lamp-300"
          >
            Add to {PRODUCT_KIND_LABELS[kind]}
          </button>
        </div>
      </div>
      <div role="tablist" aria-label="Product kinds" className="mb-4 flex flex-wrap gap-1 border-b border-line">
        {PRODUCT_KINDS.map((k, index) => (
          <button
            key={k}
            id={`kind-tab-${k}`}
            type="button"
            role="tab"
            aria-selected={k === kind}
            aria-controls="kind-panel"
            tabIndex={k === kind ? 0 : -1}
            onKeyDown={(e) => onTabKey(e, index)}
            onClick={() => {
              update({ kind: k, page: '1' });
              setEditing(null);
            }}
            className={`-mb-px rounded-t-control px-4 py-2 text-body font-semibold ${
              k === kind ? 'border-b-2 border-lamp-400 text-ink' : 'text-ink-muted hover:text-ink'
            }`}
          >
            {PRODUCT_KIND_LABELS[k]}
          </button>
        ))}
      </div>
      <div id="kind-panel" role="tabpanel" aria-labelledby={`kind-tab-${kind}`} className="grid gap-4">
        {editing ? (
          <Card title={editing === 'new' ? `New in ${PRODUCT_KIND_LABELS[kind]}` : `Edit ${editing.name}`}>
            <ProductForm key={editing === 'new' ? `new-${kind}` : `${editing.id}-${editing.version}`} kind={editing === 'new' ? kind : editing.kind} product={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
          </Card>
        ) : null}
        <div className="grid gap-4 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
          <TextField label="Search" type="search" placeholder="Name, code, supplier or description" value={searchText} onChange={(e) => setSearchText(e.target.value)} />
          <SelectField
            label="Show"
            value={query.active}
            options={[
              { value: 'active', label: 'In use' },
              { value: 'inactive', label: 'Out of use' },
              { value: 'all', label: 'Everything' },
            ]}
            onChange={(e) => update({ show: e.target.value === 'active' ? '' : e.target.value, page: '1' })}
          />
        </div>
        {products.isError ? (
          <FormMessage tone="error" title="The catalogue could not be loaded">
            {products.error.message}
          </FormMessage>
        ) : null}
        <DataTable
          table={table}
          caption={PRODUCT_KIND_LABELS[kind]}
          total={total}
          busy={products.isFetching}
          onRowOpen={(row) => setEditing(row)}
          empty={products.isPending ? 'Loading…' : query.search ? `Nothing here matches “${query.search}”.` : `Nothing in ${PRODUCT_KIND_LABELS[kind]} yet. Add an item, or import a supplier’s price list.`}
        />
      </div>
    </>
  );
}
