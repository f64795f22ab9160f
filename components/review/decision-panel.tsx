'use client';

import { useState } from 'react';
import { fileNotRead, StatusBadge } from '@/components/spectra/status-badge';
import { TextArea } from '@/components/spectra/text-area';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { formatMinute } from '@/components/ui/format';
import { Panel } from '@/components/ui/panel';
import { decide, reopenSpectrum, withdrawSpectrum } from '@/lib/client/review/review-api';
import type { DecisionDto, DecisionVerdict, ReopenDto } from '@/lib/client/review/review-types';
import { useDecisions, usePolicy, useReviewMutation } from '@/lib/client/review/use-review';
import type { SpectrumDetail } from '@/lib/client/spectra-types';
import { ApprovalProgress, approvalRuleText } from './approval-rule';
import { errorText } from './error-text';
import { personName } from './person-name';
import type { ReviewAbilities } from './review-abilities';

const VERDICTS: { value: DecisionVerdict; label: string; help: string }[] = [
  { value: 'approve', label: 'Approve', help: 'Counts toward the approvals the policy asks for.' },
  { value: 'return', label: 'Return for fixes', help: 'The submitter uploads a new revision.' },
  { value: 'reject', label: 'Reject', help: 'Ends the review; an admin can reopen it.' },
];

const verdictWord: Record<DecisionVerdict, string> = { approve: 'approved', return: 'returned', reject: 'rejected' };

function DecisionRow({ d }: { d: DecisionDto }) {
  return (
    <li className="py-2 text-sm" data-testid="decision">
      <p className="flex flex-wrap items-center gap-x-2 text-xs text-paper-700">
        <span className="font-semibold text-paper-900">{personName(d.reviewer)}</span>
        <span>{verdictWord[d.verdict]}</span>
        <span>revision {d.revision.number}</span>
        <span>· {formatMinute(d.createdAt)}</span>
        {d.verdict === 'approve' && !d.counts && <Badge tone="neutral">no longer counts</Badge>}
      </p>
      <p className="mt-0.5 whitespace-pre-wrap text-paper-800">{d.note}</p>
    </li>
  );
}

function ReopenRow({ r }: { r: ReopenDto }) {
  return (
    <li className="py-2 text-sm" data-testid="reopen-entry">
      <p className="flex flex-wrap items-center gap-x-2 text-xs text-paper-700">
        <span className="font-semibold text-paper-900">{personName(r.by)}</span>
        <span>reopened it for review</span>
        <span>· {formatMinute(r.createdAt)}</span>
      </p>
      {r.note && <p className="mt-0.5 whitespace-pre-wrap text-paper-800">{r.note}</p>}
    </li>
  );
}

type Entry = { at: string; decision: DecisionDto; reopen?: never } | { at: string; reopen: ReopenDto; decision?: never };

/** Decisions and reopenings in one list, newest first (a reopening follows the rejection it undoes). */
function history(decisions: readonly DecisionDto[], reopens: readonly ReopenDto[] = []): Entry[] {
  const entries: Entry[] = [...decisions.map((d) => ({ at: d.createdAt, decision: d })), ...reopens.map((r) => ({ at: r.createdAt, reopen: r }))];
  return entries.sort((a, b) => Date.parse(b.at) - Date.parse(a.at));
}

