import { describe, expect, it } from 'vitest';
import type { ReviewDomainEvent } from '@/lib/review/events';
import { recipientsFor, type AudienceContext } from './recipients';

const ctx = (over: Partial<AudienceContext> = {}): AudienceContext => ({
  submitterId: 'sub',
  reviewerIds: ['rev1', 'rev2'],
  adminIds: ['adm'],
  memberIds: new Set(['sub', 'rev1', 'rev2', 'adm', 'obs', 'other-rev']),
  ...over,
});
const base = { groupId: 'g', spectrumId: 's' };
const ids = (event: ReviewDomainEvent, c = ctx()) => recipientsFor(event, c).map((r) => r.userId);

describe('recipientsFor', () => {
  it('a review request reaches the newly assigned reviewers only, not the admin who assigned', () => {
    expect(ids({ ...base, actorId: 'adm', type: 'reviewer.assigned', reviewerIds: ['rev1', 'adm'] })).toEqual(['rev1']);
  });

  it('a new revision reaches assigned reviewers and earlier deciders, not its uploader', () => {
    const e: ReviewDomainEvent = { ...base, actorId: 'sub', type: 'revision.created', revisionId: 'v', number: 2 };
    expect(ids(e, ctx({ deciderIds: ['other-rev', 'rev1'] }))).toEqual(['rev1', 'rev2', 'other-rev']);
  });

  it('a new thread reaches the submitter and the reviewers except its author', () => {
    expect(ids({ ...base, actorId: 'rev1', type: 'thread.opened', threadId: 't', blocking: true })).toEqual(['sub', 'rev2']);
  });

  it('a reply reaches thread participants too; someone mentioned in it hears through the mention only', () => {
    const e: ReviewDomainEvent = { ...base, actorId: 'sub', type: 'thread.replied', threadId: 't', replyId: 'r' };
    expect(ids(e, ctx({ threadParticipantIds: ['obs', 'rev1', 'sub'], mentionedIds: ['rev2'] }))).toEqual(['rev1', 'obs']);
  });

  it('a mention reaches the mentioned members, never the writer, never a non-member', () => {
    expect(ids({ ...base, actorId: 'rev1', type: 'mention', threadId: 't', replyId: null, mentionedIds: ['rev1', 'obs', 'stranger'] })).toEqual(['obs']);
  });

  it('a decision reaches the submitter and the other reviewers', () => {
    expect(ids({ ...base, actorId: 'rev2', type: 'decision.made', decisionId: 'd', revisionId: 'v', verdict: 'return' })).toEqual(['sub', 'rev1']);
  });

  it('approval also reaches the admins; the kind is "outcome"', () => {
    const r = recipientsFor({ ...base, actorId: 'rev1', type: 'spectrum.status', from: 'in-review', to: 'approved', reason: 'auto-approved' }, ctx());
    expect(r).toEqual([{ userId: 'sub', kind: 'outcome' }, { userId: 'rev2', kind: 'outcome' }, { userId: 'adm', kind: 'outcome' }]);
  });

  it('automatic events (no actor) exclude nobody; a reopening does not go to admins', () => {
    expect(ids({ ...base, actorId: null, type: 'spectrum.status', from: 'rejected', to: 'in-review', reason: 'reopened' })).toEqual(['sub', 'rev1', 'rev2']);
  });

  it('one decision, one mail: a rejection is told by its decision only', () => {
    expect(ids({ ...base, actorId: 'rev1', type: 'spectrum.status', from: 'in-review', to: 'rejected', reason: 'rejected', decisionId: 'd' })).toEqual([]);
  });

  it('an approval a decision completed reaches only those its decision mail does not: the admins', () => {
    const e: ReviewDomainEvent = { ...base, actorId: 'rev1', type: 'spectrum.status', from: 'in-review', to: 'approved', reason: 'auto-approved', decisionId: 'd' };
    expect(ids(e)).toEqual(['adm']);
    // An admin who is also an assigned reviewer hears it once, through the decision.
    expect(ids(e, ctx({ reviewerIds: ['rev1', 'adm'] }))).toEqual([]);
    expect(ids({ ...base, actorId: 'rev1', type: 'decision.made', decisionId: 'd', revisionId: 'v', verdict: 'approve' }, ctx({ reviewerIds: ['rev1', 'adm'] }))).toEqual(['sub', 'adm']);
  });

  it('a decision that ends the review is both a decision and an outcome mail; one that does not is a decision only', () => {
    const d = { ...base, actorId: 'rev1', type: 'decision.made' as const, decisionId: 'd', revisionId: 'v' };
    expect(recipientsFor({ ...d, verdict: 'reject', outcome: { status: 'rejected' } }, ctx())[0]).toEqual({ userId: 'sub', kind: 'decision', alsoKind: 'outcome' });
    expect(recipientsFor({ ...d, verdict: 'approve', outcome: { status: 'approved' } }, ctx())[0]).toEqual({ userId: 'sub', kind: 'decision', alsoKind: 'outcome' });
    expect(recipientsFor({ ...d, verdict: 'approve', outcome: { status: 'in-review' } }, ctx())[0]).toEqual({ userId: 'sub', kind: 'decision' });
  });

  it('a withdrawal reaches the reviewers', () => {
    expect(ids({ ...base, actorId: 'sub', type: 'spectrum.status', from: 'in-review', to: 'withdrawn', reason: 'withdrawn' })).toEqual(['rev1', 'rev2']);
  });

  it('a submitter who left the group hears nothing; events without mail reach nobody', () => {
    const left = ctx({ memberIds: new Set(['rev1', 'rev2']) });
    expect(ids({ ...base, actorId: 'rev1', type: 'decision.made', decisionId: 'd', revisionId: 'v', verdict: 'approve' }, left)).toEqual(['rev2']);
    expect(ids({ ...base, actorId: 'rev1', type: 'finding.waived', findingId: 'f', waiverId: 'w' })).toEqual([]);
  });
});
