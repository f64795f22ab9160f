'use client';

import { useActionState, useEffect, useState, type FormEvent } from 'react';
import { useRouter } from 'next/navigation';
import { useFormAction } from '@/components/ui/use-form-action';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { SubmitButton } from '@/components/ui/submit-button';
import { ActionMessage } from '@/components/ui/action-message';
import { idle, type FormAction } from '@/components/ui/action-types';

/** After accepting, the person signs in with the password they just chose. */
// The action redirects by itself; this is the fallback should it ever answer ok instead.
function useGoToSignIn(state: { ok: boolean }, email: string) {
  const router = useRouter();
  useEffect(() => {
    if (state.ok) router.push(`/sign-in?accepted=1&email=${encodeURIComponent(email)}`);
  }, [state, email, router]);
}

/** A new person: name and password make the account and join the group in one step. */
export function AcceptInvitationForm({ token, email, action }: { token: string; email: string; action: FormAction }) {
  const { state, formAction, onSubmit, pending } = useFormAction(action);
  const [mismatch, setMismatch] = useState(false);
  useGoToSignIn(state, email);

  // The server never sees the second copy; a typo is caught here before anything is sent.
  function checkSame(event: FormEvent<HTMLFormElement>) {
    const form = new FormData(event.currentTarget);
    const differ = form.get('password') !== form.get('confirm');
    setMismatch(differ);
    if (differ) event.preventDefault();
    else onSubmit(event);
  }

  return (
    <form action={formAction} onSubmit={checkSame} className="space-y-4" data-testid="accept-form" noValidate>
      <input type="hidden" name="token" value={token} />
      <input type="text" name="username" value={email} autoComplete="username" hidden readOnly />
      <Field label="Your name" errors={state.fieldErrors?.name} hint="As your group will see it." id="accept-name">
        <Input name="name" autoComplete="name" required data-testid="accept-name" />
      </Field>
      <Field
        label="Choose a password"
        errors={state.fieldErrors?.password}
        hint="At least 10 characters."
        id="accept-password"
      >
        <Input name="password" type="password" autoComplete="new-password" required data-testid="accept-password" />
      </Field>
      <Field
        label="The password again"
        errors={mismatch ? ['The two passwords are not the same.'] : state.fieldErrors?.confirm}
        id="accept-confirm"
      >
        <Input name="confirm" type="password" autoComplete="new-password" required data-testid="accept-confirm" />
      </Field>
      <ActionMessage state={state} testId="accept-result" />
      <SubmitButton pending={pending} className="w-full" pendingLabel="Creating your account…" data-testid="accept-submit">
        Create account and join
      </SubmitButton>
    </form>
  );
}

/** Someone signed in with the invited address only confirms, then lands in the group. */
export function JoinGroupForm({ token, groupSlug, groupName, action }: { token: string; groupSlug: string; groupName: string; action: FormAction }) {
  const [state, formAction] = useActionState(action, idle);
  const router = useRouter();
  useEffect(() => {
    if (state.ok) router.push(`/groups/${groupSlug}`);
  }, [state, groupSlug, router]);
  return (
    <form action={formAction} className="space-y-4" data-testid="join-form">
      <input type="hidden" name="token" value={token} />
      <ActionMessage state={state} testId="accept-result" />
      <SubmitButton className="w-full" pendingLabel="Joining…" data-testid="join-submit">
        Join {groupName}
      </SubmitButton>
    </form>
  );
}
