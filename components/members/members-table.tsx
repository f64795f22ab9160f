'use client';

import { useMemo } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { RoleBadge } from '@/components/ui/badge';
import { Badge } from '@/components/ui/badge';
import { formatDay } from '@/components/ui/format';
import type { FormAction } from '@/components/ui/action-types';
import { RoleForm } from './role-form';
import { RemoveMemberForm } from './remove-member-form';
import type { MemberRow } from './types';

const col = createColumnHelper<MemberRow>();

export type MemberActions = { changeRole: FormAction; removeMember: FormAction };

/** The group's members. Admins get role and remove controls; everyone else reads. */
export function MembersTable({
  group,
  members,
  currentUserId,
  actions,
}: {
  group: string;
  members: MemberRow[];
  currentUserId: string;
  /** Present only for admins. */
  actions?: MemberActions;
}) {
  const columns = useMemo(() => {
    const label = (m: MemberRow) => m.name || m.email;
    const base = [
      col.accessor((m) => m.name ?? '', {
        id: 'name',
        header: 'Name',
        cell: (c) => (
          <span className="flex items-center gap-2">
            <span className="font-medium text-paper-900">{c.row.original.name || '—'}</span>
            {c.row.original.userId === currentUserId && (
              <Badge tone="neutral" shape="dot">
                you
              </Badge>
            )}
          </span>
        ),
      }),
      col.accessor('email', { header: 'E-mail', cell: (c) => <span className="text-paper-700">{c.getValue()}</span> }),
      col.accessor('role', {
        header: 'Role',
        cell: (c) =>
          actions ? (
            <RoleForm
              group={group}
              userId={c.row.original.userId}
              memberLabel={label(c.row.original)}
              role={c.getValue()}
              action={actions.changeRole}
            />
          ) : (
            <RoleBadge role={c.getValue()} />
          ),
      }),
      col.accessor((m) => m.joinedAt ?? '', {
        id: 'joined',
        header: 'Joined',
        cell: (c) => <span className="tabular text-paper-700">{formatDay(c.row.original.joinedAt)}</span>,
      }),
    ];
    if (!actions) return base;
    return [
      ...base,
      col.display({
        id: 'manage',
        header: () => <span className="sr-only">Manage</span>,
        cell: (c) =>
          c.row.original.userId === currentUserId ? null : (
            <RemoveMemberForm
              group={group}
              userId={c.row.original.userId}
              memberLabel={label(c.row.original)}
              action={actions.removeMember}
            />
          ),
      }),
    ];
  }, [actions, currentUserId, group]);

  return (
    <DataTable
      data={members}
      columns={columns}
      caption={`Members of the group, ${members.length} in all`}
      getRowId={(m) => m.userId}
      rowTestId={(m) => `member-${m.email}`}
      initialSorting={[{ id: 'name', desc: false }]}
      data-testid="members-table"
    />
  );
}
