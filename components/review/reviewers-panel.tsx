'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { setReviewers } from '@/lib/client/review/review-api';
import { useReviewers, useReviewMutation } from '@/lib/client/review/use-review';
import { errorText } from './error-text';
import { personName } from './person-name';

/** Who is assigned to review; admins change it (reviewers and admins other than the submitter). */
export function ReviewersPanel({ spectrumId, canAssign }: { spectrumId: string; canAssign: boolean }) {
  const q = useReviewers(spectrumId);
  const [editing, setEditing] = useState<Set<string> | null>(null);
  const save = useReviewMutation(spectrumId, (ids: string[]) => setReviewers(spectrumId, { reviewers: ids, version: q.data?.version }));
  const data = q.data;
  return (
    <Panel
      title="Reviewers"
      actions={
        canAssign && data?.candidates && !editing ? (
          <Button variant="quiet" size="sm" onClick={() => setEditing(new Set(data.reviewers.map((r) => r.id)))} data-testid="reviewers-edit">
            Assign…
          </Button>
        ) : null
      }
      data-testid="reviewers"
    >
      {q.isError && <Alert tone="error">{q.error.message}</Alert>}
      {!editing ? (
        data && data.reviewers.length > 0 ? (
          <ul className="flex flex-col gap-1 text-sm">
            {data.reviewers.map((r) => (
              <li key={r.id} className="text-paper-900">
                {personName(r)} <span className="text-xs text-paper-600">{r.email}</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-paper-600">Nobody assigned; any reviewer of the group may decide.</p>
        )
      ) : (
        <form
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            save.mutate([...editing], { onSuccess: () => setEditing(null) });
          }}
        >
          <fieldset className="flex flex-col gap-1">
            <legend className="mb-1 text-xs font-semibold text-paper-800">Reviewers of this spectrum</legend>
            {(data?.candidates ?? []).map((c) => (
              <label key={c.id} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  className="accent-ink-800"
                  checked={editing.has(c.id)}
                  onChange={(e) => {
                    const next = new Set(editing);
                    if (e.target.checked) next.add(c.id);
                    else next.delete(c.id);
                    setEditing(next);
                  }}
                />
                {personName(c)}
              </label>
            ))}
          </fieldset>
          {save.isError && <Alert tone="error">{errorText(save.error)}</Alert>}
          <div className="flex gap-2">
            <Button type="submit" size="sm" disabled={save.isPending}>
              Save reviewers
            </Button>
            <Button variant="quiet" size="sm" onClick={() => setEditing(null)}>
              Cancel
            </Button>
          </div>
        </form>
      )}
    </Panel>
  );
}
