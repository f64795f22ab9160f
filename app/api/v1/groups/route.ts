import { route } from '@/lib/http/route';
import { listMyGroups, type MyGroupDto } from '@/lib/services/groups';

export const dynamic = 'force-dynamic';

export type GroupsResponse = { items: MyGroupDto[] };

/** The caller's groups with their role in each; a token sees only its own group. */
export const GET = route({ auth: 'required' }, async ({ em, caller }): Promise<GroupsResponse> => ({
  items: await listMyGroups(em, caller.userId, { onlyGroupId: caller.tokenGroupId }),
}));
