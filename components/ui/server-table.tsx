'use client';
import { useEffect, useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from '@tanstack/react-table';
import { fetchJson } from '@/lib/client/query-client';

export interface Page<T> {
  total: number;
  page: number;
  pageSize: number;
  rows: T[];
}

interface Props<T> {
  label: string;
  /** The list endpoint; page, pageSize, sort, dir and q are added as query parameters. */
  url: string;
  queryKey: readonly unknown[];
  columns: ColumnDef<T, any>[];
  extraParams?: Record<string, string>;
  pageSize?: number;
  filterPlaceholder?: string;
  empty?: string;
  toolbar?: React.ReactNode;
}

/** A table whose sorting, filtering and paging happen on the server (for long lists such as the register). */
export function ServerTable<T>({ label, url, queryKey, columns, extraParams = {}, pageSize = 50, filterPlaceholder = 'Filter…', empty = 'Nothing here yet.', toolbar }: Props<T>) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [page, setPage] = useState(1);
  const [typed, setTyped] = useState('');
  const [q, setQ] = useState('');
  useEffect(() => {
    const t = setTimeout(() => {
      setQ(typed.trim());
      setPage(1);
    }, 250);
    return () => clearTimeout(t);
  }, [typed]);
  const params = new URLSearchParams({ page: String(page), pageSize: String(pageSize), ...extraParams });
  if (q) params.set('q', q);
  if (sorting[0]) {
    params.set('sort', sorting[0].id);
    params.set('dir', sorting[0].desc ? 'desc' : 'asc');
  }
  const query = useQuery({ queryKey: [...queryKey, params.toString()], queryFn: () => fetchJson<Page<T>>(`${url}?${params}`), placeholderData: keepPreviousData });
  const table = useReactTable({
    data: query.data?.rows ?? [],
    columns,
    state: { sorting },
    onSortingChange: (updater) => {
      setSorting(updater);
      setPage(1);
    },
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    getCoreRowModel: getCoreRowModel(),
  });
  const total = query.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <div className="flex flex-col gap-2">
      <div className="no-print flex flex-wrap items-center justify-between gap-2">
        <input aria-label={`Filter ${label}`} value={typed} onChange={(e) => setTyped(e.target.value)} placeholder={filterPlaceholder} className="w-72 rounded-[3px] border border-rule-strong bg-paper-raised px-2 py-1 text-sm" />
        {toolbar}
      </div>
      {query.isError ? <p role="alert" className="text-sm text-state-overdue">{query.error.message}</p> : null}
      <div className="overflow-x-auto rounded-[3px] border border-rule">
        <table aria-label={label} aria-busy={query.isFetching} className="w-full border-collapse text-sm">
          <thead className="bg-paper-sunk text-xs text-ink-soft">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const meta = header.column.columnDef.meta as { numeric?: boolean } | undefined;
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} scope="col" className={`border-b border-rule px-3 py-2 font-medium ${meta?.numeric ? 'text-right' : 'text-left'}`}>
                      {header.column.getCanSort() ? (
                        <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 hover:text-ink">
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden className="text-2xs">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={query.isFetching && query.isPlaceholderData ? 'opacity-60' : ''}>
            {table.getRowModel().rows.length ? (
              table.getRowModel().rows.map((row) => (
                <tr key={row.id} className="border-b border-rule last:border-0 hover:bg-tide-50/50">
                  {row.getVisibleCells().map((cell) => {
                    const meta = cell.column.columnDef.meta as { numeric?: boolean } | undefined;
                    return (
                      <td key={cell.id} className={`px-3 py-1.5 align-middle ${meta?.numeric ? 'num' : ''}`}>
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    );
                  })}
                </tr>
              ))
            ) : (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-sm text-ink-faint">
                  {query.isLoading ? 'Loading…' : empty}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      <div className="no-print flex items-center gap-3 text-xs text-ink-soft">
        <span className="num text-left">{total.toLocaleString('en-GB')} in all</span>
        <button type="button" className="underline disabled:opacity-40" onClick={() => setPage((p) => p - 1)} disabled={page <= 1}>
          Previous
        </button>
        <span>
          Page {page} of {pages}
        </span>
        <button type="button" className="underline disabled:opacity-40" onClick={() => setPage((p) => p + 1)} disabled={page >= pages}>
          Next
        </button>
      </div>
    </div>
  );
}
