'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { cx } from '@/components/ui/cx';
import { Field } from '@/components/ui/field';
import { formatMinute } from '@/components/ui/format';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { replyToThread, updateThread } from '@/lib/client/review/review-api';
import type { ThreadDto } from '@/lib/client/review/review-types';
import { useReviewMutation } from '@/lib/client/review/use-review';
import { frequencyText } from './anchor-text';
import { errorText } from './error-text';
import { MentionTextArea } from './mention-text-area';
import { personName } from './person-name';

export function threadAnchorText(t: ThreadDto, unit: FrequencyUnit): string {
  const a = t.anchor;
  if (a.kind === 'point') return `q-point ${a.index}, branch ${a.branch} at ${frequencyText(a.frequency, unit)}`;
  if (a.kind === 'finding') {
    const where = [a.index !== null ? `q-point ${a.index}` : null, a.branch !== null ? `branch ${a.branch}` : null].filter(Boolean).join(', ');
    return `finding ${a.check ?? '(removed)'}${where ? ` at ${where}` : ''}`;
  }
  return 'the spectrum';
}

/** "Moved since": whether the current revision differs at the anchor by more than the tolerance. */
function MovedNote({ t, unit }: { t: ThreadDto; unit: FrequencyUnit }) {
  const m = t.moved;
  if (!m || m.current.id === t.revision.id) return null;
  if (m.moved === null)
    return <p className="text-xs text-paper-600" data-testid="thread-moved">Revision {m.current.number} has no such point to compare with.</p>;
  const change = m.then !== null && m.now !== null ? `${frequencyText(m.then, unit)} → ${frequencyText(m.now, unit)}` : '';
  return m.moved ? (
    <p className="flex items-center gap-1.5 text-xs font-medium text-ochre-800" data-testid="thread-moved" data-moved="yes">
      <Badge tone="warn" shape="bang">moved</Badge>
      Moved since: revision {m.current.number} differs here by more than {m.tolerance !== null ? frequencyText(m.tolerance, unit) : 'the tolerance'} ({change}).
    </p>
  ) : (
    <p className="text-xs text-paper-600" data-testid="thread-moved" data-moved="no">
      Unchanged here in revision {m.current.number} ({change}).
    </p>
  );
}

export interface ThreadItemProps {
  thread: ThreadDto;
  /** The spectrum's group: its members are offered after `@` in the reply. */
  groupSlug: string;
  selfId?: string;
  unit: FrequencyUnit;
  canReply: boolean;
  canMarkBlocking: boolean;
  canResolve: boolean;
  onShow?: (t: ThreadDto) => void;
}

export function ThreadItem({ thread: t, groupSlug, selfId, unit, canReply, canMarkBlocking, canResolve, onShow }: ThreadItemProps) {
  const [reply, setReply] = useState('');
  const send = useReviewMutation(t.spectrumId, (body: string) => replyToThread(t.id, body));
  const change = useReviewMutation(t.spectrumId, (c: { resolved?: boolean; blocking?: boolean }) => updateThread(t.id, c));
  const error = send.error ?? change.error;
  return (
    <li className={cx('flex flex-col gap-2 px-4 py-3 text-sm', t.resolved && 'bg-paper-50')} data-testid="thread" data-thread={t.id} data-resolved={t.resolved ? 'yes' : 'no'} data-blocking={t.blocking ? 'yes' : 'no'}>
      <div className="flex flex-wrap items-center gap-2">
        {t.resolved ? (
          <Badge tone="ok" shape="check" data-testid="thread-state">resolved</Badge>
        ) : (
          <Badge tone="ink" shape="ring" data-testid="thread-state">open</Badge>
        )}
        {t.blocking && (
          <Badge tone="danger" shape="diamond" title="Holds back approval while open" data-testid="thread-blocking-badge">
            blocking
          </Badge>
        )}
        <span className="text-xs text-paper-700" data-testid="thread-anchor">
          On {threadAnchorText(t, unit)}
        </span>
        <span className="text-xs text-paper-600" data-testid="thread-revision">· opened on revision {t.revision.number}</span>
        {onShow && t.anchor.kind !== 'spectrum' && (
          <Button variant="quiet" size="sm" onClick={() => onShow(t)} className="ml-auto">
            Show on plot
          </Button>
        )}
      </div>
      <MovedNote t={t} unit={unit} />
      <div>
        <p className="text-xs text-paper-600">
          <span className="font-semibold text-paper-800">{personName(t.author)}</span> · {formatMinute(t.createdAt)}
        </p>
        <p className="mt-0.5 whitespace-pre-wrap text-paper-900" data-testid="thread-text">{t.body}</p>
      </div>
      {t.replies.length > 0 && (
        <ol className="ml-3 flex flex-col gap-2 border-l-2 border-paper-300 pl-3" data-testid="thread-replies">
          {t.replies.map((r) => (
            <li key={r.id}>
              <p className="text-xs text-paper-600">
                <span className="font-semibold text-paper-800">{personName(r.author)}</span> · {formatMinute(r.createdAt)}
              </p>
              <p className="whitespace-pre-wrap text-paper-900">{r.body}</p>
            </li>
          ))}
        </ol>
      )}
      {t.resolved && t.resolvedAt && (
        <p className="text-xs text-paper-600">
          Resolved by {personName(t.resolvedBy)} on {formatMinute(t.resolvedAt)}
        </p>
      )}
      {error && <Alert tone="error">{errorText(error)}</Alert>}
      <div className="flex flex-wrap items-end gap-2">
        {canReply && (
          <form
            className="flex min-w-[16rem] flex-1 items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              if (reply.trim()) send.mutate(reply.trim(), { onSuccess: () => setReply('') });
            }}
          >
            <Field label="Reply" className="flex-1">
              <MentionTextArea rows={1} value={reply} groupSlug={groupSlug} selfId={selfId} onValueChange={setReply} data-testid="reply-body" />
            </Field>
            <Button type="submit" variant="secondary" size="sm" disabled={send.isPending || !reply.trim()} data-testid="reply-submit">
              Reply
            </Button>
          </form>
        )}
        {canMarkBlocking && !t.resolved && (
          <Button variant="quiet" size="sm" disabled={change.isPending} onClick={() => change.mutate({ blocking: !t.blocking })} data-testid="thread-toggle-blocking">
            {t.blocking ? 'Not blocking' : 'Mark blocking'}
          </Button>
        )}
        {canResolve && (
          <Button variant="secondary" size="sm" disabled={change.isPending} onClick={() => change.mutate({ resolved: !t.resolved })} data-testid="thread-toggle-resolved">
            {t.resolved ? 'Reopen' : 'Resolve'}
          </Button>
        )}
      </div>
    </li>
  );
}
