import { Membership } from '@/entities';
import type { Role } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';

export interface MyGroupDto {
  slug: string;
  name: string;
  role: Role;
  members: number;
}

/** The person's groups with their role in each and the member count, by name. */
export async function listMyGroups(em: Em, userId: string, opts: { onlyGroupId?: string } = {}): Promise<MyGroupDto[]> {
  const mine = await em.find(
    Membership,
    { user: userId, ...(opts.onlyGroupId ? { group: opts.onlyGroupId } : {}) },
    { populate: ['group'] },
  );
  if (mine.length === 0) return [];
  const counts = await em
    .getConnection()
    .execute<{ group_id: string; n: string }[]>(
      `select group_id, count(*) as n from membership where group_id in (${mine.map(() => '?').join(',')}) group by group_id`,
      mine.map((m) => m.group.id),
    );
  const byGroup = new Map(counts.map((c) => [c.group_id, Number(c.n)]));
  return mine
    .map((m) => ({ slug: m.group.slug, name: m.group.name, role: m.role, members: byGroup.get(m.group.id) ?? 0 }))
    .sort((a, b) => a.name.localeCompare(b.name));
}
