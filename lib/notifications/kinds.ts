/**
 * What a person can be told about, and how. Each review event maps to one kind; each person
 * chooses per kind: mail at once, one mail a day with everything, or nothing.
 */
import type { ReviewDomainEvent } from '@/lib/review/events';

export const notificationKinds = ['reviewer-assigned', 'new-revision', 'thread', 'mention', 'decision', 'outcome'] as const;
export type NotificationKind = (typeof notificationKinds)[number];

export const deliveryModes = ['immediate', 'digest', 'off'] as const;
export type DeliveryMode = (typeof deliveryModes)[number];

/**
 * Work that waits on the person (a review request, a mention, a decision) comes at once;
 * discussion traffic, which can be chatty, comes in the daily digest.
 */
export const defaultModes: Readonly<Record<NotificationKind, DeliveryMode>> = {
  'reviewer-assigned': 'immediate',
  'new-revision': 'immediate',
  thread: 'digest',
  mention: 'immediate',
  decision: 'immediate',
  outcome: 'immediate',
};

/** Labels and hints for the account page. */
export const kindDescriptions: Readonly<Record<NotificationKind, { label: string; hint: string }>> = {
  'reviewer-assigned': { label: 'Review requests', hint: 'You are made a reviewer of a spectrum (as a reviewer or admin in a group).' },
  'new-revision': { label: 'New revisions', hint: 'A spectrum you review gets a new revision.' },
  thread: { label: 'Threads and replies', hint: 'New threads on your spectra, and replies in threads you take part in.' },
  mention: { label: 'Mentions', hint: 'Someone writes @you in a thread or reply.' },
  decision: { label: 'Decisions', hint: 'A reviewer approves, returns or rejects a spectrum you submitted or review.' },
  outcome: { label: 'Approved and rejected', hint: 'A spectrum is approved, rejected, reopened or withdrawn.' },
};

/** The words of the account page's columns; the mails quote them, so both must say the same. */
export const modeLabels: Readonly<Record<DeliveryMode, string>> = {
  immediate: 'At once',
  digest: 'Daily digest',
  off: 'Off',
};

export function isNotificationKind(v: unknown): v is NotificationKind {
  return typeof v === 'string' && (notificationKinds as readonly string[]).includes(v);
}

export function isDeliveryMode(v: unknown): v is DeliveryMode {
  return typeof v === 'string' && (deliveryModes as readonly string[]).includes(v);
}

/**
 * The kind an event is announced as, or null for events that send no mail: thread edits and
 * waivers show on the page, and a return or a rejection is already told by its decision (one
 * decision, one mail). An approval completed by a decision still goes out, but only to people
 * the decision mail does not reach (recipients.ts); one completed by a waiver, a thread or the
 * policy has no decision mail and goes to everyone.
 */
export function kindOf(event: ReviewDomainEvent): NotificationKind | null {
  switch (event.type) {
    case 'reviewer.assigned':
      return 'reviewer-assigned';
    case 'revision.created':
      return 'new-revision';
    case 'thread.opened':
    case 'thread.replied':
      return 'thread';
    case 'mention':
      return 'mention';
    case 'decision.made':
      return 'decision';
    case 'spectrum.status':
      return event.reason === 'returned' || event.reason === 'rejected' ? null : 'outcome';
    case 'thread.updated':
    case 'finding.waived':
      return null;
  }
}
