'use client';

import { useEffect, useRef } from 'react';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { SubmitButton } from '@/components/ui/submit-button';
import { ActionMessage } from '@/components/ui/action-message';
import { ROLES } from '@/components/ui/badge';
import type { FormAction } from '@/components/ui/action-types';
import { useFormAction } from '@/components/ui/use-form-action';
import { useRefreshOnOk } from './use-refresh-on-ok';

const roleOptions = ROLES.map((r) => ({ value: r, label: r }));

export function InviteForm({ group, action }: { group: string; action: FormAction }) {
  const { state, formAction, onSubmit, pending } = useFormAction(action);
  const formRef = useRef<HTMLFormElement>(null);
  useRefreshOnOk(state);
  useEffect(() => {
    if (state.ok) formRef.current?.reset();
  }, [state]);

  return (
    <form ref={formRef} action={formAction} onSubmit={onSubmit} className="space-y-3" data-testid="invite-form" noValidate>
      <input type="hidden" name="group" value={group} />
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem]">
        <Field label="E-mail address" errors={state.fieldErrors?.email} id="invite-email" hint="The invitation link is sent here.">
          <Input name="email" type="email" autoComplete="off" required data-testid="invite-email" />
        </Field>
        <Field
          label="Role"
          errors={state.fieldErrors?.role}
          id="invite-role"
          hint="Admins manage, reviewers decide, submitters upload, observers read."
        >
          <Select name="role" options={roleOptions} defaultValue="submitter" data-testid="invite-role" />
        </Field>
      </div>
      <ActionMessage state={state} testId="invite-result" />
      <SubmitButton pending={pending} pendingLabel="Sending…" data-testid="invite-submit">
        Send invitation
      </SubmitButton>
    </form>
  );
}
