import { describe, expect, it } from 'vitest';
import type { ReviewDomainEvent } from '@/lib/review/events';
import { reviewEventTypes } from '@/lib/review/events';
import { defaultModes, kindDescriptions, kindOf, notificationKinds } from './kinds';

const base = { groupId: 'g', spectrumId: 's', actorId: 'a' };

describe('kindOf', () => {
  it('maps each mail-worthy event to its kind', () => {
    const cases: [ReviewDomainEvent, string | null][] = [
      [{ ...base, type: 'reviewer.assigned', reviewerIds: ['r'] }, 'reviewer-assigned'],
      [{ ...base, type: 'revision.created', revisionId: 'v', number: 2 }, 'new-revision'],
      [{ ...base, type: 'thread.opened', threadId: 't', blocking: false }, 'thread'],
      [{ ...base, type: 'thread.replied', threadId: 't', replyId: 'r' }, 'thread'],
      [{ ...base, type: 'mention', threadId: 't', replyId: null, mentionedIds: ['m'] }, 'mention'],
      [{ ...base, type: 'decision.made', decisionId: 'd', revisionId: 'v', verdict: 'return' }, 'decision'],
      [{ ...base, type: 'spectrum.status', from: 'in-review', to: 'approved', reason: 'auto-approved' }, 'outcome'],
      [{ ...base, type: 'spectrum.status', from: 'rejected', to: 'in-review', reason: 'reopened' }, 'outcome'],
      // A return or a rejection is told by its decision; edits and waivers send nothing.
      [{ ...base, type: 'spectrum.status', from: 'in-review', to: 'rejected', reason: 'rejected' }, null],
      [{ ...base, type: 'spectrum.status', from: 'in-review', to: 'returned', reason: 'returned' }, null],
      [{ ...base, type: 'thread.updated', threadId: 't', change: { resolved: true } }, null],
      [{ ...base, type: 'finding.waived', findingId: 'f', waiverId: 'w' }, null],
    ];
    for (const [event, kind] of cases) expect(kindOf(event), event.type).toBe(kind);
    // Every event type of the review workflow is covered above.
    expect(new Set(cases.map(([e]) => e.type))).toEqual(new Set(reviewEventTypes));
  });

  it('every kind has a default and a description', () => {
    for (const k of notificationKinds) {
      expect(defaultModes[k]).toMatch(/^(immediate|digest|off)$/);
      expect(kindDescriptions[k].label.length).toBeGreaterThan(0);
    }
  });
});
