'use client';

import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { SubmitButton } from '@/components/ui/submit-button';
import { ActionMessage } from '@/components/ui/action-message';
import type { FormAction } from '@/components/ui/action-types';
import { useFormAction } from '@/components/ui/use-form-action';
import { useRefreshOnOk } from '@/components/members/use-refresh-on-ok';

export function ProfileForm({ name, email, action }: { name: string | null; email: string; action: FormAction }) {
  const { state, formAction, onSubmit, pending } = useFormAction(action);
  useRefreshOnOk(state);
  return (
    <form action={formAction} onSubmit={onSubmit} className="space-y-3" data-testid="profile-form" noValidate>
      <Field label="E-mail" hint="Your sign-in address. Ask an admin if it has to change." id="profile-email">
        <Input value={email} readOnly disabled />
      </Field>
      <Field label="Name" errors={state.fieldErrors?.name} hint="How your group sees you in reviews and threads." id="profile-name">
        <Input name="name" defaultValue={name ?? ''} autoComplete="name" required data-testid="profile-name" />
      </Field>
      <ActionMessage state={state} testId="profile-result" />
      <SubmitButton pending={pending} pendingLabel="Saving…" data-testid="profile-save">
        Save name
      </SubmitButton>
    </form>
  );
}
