'use client';

import { createColumnHelper } from '@tanstack/react-table';
import Link from 'next/link';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useMemo } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { Field } from '@/components/ui/field';
import { formatMinute } from '@/components/ui/format';
import { Input } from '@/components/ui/input';
import { Panel } from '@/components/ui/panel';
import { Select } from '@/components/ui/select';
import type { AuditFilter } from '@/lib/client/review/review-api';
import type { AuditEventDto } from '@/lib/client/review/review-types';
import { useGroupAudit } from '@/lib/client/review/use-review';

const PAGE_SIZE = 50;

/** Prefixes ending in '.' match every action of that kind. */
const ACTIONS = [
  { value: '', label: 'Any action' },
  { value: 'decision.', label: 'Decisions (all)' },
  { value: 'decision.approve', label: '— approvals' },
  { value: 'decision.return', label: '— returns' },
  { value: 'decision.reject', label: '— rejections' },
  { value: 'spectrum.', label: 'Spectrum status (all)' },
  { value: 'spectrum.approved', label: '— approved automatically' },
  { value: 'spectrum.withdrawn', label: '— withdrawn' },
  { value: 'spectrum.reopened', label: '— reopened' },
  { value: 'revision.created', label: 'New revisions' },
  { value: 'finding.waived', label: 'Waivers' },
  { value: 'thread.', label: 'Threads (all)' },
  { value: 'reviewers.assigned', label: 'Reviewer assignments' },
  { value: 'policy.updated', label: 'Policy changes' },
  { value: 'member.', label: 'Members' },
  { value: 'invitation.', label: 'Invitations' },
  { value: 'token.', label: 'API tokens' },
];

export interface AuditMember {
  id: string;
  name: string | null;
  email: string;
}

function detailsOf(e: AuditEventDto): string {
  const d = e.data ?? {};
  const parts: string[] = [];
  if (typeof d.number === 'number') parts.push(`revision ${d.number}`);
  if (typeof d.from === 'string' && typeof d.to === 'string') parts.push(`${d.from} → ${d.to}`);
  if (d.automatic === true) parts.push('automatic');
  if (typeof d.blocking === 'boolean' && e.action === 'thread.opened') parts.push(d.blocking ? 'blocking' : 'not blocking');
  if (typeof d.reason === 'string') parts.push(`“${d.reason}”`);
  if (typeof d.note === 'string') parts.push(`“${d.note}”`);
  if (typeof d.role === 'string') parts.push(`role ${d.role}`);
  return parts.join(' · ');
}

const col = createColumnHelper<AuditEventDto>();

