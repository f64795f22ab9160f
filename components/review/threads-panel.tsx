'use client';

import { useState, type ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import type { ThreadDto } from '@/lib/client/review/review-types';
import { useThreads } from '@/lib/client/review/use-review';
import type { ReviewAbilities } from './review-abilities';
import { ThreadItem } from './thread-item';

type Show = 'open' | 'all';

/**
 * The spectrum's threads, open ones first; each with its anchor, revision and replies. A new
 * thread on the spectrum as a whole is written here (`composer`), in every screening state.
 */
export function ThreadsPanel({
  spectrumId,
  groupSlug,
  selfId,
  unit,
  can,
  plotReady,
  composer,
  onNewOnSpectrum,
  onShow,
}: {
  spectrumId: string;
  groupSlug: string;
  selfId?: string;
  unit: FrequencyUnit;
  can: ReviewAbilities;
  /** Screening is done: points of the plot can be discussed too. */
  plotReady: boolean;
  /** The open composer of a thread on the spectrum, if any. */
  composer?: ReactNode;
  /** Absent when no thread on the spectrum can be opened (no right, or no revision yet). */
  onNewOnSpectrum?: () => void;
  onShow?: (t: ThreadDto) => void;
}) {
  const q = useThreads(spectrumId);
  const [show, setShow] = useState<Show>('all');
  const all = q.data?.items ?? [];
  const open = all.filter((t) => !t.resolved);
  const items = (show === 'open' ? open : all).slice().sort((a, b) => Number(a.resolved) - Number(b.resolved));
  return (
    <Panel
      title={`Threads (${open.length} open of ${all.length})`}
      description={
        // Only those who may open threads are told how.
        !can.openThread
          ? undefined
          : plotReady
            ? 'Click a line of the plot to open a thread at that point.'
            : 'Until screening has read the file, threads go on the spectrum as a whole; points of the plot can be discussed after.'
      }
      actions={
        <>
          <Button variant="quiet" size="sm" aria-pressed={show === 'open'} onClick={() => setShow(show === 'open' ? 'all' : 'open')}>
            Only open
          </Button>
          {can.openThread && onNewOnSpectrum && (
            <Button variant="secondary" size="sm" onClick={onNewOnSpectrum} aria-expanded={Boolean(composer)} data-testid="thread-new-spectrum">
              Thread on the spectrum
            </Button>
          )}
        </>
      }
      flush
      data-testid="threads"
    >
      {composer && <div className="border-b border-paper-200 p-4">{composer}</div>}
      {q.isError && <Alert tone="error" className="m-4">Could not load the threads: {q.error.message}</Alert>}
      {q.isPending ? (
        <p role="status" className="px-4 py-5 text-paper-600">Loading threads…</p>
      ) : items.length === 0 ? (
        <p className="px-4 py-5 text-paper-700" data-testid="no-threads">
          {all.length === 0 ? 'No threads yet.' : 'Every thread is resolved.'}
        </p>
      ) : (
        <ol className="divide-y divide-paper-200">
          {items.map((t) => (
            <ThreadItem key={t.id} thread={t} groupSlug={groupSlug} selfId={selfId} unit={unit} canReply={can.reply} canMarkBlocking={can.markBlocking} canResolve={can.resolve} onShow={onShow} />
          ))}
        </ol>
      )}
    </Panel>
  );
}
