'use client';

import { useEffect, useRef } from 'react';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { SubmitButton } from '@/components/ui/submit-button';
import { ActionMessage } from '@/components/ui/action-message';
import type { FormAction } from '@/components/ui/action-types';
import { useFormAction } from '@/components/ui/use-form-action';

export function PasswordForm({ action, hasPassword = true }: { action: FormAction; hasPassword?: boolean }) {
  const { state, formAction, onSubmit, pending } = useFormAction(action);
  const formRef = useRef<HTMLFormElement>(null);
  // Never keep passwords in the fields after a successful change.
  useEffect(() => {
    if (state.ok) formRef.current?.reset();
  }, [state]);

  return (
    <form ref={formRef} action={formAction} onSubmit={onSubmit} className="space-y-3" data-testid="password-form" noValidate>
      {/* Lets password managers pair the new password with the account. */}
      <input type="text" name="username" autoComplete="username" hidden readOnly />
      {hasPassword && (
        <Field label="Current password" errors={state.fieldErrors?.current} id="password-current">
          <Input name="current" type="password" autoComplete="current-password" required data-testid="password-current" />
        </Field>
      )}
      <Field
        label="New password"
        errors={state.fieldErrors?.password}
        hint={`At least 10 characters. A short sentence is easier to remember than symbols.${hasPassword ? '' : ' You sign in by e-mail link so far: this sets your first password.'}`}
        id="password-new"
      >
        <Input name="password" type="password" autoComplete="new-password" required data-testid="password-new" />
      </Field>
      <ActionMessage state={state} testId="password-result" />
      <SubmitButton pending={pending} pendingLabel="Changing…" data-testid="password-save">
        Change password
      </SubmitButton>
    </form>
  );
}
