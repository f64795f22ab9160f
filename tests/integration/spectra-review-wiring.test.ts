/**
 * The spectra API carries the review workflow: screening JSON with waivers, thread counts and
 * decisions on the spectrum, unwaived counts and reviewers in the queue, the "assigned to me" and
 * "waiting on me" filters, and the `revision.created` event written with every upload.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, OutboxMessage, Revision } from '@/entities';
import { GET as listRoute, POST as createRoute } from '@/app/api/v1/spectra/route';
import { GET as spectrumRoute } from '@/app/api/v1/spectra/[id]/route';
import { POST as revisionRoute } from '@/app/api/v1/spectra/[id]/revisions/route';
import { GET as screeningRoute } from '@/app/api/v1/revisions/[id]/screening/route';
import * as decisions from '@/app/api/v1/spectra/[id]/decisions/route';
import * as threads from '@/app/api/v1/spectra/[id]/threads/route';
import * as thread from '@/app/api/v1/threads/[id]/route';
import * as waiver from '@/app/api/v1/findings/[id]/waiver/route';
import * as reviewers from '@/app/api/v1/spectra/[id]/reviewers/route';
import { verdictOf } from '@/lib/checks';
import { closeOrm, getEm } from '@/lib/db/orm';
import { addRevisionWithFile } from '@/lib/services/revisions';
import { makeLab, routeArgs, sessionCaller, sessionCookie, type TestUser } from './helpers';
import { call, model, screenedSpectrum } from './review-fixtures';
import { modelFile, startHarness, waitForScreening, type Harness } from './spectra-support';

let lab: Awaited<ReturnType<typeof makeLab>>;
let h: Harness;

beforeAll(async () => {
  h = await startHarness();
  lab = await makeLab('wiring');
});
afterAll(async () => {
  await h?.close();
  await closeOrm();
});

async function multipart(path: string, who: TestUser, fields: Record<string, string>, file: File): Promise<Request> {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', file);
  return new Request(`${process.env.APP_URL}${path}`, { method: 'POST', headers: { cookie: await sessionCookie(who) }, body: form });
}

const list = (who: TestUser, query: Record<string, string> = {}) =>
  call(listRoute, who, { path: '/api/v1/spectra', query: { group: lab.group.slug, pageSize: '100', ...query } });
const idsOf = (body: { items: { id: string }[] }) => body.items.map((i) => i.id);

describe('screening JSON with waivers', () => {
  it('marks each waived finding with reason, person and time; keeps the screened verdict and adds the verdict with waivers', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const before = await call(screeningRoute, lab.observer, { params: { id: s.revisionId } });
    expect(before.status).toBe(200);
    expect(before.body.verdict).toBe('fail');
    expect(before.body.verdictWithWaivers).toBe('fail');
    expect(before.body.findings.every((f: { waived: unknown }) => f.waived === null)).toBe(true);

    // Waive every fail finding: the verdict with waivers is what is left.
    const fails = before.body.findings.filter((f: { severity: string }) => f.severity === 'fail');
    expect(fails.length).toBeGreaterThan(0);
    for (const f of fails) {
      const w = await call(waiver.POST, lab.reviewer, { params: { id: f.id }, body: { reason: 'Known numerical pocket near Γ; accepted for this use.' } });
      expect(w.status).toBe(201);
    }
    const after = await call(screeningRoute, lab.observer, { params: { id: s.revisionId } });
    expect(after.body.verdict).toBe('fail');
    const findings = after.body.findings as { id: string; severity: 'fail' | 'warn' | 'info'; waived: { reason: string; by: { id: string }; at: string } | null }[];
    expect(findings.map((f) => f.id)).toEqual(before.body.findings.map((f: { id: string }) => f.id));
    for (const f of findings) {
      if (f.severity === 'fail') {
        expect(f.waived).toMatchObject({ reason: 'Known numerical pocket near Γ; accepted for this use.', by: { id: lab.reviewer.id } });
        expect(Number.isNaN(Date.parse(f.waived!.at))).toBe(false);
      } else {
        expect(f.waived).toBeNull();
      }
    }
    const expected = verdictOf(findings.map((f) => ({ severity: f.severity, waived: f.waived !== null })));
    expect(expected).not.toBe('fail');
    expect(after.body.verdictWithWaivers).toBe(expected);
    // The rest of the command line's shape is unchanged.
    expect(Object.keys(after.body).sort()).toEqual(['branches', 'findings', 'folded', 'format', 'qpoints', 'revision', 'segments', 'status', 'verdict', 'verdictWithWaivers']);
  });
});

describe('spectrum and queue carry the review state', () => {
  it('counts threads, lists decisions, and counts only unwaived findings', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const t1 = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: null, body: 'Which supercell?' } });
    const t2 = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: { finding: s.findingIds[0] }, body: 'Look at this one.' } });
    expect([t1.status, t2.status]).toEqual([201, 201]);
    expect((await call(thread.PATCH, lab.reviewer, { method: 'PATCH', params: { id: t1.body.id }, body: { resolved: true } })).status).toBe(200);

    const screening = await call(screeningRoute, lab.reviewer, { params: { id: s.revisionId } });
    const first = screening.body.findings[0] as { id: string; severity: 'fail' | 'warn' | 'info' };
    const rev = await (await getEm()).findOneOrFail(Revision, { id: s.revisionId });
    const screened = { fail: rev.failCount, warn: rev.warnCount, info: rev.infoCount };
    expect((await call(waiver.POST, lab.admin, { params: { id: first.id }, body: { reason: 'Accepted.' } })).status).toBe(201);
    const unwaived = { ...screened, [first.severity]: screened[first.severity] - 1 };

    const d = await call(decisions.POST, lab.reviewer, { params: { id: s.id }, body: { verdict: 'return', note: 'Tighten the convergence.', revision: s.revisionId } });
    expect(d.status).toBe(201);

    const detail = await call(spectrumRoute, lab.observer, { params: { id: s.id } });
    expect(detail.status).toBe(200);
    expect(detail.body.threads).toEqual({ total: 2, open: 1 });
    expect(detail.body.openThreads).toBe(1);
    expect(detail.body.findings).toEqual(unwaived);
    // The revision keeps its counts as screened.
    expect(detail.body.revisions[0].findings).toEqual(screened);
    expect(detail.body.decisions).toHaveLength(1);
    expect(detail.body.decisions[0]).toMatchObject({ id: d.body.decision.id, verdict: 'return', note: 'Tighten the convergence.', revision: { id: s.revisionId, number: 1 }, reviewer: { id: lab.reviewer.id } });

    const item = (await list(lab.observer)).body.items.find((i: { id: string }) => i.id === s.id);
    expect(item).toMatchObject({ openThreads: 1, findings: unwaived });
  });

  it('shows the assigned reviewers and filters "assigned to me" and "waiting on me"', async () => {
    const assigned = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const other = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    const adminsOwn = await screenedSpectrum(lab.group, lab.admin, model({ defect: 'soft-mode' }));
    const set = await call(reviewers.PUT, lab.admin, { method: 'PUT', params: { id: assigned.id }, body: { reviewers: [lab.reviewer.id] } });
    expect(set.status).toBe(200);

    const all = await list(lab.observer);
    const item = all.body.items.find((i: { id: string }) => i.id === assigned.id);
    expect(item.reviewers).toEqual([expect.objectContaining({ id: lab.reviewer.id, name: lab.reviewer.name })]);

    const mine = await list(lab.reviewer, { assigned: 'me' });
    expect(mine.status).toBe(200);
    expect(idsOf(mine.body)).toContain(assigned.id);
    expect(idsOf(mine.body)).not.toContain(other.id);
    expect(mine.body.total).toBe(mine.body.items.length);
    expect(idsOf((await list(lab.admin, { assigned: 'me' })).body)).not.toContain(assigned.id);

    // Waiting on the reviewer: in review, not approved by them yet. An approval that does not
    // complete the rule (unwaived fail findings) leaves it in review but no longer waiting on them.
    let waiting = idsOf((await list(lab.reviewer, { waiting: 'me' })).body);
    expect(waiting).toEqual(expect.arrayContaining([assigned.id, other.id, adminsOwn.id]));
    const ok = await call(decisions.POST, lab.reviewer, { params: { id: other.id }, body: { verdict: 'approve', note: 'Fine by me.', revision: other.revisionId } });
    expect(ok.status).toBe(201);
    expect(ok.body.state.status).toBe('in-review');
    waiting = idsOf((await list(lab.reviewer, { waiting: 'me' })).body);
    expect(waiting).toContain(assigned.id);
    expect(waiting).not.toContain(other.id);

    // The admin: never their own submission; the reviewer's approval does not count for them.
    const adminWaiting = idsOf((await list(lab.admin, { waiting: 'me' })).body);
    expect(adminWaiting).toEqual(expect.arrayContaining([assigned.id, other.id]));
    expect(adminWaiting).not.toContain(adminsOwn.id);

    // Returned spectra wait on the submitter, not on reviewers; those who cannot decide wait on nothing.
    await call(decisions.POST, lab.admin, { params: { id: assigned.id }, body: { verdict: 'return', note: 'Fix it.', revision: assigned.revisionId } });
    expect(idsOf((await list(lab.reviewer, { waiting: 'me' })).body)).not.toContain(assigned.id);
    for (const who of [lab.submitter, lab.observer]) {
      const r = await list(who, { waiting: 'me' });
      expect(r.status).toBe(200);
      expect(r.body).toEqual({ items: [], total: 0 });
    }
  });

  it('refuses other values of the filters (400)', async () => {
    expect((await list(lab.reviewer, { assigned: 'someone' })).status).toBe(400);
    expect((await list(lab.reviewer, { waiting: 'all' })).status).toBe(400);
  });
});

describe('uploads write revision.created with the revision', () => {
  it('one event per new revision, in the same transaction; a replay or a refusal writes none', async () => {
    const eventsOf = async (spectrumId: string) =>
      (await (await getEm()).find(OutboxMessage, { type: 'revision.created', group: lab.group.id }, { orderBy: { createdAt: 'asc', id: 'asc' } }))
        .map((m) => m.payload as { spectrumId: string; revisionId: string; number: number; actorId: string; groupId: string })
        .filter((p) => p.spectrumId === spectrumId);

    const res = await createRoute(await multipart('/api/v1/spectra', lab.submitter, { group: lab.group.slug, title: 'Events', material: 'Invented cubic solid (test)' }, modelFile()), routeArgs());
    expect(res.status).toBe(201);
    const created = (await res.json()) as { id: string; revision: { id: string } };
    expect(await eventsOf(created.id)).toEqual([
      { type: 'revision.created', groupId: lab.group.id, spectrumId: created.id, actorId: lab.submitter.id, revisionId: created.revision.id, number: 1 },
    ]);
    const audit = await (await getEm()).find(AuditEvent, { action: 'spectrum.created', target: `spectrum:${created.id}` });
    expect(audit).toHaveLength(1);
    await waitForScreening(created.revision.id);

    // An observer's upload is refused before anything is written.
    const refused = await revisionRoute(await multipart(`/api/v1/spectra/${created.id}/revisions`, lab.observer, {}, modelFile('again.txt')), routeArgs({ id: created.id }));
    expect(refused.status).toBe(403);
    expect(await eventsOf(created.id)).toHaveLength(1);

    const second = await revisionRoute(await multipart(`/api/v1/spectra/${created.id}/revisions`, lab.submitter, { note: 'Denser path.' }, modelFile('fix.txt')), routeArgs({ id: created.id }));
    expect(second.status).toBe(201);
    const rev2 = (await second.json()) as { id: string; number: number };
    const events = await eventsOf(created.id);
    expect(events.map((e) => [e.number, e.revisionId])).toEqual([
      [1, created.revision.id],
      [2, rev2.id],
    ]);

    // The same stored file handed over again (a replayed callback) makes no revision and no event.
    const stored = await (await getEm()).findOneOrFail(Revision, { id: rev2.id });
    const replay = await addRevisionWithFile(await getEm(), sessionCaller(lab.submitter), {
      spectrumId: created.id,
      file: { key: stored.fileKey, ufsUrl: stored.ufsUrl, name: stored.originalName, size: Number(stored.size) },
    });
    expect(replay.id).toBe(rev2.id);
    expect(await eventsOf(created.id)).toHaveLength(2);
    await waitForScreening(rev2.id);
  });
});
