import { Group, Membership } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { assertCan, type Action, type Role } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';

export interface GroupRef {
  id: string;
  slug: string;
  name: string;
}

export interface GroupAccess {
  group: GroupRef;
  role: Role;
}

const notFound = () => new AppError('not_found', 'No such group.');

/**
 * The group and the caller's role in it. A group the caller is not in, or not the group of the
 * caller's API token, is a 404 exactly like a group that does not exist (no existence leaks).
 * With `action`, a member whose role does not allow it gets a 403.
 */
export async function groupAccess(
  em: Em,
  caller: Caller,
  ref: { slug: string } | { id: string },
  action?: Action,
): Promise<GroupAccess> {
  const where = 'slug' in ref ? { slug: ref.slug } : { id: ref.id };
  if ('id' in ref && !/^[0-9a-f-]{36}$/i.test(ref.id)) throw notFound();
  const group = await em.findOne(Group, where);
  if (!group) throw notFound();
  if (caller.tokenGroupId && caller.tokenGroupId !== group.id) throw notFound();
  const membership = await em.findOne(Membership, { group: group.id, user: caller.userId });
  if (!membership) throw notFound();
  if (action) assertCan(membership.role, action);
  return { group: { id: group.id, slug: group.slug, name: group.name }, role: membership.role };
}
