'use client';

import { useActionState } from 'react';
import { Badge, RoleBadge } from '@/components/ui/badge';
import { SubmitButton } from '@/components/ui/submit-button';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDay } from '@/components/ui/format';
import { idle, type FormAction } from '@/components/ui/action-types';
import { useRefreshOnOk } from './use-refresh-on-ok';
import type { InvitationRow } from './types';

export function PendingInvitations({
  group,
  invitations,
  revoke,
}: {
  group: string;
  invitations: InvitationRow[];
  revoke: FormAction;
}) {
  if (invitations.length === 0) {
    return <EmptyState title="No open invitations" data-testid="no-invitations" />;
  }
  return (
    <ul className="divide-y divide-paper-200" data-testid="pending-invitations">
      {invitations.map((inv) => (
        <li key={inv.id} className="flex items-center gap-3 px-4 py-2.5" data-testid={`invitation-${inv.email}`}>
          <div className="min-w-0 flex-1">
            <p className="truncate font-medium text-paper-900" title={inv.email}>
              {inv.email}
            </p>
            {inv.expired ? (
              <p className="mt-0.5">
                <Badge tone="warn" shape="bang">
                  expired {formatDay(inv.expiresAt)}
                </Badge>
              </p>
            ) : (
              <p className="tabular text-xs text-paper-600">
                sent {formatDay(inv.createdAt)}
                {inv.invitedBy ? ` by ${inv.invitedBy}` : ''} · valid until {formatDay(inv.expiresAt)}
              </p>
            )}
          </div>
          <RoleBadge role={inv.role} />
          <RevokeButton group={group} invitation={inv} revoke={revoke} />
        </li>
      ))}
    </ul>
  );
}

function RevokeButton({ group, invitation, revoke }: { group: string; invitation: InvitationRow; revoke: FormAction }) {
  const [state, formAction] = useActionState(revoke, idle);
  useRefreshOnOk(state);
  return (
    <form action={formAction} className="flex items-center gap-2">
      <input type="hidden" name="group" value={group} />
      <input type="hidden" name="invitationId" value={invitation.id} />
      <SubmitButton variant="danger" size="sm" pendingLabel="Revoking…" aria-label={`Revoke the invitation to ${invitation.email}`} data-testid="revoke-invitation">
        Revoke
      </SubmitButton>
      {state.message && !state.ok && (
        <span role="alert" className="text-xs text-brick-700">
          ✕ {state.message}
        </span>
      )}
    </form>
  );
}
