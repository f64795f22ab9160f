'use client';

import { useActionState } from 'react';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { SubmitButton } from '@/components/ui/submit-button';
import { ActionMessage } from '@/components/ui/action-message';
import { idle, type FormAction } from '@/components/ui/action-types';
import { useRefreshOnOk } from '@/components/members/use-refresh-on-ok';

export function ProfileForm({ name, email, action }: { name: string | null; email: string; action: FormAction }) {
  const [state, formAction] = useActionState(action, idle);
  useRefreshOnOk(state);
  return (
    <form action={formAction} className="space-y-3" data-testid="profile-form" noValidate>
      <Field label="E-mail" hint="Your sign-in address. Ask an admin if it has to change." id="profile-email">
        <Input value={email} readOnly disabled />
      </Field>
      <Field label="Name" errors={state.fieldErrors?.name} hint="How your group sees you in reviews and threads." id="profile-name">
        <Input name="name" defaultValue={name ?? ''} autoComplete="name" required data-testid="profile-name" />
      </Field>
      <ActionMessage state={state} testId="profile-result" />
      <SubmitButton pendingLabel="Saving…" data-testid="profile-save">
        Save name
      </SubmitButton>
    </form>
  );
}
