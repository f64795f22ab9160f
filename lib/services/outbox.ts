/**
 * The hand-off from the review workflow to notifications: `notify` stores a domain event in the
 * `outbox` table in the caller's unit of work, so it is committed with the change it describes
 * (or not at all). The notification worker reads unprocessed rows in order with
 * `claimOutbox` (inside a transaction), sends through the queue with retries, and marks them with `markOutbox`.
 */
import { Group, OutboxMessage } from '@/entities';
import type { Em } from '@/lib/db/orm';
import type { ReviewDomainEvent } from '@/lib/review/events';

export function notify(em: Em, event: ReviewDomainEvent): void {
  em.create(OutboxMessage, {
    type: event.type,
    group: em.getReference(Group, event.groupId),
    payload: { ...event } as Record<string, unknown>,
    attempts: 0,
    processedAt: null,
    lastError: null,
  });
}

export interface OutboxItem {
  id: string;
  event: ReviewDomainEvent;
  attempts: number;
  createdAt: Date;
}

/**
 * Up to `limit` unprocessed events, oldest first, locked for this transaction (SKIP LOCKED, so
 * two workers never take the same row). Call inside `em.transactional` and mark them before it ends.
 */
export async function claimOutbox(tx: Em, opts: { limit?: number; groupId?: string } = {}): Promise<OutboxItem[]> {
  const byGroup = opts.groupId ? 'and group_id = ?' : '';
  const rows = await tx.getConnection().execute<{ id: string; payload: ReviewDomainEvent; attempts: number; created_at: Date }[]>(
    `select id, payload, attempts, created_at from outbox where processed_at is null ${byGroup} order by created_at, id limit ? for update skip locked`,
    [...(opts.groupId ? [opts.groupId] : []), opts.limit ?? 50],
    'all',
    tx.getTransactionContext(),
  );
  return rows.map((r) => ({ id: r.id, event: r.payload, attempts: r.attempts, createdAt: new Date(r.created_at) }));
}

/** Marks an event handled, or records a failed attempt (it stays unprocessed for the next run). */
export async function markOutbox(tx: Em, id: string, outcome: { ok: true } | { ok: false; error: string }): Promise<void> {
  if (outcome.ok) {
    await tx.nativeUpdate(OutboxMessage, { id }, { processedAt: new Date() });
  } else {
    await tx
      .getConnection()
      .execute('update outbox set attempts = attempts + 1, last_error = ? where id = ?', [outcome.error.slice(0, 2000), id], 'run', tx.getTransactionContext());
  }
}
