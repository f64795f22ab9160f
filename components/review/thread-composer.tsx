'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { openThread } from '@/lib/client/review/review-api';
import { useReviewMutation } from '@/lib/client/review/use-review';
import { draftAnchorText, type DraftAnchor } from './draft-anchor';
import { errorText } from './error-text';
import { MentionTextArea } from './mention-text-area';

export type { DraftAnchor };

export interface ThreadComposerProps {
  spectrumId: string;
  /** The spectrum's group: its members are offered after `@`. */
  groupSlug: string;
  /** The writer (not offered for mentions). */
  selfId?: string;
  anchor: DraftAnchor;
  unit: FrequencyUnit;
  canMarkBlocking: boolean;
  onClose: () => void;
}

/** A new thread at its anchor; blocking threads hold back approval until resolved. */
export function ThreadComposer({ spectrumId, groupSlug, selfId, anchor, unit, canMarkBlocking, onClose }: ThreadComposerProps) {
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
      <Field label="What should be looked at" hint="Type @ to mention a member (arrow keys and Enter to pick); they get notified." errors={missing ? ['Write something first.'] : undefined}>
        <MentionTextArea
          rows={3}
          value={body}
          autoFocus
          groupSlug={groupSlug}
          selfId={selfId}
          onValueChange={(v) => (setBody(v), setMissing(false))}
          data-testid="thread-body"
        />
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
