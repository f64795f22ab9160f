import { AuditEvent, Group, User } from '@/entities';
import type { Em } from '@/lib/db/orm';

export interface AuditInput {
  groupId?: string | null;
  actorId?: string | null;
  action: string;
  target?: string | null;
  data?: Record<string, unknown>;
}

/**
 * Records an event in the caller's unit of work: it is written by the same flush as the change
 * it describes, so a failed change leaves no event and an event never lacks its change.
 */
export function recordAudit(em: Em, input: AuditInput): void {
  em.create(AuditEvent, {
    group: input.groupId ? em.getReference(Group, input.groupId) : null,
    actor: input.actorId ? em.getReference(User, input.actorId) : null,
    action: input.action,
    target: input.target ?? null,
    data: input.data ?? {},
  });
}

export interface AuditEventDto {
  id: string;
  action: string;
  target: string | null;
  actor: { id: string; name: string | null; email: string } | null;
  data: Record<string, unknown>;
  createdAt: string;
  /** The spectrum the event concerns (its target, or the spectrum named in its data), when there is one. */
  spectrum?: { id: string; title: string } | null;
}
