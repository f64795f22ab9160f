/**
 * Several findings waived with one reason (POST /revisions/{id}/waivers): all or nothing, one
 * audit and outbox event per finding, the verdict and the approval rule settled once.
 * The spectrum is the demo's soft pocket: one imaginary-modes fail and ten continuity fails
 * on branch 0 around it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, OutboxMessage, Spectrum, Waiver } from '@/entities';
import * as decisions from '@/app/api/v1/spectra/[id]/decisions/route';
import * as waiver from '@/app/api/v1/findings/[id]/waiver/route';
import * as waivers from '@/app/api/v1/revisions/[id]/waivers/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { injectSoftMode, modelSpectrum } from '@/lib/models';
import { addMember, makeGroup, makeLab, makeUser } from './helpers';
import { call, model, newScreenedRevision, screenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
let other: Awaited<ReturnType<typeof makeLab>>;

beforeAll(async () => {
  lab = await makeLab('bulk-waive');
  other = await makeLab('bulk-waive-other');
});
afterAll(closeOrm);

const softPocket = () => injectSoftMode(modelSpectrum('fcc', { points: 41 }), { index: 60, depthTHz: 1.4, widthPoints: 4 });
const REASON = 'A real soft mode of the strained invented cell; the jumps are its pocket.';

const waiveMany = (who: typeof lab.reviewer, revisionId: string, findingIds: string[], reason = REASON) =>
  call(waivers.POST, who, { params: { id: revisionId }, body: { findingIds, reason } });

async function written(findingIds: string[]) {
  const em = (await getEm()).fork();
  return {
    waivers: await em.count(Waiver, { finding: { $in: findingIds } }),
    audit: await em.find(AuditEvent, { target: { $in: findingIds.map((id) => `finding:${id}`) } }),
    outbox: await em.count(OutboxMessage, { type: 'finding.waived', payload: { findingId: { $in: findingIds } } }),
  };
}

const spectrumRow = async (id: string) => (await getEm()).fork().findOneOrFail(Spectrum, { id });

describe('waiving several findings at once', () => {
  it('waives every finding with one reason: a waiver, an audit and an outbox event each; the verdict passes and the spectrum is approved', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, softPocket());
    expect(s.findingIds).toHaveLength(11);
    const approve = await call(decisions.POST, lab.reviewer, { params: { id: s.id }, body: { verdict: 'approve', note: 'Looked at the pocket.', revision: s.revisionId } });
    expect(approve.body.state).toMatchObject({ status: 'in-review', approval: { blockingFindings: 11 } });

    const res = await waiveMany(lab.admin, s.revisionId, s.findingIds);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.waivers).toHaveLength(11);
    expect(res.body.waivers.map((w: { findingId: string }) => w.findingId)).toEqual(s.findingIds);
    for (const w of res.body.waivers) expect(w).toMatchObject({ reason: REASON, author: { id: lab.admin.id } });
    expect(res.body.verdict).toBe('pass');
    expect(res.body.approval).toMatchObject({ approve: true, blockingFindings: 0 });

    const row = await spectrumRow(s.id);
    expect(row.status).toBe('approved');
    expect(row.verdict).toBe('pass');
    const w = await written(s.findingIds);
    expect(w.waivers).toBe(11);
    expect(w.outbox).toBe(11);
    expect(w.audit).toHaveLength(11);
    for (const a of w.audit) {
      expect(a.action).toBe('finding.waived');
      expect(a.data).toMatchObject({ spectrum: s.id, revision: s.revisionId, reason: REASON, batch: 11 });
    }
    // The approval is recorded once, after all the waivers.
    const approvals = await (await getEm()).fork().find(AuditEvent, { action: 'spectrum.approved', target: `spectrum:${s.id}` });
    expect(approvals).toHaveLength(1);
    expect(approvals[0]!.data).toMatchObject({ automatic: true });
  });

  it('waiving only some findings leaves the verdict failing and the spectrum in review', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, softPocket());
    await call(decisions.POST, lab.reviewer, { params: { id: s.id }, body: { verdict: 'approve', note: 'Fine.', revision: s.revisionId } });
    const some = s.findingIds.slice(0, 4);
    const res = await waiveMany(lab.reviewer, s.revisionId, some);
    expect(res.status).toBe(201);
    expect(res.body.verdict).toBe('fail');
    expect(res.body.approval).toMatchObject({ approve: false, blockingFindings: 7 });
    expect((await spectrumRow(s.id)).status).toBe('in-review');
    expect((await written(s.findingIds)).waivers).toBe(4);
  });

  it('all or nothing: one unknown, foreign, stale or already waived id writes nothing and the answer names it', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, softPocket());
    const ids = s.findingIds;
    const before = await spectrumRow(s.id);

    const unknownId = '00000000-0000-4000-8000-000000000000';
    const unknown = await waiveMany(lab.reviewer, s.revisionId, [ids[0]!, unknownId, 'not-a-uuid']);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.details).toEqual({ unknown: [unknownId, 'not-a-uuid'] });
    expect(unknown.body.error.message).toContain(unknownId);
    expect(unknown.body.error.message).toMatch(/Nothing was waived/);

    // Another group's finding is unknown here, as on the single route.
    const foreign = await screenedSpectrum(other.group, other.submitter, model({ defect: 'soft-mode' }));
    const f = await waiveMany(lab.reviewer, s.revisionId, [ids[0]!, foreign.findingIds[0]!]);
    expect(f.status).toBe(404);
    expect(f.body.error.details).toEqual({ unknown: [foreign.findingIds[0]] });

    // A finding of another spectrum of the group, and one of an older revision: another revision.
    const sibling = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const t = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const t2 = await newScreenedRevision(t.id, lab.submitter, model({ defect: 'soft-mode' }));
    const stale = await waiveMany(lab.reviewer, t2.revisionId, [t2.findingIds[0]!, t.findingIds[0]!, sibling.findingIds[0]!]);
    expect(stale.status).toBe(409);
    expect(stale.body.error.details).toEqual({ otherRevision: [t.findingIds[0], sibling.findingIds[0]] });
    expect(stale.body.error.message).toContain(t.findingIds[0]);
    expect((await written([t2.findingIds[0]!])).waivers).toBe(0);

    // Already waived one at a time, then listed again with the others.
    expect((await call(waiver.POST, lab.reviewer, { params: { id: ids[3]! }, body: { reason: 'Seen.' } })).status).toBe(201);
    const again = await waiveMany(lab.admin, s.revisionId, ids);
    expect(again.status).toBe(409);
    expect(again.body.error.details).toEqual({ alreadyWaived: [ids[3]] });
    expect(again.body.error.message).toMatch(/already waived/);

    // Nothing of the refused requests was written: only the single waiver stands.
    const w = await written(ids);
    expect(w.waivers).toBe(1);
    expect(w.audit.map((a) => a.target)).toEqual([`finding:${ids[3]}`]);
    expect(w.outbox).toBe(1);
    const after = await spectrumRow(s.id);
    expect(after.status).toBe(before.status);
    expect(after.verdict).toBe('fail');
  });

  it('only the current revision of a spectrum open for review; bad bodies are 400 with the field named', async () => {
    const t = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    await newScreenedRevision(t.id, lab.submitter, model({ defect: 'soft-mode' }));
    const old = await waiveMany(lab.reviewer, t.revisionId, t.findingIds);
    expect(old.status).toBe(409);
    expect(old.body.error.message).toMatch(/not the current one/);

    const s = await screenedSpectrum(lab.group, lab.submitter, softPocket());
    for (const body of [
      { findingIds: [], reason: REASON },
      { findingIds: [s.findingIds[0], s.findingIds[0]], reason: REASON },
      { findingIds: s.findingIds, reason: '   ' },
      { findingIds: s.findingIds },
    ]) {
      const r = await call(waivers.POST, lab.reviewer, { params: { id: s.revisionId }, body });
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(r.body.error.details.fieldErrors).length).toBeGreaterThan(0);
    }
    const extra = await call(waivers.POST, lab.reviewer, { params: { id: s.revisionId }, body: { findingIds: s.findingIds, reason: REASON, note: 'x' } });
    expect(extra.status).toBe(400);

    await call(decisions.POST, lab.reviewer, { params: { id: s.id }, body: { verdict: 'reject', note: 'Wrong cell.', revision: s.revisionId } });
    const closed = await waiveMany(lab.reviewer, s.revisionId, s.findingIds);
    expect(closed.status).toBe(409);
    expect(closed.body.error.message).toMatch(/rejected takes no waivers/);
    expect((await written(s.findingIds)).waivers).toBe(0);
  });
});

describe('who may', () => {
  it('an observer is refused; a reviewer of the group may; an outsider sees no revision', async () => {
    const em = await getEm();
    const outsider = await makeUser(em, 'outsider');
    await addMember(em, outsider, await makeGroup(em, 'bulk-elsewhere'), 'admin');
    const s = await screenedSpectrum(lab.group, lab.submitter, softPocket());
    expect((await waiveMany(lab.observer, s.revisionId, s.findingIds)).status).toBe(403);
    const o = await waiveMany(outsider, s.revisionId, s.findingIds);
    expect(o.status).toBe(404);
    expect(JSON.stringify(o.body)).not.toContain(s.id);
    expect((await written(s.findingIds)).waivers).toBe(0);
  });
});
