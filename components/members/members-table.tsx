'use client';

import { createContext, useContext } from 'react';
import { createColumnHelper, type CellContext } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { Badge, RoleBadge, type Role } from '@/components/ui/badge';
import { formatDay } from '@/components/ui/format';
import type { FormAction } from '@/components/ui/action-types';
import { RoleForm } from './role-form';
import { RemoveMemberForm } from './remove-member-form';
import type { MemberRow } from './types';

export type MemberActions = { changeRole: FormAction; removeMember: FormAction };

type TableContext = { group: string; currentUserId: string; actions?: MemberActions };

// Cells read the page's settings from here, so the column definitions stay the same objects
// across server refreshes (new definitions would remount every cell and lose form state).
const Ctx = createContext<TableContext>({ group: '', currentUserId: '' });

const label = (m: MemberRow) => m.name || m.email;

function NameCell({ row }: CellContext<MemberRow, unknown>) {
  const { currentUserId } = useContext(Ctx);
  return (
    <span className="flex items-center gap-2">
      <span className="whitespace-nowrap font-medium text-paper-900">{row.original.name || '—'}</span>
      {row.original.userId === currentUserId && (
        <Badge tone="neutral" shape="dot">
          you
        </Badge>
      )}
    </span>
  );
}

function RoleCell({ row }: CellContext<MemberRow, unknown>) {
  const { group, actions } = useContext(Ctx);
  const m = row.original;
  if (!actions) return <RoleBadge role={m.role} />;
  return <RoleForm group={group} userId={m.userId} memberLabel={label(m)} role={m.role} action={actions.changeRole} />;
}

function ManageCell({ row }: CellContext<MemberRow, unknown>) {
  const { group, actions, currentUserId } = useContext(Ctx);
  const m = row.original;
  if (!actions || m.userId === currentUserId) return null;
  return <RemoveMemberForm group={group} userId={m.userId} memberLabel={label(m)} action={actions.removeMember} />;
}

const col = createColumnHelper<MemberRow>();

const readColumns = [
  col.accessor((m) => m.name ?? '', { id: 'name', header: 'Name', cell: NameCell }),
  col.accessor('email', { header: 'E-mail', cell: (c) => <span className="whitespace-nowrap text-paper-700">{c.getValue()}</span> }),
  col.accessor((m): Role => m.role, { id: 'role', header: 'Role', cell: RoleCell }),
  col.accessor((m) => m.joinedAt ?? '', {
    id: 'joined',
    header: 'Joined',
    cell: (c) => <span className="tabular whitespace-nowrap text-paper-700">{formatDay(c.row.original.joinedAt)}</span>,
  }),
];

const adminColumns = [
  ...readColumns,
  col.display({ id: 'manage', header: () => <span className="sr-only">Manage</span>, cell: ManageCell }),
];

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
  return (
    <Ctx.Provider value={{ group, currentUserId, actions }}>
      <DataTable
        data={members}
        columns={actions ? adminColumns : readColumns}
        caption={`Members of the group, ${members.length} in all`}
        getRowId={(m) => m.userId}
        rowTestId={(m) => `member-${m.email}`}
        initialSorting={[{ id: 'name', desc: false }]}
        data-testid="members-table"
      />
    </Ctx.Provider>
  );
}
