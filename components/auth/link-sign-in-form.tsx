'use client';

import { useState, type FormEvent } from 'react';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { LINK_LIMIT_ERROR } from '@/lib/auth/link-limits';
import { authErrorMessage } from './auth-messages';
import { fieldErrorsOf, linkSignInSchema, type FieldErrors } from './sign-in-schema';

export function LinkSignInForm({ callbackUrl }: { callbackUrl: string }) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const router = useRouter();

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const parsed = linkSignInSchema.safeParse({ email: form.get('email') });
    setMessage(null);
    if (!parsed.success) {
      setErrors(fieldErrorsOf(parsed.error));
      return;
    }
    setErrors({});
    setPending(true);
    try {
      const result = await signIn('email', { email: parsed.data.email, callbackUrl, redirect: false });
      // AccessDenied (no such account) looks the same as a sent link: the page must not say who has an account.
      if (!result?.error || result.error === 'AccessDenied') {
        router.push(`/sign-in/check-email?email=${encodeURIComponent(parsed.data.email)}`);
        return;
      }
      setMessage(authErrorMessage(result.error === LINK_LIMIT_ERROR ? LINK_LIMIT_ERROR : 'EmailSignin'));
    } catch {
      setMessage('Could not reach the server. Check your connection and try again.');
    }
    setPending(false);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby="link-sign-in-title" data-testid="link-sign-in">
      <div>
        <h2 id="link-sign-in-title" className="text-sm font-semibold text-paper-900">
          E-mail me a sign-in link
        </h2>
        <p className="text-xs text-paper-600">No password needed: the link signs you in once.</p>
      </div>
      <Field label="E-mail" errors={errors.email} id="link-email">
        <Input name="email" type="email" autoComplete="email" data-testid="link-email" required />
      </Field>
      <div aria-live="polite">
        {message && (
          <Alert tone="error" data-testid="link-error">
            {message}
          </Alert>
        )}
      </div>
      <Button type="submit" variant="secondary" className="w-full" disabled={pending} data-testid="link-submit">
        {pending ? 'Sending…' : 'Send me a link'}
      </Button>
    </form>
  );
}
