'use client';

import { useState, type ReactNode } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import { cx } from './cx';

export type { ColumnDef } from '@tanstack/react-table';

export type DataTableProps<T> = {
  data: T[];
  columns: ColumnDef<T, any>[];
  /** Read out by screen readers; shown when `showCaption`. */
  caption: string;
  showCaption?: boolean;
  getRowId?: (row: T) => string;
  initialSorting?: SortingState;
  empty?: ReactNode;
  rowTestId?: (row: T) => string;
  className?: string;
  'data-testid'?: string;
};

/** A dense, sortable table (TanStack Table v8) with accessible sort buttons and aria-sort. */
export function DataTable<T>({
  data,
  columns,
  caption,
  showCaption,
  getRowId,
  initialSorting = [],
  empty,
  rowTestId,
  className,
  ...rest
}: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const table = useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  if (data.length === 0 && empty) return <>{empty}</>;

  return (
    <div className={cx('relative overflow-x-auto', className)} {...rest}>
      <table className="w-full border-collapse text-left text-sm">
        <caption className={showCaption ? 'px-4 py-2 text-left text-xs text-paper-600' : 'sr-only'}>{caption}</caption>
        <thead className="bg-paper-100 text-2xs uppercase tracking-wide text-paper-700">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                const label = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : canSort ? 'none' : undefined}
                    className="border-b border-paper-300 px-4 py-2 font-semibold first:pl-4"
                  >
                    {canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 uppercase tracking-wide hover:text-ink-800"
                      >
                        {label}
                        <SortMark state={sorted} />
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
              data-testid={rowTestId?.(row.original)}
              className="border-b border-paper-200 last:border-b-0 hover:bg-paper-50"
            >
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-4 py-2 align-middle">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The sort direction of a column header, drawn; the header's aria-sort says it in words. */
export function SortMark({ state }: { state: false | 'asc' | 'desc' }) {
  return (
    <svg viewBox="0 0 8 12" className="h-3 w-2" aria-hidden="true">
      <path d="M4 1 L7 5 H1 Z" className={state === 'asc' ? 'fill-ink-800' : 'fill-paper-400'} />
      <path d="M4 11 L7 7 H1 Z" className={state === 'desc' ? 'fill-ink-800' : 'fill-paper-400'} />
    </svg>
  );
}
