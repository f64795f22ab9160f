'use client';

import Link from 'next/link';
import { useMemo } from 'react';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { cx } from '@/components/ui/cx';
import { formatDay, formatMinute } from '@/components/ui/format';
import type { QueueState } from '@/lib/client/queue-params';
import type { SortKey, SpectrumListItem } from '@/lib/client/spectra-types';
import { FindingCountsText } from './severity-mark';
import { StatusBadge } from './status-badge';
import { VerdictBadge } from './verdict-badge';
import { SortMark } from '@/components/ui/data-table';

const col = createColumnHelper<SpectrumListItem>();

// Column ids are the API's sort keys where the server can sort by them.
const columnsFor = (group: string) => [
  col.accessor('title', {
    id: 'title',
    header: 'Spectrum',
    cell: ({ row }) => <TitleCell group={group} item={row.original} />,
  }),
  col.accessor('status', {
    id: 'status',
    header: 'Status',
    cell: ({ row }) => <StatusBadge status={row.original.status} screening={row.original.currentRevision?.screeningStatus} />,
  }),
  col.accessor('verdict', {
    id: 'verdict',
    header: 'Verdict',
    cell: ({ row }) => <VerdictBadge verdict={row.original.verdict} screening={row.original.currentRevision?.screeningStatus} />,
  }),
  col.accessor('findings', {
    id: 'findings',
    header: 'Unwaived findings',
    enableSorting: false,
    cell: ({ row }) =>
      row.original.currentRevision?.screeningStatus === 'done' ? (
        <FindingCountsText counts={row.original.findings} />
      ) : (
        <span className="text-paper-600">—</span>
      ),
  }),
  col.accessor('openThreads', {
    id: 'threads',
    header: 'Open threads',
    enableSorting: false,
    cell: (c) =>
      c.getValue() > 0 ? (
        <span className="tabular font-medium text-paper-900" data-testid="open-threads">
          {c.getValue()} open
        </span>
      ) : (
        <span className="text-paper-600" data-testid="open-threads">none</span>
      ),
  }),
  col.accessor((s) => s.reviewers.map((r) => r.name || r.email).join(', '), {
    id: 'reviewers',
    header: 'Reviewers',
    enableSorting: false,
    cell: (c) => <span className="text-paper-700">{c.getValue() || <span className="text-paper-600">unassigned</span>}</span>,
  }),
  col.accessor((s) => s.submitter?.name || s.submitter?.email || '', {
    id: 'submitter',
    header: 'Submitter',
    enableSorting: false,
    cell: (c) => <span className="text-paper-700">{c.getValue() || '—'}</span>,
  }),
  col.accessor('updatedAt', {
    id: 'updated',
    header: 'Updated',
    sortDescFirst: true,
    cell: (c) => (
      <time dateTime={c.getValue()} title={formatMinute(c.getValue())} className="tabular whitespace-nowrap text-paper-700">
        {formatDay(c.getValue())}
      </time>
    ),
  }),
];

function TitleCell({ group, item }: { group: string; item: SpectrumListItem }) {
  return (
    <div className="min-w-[12rem]">
      <Link href={`/groups/${group}/spectra/${item.id}`} className="font-medium text-ink-800 no-underline hover:underline" data-testid="spectrum-link">
        {item.title}
      </Link>
      <div className="text-xs text-paper-600">
        {item.material}
        {item.formula && <span className="ml-1.5 font-mono text-paper-600">{item.formula}</span>}
        {item.currentRevision && <span className="ml-1.5 text-paper-600">· rev {item.currentRevision.number}</span>}
      </div>
    </div>
  );
}

export interface SpectraTableProps {
  group: string;
  items: SpectrumListItem[];
  total: number;
  state: QueueState;
  onSort: (sort: SortKey, direction: 'asc' | 'desc') => void;
  /** The rows are a previous page's while the next loads. */
  stale?: boolean;
  caption: string;
}

/**
 * The queue's table. Sorting, filtering and paging happen on the server (TanStack Table in
 * manual mode): the table only draws the page it is given and reports sort clicks.
 */
export function SpectraTable({ group, items, total, state, onSort, stale, caption }: SpectraTableProps) {
  const columns = useMemo(() => columnsFor(group), [group]);
  const sorting: SortingState = [{ id: state.sort, desc: state.direction === 'desc' }];
  const table = useReactTable({
    data: items,
    columns,
    getRowId: (s) => s.id,
    state: { sorting, pagination: { pageIndex: state.page - 1, pageSize: state.pageSize } },
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    rowCount: total,
    enableSortingRemoval: false,
    enableMultiSort: false,
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) onSort(first.id as SortKey, first.desc ? 'desc' : 'asc');
    },
    getCoreRowModel: getCoreRowModel(),
  });

  return (
    <div className={cx('overflow-x-auto transition-opacity', stale && 'opacity-60')} aria-busy={stale || undefined}>
      <table className="w-full border-collapse text-left text-sm" data-testid="spectra-table">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-paper-100 text-2xs uppercase tracking-wide text-paper-700">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const label = flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : header.column.getCanSort() ? 'none' : undefined}
                    className="border-b border-paper-300 px-4 py-2 font-semibold"
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 uppercase tracking-wide hover:text-ink-800"
                        data-testid={`sort-${header.column.id}`}
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
            <tr key={row.id} data-testid={`spectrum-row-${row.original.id}`} className="border-b border-paper-200 last:border-b-0 hover:bg-paper-50">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-4 py-2.5 align-middle">
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
