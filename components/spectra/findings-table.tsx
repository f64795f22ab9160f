'use client';

import { createColumnHelper } from '@tanstack/react-table';
import { useMemo } from 'react';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import type { StoredFindingDto } from '@/lib/client/spectra-types';
import { SeverityMark } from './severity-mark';

const fmt = (x: number | null, digits = 3) => (x === null ? '—' : Number.isInteger(x) ? String(x) : x.toFixed(digits));
const fmtQ = (q: number[] | null) => (q ? `(${q.map((v) => fmt(v, 3)).join(', ')})` : '—');
const severityRank = { fail: 0, warn: 1, info: 2 } as const;

/** Where on the path, in the screening JSON's own terms (0-based, as the command line prints). */
function Location({ f }: { f: StoredFindingDto }) {
  const parts: [string, string][] = [];
  if (f.segment !== null) parts.push(['segment', String(f.segment)]);
  if (f.index !== null) parts.push(['q-point', String(f.index)]);
  if (f.branch !== null) parts.push(['branch', String(f.branch)]);
  if (parts.length === 0 && !f.q) return <span className="text-paper-600">whole file</span>;
  return (
    <div className="min-w-[10rem] text-xs leading-5">
      <div className="flex flex-wrap gap-x-2.5">
        {parts.map(([k, v]) => (
          <span key={k} className="whitespace-nowrap">
            <span className="text-paper-600">{k}</span> <span className="tabular font-semibold text-paper-900">{v}</span>
          </span>
        ))}
      </div>
      {f.q && (
        <div className="tabular whitespace-nowrap font-mono text-paper-700" title="q, folded into the first Brillouin zone where known">
          q = {fmtQ(f.q)}
        </div>
      )}
    </div>
  );
}

const col = createColumnHelper<StoredFindingDto>();

export interface FindingsTableProps {
  findings: StoredFindingDto[];
  highlighted: string | null;
  onShow?: (f: StoredFindingDto) => void;
}

/** The current revision's findings: severity (shape and word), check, location, value and limit, message. */
export function FindingsTable({ findings, highlighted, onShow }: FindingsTableProps) {
  const columns = useMemo(
    () => [
      col.accessor((f) => severityRank[f.severity], {
        id: 'severity',
        header: 'Severity',
        cell: (c) => <SeverityMark severity={c.row.original.severity} />,
      }),
      col.accessor('check', { header: 'Check', cell: (c) => <code className="whitespace-nowrap text-paper-900">{c.getValue()}</code> }),
      col.accessor((f) => f.index ?? -1, { id: 'location', header: 'Location', cell: (c) => <Location f={c.row.original} /> }),
      col.accessor((f) => f.value ?? Number.NEGATIVE_INFINITY, {
        id: 'value',
        header: () => (
          <span className="whitespace-nowrap">
            Value / limit <span className="normal-case">(THz)</span>
          </span>
        ),
        cell: (c) => (
          <span className="tabular whitespace-nowrap">
            {fmt(c.row.original.value)} <span className="text-paper-500">/</span> <span className="text-paper-700">{fmt(c.row.original.limit)}</span>
          </span>
        ),
      }),
      col.accessor('message', {
        header: 'What was found',
        enableSorting: false,
        cell: (c) => <p className="min-w-[18rem] max-w-prose text-paper-800">{c.getValue()}</p>,
      }),
      col.display({
        id: 'show',
        header: () => <span className="sr-only">On the plot</span>,
        cell: ({ row }) =>
          onShow && row.original.index !== null ? (
            <Button
              variant={highlighted === row.original.id ? 'secondary' : 'quiet'}
              size="sm"
              aria-pressed={highlighted === row.original.id}
              onClick={() => onShow(row.original)}
            >
              {highlighted === row.original.id ? 'Shown' : 'Show'}
            </Button>
          ) : null,
      }),
    ],
    [highlighted, onShow],
  );

  return (
    <DataTable
      data={findings}
      columns={columns}
      caption="Findings of the current revision"
      getRowId={(f) => f.id}
      rowTestId={(f) => `finding-${f.check}`}
      data-testid="findings-table"
    />
  );
}
