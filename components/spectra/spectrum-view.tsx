'use client';

import { PageHeader } from '@/components/shell/page-header';
import { Alert } from '@/components/ui/alert';
import { Panel } from '@/components/ui/panel';
import type { SpectrumDetail } from '@/lib/client/spectra-types';
import { useSpectrum } from '@/lib/client/use-spectrum';
import { RevisionList } from './revision-list';
import { RevisionUpload } from './revision-upload';
import { ScreeningPanel } from './screening-panel';
import { SpectrumFacts } from './spectrum-facts';
import { StatusBadge } from './status-badge';

/** One spectrum: its status and current revision, the screening, the metadata and the revisions. */
export function SpectrumView({ initial }: { initial: SpectrumDetail }) {
  const query = useSpectrum(initial.id, initial);
  const s = query.data ?? initial;
  const current = s.revisions.find((r) => r.id === s.currentRevision?.id) ?? s.revisions[0] ?? null;
  const group = s.group;
  const aside = (
    <>
      <SpectrumFacts spectrum={s} />
      {s.revisions.length > 0 && <RevisionList revisions={s.revisions} currentId={current?.id ?? null} />}
    </>
  );

  return (
    <>
      <PageHeader
        title={s.title}
        badge={<StatusBadge status={s.status} />}
        crumbs={[
          { href: '/', label: 'My groups' },
          { href: `/groups/${group.slug}`, label: group.name },
          { href: `/groups/${group.slug}/spectra`, label: 'Spectra' },
        ]}
        lead={
          <span data-testid="spectrum-lead">
            {s.material}
            {s.formula && <span className="ml-1.5 font-mono">{s.formula}</span>}
            {current && (
              <span className="ml-2 text-paper-600" data-testid="current-revision">
                · revision {current.number}
              </span>
            )}
          </span>
        }
      />
      {query.isError && (
        <Alert tone="error" className="mb-4">
          Could not refresh this spectrum: {query.error.message}
        </Alert>
      )}
      <div className="flex flex-col gap-5">
        {current ? (
          <ScreeningPanel key={current.id} spectrumId={s.id} revision={current} aside={aside} />
        ) : (
          <div className="grid gap-5 xl:grid-cols-[1fr_20rem]">
            <Panel title="Screening">
              <p className="text-paper-700">This spectrum has no revision yet.</p>
            </Panel>
            <div className="flex flex-col gap-5">{aside}</div>
          </div>
        )}
        {s.can.revise && (
          <div className="max-w-3xl">
            <RevisionUpload spectrumId={s.id} nextNumber={(s.revisions[0]?.number ?? 0) + 1} />
          </div>
        )}
      </div>
    </>
  );
}
