import type { Metadata } from 'next';
import Link from 'next/link';
import { getServerSession } from 'next-auth';
import { getAuthOptions } from '@/lib/auth/options';
import { getEm } from '@/lib/db/orm';
import { getInvitation } from '@/lib/services/invitations';
import { Alert } from '@/components/ui/alert';
import { RoleBadge, ROLE_HELP } from '@/components/ui/badge';
import { formatDay } from '@/components/ui/format';
import { AcceptInvitationForm, JoinGroupForm } from '@/components/auth/accept-invitation-form';
import { SignOutButton } from '@/components/shell/sign-out-button';
import { buttonClasses } from '@/components/ui/button';
import { acceptInvitation } from './actions';

export const metadata: Metadata = { title: 'Invitation' };

// Why a link cannot be used, said plainly and with the next step.
const refusals: Record<string, { title: string; body: string }> = {
  expired: {
    title: 'This invitation has expired',
    body: 'Invitation links work for a limited time. Ask the admin who invited you to send a new one.',
  },
  used: {
    title: 'This invitation was already used',
    body: 'The account for it exists. Sign in with that address, or ask for a new invitation.',
  },
  revoked: {
    title: 'This invitation was withdrawn',
    body: 'An admin of the group cancelled it. Ask them if you should still join.',
  },
  unknown: {
    title: 'We do not recognise this invitation link',
    body: 'Check that the whole link was copied from the e-mail, or ask for a new invitation.',
  },
};

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const em = await getEm();
  const invitation = await getInvitation(em, token);

  if (invitation.status !== 'valid' || !invitation.email || !invitation.role || !invitation.groupName) {
    const refusal = refusals[invitation.status] ?? refusals.unknown;
    return (
      <div className="space-y-5" data-testid="invitation-refused" data-status={invitation.status}>
        <h1 className="text-xl font-semibold tracking-tight text-paper-900">Invitation</h1>
        <Alert tone="error" title={refusal.title}>
          {refusal.body}
        </Alert>
        <Link href="/sign-in">Go to sign-in</Link>
      </div>
    );
  }

  const { role, email, hasAccount, expiresAt } = invitation;
  const group = { name: invitation.groupName, slug: invitation.groupSlug ?? '' };
  const session = hasAccount ? await getServerSession(getAuthOptions()) : null;
  const signedInAs = session?.user?.email?.toLowerCase() ?? null;
  return (
    <div className="space-y-5" data-testid="invitation">
      <div>
        <p className="text-xs font-semibold uppercase tracking-wider text-ember-700">You are invited</p>
        <h1 className="mt-1 text-xl font-semibold tracking-tight text-paper-900">Join {group.name} on Branchwise</h1>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded-lg border border-paper-300 bg-paper-0 p-4 text-sm shadow-panel">
        <dt className="text-paper-600">Group</dt>
        <dd className="font-semibold" data-testid="invitation-group">
          {group.name}
        </dd>
        <dt className="text-paper-600">Role</dt>
        <dd className="flex flex-wrap items-center gap-2">
          <RoleBadge role={role} />
          <span className="text-xs text-paper-600">{ROLE_HELP[role]}</span>
        </dd>
        <dt className="text-paper-600">Address</dt>
        <dd data-testid="invitation-email">{email}</dd>
        <dt className="text-paper-600">Valid until</dt>
        <dd className="tabular">{formatDay(expiresAt)}</dd>
      </dl>
      {hasAccount ? (
        signedInAs === email ? (
          <>
            <p className="text-paper-700">You are signed in as {email}. One click and you are in.</p>
            <JoinGroupForm token={token} groupSlug={group.slug} groupName={group.name} action={acceptInvitation} />
          </>
        ) : signedInAs ? (
          <div className="space-y-3" data-testid="invitation-wrong-account">
            <Alert tone="warning" title="Signed in as someone else">
              This invitation is for {email}, but you are signed in as {signedInAs}. Sign out, then open the link again and
              sign in as {email}.
            </Alert>
            <div className="rounded-md bg-ink-900 p-2">
              <SignOutButton />
            </div>
          </div>
        ) : (
          <div className="space-y-3" data-testid="invitation-sign-in-first">
            <p className="text-paper-700">
              {email} already has a Branchwise account. Sign in with it first; you come back here to join.
            </p>
            <Link
              href={`/sign-in?callbackUrl=${encodeURIComponent(`/invitations/${token}`)}&email=${encodeURIComponent(email)}`}
              className={buttonClasses('primary', 'md', 'w-full')}
            >
              Sign in as {email}
            </Link>
          </div>
        )
      ) : (
        <div className="rounded-lg border border-paper-300 bg-paper-0 p-5 shadow-panel">
          <h2 className="mb-3 text-sm font-semibold">Make your account</h2>
          <AcceptInvitationForm token={token} email={email} action={acceptInvitation} />
        </div>
      )}
    </div>
  );
}
