import type { Metadata } from 'next';
import { groupContext } from '@/lib/http/page';
import { listMembers } from '@/lib/services/members';
import { listInvitations } from '@/lib/services/invitations';
import { PageHeader } from '@/components/shell/page-header';
import { Panel } from '@/components/ui/panel';
import { RoleBadge } from '@/components/ui/badge';
import { isoOf } from '@/components/ui/format';
import { MembersTable } from '@/components/members/members-table';
import { InviteForm } from '@/components/members/invite-form';
import { PendingInvitations } from '@/components/members/pending-invitations';
import type { InvitationRow, MemberRow } from '@/components/members/types';
import { changeRole, inviteMember, removeMember, revokeInvitation } from './actions';

type Params = { slug: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { group } = await groupContext((await params).slug);
  return { title: `Members · ${group.name}` };
}

export default async function MembersPage({ params }: { params: Promise<Params> }) {
  const { slug } = await params;
  const { em, user, group, role } = await groupContext(slug);
  const isAdmin = role === 'admin';

  const members: MemberRow[] = (await listMembers(em, group.id)).map((m) => ({
    userId: m.userId,
    name: m.name ?? null,
    email: m.email,
    role: m.role,
    joinedAt: isoOf(m.joinedAt),
  }));
  const invitations: InvitationRow[] = isAdmin
    ? (await listInvitations(em, group.id)).map((i) => ({
        id: i.id,
        email: i.email,
        role: i.role,
        createdAt: isoOf(i.createdAt),
        expiresAt: isoOf(i.expiresAt),
        expired: i.status === 'expired',
        invitedBy: i.invitedBy,
      }))
    : [];

  return (
    <>
      <PageHeader
        title="Members"
        badge={<RoleBadge role={role} />}
        crumbs={[
          { href: '/', label: 'My groups' },
          { href: `/groups/${group.slug}`, label: group.name },
        ]}
        lead={
          isAdmin
            ? 'Set roles, remove members and invite new people. Every change is written to the audit log.'
            : 'Who is in the group and in which role. Only admins change this list.'
        }
      />
      <div className="space-y-5">
        <Panel title={`${members.length} ${members.length === 1 ? 'member' : 'members'}`} flush>
          <MembersTable
            group={group.slug}
            members={members}
            currentUserId={user.id}
            actions={isAdmin ? { changeRole, removeMember } : undefined}
          />
        </Panel>

        {isAdmin && (
          <div className="grid gap-5 lg:grid-cols-2">
            <Panel title="Invite someone" description="They get an e-mail with a link to join this group with the role you pick.">
              <InviteForm group={group.slug} action={inviteMember} />
            </Panel>
            <Panel title="Open invitations" description="Links that were sent and not used yet." flush>
              <PendingInvitations group={group.slug} invitations={invitations} revoke={revokeInvitation} />
            </Panel>
          </div>
        )}
      </div>
    </>
  );
}
