'use client';

import { signIn } from 'next-auth/react';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Button } from '@/components/ui/button';
import { ActionMessage } from '@/components/ui/action-message';
import { passwordSignInSchema } from './sign-in-schema';
import { useSignInForm } from './use-sign-in-form';

// Wrong password and unknown address get the same words: the form must not tell which.
const NOT_RIGHT = 'E-mail or password is not right.';

export function PasswordSignInForm({ callbackUrl, defaultEmail }: { callbackUrl: string; defaultEmail?: string }) {
  const { errors, message, pending, onSubmit } = useSignInForm(passwordSignInSchema, ['email', 'password'], async (data) => {
    const result = await signIn('credentials', { ...data, redirect: false });
    if (result?.ok && !result.error) {
      // A full navigation so every server component renders with the new session cookie.
      window.location.assign(callbackUrl);
      return null;
    }
    return NOT_RIGHT;
  });

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
      <ActionMessage state={message ? { ok: false, message } : null} testId="signin-error" />
      <Button type="submit" className="w-full" disabled={pending} data-testid="signin-submit">
        {pending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
