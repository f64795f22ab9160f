import { LockMode } from '@mikro-orm/core';
import { ApiToken, Membership } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import type { Role } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { groupAccess } from './access';
import { recordAudit } from './audit';

export interface MemberDto {
  userId: string;
  name: string | null;
  email: string;
  role: Role;
  joinedAt: string;
}

/** The group's members, by name then e-mail. Callers check membership first (groupAccess). */
export async function listMembers(em: Em, groupId: string): Promise<MemberDto[]> {
  const rows = await em.find(Membership, { group: groupId }, { populate: ['user'] });
  return rows
    .map((m) => ({ userId: m.user.id, name: m.user.name ?? null, email: m.user.email, role: m.role, joinedAt: m.joinedAt.toISOString() }))
    .sort((a, b) => (a.name ?? a.email).localeCompare(b.name ?? b.email) || a.email.localeCompare(b.email));
}

/** The group's members as any member may read them (`members.read`): for pickers and @-mentions. */
export async function readMembers(em: Em, caller: Caller, slug: string): Promise<{ items: MemberDto[] }> {
  const { group } = await groupAccess(em, caller, { slug }, 'members.read');
  return { items: await listMembers(em, group.id) };
}

async function lockedMembership(em: Em, groupId: string, userId: string) {
  // Lock the group's admin rows too: two admins demoting each other at once must not both win.
  const admins = await em.find(Membership, { group: groupId, role: 'admin' }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  const target = await em.findOne(Membership, { group: groupId, user: userId }, { populate: ['user'], lockMode: LockMode.PESSIMISTIC_WRITE });
  if (!target) throw new AppError('not_found', 'That person is not a member of this group.');
  return { admins, target };
}

export async function changeRole(em: Em, caller: Caller, input: { group: string; userId: string; role: Role }): Promise<MemberDto> {
  const { group } = await groupAccess(em, caller, { slug: input.group }, 'members.manage');
  return em.transactional(async (tem) => {
    const { admins, target } = await lockedMembership(tem, group.id, input.userId);
    const from = target.role;
    if (from === input.role) return toDto(target);
    if (from === 'admin' && admins.length <= 1) {
      throw new AppError('conflict', 'This is the last admin of the group: make someone else admin first.');
    }
    target.role = input.role;
    recordAudit(tem, {
      groupId: group.id,
      actorId: caller.userId,
      action: 'member.role-changed',
      target: `user:${target.user.id}`,
      data: { email: target.user.email, from, to: input.role },
    });
    return toDto(target);
  });
}

export async function removeMember(em: Em, caller: Caller, input: { group: string; userId: string }): Promise<void> {
  const { group } = await groupAccess(em, caller, { slug: input.group }, 'members.manage');
  await em.transactional(async (tem) => {
    const { admins, target } = await lockedMembership(tem, group.id, input.userId);
    if (target.role === 'admin' && admins.length <= 1) {
      throw new AppError('conflict', 'This is the last admin of the group: make someone else admin first.');
    }
    // Their API tokens for this group stop working with the membership.
    await tem.nativeUpdate(ApiToken, { user: input.userId, group: group.id, revokedAt: null }, { revokedAt: new Date() });
    tem.remove(target);
    recordAudit(tem, {
      groupId: group.id,
      actorId: caller.userId,
      action: 'member.removed',
      target: `user:${target.user.id}`,
      data: { email: target.user.email, role: target.role },
    });
  });
}

function toDto(m: Membership): MemberDto {
  return { userId: m.user.id, name: m.user.name ?? null, email: m.user.email, role: m.role, joinedAt: m.joinedAt.toISOString() };
}
