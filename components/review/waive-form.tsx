'use client';

import { useState } from 'react';
import { TextArea } from '@/components/spectra/text-area';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { waiveFinding, waiveFindings } from '@/lib/client/review/review-api';
import { useReviewMutation } from '@/lib/client/review/use-review';
import { spectraKeys } from '@/lib/client/spectra-api';
import { errorText } from './error-text';

export interface WaiveFormProps {
  spectrumId: string;
  revisionId: string;
  /** One finding goes to its own waiver route; several go together, all or none. */
  findingIds: string[];
  onDone: () => void;
}

/** A written reason, then the waiver(s); the findings stay listed, marked waived. */
export function WaiveForm({ spectrumId, revisionId, findingIds, onDone }: WaiveFormProps) {
  const [reason, setReason] = useState('');
  const [missing, setMissing] = useState(false);
  const n = findingIds.length;
  // The waivers show in the revision's screening JSON (`waived`), so that is read again too.
  const m = useReviewMutation(
    spectrumId,
    (r: string): Promise<unknown> => (n === 1 ? waiveFinding(findingIds[0]!, r) : waiveFindings(revisionId, findingIds, r)),
    [spectraKeys.screening(revisionId)],
  );
  return (
    <form
      className="mt-2 flex flex-col gap-2 rounded-md border border-paper-300 bg-paper-50 p-3"
      data-testid="waive-form"
      onSubmit={(e) => {
        e.preventDefault();
        if (!reason.trim()) return setMissing(true);
        m.mutate(reason.trim(), { onSuccess: onDone });
      }}
    >
      <Field
        label={n === 1 ? 'Why this finding can be kept' : `Why these ${n} findings can be kept`}
        hint={n === 1 ? 'Recorded with your name in the audit trail.' : 'One reason for all of them, recorded with your name for each in the audit trail.'}
        errors={missing ? ['Write the reason for the waiver.'] : undefined}
      >
        <TextArea rows={2} value={reason} onChange={(e) => (setReason(e.target.value), setMissing(false))} data-testid="waive-reason" />
      </Field>
      {m.isError && <Alert tone="error">{errorText(m.error)}</Alert>}
      <div className="flex gap-2">
        <Button type="submit" size="sm" disabled={m.isPending} data-testid="waive-submit">
          {m.isPending ? 'Waiving…' : n === 1 ? 'Waive finding' : `Waive ${n} findings`}
        </Button>
        <Button variant="quiet" size="sm" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
