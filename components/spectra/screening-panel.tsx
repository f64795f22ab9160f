'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { DispersionPlot, type PlotFinding } from '@/components/plot/dispersion-plot';
import { Alert } from '@/components/ui/alert';
import { Panel } from '@/components/ui/panel';
import { spectraKeys } from '@/lib/client/spectra-api';
import type { RevisionDto, StoredFindingDto } from '@/lib/client/spectra-types';
import { useRevisionData } from '@/lib/client/use-revision-data';
import { useScreening } from '@/lib/client/use-screening';
import { FindingsTable } from './findings-table';
import { ScreeningCaution } from './screening-caution';
import { ScreeningError } from './screening-error';
import { VerdictBadge } from './verdict-badge';

/**
 * The current revision's screening: a waiting note while it runs (polled), where the file
 * failed to parse, or the verdict, the plot with the findings marked and the findings list.
 */
export function ScreeningPanel({ spectrumId, revision, aside }: { spectrumId: string; revision: RevisionDto; aside?: ReactNode }) {
  const queryClient = useQueryClient();
  const screening = useScreening(revision.id);
  const status = screening.data?.status;
  const data = useRevisionData(revision.id, status === 'done');
  const [highlighted, setHighlighted] = useState<string | null>(null);

  // When screening ends the spectrum moves on (screening → in review). If the spectrum we hold
  // still shows this revision as pending, fetch it and the queue again, once.
  const refreshed = useRef(false);
  useEffect(() => {
    if (refreshed.current || revision.screeningStatus !== 'pending') return;
    if (status === 'done' || status === 'error') {
      refreshed.current = true;
      void queryClient.invalidateQueries({ queryKey: spectraKeys.detail(spectrumId) });
      void queryClient.invalidateQueries({ queryKey: ['spectra', 'list'] });
    }
  }, [status, revision.screeningStatus, spectrumId, queryClient]);

  const findings = useMemo(() => (screening.data?.status === 'done' ? screening.data.findings : []), [screening.data]);
  const plotFindings = useMemo<PlotFinding[]>(
    () =>
      findings
        .filter((f) => f.index !== null)
        .map((f) => ({ id: f.id, severity: f.severity, index: f.index!, branch: f.branch, value: f.value, label: `${f.check}: ${f.message}` })),
    [findings],
  );
  const highlight = plotFindings.find((f) => f.id === highlighted) ?? null;
  const show = useCallback((f: StoredFindingDto) => setHighlighted((h) => (h === f.id ? null : f.id)), []);

  const title = `Screening of revision ${revision.number}`;
  // The side column (metadata, revisions) sits beside the plot; the findings take the full width.
  const withAside = (main: ReactNode) => (
    <div className="grid gap-5 xl:grid-cols-[1fr_20rem]">
      <div className="min-w-0">{main}</div>
      {aside && <div className="flex flex-col gap-5">{aside}</div>}
    </div>
  );

  if (screening.isError) {
    return withAside(
      <Panel title={title}>
        <Alert tone="error" title="The screening could not be loaded">
          {screening.error.message}
        </Alert>
      </Panel>,
    );
  }

  if (!screening.data || screening.data.status === 'pending') {
    return withAside(
      <Panel title={title} data-testid="screening-panel" data-status="pending">
        <div role="status" className="flex items-center gap-3 py-4 text-paper-700" data-testid="screening-pending">
          <svg viewBox="0 0 16 16" className="h-4 w-4 animate-spin text-ink-700" aria-hidden="true">
            <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeOpacity="0.25" strokeWidth="2" />
            <path d="M8 2 A6 6 0 0 1 14 8" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
          </svg>
          <div>
            <p className="font-medium text-paper-900">Screening {revision.originalName}…</p>
            <p className="text-xs">The checks run in the background; this page updates by itself when they finish.</p>
          </div>
        </div>
      </Panel>,
    );
  }

  if (screening.data.status === 'error') {
    return withAside(
      <Panel title={title} data-testid="screening-panel" data-status="error">
        <ScreeningError error={screening.data.error} fileName={revision.originalName} />
      </Panel>,
    );
  }

  const done = screening.data;
  return (
    <div className="flex flex-col gap-5" data-testid="screening-panel" data-status="done">
      {withAside(
      <Panel
        title={title}
        description={`${done.format} file · ${done.qpoints} q-points · ${done.branches} branches · ${done.segments} ${done.segments === 1 ? 'segment' : 'segments'}`}
        actions={
          <span className="flex items-center gap-2 text-xs text-paper-700" data-testid="screening-verdict">
            Verdict <VerdictBadge verdict={done.verdict} />
          </span>
        }
        flush
      >
        <div className="px-4 pt-4">
          <ScreeningCaution />
        </div>
        <div className="p-4" data-testid="dispersion">
          {data.data ? (
            <DispersionPlot data={data.data} findings={plotFindings} highlight={highlight} height={440} />
          ) : data.isError ? (
            <Alert tone="error" title="The plot data could not be loaded">
              {data.error.message}
            </Alert>
          ) : (
            <p role="status" className="flex h-[440px] items-center justify-center rounded-md bg-paper-50 text-paper-600">
              Loading the dispersion…
            </p>
          )}
        </div>
      </Panel>,
      )}

      <Panel
        title={`Findings (${findings.length})`}
        description="Indices are 0-based, as in the screening JSON. Branch k is the k-th lowest frequency at that q-point."
        flush
        data-testid="findings"
      >
        {findings.length === 0 ? (
          <p className="px-4 py-6 text-paper-700" data-testid="no-findings">
            No check raised anything for this revision.
          </p>
        ) : (
          <FindingsTable findings={findings} highlighted={highlighted} onShow={show} />
        )}
      </Panel>
    </div>
  );
}
