import { route } from '@/lib/http/route';
import { readMembers, type MemberDto } from '@/lib/services/members';
import { membersParams } from './schema';

export const dynamic = 'force-dynamic';

export type MembersResponse = { items: MemberDto[] };

/** The group's members by name: user id, name, e-mail, role, joined (any member; @-mention autocomplete). */
export const GET = route({ params: membersParams }, async ({ em, caller, params }): Promise<MembersResponse> => readMembers(em, caller, params.slug));
