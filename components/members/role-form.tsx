'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { SubmitButton } from '@/components/ui/submit-button';
import { ROLES, type Role } from '@/components/ui/badge';
import type { FormAction } from '@/components/ui/action-types';
import { useFormAction } from '@/components/ui/use-form-action';
import { useRefreshOnOk } from './use-refresh-on-ok';

const roleOptions = ROLES.map((r) => ({ value: r, label: r }));

/** Change one member's role: pick, then save (no change on selection alone, so keyboards are safe). */
export function RoleForm({
  group,
  userId,
  memberLabel,
  role,
  action,
}: {
  group: string;
  userId: string;
  memberLabel: string;
  role: Role;
  action: FormAction;
}) {
  const { state, formAction, onSubmit, pending } = useFormAction(action);
  const [value, setValue] = useState<string>(role);
  useRefreshOnOk(state);
  const changed = value !== role;

  return (
    <form action={formAction} onSubmit={onSubmit} className="flex items-center gap-1.5 whitespace-nowrap" data-testid="role-form">
      <input type="hidden" name="group" value={group} />
      <input type="hidden" name="userId" value={userId} />
      <div className="w-28 shrink-0">
        <Select
          name="role"
          size="sm"
          options={roleOptions}
          value={value}
          onChange={(e) => setValue(e.target.value)}
          aria-label={`Role of ${memberLabel}`}
          data-testid="role-select"
        />
      </div>
      <SubmitButton pending={pending} size="sm" variant="secondary" disabled={!changed} pendingLabel="Saving…" data-testid="role-save">
        Save
      </SubmitButton>
      <span aria-live="polite" className="text-xs">
        {state.message && (
          <span className={state.ok ? 'text-moss-700' : 'text-brick-700'} data-testid="role-result" role={state.ok ? undefined : 'alert'}>
            {state.ok ? '✓ ' : '✕ '}
            {state.message}
          </span>
        )}
      </span>
    </form>
  );
}
