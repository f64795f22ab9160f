'use client';

import { useEffect, useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { controlClasses } from '@/components/ui/control-classes';
import type { MineFilter, QueueState } from '@/lib/client/queue-params';
import { SCREENING_STATUSES, SPECTRUM_STATUSES, VERDICT_FILTERS, type ScreeningStatus, type SpectrumStatus, type VerdictFilter } from '@/lib/client/spectra-types';
import { FILE_NOT_READ, STATUS_LOOK } from './status-badge';

const SEARCH_DELAY_MS = 300;

const verdictWords: Record<VerdictFilter, string> = { pass: 'pass', warn: 'warn', fail: 'fail', none: 'pending or unreadable' };
const screeningWords: Record<ScreeningStatus, string> = { pending: 'being screened', done: 'screened', error: FILE_NOT_READ.word };

export interface QueueToolbarProps {
  state: QueueState;
  onChange: (change: Partial<QueueState>) => void;
}

/** Search, status and verdict filters of the queue. Search waits for a pause in typing. */
export function QueueToolbar({ state, onChange }: QueueToolbarProps) {
  const id = useId();
  const [q, setQ] = useState(state.q);

  // The URL can change under us (back button, clear): follow it, unless it is only our own
  // typing arriving there (trimmed), which must not eat a space the person just typed.
  const [urlQ, setUrlQ] = useState(state.q);
  if (urlQ !== state.q) {
    setUrlQ(state.q);
    if (state.q !== q.trim()) setQ(state.q);
  }

  useEffect(() => {
    if (q.trim() === state.q.trim()) return;
    const t = setTimeout(() => onChange({ q }), SEARCH_DELAY_MS);
    return () => clearTimeout(t);
  }, [q, state.q, onChange]);

  const filtered = Boolean(state.status || state.mine || state.verdict || state.screening || state.q);

  return (
    <div className="flex flex-wrap items-end gap-3 border-b border-paper-200 px-4 py-3" role="search" aria-label="Filter the queue">
      <div className="flex min-w-[14rem] flex-1 flex-col gap-1">
        <label htmlFor={`${id}-q`} className="text-xs font-semibold text-paper-800">
          Search
        </label>
        <input
          id={`${id}-q`}
          type="search"
          value={q}
          maxLength={200}
          placeholder="Title, material, formula, code or method"
          onChange={(e) => setQ(e.target.value)}
          onKeyDown={(e) => e.key === 'Enter' && onChange({ q })}
          className={controlClasses(false, 'h-9')}
          data-testid="queue-search"
        />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-mine`} className="text-xs font-semibold text-paper-800">
          Mine
        </label>
        <select
          id={`${id}-mine`}
          value={state.mine ?? ''}
          onChange={(e) => onChange({ mine: (e.target.value || null) as MineFilter | null })}
          className={controlClasses(false, 'h-9 pr-7')}
          data-testid="queue-mine"
        >
          <option value="">Everyone&apos;s</option>
          <option value="assigned">Assigned to me</option>
          <option value="waiting">Waiting on me</option>
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-status`} className="text-xs font-semibold text-paper-800">
          Status
        </label>
        <select
          id={`${id}-status`}
          value={state.status ?? ''}
          onChange={(e) => onChange({ status: (e.target.value || null) as SpectrumStatus | null })}
          className={controlClasses(false, 'h-9 pr-7')}
          data-testid="queue-status"
        >
          <option value="">Any status</option>
          {SPECTRUM_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_LOOK[s].word}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-verdict`} className="text-xs font-semibold text-paper-800">
          Verdict
        </label>
        <select
          id={`${id}-verdict`}
          value={state.verdict ?? ''}
          onChange={(e) => onChange({ verdict: (e.target.value || null) as VerdictFilter | null })}
          className={controlClasses(false, 'h-9 pr-7')}
          data-testid="queue-verdict"
        >
          <option value="">Any verdict</option>
          {VERDICT_FILTERS.map((v) => (
            <option key={v} value={v}>
              {verdictWords[v]}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-screening`} className="text-xs font-semibold text-paper-800">
          Current file
        </label>
        <select
          id={`${id}-screening`}
          value={state.screening ?? ''}
          onChange={(e) => onChange({ screening: (e.target.value || null) as ScreeningStatus | null })}
          className={controlClasses(false, 'h-9 pr-7')}
          data-testid="queue-screening"
        >
          <option value="">Any</option>
          {SCREENING_STATUSES.map((v) => (
            <option key={v} value={v}>
              {screeningWords[v]}
            </option>
          ))}
        </select>
      </div>
      {filtered && (
        <Button variant="quiet" onClick={() => { setQ(''); onChange({ status: null, mine: null, verdict: null, screening: null, q: '' }); }} data-testid="queue-clear">
          Clear filters
        </Button>
      )}
    </div>
  );
}