/** The group's audit trail, newest first; filters and page live in the URL. */
export function AuditLog({ slug, members }: { slug: string; members: AuditMember[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const filter: AuditFilter = {
    action: params.get('action') ?? undefined,
    actor: params.get('actor') ?? undefined,
    target: params.get('target') ?? undefined,
    from: params.get('from') ?? undefined,
    to: params.get('to') ?? undefined,
    page: Math.max(1, Number(params.get('page')) || 1),
    pageSize: PAGE_SIZE,
  };
  const q = useGroupAudit(slug, filter);
  const set = (patch: Record<string, string | undefined>) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(patch)) if (v) next.set(k, v);
    else next.delete(k);
    if (!('page' in patch)) next.delete('page');
    router.replace(`${pathname}?${next}`, { scroll: false });
  };

  const columns = useMemo(
    () => [
      col.accessor('createdAt', { header: 'When', cell: (c) => <span className="whitespace-nowrap tabular">{formatMinute(c.getValue())}</span> }),
      col.accessor((e) => e.actor?.name ?? e.actor?.email ?? '', {
        id: 'actor',
        header: 'Who',
        cell: (c) => (c.row.original.actor ? <span title={c.row.original.actor.email}>{c.getValue()}</span> : <span className="text-paper-600">the system</span>),
      }),
      col.accessor('action', { header: 'Action', cell: (c) => <code className="whitespace-nowrap text-paper-900">{c.getValue()}</code> }),
      col.accessor((e) => e.target ?? '', {
        id: 'target',
        header: 'On',
        cell: (c) => {
          const e = c.row.original;
          const spectrum = typeof e.data?.spectrum === 'string' ? e.data.spectrum : e.target?.startsWith('spectrum:') ? e.target.slice('spectrum:'.length) : null;
          return (
            <span className="flex flex-col">
              <button type="button" className="text-left font-mono text-2xs text-paper-700 hover:underline" title="Show only this target" onClick={() => set({ target: c.getValue() })}>
                {c.getValue() || '—'}
              </button>
              {spectrum && (
                <Link href={`/groups/${slug}/spectra/${spectrum}`} className="text-xs" data-testid="audit-spectrum">
                  {e.spectrum?.title ?? 'Open spectrum'}
                </Link>
              )}
            </span>
          );
        },
      }),
      col.display({ id: 'details', header: 'Details', cell: (c) => <span className="text-paper-800">{detailsOf(c.row.original)}</span> }),
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [slug, params],
  );

  const total = q.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));
  return (
    <div className="flex flex-col gap-4">
      <Panel title="Filters" data-testid="audit-filters">
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Action">
            <Select options={ACTIONS} value={filter.action ?? ''} onChange={(e) => set({ action: e.target.value })} data-testid="audit-action" />
          </Field>
          <Field label="Who">
            <Select
              options={[{ value: '', label: 'Anyone' }, ...members.map((m) => ({ value: m.id, label: m.name ?? m.email }))]}
              value={filter.actor ?? ''}
              onChange={(e) => set({ actor: e.target.value })}
              data-testid="audit-actor"
            />
          </Field>
          <Field label="From (day)">
            <Input type="date" value={filter.from ?? ''} onChange={(e) => set({ from: e.target.value })} />
          </Field>
          <Field label="To (day, inclusive)">
            <Input type="date" value={filter.to ?? ''} onChange={(e) => set({ to: e.target.value })} />
          </Field>
          {filter.target && (
            <p className="flex items-center gap-2 text-xs text-paper-700">
              Target <code>{filter.target}</code>
              <Button variant="quiet" size="sm" onClick={() => set({ target: undefined })}>
                Clear
              </Button>
            </p>
          )}
          {(filter.action || filter.actor || filter.from || filter.to || filter.target) && (
            <Button variant="quiet" size="sm" onClick={() => router.replace(pathname, { scroll: false })}>
              Clear all filters
            </Button>
          )}
        </div>
      </Panel>
      {q.isError && <Alert tone="error">{q.error.message}</Alert>}
      <Panel title={q.data ? `${total} ${total === 1 ? 'event' : 'events'}` : 'Events'} flush data-testid="audit-log">
        {!q.data ? (
          <p role="status" className="px-4 py-5 text-paper-600">Loading…</p>
        ) : (
          <DataTable
            data={q.data.items}
            columns={columns}
            caption="Audit events, newest first"
            getRowId={(e) => e.id}
            rowTestId={(e) => `audit-${e.action}`}
            empty={<p className="px-4 py-5 text-paper-700">No event matches these filters.</p>}
          />
        )}
        {pages > 1 && (
          <nav aria-label="Audit pages" className="flex items-center justify-between border-t border-paper-200 px-4 py-2 text-xs text-paper-700">
            <Button variant="secondary" size="sm" disabled={filter.page <= 1} onClick={() => set({ page: String(filter.page - 1) })}>
              Newer
            </Button>
            <span>
              Page {filter.page} of {pages}
            </span>
            <Button variant="secondary" size="sm" disabled={filter.page >= pages} onClick={() => set({ page: String(filter.page + 1) })}>
              Older
            </Button>
          </nav>
        )}
      </Panel>
    </div>
  );
}
