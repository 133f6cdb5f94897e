import type { CustomerContactFilter, CustomerSummary } from '@gloaming/contracts';
import { createColumnHelper, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { DataTable } from '../../../components/ui/data-table';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useCustomers } from '../api/list-customers';
import { customerQueryFromSearch } from '../customer-list-query';
import { useListSearchParams } from '../../../lib/list-search-params';
import { useSearchAsYouType } from '../../../lib/search-as-you-type';

const column = createColumnHelper<CustomerSummary>();
const NO_CUSTOMERS: CustomerSummary[] = [];
const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

const COLUMNS = [
  column.accessor('name', {
    header: 'Name',
    cell: (info) => (
      <Link to={`/customers/${info.row.original.id}`} className="font-medium text-dusk-800 underline-offset-2 hover:underline" onClick={(e) => e.stopPropagation()}>
        {info.getValue()}
      </Link>
    ),
  }),
  column.display({
    id: 'contact',
    header: 'Contact',
    cell: (info) => (
      <div className="flex flex-col text-caption">
        <span className={info.row.original.email ? 'text-ink' : 'text-mist-400'}>{info.row.original.email ?? 'no e-mail'}</span>
        {info.row.original.phone ? <span className="text-ink-muted">{info.row.original.phone}</span> : null}
      </div>
    ),
  }),
  column.accessor('firstPostcode', { header: 'Postcode', enableSorting: false, cell: (info) => <span className="font-mono text-caption">{info.getValue() || '–'}</span> }),
  column.accessor('siteCount', { header: 'Sites', enableSorting: false, cell: (info) => <span className="font-mono">{info.getValue()}</span> }),
  column.accessor('updatedAt', { header: 'Last changed', cell: (info) => <span className="text-caption text-ink-muted">{dateFormat.format(new Date(info.getValue()))}</span> }),
];

const CONTACT_OPTIONS: { value: CustomerContactFilter; label: string }[] = [
  { value: 'all', label: 'Everyone' },
  { value: 'with-email', label: 'With an e-mail address' },
  { value: 'without-email', label: 'Without an e-mail address' },
];

export function CustomersPage() {
  const user = useSignedInUser();
  const navigate = useNavigate();
  const [params, update] = useListSearchParams();
  const query = customerQueryFromSearch(params);
  const customers = useCustomers(query);
  const [searchText, setSearchText] = useState(query.search);

  useSearchAsYouType(searchText, query.search, (q) => update({ q, page: '1' }));

  const sorting: SortingState = useMemo(() => [{ id: query.sort, desc: query.direction === 'desc' }], [query.sort, query.direction]);
  const total = customers.data?.total ?? 0;
  const table = useReactTable({
    data: customers.data?.customers ?? NO_CUSTOMERS,
    columns: COLUMNS,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => row.id,
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    rowCount: total,
    state: { sorting, pagination: { pageIndex: query.page - 1, pageSize: query.pageSize } },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) update({ sort: first.id, dir: first.desc ? 'desc' : 'asc', page: '1' });
    },
    onPaginationChange: (updater) => {
      const next = typeof updater === 'function' ? updater({ pageIndex: query.page - 1, pageSize: query.pageSize }) : updater;
      update({ page: String(next.pageIndex + 1) });
    },
  });

  return (
    <>
      <title>{`Customers · ${user.organization.name} · Gloaming`}</title>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeader eyebrow={user.organization.name} title="Customers">
          The people you quote for and the sites where the lighting goes.
        </PageHeader>
        <Link
          to="/customers/new"
          className="inline-flex h-11 items-center rounded-control bg-accent px-5 font-semibold text-accent-ink shadow-control hover:bg-lamp-300"
        >
          New customer
        </Link>
      </div>
      <div className="mb-4 grid gap-4 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <TextField
          label="Search"
          type="search"
          placeholder="Name, e-mail, phone, address or postcode"
          value={searchText}
          onChange={(e) => setSearchText(e.target.value)}
        />
        <SelectField label="Show" options={CONTACT_OPTIONS} value={query.contact} onChange={(e) => update({ contact: e.target.value === 'all' ? '' : e.target.value, page: '1' })} />
      </div>
      {customers.isError ? (
        <FormMessage tone="error" title="Customers could not be loaded">
          {customers.error.message}
        </FormMessage>
      ) : null}
      <DataTable
        table={table}
        caption="Customers"
        total={total}
        busy={customers.isFetching}
        onRowOpen={(row) => navigate(`/customers/${row.id}`)}
        empty={customers.isPending ? 'Loading customers…' : query.search ? `No customer matches “${query.search}”.` : 'No customers yet. Add the first one with “New customer”.'}
      />
    </>
  );
}
