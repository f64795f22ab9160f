/**
 * Domain events of the review workflow. Services hand each one to `notify(em, event)`
 * (lib/services/outbox.ts), which stores it in the `outbox` table in the same transaction as
 * the change; the notification worker reads the outbox, decides who gets mail under their
 * preferences, and sends through the queue with retries. Nothing here knows about mail.
 */
export interface EventBase {
  groupId: string;
  spectrumId: string;
  /** Who caused it; null for the application (screening, automatic approval). */
  actorId: string | null;
}

export type ReviewDomainEvent =
  | (EventBase & { type: 'reviewer.assigned'; reviewerIds: string[] })
  | (EventBase & { type: 'revision.created'; revisionId: string; number: number })
  | (EventBase & { type: 'thread.opened'; threadId: string; blocking: boolean })
  | (EventBase & { type: 'thread.replied'; threadId: string; replyId: string })
  | (EventBase & { type: 'thread.updated'; threadId: string; change: { resolved?: boolean; blocking?: boolean } })
  | (EventBase & { type: 'mention'; threadId: string; replyId: string | null; mentionedIds: string[] })
  | (EventBase & { type: 'finding.waived'; findingId: string; waiverId: string })
  | (EventBase & { type: 'decision.made'; decisionId: string; revisionId: string; verdict: DecisionVerdict; outcome?: DecisionOutcome })
  | (EventBase & {
      type: 'spectrum.status';
      from: string;
      to: string;
      reason: StatusReason;
      /** Set when a decision caused the change: its mail already tells the people it reaches. */
      decisionId?: string;
    });

export type DecisionVerdict = 'approve' | 'return' | 'reject';

/**
 * Where a decision left the spectrum, fixed when it was made (the mail may go out later, after
 * more has changed). `waiting` is set when an approval left it in review: what it still waits on.
 * Optional because events stored before it existed lack it.
 */
export interface DecisionOutcome {
  status: string;
  waiting?: {
    approvals: { count: number; required: number };
    openBlockingThreads: number;
    blockingFindings: number;
  };
}
export type StatusReason = 'auto-approved' | 'returned' | 'rejected' | 'reopened' | 'withdrawn';

export type ReviewEventType = ReviewDomainEvent['type'];

export const reviewEventTypes: readonly ReviewEventType[] = [
  'reviewer.assigned',
  'revision.created',
  'thread.opened',
  'thread.replied',
  'thread.updated',
  'mention',
  'finding.waived',
  'decision.made',
  'spectrum.status',
];
