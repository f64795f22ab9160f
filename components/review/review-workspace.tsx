'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { DispersionPlot, type MeasuredPoint, type PlotFinding, type PlotPoint } from '@/components/plot/dispersion-plot';
import { PageHeader } from '@/components/shell/page-header';
import { RevisionUpload } from '@/components/spectra/revision-upload';
import { ScreeningCaution } from '@/components/spectra/screening-caution';
import { ScreeningError } from '@/components/spectra/screening-error';
import { SpectrumFacts } from '@/components/spectra/spectrum-facts';
import { StatusBadge } from '@/components/spectra/status-badge';
import { VerdictBadge } from '@/components/spectra/verdict-badge';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import type { MeasuredRow } from '@/lib/client/review/measured-points';
import type { ThreadDto } from '@/lib/client/review/review-types';
import { spectraKeys } from '@/lib/client/spectra-api';
import type { SpectrumDetail, StoredFindingDto } from '@/lib/client/spectra-types';
import { useRevisionData } from '@/lib/client/use-revision-data';
import { useScreening } from '@/lib/client/use-screening';
import { useSpectrum } from '@/lib/client/use-spectrum';
import { exportFilename } from '@/lib/export/filename';
import { DecisionPanel } from './decision-panel';
import { DerivedPanel } from './derived-panel';
import { ExportPanel } from './export-panel';
import { FindingsPanel, findingPlace } from './findings-panel';
import { ReviewersPanel } from './reviewers-panel';
import type { ReviewAbilities } from './review-abilities';
import { RevisionsPanel, type ComparePair } from './revisions-panel';
import { draftPlace, type DraftAnchor } from './draft-anchor';
import { ThreadComposer } from './thread-composer';
import { ThreadsPanel } from './threads-panel';

const OPEN_STATES = ['in-review', 'returned'];

/**
 * The review workspace of one spectrum: the plot with findings and a thread composer at the
 * clicked point, findings with waivers, threads, the decision, revisions with compare, derived
 * physics and export. What the caller may do comes from the server (`can`); `userId` is the
 * caller (left out of @-mention suggestions).
 */
