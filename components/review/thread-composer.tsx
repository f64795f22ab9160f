'use client';

import { useState } from 'react';
import { TextArea } from '@/components/spectra/text-area';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { openThread } from '@/lib/client/review/review-api';
import { useReviewMutation } from '@/lib/client/review/use-review';
import { frequencyText } from './anchor-text';
import { errorText } from './error-text';

/** Where a new thread will sit: a point the reviewer clicked, a finding, or the whole spectrum. */
export type DraftAnchor =
  | { kind: 'point'; revision: string; revisionNumber: number; index: number; branch: number; frequencyTHz: number }
  | { kind: 'finding'; finding: string; label: string }
  | { kind: 'spectrum' };

export function draftAnchorText(a: DraftAnchor, unit: FrequencyUnit): string {
  if (a.kind === 'point') return `q-point ${a.index}, branch ${a.branch} at ${frequencyText(a.frequencyTHz, unit)} (revision ${a.revisionNumber})`;
  if (a.kind === 'finding') return `the finding ${a.label}`;
  return 'the spectrum as a whole';
}

export interface ThreadComposerProps {
  spectrumId: string;
  anchor: DraftAnchor;
  unit: FrequencyUnit;
  canMarkBlocking: boolean;
  onClose: () => void;
}

/** A new thread at its anchor; blocking threads hold back approval until resolved. */
export function ThreadComposer({ spectrumId, anchor, unit, canMarkBlocking, onClose }: ThreadComposerProps) {
  const [body, setBody] = useState('');
  const [blocking, setBlocking] = useState(false);
  const [missing, setMissing] = useState(false);
  const m = useReviewMutation(spectrumId, () =>
    openThread(spectrumId, {
      anchor:
        anchor.kind === 'point'
          ? { revision: anchor.revision, index: anchor.index, branch: anchor.branch }
          : anchor.kind === 'finding'
            ? { finding: anchor.finding }
            : null,
      body: body.trim(),
      blocking,
    }),
  );
  return (
    <form
      className="flex flex-col gap-3 rounded-lg border-2 border-ink-300 bg-paper-0 p-4 shadow-panel"
      aria-label="New thread"
      data-testid="thread-composer"
      onSubmit={(e) => {
        e.preventDefault();
        if (!body.trim()) return setMissing(true);
        m.mutate(undefined, { onSuccess: onClose });
      }}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-sm font-semibold text-paper-900">New thread</h3>
        <p className="text-xs text-paper-700" data-testid="composer-anchor">
          On {draftAnchorText(anchor, unit)}
        </p>
      </div>
      <Field label="What should be looked at" hint="Mention a member with @ and the start of their e-mail address; they get notified." errors={missing ? ['Write something first.'] : undefined}>
        <TextArea rows={3} value={body} autoFocus onChange={(e) => (setBody(e.target.value), setMissing(false))} data-testid="thread-body" />
      </Field>
      {canMarkBlocking && (
        <label className="flex items-center gap-2 text-sm text-paper-800">
          <input type="checkbox" checked={blocking} onChange={(e) => setBlocking(e.target.checked)} data-testid="thread-blocking" className="h-4 w-4 accent-ink-800" />
          Blocking: the spectrum cannot be approved while this thread is open
        </label>
      )}
      {m.isError && <Alert tone="error">{errorText(m.error)}</Alert>}
      <div className="flex gap-2">
        <Button type="submit" disabled={m.isPending} data-testid="thread-submit">
          {m.isPending ? 'Opening…' : 'Open thread'}
        </Button>
        <Button variant="quiet" onClick={onClose}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
