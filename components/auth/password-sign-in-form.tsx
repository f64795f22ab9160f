'use client';

import { useState, type FormEvent } from 'react';
import { signIn } from 'next-auth/react';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { fieldErrorsOf, passwordSignInSchema, type FieldErrors } from './sign-in-schema';

// Wrong password and unknown address get the same words: the form must not tell which.
const NOT_RIGHT = 'E-mail or password is not right.';

export function PasswordSignInForm({ callbackUrl, defaultEmail }: { callbackUrl: string; defaultEmail?: string }) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const parsed = passwordSignInSchema.safeParse({ email: form.get('email'), password: form.get('password') });
    setMessage(null);
    if (!parsed.success) {
      setErrors(fieldErrorsOf(parsed.error));
      return;
    }
    setErrors({});
    setPending(true);
    try {
      const result = await signIn('credentials', { ...parsed.data, redirect: false });
      if (result?.ok && !result.error) {
        // A full navigation so every server component renders with the new session cookie.
        window.location.assign(callbackUrl);
        return;
      }
      setMessage(NOT_RIGHT);
    } catch {
      setMessage('Could not reach the server. Check your connection and try again.');
    }
    setPending(false);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="password-sign-in-title" data-testid="password-sign-in">
      <h2 id="password-sign-in-title" className="sr-only">
        Sign in with your password
      </h2>
      <Field label="E-mail" errors={errors.email} id="signin-email">
        <Input name="email" type="email" autoComplete="username" defaultValue={defaultEmail} data-testid="signin-email" required />
      </Field>
      <Field label="Password" errors={errors.password} id="signin-password">
        <Input name="password" type="password" autoComplete="current-password" data-testid="signin-password" required />
      </Field>
      <div aria-live="polite">
        {message && (
          <Alert tone="error" data-testid="signin-error">
            {message}
          </Alert>
        )}
      </div>
      <Button type="submit" className="w-full" disabled={pending} data-testid="signin-submit">
        {pending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
