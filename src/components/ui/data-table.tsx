import { useState } from 'react';
import { flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState } from '@tanstack/react-table';

export type { ColumnDef } from '@tanstack/react-table';

/** A table's columns, each with its own value type (TanStack Table's ColumnDef is invariant in it, so mixed columns take any). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- TanStack Table's documented way to type mixed columns; unknown refuses typed accessors
export type TableColumns<T> = ColumnDef<T, any>[];

/**
 * A dense, calm, sortable table. Headers are buttons (keyboard sortable); columns flagged with
 * `meta: { numeric: true }` are right-aligned with tabular figures.
 */
export function DataTable<T>({
  data,
  columns,
  initialSorting = [],
  caption,
  rowKey,
  minWidthClass = '',
}: {
  data: T[];
  columns: TableColumns<T>;
  initialSorting?: SortingState;
  caption?: string;
  rowKey?: (row: T) => string | number;
  /** e.g. "min-w-[56rem]": on a narrow screen the table keeps readable columns and scrolls inside its card. */ minWidthClass?: string;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const table = useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: rowKey ? (row) => String(rowKey(row)) : undefined,
  });
  return (
    <div className="overflow-x-auto">
      <table className={`w-full border-collapse text-left text-sm ${minWidthClass}`}>
        {caption && <caption className="sr-only">{caption}</caption>}
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((header) => {
                const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    className={`whitespace-nowrap px-3 py-2 font-semibold ${numeric ? 'text-right' : ''}`}
                    aria-sort={sorted ? (sorted === 'asc' ? 'ascending' : 'descending') : undefined}
                  >
                    {header.isPlaceholder ? null : header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 tracking-wide hover:text-ink"
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className="text-[10px]">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
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
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-rule/60 hover:bg-paper-deep/40">
              {row.getVisibleCells().map((cell) => {
                const numeric = (cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                return (
                  <td key={cell.id} className={`px-3 py-1.5 ${numeric ? 'num text-right' : ''}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
