/**
 * Who hears about an event. The rules, in product terms:
 * - a review request goes to the reviewers just assigned;
 * - a new revision goes to the assigned reviewers and to anyone who decided on an earlier one;
 * - a new thread goes to the submitter and the assigned reviewers; a reply also to everyone
 *   who wrote in that thread; people the same message @-mentions get the mention instead;
 * - a decision goes to the submitter and the assigned reviewers;
 * - approval goes to the submitter, the reviewers and the group's admins (they export);
 *   a reopening or withdrawal to the submitter and the reviewers; a return or rejection is told
 *   by its decision only, and an approval a decision completed reaches the submitter and the
 *   reviewers through that decision's mail (the admins still get the approval); that mail
 *   counts as an outcome too, so turning decisions off does not hide how a review ended.
 * Never the person who caused it, and only people who are still members of the group.
 */
import type { ReviewDomainEvent } from '@/lib/review/events';
import { kindOf, type NotificationKind } from './kinds';

export interface AudienceContext {
  submitterId: string | null;
  /** Assigned reviewers. */
  reviewerIds: readonly string[];
  adminIds: readonly string[];
  /** Everyone currently in the spectrum's group. */
  memberIds: ReadonlySet<string>;
  /** The thread's author and everyone who replied in it (thread events). */
  threadParticipantIds?: readonly string[];
  /** Reviewers who made a decision on any revision of the spectrum. */
  deciderIds?: readonly string[];
  /** People the same thread or reply @-mentions (their own 'mention' event tells them). */
  mentionedIds?: readonly string[];
}

export interface Recipient {
  userId: string;
  kind: NotificationKind;
  /**
   * A second kind the same mail also belongs to: a decision that ends the review is both a
   * decision and an outcome, and is sent unless the person turned both off.
   */
  alsoKind?: NotificationKind;
}

function audience(event: ReviewDomainEvent, ctx: AudienceContext): (string | null | undefined)[] {
  const submitter = ctx.submitterId;
  const reviewers = ctx.reviewerIds;
  switch (event.type) {
    case 'reviewer.assigned':
      return event.reviewerIds;
    case 'revision.created':
      return [...reviewers, ...(ctx.deciderIds ?? [])];
    case 'thread.opened':
      return [submitter, ...reviewers].filter((id) => !ctx.mentionedIds?.includes(id ?? ''));
    case 'thread.replied':
      return [submitter, ...reviewers, ...(ctx.threadParticipantIds ?? [])].filter((id) => !ctx.mentionedIds?.includes(id ?? ''));
    case 'mention':
      return event.mentionedIds;
    case 'decision.made':
      return [submitter, ...reviewers];
    case 'spectrum.status': {
      const all = event.to === 'approved' ? [submitter, ...reviewers, ...ctx.adminIds] : event.reason === 'withdrawn' ? [...reviewers] : [submitter, ...reviewers];
      if (!event.decisionId) return all;
      const told = new Set([submitter, ...reviewers]);
      return all.filter((id) => !told.has(id));
    }
    default:
      return [];
  }
}

/** Each recipient once, in a stable order, without the actor and without non-members. */
export function recipientsFor(event: ReviewDomainEvent, ctx: AudienceContext): Recipient[] {
  const kind = kindOf(event);
  if (!kind) return [];
  const ended = event.type === 'decision.made' && (event.outcome?.status === 'approved' || event.outcome?.status === 'rejected');
  const seen = new Set<string>();
  const out: Recipient[] = [];
  for (const id of audience(event, ctx)) {
    if (!id || id === event.actorId || seen.has(id) || !ctx.memberIds.has(id)) continue;
    seen.add(id);
    out.push(ended ? { userId: id, kind, alsoKind: 'outcome' } : { userId: id, kind });
  }
  return out;
}
