import type { Metadata } from 'next';
import Link from 'next/link';
import { devMailEnabled } from '@/lib/config';
import { SIGN_IN_LINK_MINUTES } from '@/lib/auth/options';

export const metadata: Metadata = { title: 'Check your e-mail' };

type Search = { [key: string]: string | string[] | undefined };

export default async function CheckEmailPage({ searchParams }: { searchParams: Promise<Search> }) {
  const params = await searchParams;
  const raw = params.email;
  const email = Array.isArray(raw) ? raw[0] : raw;
  return (
    <div className="space-y-5" data-testid="check-email">
      <InboxArt />
      <div>
        <h1 className="text-xl font-semibold tracking-tight text-paper-900">Check your e-mail</h1>
        <p className="mt-2 text-paper-700">
          If {email ? <strong className="font-semibold text-paper-900">{email}</strong> : 'that address'} belongs to a
          Branchwise account, a sign-in link is on its way. The link works once, for {SIGN_IN_LINK_MINUTES} minutes.
        </p>
      </div>
      <ul className="list-disc space-y-1 pl-5 text-sm text-paper-700">
        <li>Open it in this browser to sign in here.</li>
        <li>Nothing arrived after a few minutes? Look in the spam folder, or ask for a new link.</li>
      </ul>
      <div className="flex flex-wrap gap-4 text-sm">
        <Link href="/sign-in">Back to sign-in</Link>
        {devMailEnabled() && <Link href="/dev/mail">Open the development mailbox</Link>}
      </div>
    </div>
  );
}

function InboxArt() {
  return (
    <svg viewBox="0 0 64 40" className="h-10 w-16" aria-hidden="true">
      <rect x="2" y="6" width="52" height="32" rx="3" className="fill-paper-0 stroke-ink-700" strokeWidth="1.5" />
      <path d="M2.5 8 L28 26 L53.5 8" fill="none" className="stroke-ink-700" strokeWidth="1.5" />
      <circle cx="54" cy="8" r="7" className="fill-ember-500" />
      <path d="M51 8 L53.3 10.2 L57.2 5.8" fill="none" className="stroke-paper-0" strokeWidth="1.6" strokeLinecap="round" />
    </svg>
  );
}
