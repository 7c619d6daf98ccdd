'use client';
import { TableView, rowIdOf } from './table-view';
import { useState } from 'react';
import {
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';

interface DataTableProps<T> {
  data: T[];
  columns: ColumnDef<T, any>[];
  filterPlaceholder?: string;
  pageSize?: number;
  empty?: string;
  label: string;
}

/** A sortable, filterable, paged table for short lists that arrive whole (long lists page on the server). */
export function DataTable<T>({ data, columns, filterPlaceholder = 'Filter…', pageSize = 25, empty = 'Nothing here yet.', label }: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState('');
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    getRowId: rowIdOf,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize } },
  });
  return (
    <div className="flex flex-col gap-2">
      <input
        aria-label={`Filter ${label}`}
        value={globalFilter}
        onChange={(e) => setGlobalFilter(e.target.value)}
        placeholder={filterPlaceholder}
        className="no-print w-full max-w-64 rounded-[3px] border border-rule-strong bg-paper-raised px-2 py-1 text-sm max-lg:min-h-11"
      />
      <TableView table={table} label={label} empty={empty} />
      {table.getPageCount() > 1 ? (
        <div className="no-print flex flex-wrap items-center gap-2 text-xs text-ink-soft">
          <button type="button" className="underline disabled:opacity-40 max-lg:min-h-11 max-lg:px-2" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </button>
          <span>
            Page {table.getState().pagination.pageIndex + 1} of {table.getPageCount()}
          </span>
          <button type="button" className="underline disabled:opacity-40 max-lg:min-h-11 max-lg:px-2" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </button>
        </div>
      ) : null}
    </div>
  );
}
