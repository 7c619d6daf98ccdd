'use client';
import { useState } from 'react';
import {
  flexRender,
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
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize } },
  });
  const rows = table.getRowModel().rows;
  return (
    <div className="flex flex-col gap-2">
      <input
        aria-label={`Filter ${label}`}
        value={globalFilter}
        onChange={(e) => setGlobalFilter(e.target.value)}
        placeholder={filterPlaceholder}
        className="no-print w-64 rounded-[3px] border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
      />
      <div className="overflow-x-auto rounded-[3px] border border-rule">
        <table aria-label={label} className="w-full border-collapse text-sm">
          <thead className="bg-paper-sunk text-xs text-ink-soft">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const meta = header.column.columnDef.meta as { numeric?: boolean } | undefined;
                  return (
                    <th key={header.id} scope="col" className={`border-b border-rule px-3 py-2 font-medium ${meta?.numeric ? 'text-right' : 'text-left'}`}>
                      {header.isPlaceholder ? null : header.column.getCanSort() ? (
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
          <tbody>
            {rows.length ? (
              rows.map((row) => (
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
                  {empty}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      {table.getPageCount() > 1 ? (
        <div className="no-print flex items-center gap-2 text-xs text-ink-soft">
          <button type="button" className="underline disabled:opacity-40" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </button>
          <span>
            Page {table.getState().pagination.pageIndex + 1} of {table.getPageCount()}
          </span>
          <button type="button" className="underline disabled:opacity-40" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </button>
        </div>
      ) : null}
    </div>
  );
}
