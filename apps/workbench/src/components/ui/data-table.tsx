import { flexRender, type Table } from '@tanstack/react-table';
import type { ReactNode } from 'react';

/**
 * A TanStack table drawn in the workbench's style: sortable column headers are buttons with
 * aria-sort, the footer pages through a server-side list. Sorting and paging are "manual"
 * (the api sorts and pages); the caller owns the state.
 */
export function DataTable<Row>({
  table,
  caption,
  total,
  empty,
  busy = false,
  onRowOpen,
}: {
  table: Table<Row>;
  caption: string;
  total: number;
  empty: ReactNode;
  busy?: boolean;
  onRowOpen?: (row: Row) => void;
}) {
  const { pageIndex, pageSize } = table.getState().pagination;
  const first = total === 0 ? 0 : pageIndex * pageSize + 1;
  const last = Math.min(total, (pageIndex + 1) * pageSize);
  return (
    <div className="overflow-hidden rounded-card bg-surface shadow-card ring-1 ring-line">
      <div className="overflow-x-auto">
        <table className="w-full text-left text-body" aria-busy={busy || undefined}>
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-mist-50">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} className="border-b border-line text-caption text-ink-muted">
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const label = flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className="px-4 py-2.5 font-semibold whitespace-nowrap"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    >
                      {header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex items-center gap-1 rounded-control hover:text-ink"
                        >
                          {label}
                          <span aria-hidden="true" className="font-mono text-micro">
                            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                          </span>
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr
                key={row.id}
                className={`border-b border-line last:border-0 ${onRowOpen ? 'cursor-pointer hover:bg-lamp-50' : ''}`}
                onClick={onRowOpen ? () => onRowOpen(row.original) : undefined}
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-3 align-top">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {total === 0 ? <div className="px-6 py-10 text-center text-ink-muted">{empty}</div> : null}
      <nav aria-label={`${caption}: pages`} className="flex items-center justify-between gap-4 border-t border-line px-4 py-3 text-caption text-ink-muted">
        <p role="status">
          {total === 0 ? 'No rows' : `${first}–${last} of ${total}`}
        </p>
        <div className="flex items-center gap-2">
          <button
            type="button"
            className="rounded-control px-3 py-1.5 font-semibold text-dusk-700 ring-1 ring-mist-300 ring-inset hover:bg-dusk-50 disabled:text-mist-400"
            onClick={() => table.previousPage()}
            disabled={!table.getCanPreviousPage()}
          >
            Previous
          </button>
          <span>
            Page {pageIndex + 1} of {Math.max(1, table.getPageCount())}
          </span>
          <button
            type="button"
            className="rounded-control px-3 py-1.5 font-semibold text-dusk-700 ring-1 ring-mist-300 ring-inset hover:bg-dusk-50 disabled:text-mist-400"
            onClick={() => table.nextPage()}
            disabled={!table.getCanNextPage()}
          >
            Next
          </button>
        </div>
      </nav>
    </div>
  );
}