/** Status, the approval rule and where the spectrum stands, the decision form, withdraw and reopen. */
export function DecisionPanel({ spectrum: s, can, selfId }: { spectrum: SpectrumDetail; can: ReviewAbilities; selfId?: string }) {
  const q = useDecisions(s.id);
  const policy = usePolicy(s.group.slug);
  const [verdict, setVerdict] = useState<DecisionVerdict | null>(null);
  const [note, setNote] = useState('');
  const [noteMissing, setNoteMissing] = useState(false);
  const [closeNote, setCloseNote] = useState('');
  // Withdrawing cannot be undone (nobody reopens a withdrawn spectrum): one more click to be sure.
  const [confirmWithdraw, setConfirmWithdraw] = useState(false);
  const state = q.data?.state;
  const version = state?.version ?? s.version;
  const revision = state?.currentRevisionId ?? s.currentRevision?.id ?? null;

  const decideM = useReviewMutation(s.id, () => decide(s.id, { verdict: verdict!, note: note.trim(), revision: revision!, version }));
  const withdrawM = useReviewMutation(s.id, () => withdrawSpectrum(s.id, { note: closeNote.trim() || undefined, version }));
  const reopenM = useReviewMutation(s.id, () => reopenSpectrum(s.id, { note: closeNote.trim() || undefined, version }));
  const status = state?.status ?? s.status;
  const canDecideNow = can.decide && status === 'in-review' && revision;
  const canWithdrawNow = can.withdraw && ['screening', 'in-review', 'returned'].includes(status);
  const canReopenNow = can.reopen && status === 'rejected';
  // The server refuses a second approval of the same revision; do not offer it.
  const approvedByMe = Boolean(
    selfId && revision && q.data?.items.some((d) => d.verdict === 'approve' && d.counts && d.revision.id === revision && d.reviewer?.id === selfId),
  );
  const error = decideM.error ?? withdrawM.error ?? reopenM.error;

  return (
    <Panel
      title="Decision"
      actions={<StatusBadge status={status} screening={s.currentRevision && s.currentRevision.id === revision ? s.currentRevision.screeningStatus : null} />}
      data-testid="decision-panel"
    >
      <div className="flex flex-col gap-4">
        <p className="text-xs text-paper-700" data-testid="approval-rule">
          {approvalRuleText(policy.data?.requiredApprovals ?? state?.approval.approvals.required ?? 1, policy.data?.blockingSeverities ?? ['fail'])}
        </p>
        {state && status === 'in-review' && <ApprovalProgress approval={state.approval} />}
        {fileNotRead(status, s.currentRevision && s.currentRevision.id === revision ? s.currentRevision.screeningStatus : null) && (
          <p className="text-sm text-paper-800" data-testid="decision-file-not-read">
            Nothing to decide yet: the file of revision {s.currentRevision?.number} did not parse, so it was not screened.
            {can.revise ? ' Upload a new revision to go on.' : ' The submitter uploads a new revision to go on.'}
          </p>
        )}
        {error && (
          <Alert tone="error" title="Not done" data-testid="decision-error">
            {errorText(error)}
          </Alert>
        )}
        {canDecideNow && (
          <form
            className="flex flex-col gap-3"
            data-testid="decision-form"
            onSubmit={(e) => {
              e.preventDefault();
              if (!note.trim()) return setNoteMissing(true);
              decideM.mutate(undefined, { onSuccess: () => (setNote(''), setVerdict(null)) });
            }}
          >
            <fieldset className="flex flex-col gap-1.5">
              <legend className="mb-1 text-xs font-semibold text-paper-800">Your decision on revision {s.revisions.find((r) => r.id === revision)?.number ?? ''}</legend>
              {VERDICTS.map((v) => {
                const done = v.value === 'approve' && approvedByMe;
                return (
                  <label key={v.value} className={`flex items-start gap-2 text-sm ${done ? 'text-paper-600' : ''}`}>
                    <input type="radio" name="verdict" value={v.value} checked={verdict === v.value} disabled={done} onChange={() => setVerdict(v.value)} className="mt-1 accent-ink-800" data-testid={`verdict-${v.value}`} />
                    <span>
                      <span className={done ? 'font-medium' : 'font-medium text-paper-900'}>{v.label}</span>
                      <span className="block text-xs text-paper-600" data-testid={done ? 'approved-by-me' : undefined}>
                        {done ? 'You approved this revision; your approval counts.' : v.help}
                      </span>
                    </span>
                  </label>
                );
              })}
            </fieldset>
            <Field label="Note" hint="Every decision carries a note; the submitter reads it." errors={noteMissing ? ['A decision needs a note.'] : undefined}>
              <TextArea rows={3} value={note} onChange={(e) => (setNote(e.target.value), setNoteMissing(false))} data-testid="decision-note" />
            </Field>
            <Button type="submit" disabled={!verdict || decideM.isPending} data-testid="decision-submit">
              {decideM.isPending ? 'Sending…' : verdict ? `${VERDICTS.find((v) => v.value === verdict)!.label}` : 'Choose a decision'}
            </Button>
          </form>
        )}
        {!can.decide && status === 'in-review' && s.submitter && (
          <p className="text-xs text-paper-600">Reviewers and admins who did not submit this spectrum decide on it.</p>
        )}
        {(canWithdrawNow || canReopenNow) && (
          <div className="flex flex-col gap-2 border-t border-paper-200 pt-3">
            <Field label={canReopenNow ? 'Note for reopening (optional)' : 'Note for withdrawing (optional)'}>
              <TextArea rows={2} value={closeNote} onChange={(e) => setCloseNote(e.target.value)} data-testid="close-note" />
            </Field>
            {canWithdrawNow && !confirmWithdraw && (
              <Button variant="danger" onClick={() => setConfirmWithdraw(true)} data-testid="withdraw">
                Withdraw this spectrum
              </Button>
            )}
            {canWithdrawNow && confirmWithdraw && (
              <div role="group" aria-labelledby="withdraw-confirm-text" className="flex flex-col gap-2 rounded-md border border-brick-200 bg-brick-50 p-3" data-testid="withdraw-confirm">
                <p id="withdraw-confirm-text" className="text-sm text-brick-800">
                  Withdrawing ends the review for good: nobody can reopen this spectrum or add revisions to it.
                </p>
                <div className="flex flex-wrap gap-2">
                  <Button variant="danger" disabled={withdrawM.isPending} onClick={() => withdrawM.mutate()} data-testid="withdraw-confirm-yes" autoFocus>
                    {withdrawM.isPending ? 'Withdrawing…' : 'Withdraw for good'}
                  </Button>
                  <Button variant="quiet" disabled={withdrawM.isPending} onClick={() => setConfirmWithdraw(false)} data-testid="withdraw-confirm-no">
                    Don&rsquo;t withdraw
                  </Button>
                </div>
              </div>
            )}
            {canReopenNow && (
              <Button variant="secondary" disabled={reopenM.isPending} onClick={() => reopenM.mutate()} data-testid="reopen">
                Reopen for review
              </Button>
            )}
          </div>
        )}
        <div>
          <h3 className="text-xs font-semibold uppercase tracking-wide text-paper-600">Decisions</h3>
          {q.data && (q.data.items.length > 0 || (q.data.reopens?.length ?? 0) > 0) ? (
            <ol className="divide-y divide-paper-200" data-testid="decisions">
              {history(q.data.items, q.data.reopens).map((e) =>
                e.decision ? <DecisionRow key={e.decision.id} d={e.decision} /> : <ReopenRow key={e.reopen.id} r={e.reopen} />,
              )}
            </ol>
          ) : (
            <p className="mt-1 text-sm text-paper-600">None yet.</p>
          )}
        </div>
      </div>
    </Panel>
  );
}
