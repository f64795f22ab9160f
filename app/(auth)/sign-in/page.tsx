import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getServerSession } from 'next-auth';
import { getAuthOptions } from '@/lib/auth/options';
import { Alert } from '@/components/ui/alert';
import { PasswordSignInForm } from '@/components/auth/password-sign-in-form';
import { LinkSignInForm } from '@/components/auth/link-sign-in-form';
import { authErrorMessage, safeCallbackUrl } from '@/components/auth/auth-messages';

export const metadata: Metadata = { title: 'Sign in' };

type Search = { [key: string]: string | string[] | undefined };
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export default async function SignInPage({ searchParams }: { searchParams: Promise<Search> }) {
  const params = await searchParams;
  const callbackUrl = safeCallbackUrl(one(params.callbackUrl), process.env.NEXTAUTH_URL);
  const session = await getServerSession(getAuthOptions());
  if (session?.user) redirect(callbackUrl);

  const error = authErrorMessage(one(params.error));
  const accepted = one(params.accepted) === '1';
  const email = one(params.email);

  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-xl font-semibold tracking-tight text-paper-900">Sign in</h1>
        <p className="mt-1 text-paper-600">Use your password, or have a one-time link sent to your inbox.</p>
      </div>

      {accepted && (
        <Alert tone="success" title="Invitation accepted" data-testid="signin-accepted">
          Your account is ready. Sign in to see your group.
        </Alert>
      )}
      {error && (
        <Alert tone="error" data-testid="signin-notice">
          {error}
        </Alert>
      )}

      <div className="rounded-lg border border-paper-300 bg-paper-0 p-5 shadow-panel">
        <PasswordSignInForm callbackUrl={callbackUrl} defaultEmail={email} />
      </div>

      <div className="flex items-center gap-3 text-2xs font-semibold uppercase tracking-wider text-paper-600" aria-hidden="true">
        <span className="h-px flex-1 bg-paper-300" />
        or
        <span className="h-px flex-1 bg-paper-300" />
      </div>

      <div className="rounded-lg border border-dashed border-paper-400 bg-paper-50 p-5">
        <LinkSignInForm callbackUrl={callbackUrl} />
      </div>

      <p className="text-xs text-paper-600">
        New to Branchwise? Accounts are made by invitation: ask an admin of your group to invite your address.
      </p>
    </div>
  );
}
