'use client';
import { flexRender, type Table } from '@tanstack/react-table';
import { TableFrame } from './table-frame';

/** The table markup both table kinds share: sortable headers, numeric cells right-aligned, an empty row; wide tables scroll in their frame. */
export function TableView<T>({ table, label, empty, busy = false, dimmed = false }: { table: Table<T>; label: string; empty: string; busy?: boolean; dimmed?: boolean }) {
  const rows = table.getRowModel().rows;
  const columnCount = table.getAllLeafColumns().length;
  return (
    <TableFrame label={label} head="sunk" className="rounded-[3px] border border-rule">
      <table aria-label={label} aria-busy={busy} className="w-full border-collapse text-sm">
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
        <tbody className={dimmed ? 'opacity-60' : ''}>
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
              <td colSpan={columnCount} className="px-3 py-6 text-left text-sm text-ink-faint lg:text-center">
                {/* Below 1024 px the row is wider than the screen: the sentence stays within the visible part. */}
                <span className="inline-block max-w-[calc(100vw-5rem)] lg:max-w-none">{empty}</span>
              </td>
            </tr>
          )}
        </tbody>
      </table>
    </TableFrame>
  );
}

/**
 * Rows are keyed by the record's own id when it has one, never by position: a removed row must not hand its
 * open question or its focus to the row that moves up into its place (or to the record when it comes back).
 */
export function rowIdOf(row: unknown, index: number): string {
  const id = (row as { id?: unknown } | null)?.id;
  return typeof id === 'string' && id !== '' ? id : String(index);
}
