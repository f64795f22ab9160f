import { route } from '@/lib/http/route';
import type { AuditEventDto } from '@/lib/services/audit';
import { groupAudit } from '@/lib/services/review-audit';
import { groupAuditParams, groupAuditQuery } from './schema';

export const dynamic = 'force-dynamic';

export type GroupAuditResponse = { items: AuditEventDto[]; total: number };

/** The group's audit log, newest first (admins); filter by action (or "prefix."), actor, target, time. */
export const GET = route({ params: groupAuditParams, query: groupAuditQuery }, async ({ em, caller, params, query }): Promise<GroupAuditResponse> =>
  groupAudit(em, caller, params.slug, query),
);