export function ReviewWorkspace({ initial, can, userId }: { initial: SpectrumDetail; can: ReviewAbilities; userId?: string }) {
  const qc = useQueryClient();
  const spectrum = useSpectrum(initial.id, initial);
  const s = spectrum.data ?? initial;
  const current = s.revisions.find((r) => r.id === s.currentRevision?.id) ?? s.revisions[0] ?? null;
  const screening = useScreening(current?.id);
  const status = screening.data?.status;
  const currentData = useRevisionData(current?.id, status === 'done');

  // Screening ended (seen here, or before the first answer came): the spectrum moves on
  // (screening → in review). Until the spectrum says so, fetch it again, a few times at most.
  const refreshes = useRef(0);
  const stale = (status === 'done' || status === 'error') && s.status === 'screening' && s.currentRevision?.id === current?.id;
  useEffect(() => {
    if (!stale) {
      refreshes.current = 0;
      return;
    }
    if (refreshes.current >= 10) return;
    const t = setTimeout(
      () => {
        refreshes.current++;
        void qc.invalidateQueries({ queryKey: spectraKeys.detail(s.id) });
        void qc.invalidateQueries({ queryKey: ['spectra', 'list'] });
        void qc.invalidateQueries({ queryKey: ['review', s.id] });
      },
      refreshes.current === 0 ? 0 : 1000,
    );
    return () => clearTimeout(t);
  }, [stale, s.id, s.version, qc, spectrum.dataUpdatedAt]);

  const [unit, setUnit] = useState<FrequencyUnit>('THz');
  const [highlighted, setHighlighted] = useState<PlotFinding | null>(null);
  const [draft, setDraft] = useState<DraftAnchor | null>(null);
  const [pair, setPair] = useState<ComparePair | null>(null);
  const [measuredRows, setMeasuredRows] = useState<MeasuredRow[] | null>(null);

  // Comparing: revision `b` drawn solid, `a` dashed on top; otherwise the current revision.
  const shownId = pair && pair.a !== pair.b ? pair.b : (current?.id ?? null);
  const shownData = useRevisionData(shownId, Boolean(shownId) && (shownId !== current?.id || status === 'done'));
  const overlayData = useRevisionData(pair && pair.a !== pair.b ? pair.a : null, Boolean(pair));
  const data = shownId === current?.id ? currentData.data : shownData.data;
  const shownNumber = s.revisions.find((r) => r.id === shownId)?.number ?? null;
  const overlayNumber = pair && pair.a !== pair.b ? s.revisions.find((r) => r.id === pair.a)?.number : null;

  const findings = useMemo(() => (screening.data?.status === 'done' ? screening.data.findings : []), [screening.data]);
  const plotFindings = useMemo<PlotFinding[]>(
    () =>
      shownId !== current?.id
        ? []
        : findings
            .filter((f) => f.index !== null && !f.waived)
            .map((f) => ({ id: f.id, severity: f.severity, index: f.index!, branch: f.branch, value: f.value, label: `${f.check}: ${f.message}` })),
    [findings, shownId, current?.id],
  );
  const measured = useMemo<MeasuredPoint[]>(
    () => (measuredRows ?? []).map((r) => ({ distance: r.distance, index: r.index, frequencyTHz: r.frequencyTHz, uncertaintyTHz: r.uncertaintyTHz })),
    [measuredRows],
  );

  const showFinding = useCallback(
    (f: StoredFindingDto) =>
      setHighlighted((h) => (h?.id === f.id ? null : { id: f.id, severity: f.severity, index: f.index!, branch: f.branch, value: f.value, label: `${f.check}: ${f.message}` })),
    [],
  );
  const showThread = useCallback((t: ThreadDto) => {
    const a = t.anchor;
    if (a.kind === 'point') setHighlighted({ id: `thread:${t.id}`, severity: 'info', index: a.index, branch: a.branch, value: a.frequency, label: `thread: ${t.body.slice(0, 60)}` });
    else if (a.kind === 'finding' && a.index !== null)
      setHighlighted({ id: `thread:${t.id}`, severity: (a.severity as PlotFinding['severity']) ?? 'info', index: a.index, branch: a.branch, label: `thread on ${a.check}` });
    document.getElementById('workspace-plot')?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  }, []);
  const onPointClick = useCallback(
    (p: PlotPoint) => {
      if (!can.openThread || !shownId || shownNumber === null) return;
      setDraft({ kind: 'point', revision: shownId, revisionNumber: shownNumber, index: p.index, branch: p.branch, frequencyTHz: p.frequencyTHz });
    },
    [can.openThread, shownId, shownNumber],
  );

  const group = s.group;
  const place = draftPlace(draft, status, Boolean(current));
  const composer = draft && place && (
    <ThreadComposer
      key={JSON.stringify(draft)}
      spectrumId={s.id}
      groupSlug={group.slug}
      selfId={userId}
      anchor={draft}
      unit={unit}
      canMarkBlocking={can.markBlocking}
      onClose={() => setDraft(null)}
    />
  );
  const plotTitle = current ? `Revision ${shownNumber ?? current.number}${pair && overlayNumber ? ` against revision ${overlayNumber} (dashed)` : ''}` : 'Dispersion';

  return (
    <>
      <PageHeader
        title={s.title}
        badge={<StatusBadge status={s.status} screening={s.currentRevision?.screeningStatus} />}
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
      {spectrum.isError && (
        <Alert tone="error" className="mb-4">
          Could not refresh this spectrum: {spectrum.error.message}
        </Alert>
      )}
      <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex min-w-0 flex-col gap-5">
          <Panel
            id="workspace-plot"
            title={plotTitle}
            description={
              screening.data?.status === 'done'
                ? `${screening.data.format} file · ${screening.data.qpoints} q-points · ${screening.data.branches} branches · ${screening.data.segments} ${screening.data.segments === 1 ? 'segment' : 'segments'}${can.openThread ? ' · click a line to open a thread there' : ''}`
                : undefined
            }
            actions={
              screening.data?.status === 'done' ? (
                <span className="flex items-center gap-2 text-xs text-paper-700" data-testid="screening-verdict">
                  Screening verdict <VerdictBadge verdict={screening.data.verdict} />
                </span>
              ) : undefined
            }
            data-testid="screening-panel"
          >
            <div className="flex flex-col gap-4" data-status={status ?? 'pending'}>
              {!current ? (
                <p className="text-paper-700">This spectrum has no revision yet.</p>
              ) : screening.isError ? (
                <Alert tone="error" title="The screening could not be loaded">{screening.error.message}</Alert>
              ) : !screening.data || screening.data.status === 'pending' ? (
                <p role="status" className="py-4 text-paper-700" data-testid="screening-pending">
                  Screening {current.originalName}… the checks run in the background; this page updates by itself when they finish.
                </p>
              ) : screening.data.status === 'error' ? (
                <>
                  <ScreeningError error={screening.data.error} fileName={current.originalName} />
                  {can.openThread && (
                    <div>
                      <Button variant="secondary" size="sm" onClick={() => setDraft({ kind: 'spectrum' })} data-testid="thread-ask-file">
                        Ask about this file in a thread
                      </Button>
                    </div>
                  )}
                </>
              ) : (
                <>
                  <ScreeningCaution />
                  <div data-testid="dispersion">
                    {data ? (
                      <DispersionPlot
                        data={data}
                        findings={plotFindings}
                        highlight={highlighted}
                        overlay={pair ? (overlayData.data ?? null) : null}
                        overlayLabel={overlayNumber ? `Revision ${overlayNumber}` : undefined}
                        measured={measured}
                        unit={unit}
                        onUnitChange={setUnit}
                        onPointClick={can.openThread ? onPointClick : undefined}
                        height={440}
                      />
                    ) : currentData.isError ? (
                      <Alert tone="error" title="The plot data could not be loaded">{currentData.error.message}</Alert>
                    ) : (
                      <p role="status" className="flex h-[440px] items-center justify-center rounded-md bg-paper-50 text-paper-600">
                        Loading the dispersion…
                      </p>
                    )}
                  </div>
                  {place === 'plot' && composer}
                </>
              )}
            </div>
          </Panel>

          {screening.data?.status === 'done' && (
            <FindingsPanel
              spectrumId={s.id}
              revisionId={screening.data.revision}
              findings={findings}
              screeningVerdict={screening.data.verdict}
              effectiveVerdict={s.verdict}
              highlighted={highlighted && typeof highlighted.id === 'string' ? highlighted.id : null}
              onShow={showFinding}
              onDiscuss={can.openThread ? (f) => setDraft({ kind: 'finding', finding: f.id, label: `${f.check} (${findingPlace(f)})` }) : undefined}
              canWaive={can.waive}
              waivable={OPEN_STATES.includes(s.status)}
            />
          )}
          <ThreadsPanel
            spectrumId={s.id}
            groupSlug={group.slug}
            selfId={userId}
            unit={unit}
            can={can}
            plotReady={status === 'done'}
            composer={place === 'threads' ? composer : null}
            onNewOnSpectrum={current ? () => setDraft({ kind: 'spectrum' }) : undefined}
            onShow={showThread}
          />
          <RevisionsPanel spectrumId={s.id} revisions={s.revisions} currentId={current?.id ?? null} pair={pair} onPair={setPair} unit={unit} />
          <DerivedPanel revisionId={shownId} data={data ?? null} unit={unit} onMeasured={setMeasuredRows} />
        </div>
        <div className="flex flex-col gap-5">
          <DecisionPanel spectrum={s} can={can} selfId={userId} />
          <ReviewersPanel spectrumId={s.id} canAssign={can.assignReviewers} />
          {/* Named like the server's exports (title-r2-plot.svg), for the revision drawn now. */}
          {can.export && <ExportPanel spectrumId={s.id} approved={s.status === 'approved'} pngName={exportFilename(s.title, shownNumber ?? current?.number ?? 0, 'plot', 'png')} />}
          {s.can.revise && <RevisionUpload spectrumId={s.id} nextNumber={(s.revisions[0]?.number ?? 0) + 1} />}
          <SpectrumFacts spectrum={s} />
        </div>
      </div>
    </>
  );
}
