/**
 * The review workflow end to end through the API: the status machine, the group's policy,
 * waivers, blocking threads, optimistic locking, thread carry-over across revisions and compare.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Decision, OutboxMessage, Spectrum } from '@/entities';
import * as decisions from '@/app/api/v1/spectra/[id]/decisions/route';
import * as threads from '@/app/api/v1/spectra/[id]/threads/route';
import * as thread from '@/app/api/v1/threads/[id]/route';
import * as replies from '@/app/api/v1/threads/[id]/replies/route';
import * as waiver from '@/app/api/v1/findings/[id]/waiver/route';
import * as withdraw from '@/app/api/v1/spectra/[id]/withdraw/route';
import * as reopen from '@/app/api/v1/spectra/[id]/reopen/route';
import * as policy from '@/app/api/v1/groups/[slug]/policy/route';
import * as compare from '@/app/api/v1/spectra/[id]/compare/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { decide } from '@/lib/services/decisions';
import { revisionA, revisionB } from '@/lib/review/test-curves';
import { addMember, makeLab, makeUser, sessionCaller, type TestUser } from './helpers';
import { call, model, newScreenedRevision, screenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
let reviewer2: TestUser;

beforeAll(async () => {
  lab = await makeLab('review');
  const em = await getEm();
  reviewer2 = await makeUser(em, 'reviewer');
  await addMember(em, reviewer2, lab.group, 'reviewer');
});
afterAll(closeOrm);

const decideAs = (who: TestUser, id: string, body: Record<string, unknown>) =>
  call(decisions.POST, who, { params: { id }, body: { note: 'Looked at every branch.', ...body } });
const statusOf = async (id: string) => (await (await getEm()).findOneOrFail(Spectrum, { id })).status;

async function setPolicy(body: Record<string, unknown>) {
  const res = await call(policy.PUT, lab.admin, { method: 'PUT', params: { slug: lab.group.slug }, body });
  expect(res.status).toBe(200);
  return res.body;
}

describe('the status machine on the server', () => {
  it('return → returned; a new revision → in review again with the decision history kept', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const r = await decideAs(lab.reviewer, s.id, { verdict: 'return', revision: s.revisionId, note: 'Impose the sum rule and upload again.' });
    expect(r.status).toBe(201);
    expect(r.body.decision).toMatchObject({ verdict: 'return', note: 'Impose the sum rule and upload again.', reviewer: { id: lab.reviewer.id } });
    expect(r.body.state.status).toBe('returned');
    // No further decision while returned.
    expect((await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId })).status).toBe(409);
    const rev2 = await newScreenedRevision(s.id, lab.submitter, model());
    expect(await statusOf(s.id)).toBe('in-review');
    const list = await call(decisions.GET, lab.observer, { params: { id: s.id } });
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.state.currentRevisionId).toBe(rev2.revisionId);
  });

  it('409 on one\'s own spectrum, on a stale revision, in the wrong state', async () => {
    const own = await screenedSpectrum(lab.group, lab.admin);
    const mine = await decideAs(lab.admin, own.id, { verdict: 'approve', revision: own.revisionId });
    expect(mine.status).toBe(409);
    expect(mine.body.error.message).toMatch(/own submission/);

    const s = await screenedSpectrum(lab.group, lab.submitter);
    const old = s.revisionId;
    await newScreenedRevision(s.id, lab.submitter, model());
    const stale = await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: old });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/older revision/);

    const rej = await screenedSpectrum(lab.group, lab.submitter);
    expect((await decideAs(lab.reviewer, rej.id, { verdict: 'reject', revision: rej.revisionId })).body.state.status).toBe('rejected');
    expect((await decideAs(lab.admin, rej.id, { verdict: 'approve', revision: rej.revisionId })).status).toBe(409);
    // Nothing was written by the refused requests.
    const em = await getEm();
    expect(await em.count(Decision, { spectrum: { $in: [own.id, s.id] } })).toBe(0);
  });

  it('an admin reopens a rejected spectrum; approvals from before no longer count', async () => {
    await setPolicy({ requiredApprovals: 2 });
    try {
      const s = await screenedSpectrum(lab.group, lab.submitter);
      expect((await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId })).body.state.approval.approvals.count).toBe(1);
      expect((await decideAs(reviewer2, s.id, { verdict: 'reject', revision: s.revisionId })).body.state.status).toBe('rejected');
      expect((await call(reopen.POST, lab.reviewer, { params: { id: s.id }, body: {} })).status).toBe(403);
      const r = await call(reopen.POST, lab.admin, { params: { id: s.id }, body: { note: 'The soft mode is real; look again.' } });
      expect(r.status).toBe(200);
      expect(r.body).toMatchObject({ status: 'in-review', approval: { approvals: { count: 0, required: 2 } } });
      expect((await call(reopen.POST, lab.admin, { params: { id: s.id }, body: {} })).status).toBe(409);
      // The decisions list says who reopened it, when and why, so "in review" after a
      // rejection reads as what happened.
      const list = await call(decisions.GET, lab.submitter, { params: { id: s.id } });
      expect(list.body.items.map((d: { verdict: string }) => d.verdict)).toEqual(['reject', 'approve']);
      expect(list.body.reopens).toEqual([
        { id: expect.any(String), by: { id: lab.admin.id, name: lab.admin.name, email: lab.admin.email }, note: 'The soft mode is real; look again.', createdAt: expect.any(String) },
      ]);
      expect(Date.parse(list.body.reopens[0].createdAt)).toBeGreaterThanOrEqual(Date.parse(list.body.items[0].createdAt));
      // A spectrum never reopened has none; another spectrum's reopening is not listed.
      const other = await screenedSpectrum(lab.group, lab.submitter);
      expect((await call(decisions.GET, lab.submitter, { params: { id: other.id } })).body.reopens).toEqual([]);
    } finally {
      await setPolicy({ requiredApprovals: 1 });
    }
  });

  it('the submitter withdraws from an open state, nobody else; nothing after', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    expect((await call(withdraw.POST, lab.admin, { params: { id: s.id }, body: {} })).status).toBe(403);
    const w = await call(withdraw.POST, lab.submitter, { params: { id: s.id }, body: {} });
    expect(w.status).toBe(200);
    expect(w.body.status).toBe('withdrawn');
    expect((await call(withdraw.POST, lab.submitter, { params: { id: s.id }, body: {} })).status).toBe(409);
    expect((await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId })).status).toBe(409);
  });

  it('every change is audited and emits an event into the outbox', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const r = await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId });
    expect(r.body.state.status).toBe('approved');
    const em = await getEm();
    const audit = await em.find(AuditEvent, { target: `spectrum:${s.id}` }, { orderBy: { createdAt: 'asc' } });
    expect(audit.map((a) => [a.action, a.actor?.id ?? null])).toEqual([
      ['decision.approve', lab.reviewer.id],
      ['spectrum.approved', lab.reviewer.id],
    ]);
    expect(audit[1]!.data).toMatchObject({ automatic: true, revision: s.revisionId });
    const outbox = await em.find(OutboxMessage, { payload: { spectrumId: s.id } }, { orderBy: { createdAt: 'asc' } });
    expect(outbox.map((o) => o.type).sort()).toEqual(['decision.made', 'spectrum.status']);
    expect(outbox.find((o) => o.type === 'spectrum.status')!.payload).toMatchObject({ from: 'in-review', to: 'approved', reason: 'auto-approved' });
  });
});

describe('the group policy', () => {
  it('two required approvals: the first keeps it in review, the second approves; one person counts once', async () => {
    const p = await setPolicy({ requiredApprovals: 2 });
    expect(p.requiredApprovals).toBe(2);
    try {
      const s = await screenedSpectrum(lab.group, lab.submitter);
      const first = await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId });
      expect(first.body.state).toMatchObject({ status: 'in-review', approval: { approvals: { count: 1, required: 2 }, waitingFor: ['1 more approval'] } });
      expect((await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId })).status).toBe(409);
      const second = await decideAs(lab.admin, s.id, { verdict: 'approve', revision: s.revisionId });
      expect(second.body.state.status).toBe('approved');
    } finally {
      await setPolicy({ requiredApprovals: 1 });
    }
  });

  it('a new revision clears approvals', async () => {
    await setPolicy({ requiredApprovals: 2 });
    try {
      const s = await screenedSpectrum(lab.group, lab.submitter);
      await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId });
      const rev2 = await newScreenedRevision(s.id, lab.submitter, model());
      const after = await call(decisions.GET, lab.reviewer, { params: { id: s.id } });
      expect(after.body.state.approval.approvals.count).toBe(0);
      expect(after.body.items[0]).toMatchObject({ verdict: 'approve', counts: false });
      // Both approvals are needed again on the new revision.
      expect((await decideAs(reviewer2, s.id, { verdict: 'approve', revision: rev2.revisionId })).body.state.status).toBe('in-review');
      expect((await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: rev2.revisionId })).body.state.status).toBe('approved');
    } finally {
      await setPolicy({ requiredApprovals: 1 });
    }
  });

  it('warnings block when the policy says so', async () => {
    await setPolicy({ blockingSeverities: ['warn', 'fail'], checks: { acousticGamma: { warn: 0.01, fail: 0.5 } } });
    try {
      const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'sum-rule' }));
      const r = await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId });
      expect(r.body.state.status).toBe('in-review');
      expect(r.body.state.approval.blockingFindings).toBeGreaterThan(0);
    } finally {
      await setPolicy({ blockingSeverities: ['fail'], checks: { acousticGamma: { warn: 0.03, fail: 0.1 } } });
    }
  });
});

describe('waivers', () => {
  it('a waived fail stops counting: the verdict changes and the spectrum is approved', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const em = await getEm();
    expect((await em.findOneOrFail(Spectrum, { id: s.id })).verdict).toBe('fail');
    const approve = await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId });
    expect(approve.body.state).toMatchObject({ status: 'in-review', approval: { blockingFindings: 1 } });

    expect((await call(waiver.POST, lab.submitter, { params: { id: s.findingIds[0]! }, body: { reason: 'mine' } })).status).toBe(403);
    expect((await call(waiver.POST, lab.admin, { params: { id: s.findingIds[0]! }, body: { reason: '  ' } })).status).toBe(400);
    const w = await call(waiver.POST, lab.admin, {
      params: { id: s.findingIds[0]! },
      body: { reason: 'A real soft mode of this invented phase; keep it.' },
    });
    expect(w.status).toBe(201);
    expect(w.body.waiver).toMatchObject({ findingId: s.findingIds[0], reason: 'A real soft mode of this invented phase; keep it.', author: { id: lab.admin.id } });
    expect(w.body.verdict).toBe('pass');
    expect(w.body.approval.approve).toBe(true);
    expect(await statusOf(s.id)).toBe('approved');
    // Still visible, marked as waived.
    const got = await call(waiver.GET, lab.observer, { params: { id: s.findingIds[0]! } });
    expect(got.body.reason).toMatch(/soft mode/);
    const audit = await (await getEm()).find(AuditEvent, { target: `finding:${s.findingIds[0]}` });
    expect(audit.map((a) => a.action)).toEqual(['finding.waived']);
  });

  it('once only, and only on the current revision', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    expect((await call(waiver.POST, lab.reviewer, { params: { id: s.findingIds[0]! }, body: { reason: 'real' } })).status).toBe(201);
    expect((await call(waiver.POST, lab.admin, { params: { id: s.findingIds[0]! }, body: { reason: 'again' } })).status).toBe(409);
    const t = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    await newScreenedRevision(t.id, lab.submitter, model({ defect: 'soft-mode' }));
    expect((await call(waiver.POST, lab.reviewer, { params: { id: t.findingIds[0]! }, body: { reason: 'old' } })).status).toBe(409);
  });
});

describe('blocking threads', () => {
  it('an unresolved blocking thread prevents approval; resolving it approves', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const t = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: null, body: 'Which supercell?', blocking: true } });
    expect(t.status).toBe(201);
    const approve = await decideAs(reviewer2, s.id, { verdict: 'approve', revision: s.revisionId });
    expect(approve.body.state).toMatchObject({ status: 'in-review', approval: { openBlockingThreads: 1 } });
    expect((await call(replies.POST, lab.submitter, { params: { id: t.body.id }, body: { body: '4×4×4, see notes.' } })).status).toBe(201);
    expect((await call(thread.PATCH, lab.submitter, { method: 'PATCH', params: { id: t.body.id }, body: { resolved: true } })).status).toBe(403);
    const resolved = await call(thread.PATCH, lab.reviewer, { method: 'PATCH', params: { id: t.body.id }, body: { resolved: true } });
    expect(resolved.status).toBe(200);
    expect(resolved.body.thread).toMatchObject({ resolved: true, resolvedBy: { id: lab.reviewer.id }, replies: [{ body: '4×4×4, see notes.' }] });
    expect(resolved.body.approval.approve).toBe(true);
    expect(await statusOf(s.id)).toBe('approved');
  });

  it('unmarking blocking also lets approval through; reopening a thread is allowed', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const t = await call(threads.POST, lab.admin, { params: { id: s.id }, body: { body: 'Hold on.', blocking: true } });
    await decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId });
    const r = await call(thread.PATCH, lab.admin, { method: 'PATCH', params: { id: t.body.id }, body: { blocking: false } });
    expect(r.body.thread.blocking).toBe(false);
    expect(await statusOf(s.id)).toBe('approved');
    const again = await call(thread.PATCH, lab.admin, { method: 'PATCH', params: { id: t.body.id }, body: { resolved: true } });
    expect(again.body.thread.resolved).toBe(true);
    const reopened = await call(thread.PATCH, lab.admin, { method: 'PATCH', params: { id: t.body.id }, body: { resolved: false } });
    expect(reopened.body.thread).toMatchObject({ resolved: false, resolvedAt: null, resolvedBy: null });
  });
});

describe('optimistic locking', () => {
  it('two reviewers deciding on the same version: one wins, the other gets 409, and its retry counts', async () => {
    await setPolicy({ requiredApprovals: 2 });
    try {
      const s = await screenedSpectrum(lab.group, lab.submitter);
      const version = (await (await getEm()).findOneOrFail(Spectrum, { id: s.id })).version;
      const results = await Promise.all([
        decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId, version }),
        decideAs(reviewer2, s.id, { verdict: 'approve', revision: s.revisionId, version }),
      ]);
      expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
      const loser = results[0]!.status === 409 ? lab.reviewer : reviewer2;
      const retry = await decideAs(loser, s.id, { verdict: 'approve', revision: s.revisionId });
      expect(retry.status).toBe(201);
      expect(retry.body.state.status).toBe('approved');
      expect(await (await getEm()).count(Decision, { spectrum: s.id })).toBe(2);
    } finally {
      await setPolicy({ requiredApprovals: 1 });
    }
  });

  it('without a version from the page, two concurrent approvals never lose an update', async () => {
    await setPolicy({ requiredApprovals: 2 });
    try {
      const s = await screenedSpectrum(lab.group, lab.submitter);
      const results = await Promise.all([
        decideAs(lab.reviewer, s.id, { verdict: 'approve', revision: s.revisionId }),
        decideAs(reviewer2, s.id, { verdict: 'approve', revision: s.revisionId }),
      ]);
      for (const [i, r] of results.entries()) {
        if (r.status === 409) {
          expect(r.body.error.message).toMatch(/same time|changed/);
          expect((await decideAs([lab.reviewer, reviewer2][i]!, s.id, { verdict: 'approve', revision: s.revisionId })).status).toBe(201);
        } else expect(r.status).toBe(201);
      }
      // Whatever the interleaving: two approvals stored and the spectrum approved.
      expect(await statusOf(s.id)).toBe('approved');
      expect(await (await getEm()).count(Decision, { spectrum: s.id, verdict: 'approve' })).toBe(2);
    } finally {
      await setPolicy({ requiredApprovals: 1 });
    }
  });

  it('a decision made on a stale read of the spectrum is refused at commit (version check)', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const stale = await getEm();
    await stale.findOneOrFail(Spectrum, { id: s.id }); // this request read the spectrum…
    await decideAs(reviewer2, s.id, { verdict: 'return', revision: s.revisionId }); // …then someone else decided
    // The stale unit of work still believes the spectrum is in review: the UPDATE … WHERE version fails.
    await expect(decide(stale, sessionCaller(lab.reviewer), s.id, { verdict: 'reject', note: 'no', revision: s.revisionId })).rejects.toMatchObject({
      code: 'conflict',
      message: expect.stringMatching(/same time/),
    });
    expect(await statusOf(s.id)).toBe('returned');
    expect(await (await getEm()).count(Decision, { spectrum: s.id })).toBe(1);
  });
});

describe('threads across revisions', () => {
  it('keep the revision they were opened on and say whether the spectrum moved at their anchor', async () => {
    const before = model();
    const after = model({ defect: 'shift' });
    // One q-point the shift moves and one it leaves alone (branch 2, the highest).
    const diff = (i: number) => Math.abs(after.frequencies[i * 3 + 2] - before.frequencies[i * 3 + 2]);
    const movedIndex = [...Array(before.nq).keys()].find((i) => diff(i) > 0.5)!;
    const stillIndex = [...Array(before.nq).keys()].find((i) => diff(i) === 0 && i > 0)!;
    const s = await screenedSpectrum(lab.group, lab.submitter, before);
    const open = (index: number) =>
      call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: { revision: s.revisionId, index, branch: 2 }, body: `Point ${index}` } });
    const a = await open(movedIndex);
    expect(a.status).toBe(201);
    expect(a.body.anchor).toEqual({ kind: 'point', revision: s.revisionId, index: movedIndex, branch: 2, frequency: before.frequencies[movedIndex * 3 + 2] });
    expect(a.body.moved).toMatchObject({ moved: false, delta: 0 });
    await open(stillIndex);
    const onSpectrum = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { body: '@' + lab.submitter.email + ' which code version?' } });
    expect(onSpectrum.body.moved).toBeNull();

    const rev2 = await newScreenedRevision(s.id, lab.submitter, after);
    const list = await call(threads.GET, lab.observer, { params: { id: s.id } });
    expect(list.status).toBe(200);
    const [t1, t2, t3] = list.body.items;
    expect(t1.revision).toEqual({ id: s.revisionId, number: 1 });
    expect(t1.moved).toMatchObject({ moved: true, current: { id: rev2.revisionId, number: 2 } });
    expect(Math.abs(t1.moved.delta)).toBeGreaterThan(t1.moved.tolerance);
    expect(t2.moved).toMatchObject({ moved: false, delta: 0 });
    expect(t3.anchor).toEqual({ kind: 'spectrum' });

    // A third revision sampled twice as finely, back to the unshifted model: nothing moved since revision 1.
    await newScreenedRevision(s.id, lab.submitter, model({ points: 40 }));
    const again = (await call(threads.GET, lab.observer, { params: { id: s.id } })).body.items;
    expect(again[0].moved.moved).toBe(false);
    expect(Math.abs(again[0].moved.delta)).toBeLessThan(again[0].moved.tolerance);
    expect(again[1].moved.moved).toBe(false);

    // The mention went to the outbox for the submitter.
    const em = await getEm();
    const mention = await em.findOneOrFail(OutboxMessage, { type: 'mention', payload: { threadId: onSpectrum.body.id } });
    expect(mention.payload.mentionedIds).toEqual([lab.submitter.id]);
  });

  it('a thread on a finding, and anchors outside the revision are refused with where', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const f = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: { finding: s.findingIds[0] }, body: 'Real?' } });
    expect(f.status).toBe(201);
    expect(f.body.anchor).toMatchObject({ kind: 'finding', finding: s.findingIds[0], check: 'imaginary-modes', severity: 'fail' });
    expect(f.body.moved).toMatchObject({ moved: false });
    const bad = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: { revision: s.revisionId, index: 100000, branch: 7 }, body: 'x' } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details.fieldErrors).sort()).toEqual(['anchor.branch', 'anchor.index']);
  });
});

describe('compare', () => {
  it('per-branch maximum deviation between two revisions sampled differently (hand-computed)', async () => {
    const em = await getEm();
    const group = lab.group;
    const s = await screenedSpectrum(group, lab.submitter, revisionA());
    const b = await newScreenedRevision(s.id, lab.submitter, revisionB());
    const r = await call(compare.GET, lab.observer, { params: { id: s.id }, query: { a: s.revisionId, b: b.revisionId } });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ a: { number: 1 }, b: { number: 2 }, sampling: 'interpolated', compared: 3, tolerance: 0.05 });
    // See lib/review/compare.test.ts for the arithmetic.
    expect(r.body.branches[0].maxDeviation).toBeCloseTo(0.1, 12);
    expect(r.body.branches[0].at).toEqual({ index: 1, distance: 1 });
    expect(r.body.branches[1].maxDeviation).toBeCloseTo(0.3, 12);
    expect(r.body.branches[1].signed).toBeCloseTo(-0.3, 12);
    const other = await screenedSpectrum(group, lab.submitter);
    expect((await call(compare.GET, lab.observer, { params: { id: s.id }, query: { a: s.revisionId, b: other.revisionId } })).status).toBe(404);
    expect((await call(compare.GET, lab.observer, { params: { id: s.id }, query: { a: s.revisionId } })).status).toBe(400);
    void em;
  });
});
