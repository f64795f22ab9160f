'use client';

import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Button } from '@/components/ui/button';
import { ActionMessage } from '@/components/ui/action-message';
import { LINK_LIMIT_ERROR } from '@/lib/auth/link-limits';
import { authErrorMessage } from './auth-messages';
import { linkSignInSchema } from './sign-in-schema';
import { useSignInForm } from './use-sign-in-form';

export function LinkSignInForm({ callbackUrl }: { callbackUrl: string }) {
  const router = useRouter();
  const { errors, message, pending, onSubmit } = useSignInForm(linkSignInSchema, ['email'], async ({ email }) => {
    const result = await signIn('email', { email, callbackUrl, redirect: false });
    // AccessDenied (no such account) looks the same as a sent link: the page must not say who has an account.
    if (!result?.error || result.error === 'AccessDenied') {
      router.push(`/sign-in/check-email?email=${encodeURIComponent(email)}`);
      return null;
    }
    return authErrorMessage(result.error === LINK_LIMIT_ERROR ? LINK_LIMIT_ERROR : 'EmailSignin');
  });

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
      <ActionMessage state={message ? { ok: false, message } : null} testId="link-error" />
      <Button type="submit" variant="secondary" className="w-full" disabled={pending} data-testid="link-submit">
        {pending ? 'Sending…' : 'Send me a link'}
      </Button>
    </form>
  );
}
