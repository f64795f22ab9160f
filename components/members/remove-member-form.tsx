'use client';

import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { SubmitButton } from '@/components/ui/submit-button';
import { idle, type FormAction } from '@/components/ui/action-types';
import { useRefreshOnOk } from './use-refresh-on-ok';

/** Remove a member after a second, explicit confirmation. */
export function RemoveMemberForm({
  group,
  userId,
  memberLabel,
  action,
}: {
  group: string;
  userId: string;
  memberLabel: string;
  action: FormAction;
}) {
  const [confirming, setConfirming] = useState(false);
  const [state, formAction] = useActionState(action, idle);
  useRefreshOnOk(state);

  return (
    <div className="flex items-center justify-end gap-1.5 whitespace-nowrap">
      {confirming ? (
        <form action={formAction} className="flex items-center gap-1.5" data-testid="remove-confirm">
          <input type="hidden" name="group" value={group} />
          <input type="hidden" name="userId" value={userId} />
          <span className="text-xs font-medium text-brick-800">Remove?</span>
          <SubmitButton
            variant="danger"
            size="sm"
            pendingLabel="Removing…"
            aria-label={`Yes, remove ${memberLabel} from the group`}
            data-testid="confirm-remove"
          >
            Yes, remove
          </SubmitButton>
          <Button variant="quiet" size="sm" onClick={() => setConfirming(false)} autoFocus>
            Cancel
          </Button>
        </form>
      ) : (
        <Button variant="danger" size="sm" onClick={() => setConfirming(true)} data-testid="remove-member" aria-label={`Remove ${memberLabel}`}>
          Remove
        </Button>
      )}
      {state.message && !state.ok && (
        <span role="alert" className="text-xs text-brick-700" data-testid="remove-result">
          ✕ {state.message}
        </span>
      )}
    </div>
  );
}
