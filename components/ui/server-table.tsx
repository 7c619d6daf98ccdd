'use client';
import { TableView, rowIdOf } from './table-view';
import { useEffect, useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from '@tanstack/react-table';
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
    getRowId: rowIdOf,
    getCoreRowModel: getCoreRowModel(),
  });
  const total = query.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <div className="flex flex-col gap-2">
      <div className="no-print flex flex-wrap items-center justify-between gap-2">
        <input aria-label={`Filter ${label}`} value={typed} onChange={(e) => setTyped(e.target.value)} placeholder={filterPlaceholder} className="w-full max-w-72 rounded-[3px] border border-rule-strong bg-paper-raised px-2 py-1 text-sm max-lg:min-h-11" />
        {toolbar}
      </div>
      {query.isError ? <p role="alert" className="text-sm text-state-action">{query.error.message}</p> : null}
      <TableView table={table} label={label} empty={query.isLoading ? 'Loading…' : empty} busy={query.isFetching} dimmed={query.isFetching && query.isPlaceholderData} />
      <div className="no-print flex flex-wrap items-center gap-3 text-xs text-ink-soft">
        <span className="num text-left">{total.toLocaleString('en-GB')} in all</span>
        <button type="button" className="underline disabled:opacity-40 max-lg:min-h-11 max-lg:px-2" onClick={() => setPage((p) => p - 1)} disabled={page <= 1}>
          Previous
        </button>
        <span>
          Page {page} of {pages}
        </span>
        <button type="button" className="underline disabled:opacity-40 max-lg:min-h-11 max-lg:px-2" onClick={() => setPage((p) => p + 1)} disabled={page >= pages}>
          Next
        </button>
      </div>
    </div>
  );
}
