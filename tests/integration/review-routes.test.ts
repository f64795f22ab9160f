/**
 * Every review route × every role: signed out (401), observer, the spectrum's submitter, another
 * submitter of the group, reviewer, admin, and an admin of another group (404, no leaks).
 * Each cell gets a fresh spectrum so that cells do not depend on each other.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as threads from '@/app/api/v1/spectra/[id]/threads/route';
import * as thread from '@/app/api/v1/threads/[id]/route';
import * as replies from '@/app/api/v1/threads/[id]/replies/route';
import * as waiver from '@/app/api/v1/findings/[id]/waiver/route';
import * as waivers from '@/app/api/v1/revisions/[id]/waivers/route';
import * as decisions from '@/app/api/v1/spectra/[id]/decisions/route';
import * as withdraw from '@/app/api/v1/spectra/[id]/withdraw/route';
import * as reopen from '@/app/api/v1/spectra/[id]/reopen/route';
import * as reviewers from '@/app/api/v1/spectra/[id]/reviewers/route';
import * as compare from '@/app/api/v1/spectra/[id]/compare/route';
import * as spectrumAudit from '@/app/api/v1/spectra/[id]/audit/route';
import * as groupAudit from '@/app/api/v1/groups/[slug]/audit/route';
import * as policy from '@/app/api/v1/groups/[slug]/policy/route';
import * as members from '@/app/api/v1/groups/[slug]/members/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { createApiToken } from '@/lib/services/api-tokens';
import { decide } from '@/lib/services/decisions';
import { openThread } from '@/lib/services/threads';
import { waiveFinding } from '@/lib/services/waivers';
import { addMember, makeGroup, makeLab, makeUser, request, routeArgs, sessionCaller, type TestUser } from './helpers';
import { call, model, screenedSpectrum } from './review-fixtures';

const who = ['anonymous', 'observer', 'submitter-own', 'submitter-other', 'reviewer', 'admin', 'outsider'] as const;
type Who = (typeof who)[number];

let lab: Awaited<ReturnType<typeof makeLab>>;
let otherSubmitter: TestUser;
let outsider: TestUser;

beforeAll(async () => {
  lab = await makeLab('routes');
  const em = await getEm();
  otherSubmitter = await makeUser(em, 'submitter');
  await addMember(em, otherSubmitter, lab.group, 'submitter');
  outsider = await makeUser(em, 'outsider');
  const elsewhere = await makeGroup(em, 'elsewhere');
  await addMember(em, outsider, elsewhere, 'admin');
});
afterAll(closeOrm);

function person(w: Who): TestUser | null {
  switch (w) {
    case 'anonymous':
      return null;
    case 'submitter-own':
      return lab.submitter;
    case 'submitter-other':
      return otherSubmitter;
    case 'outsider':
      return outsider;
    default:
      return lab[w];
  }
}

type Spectrum = Awaited<ReturnType<typeof screenedSpectrum>>;
interface Case {
  name: string;
  /** Expected status per caller. */
  expect: Record<Who, number>;
  run: (s: Spectrum, as: TestUser | null) => Promise<{ status: number; body: any }>;
  /** Extra set-up on the fresh spectrum; returns what `run` needs. */
  prepare?: (s: Spectrum) => Promise<Record<string, string>>;
}

const readable = (ok = 200) => ({ anonymous: 401, observer: ok, 'submitter-own': ok, 'submitter-other': ok, reviewer: ok, admin: ok, outsider: 404 });
const reviewersOnly = (ok: number) => ({ anonymous: 401, observer: 403, 'submitter-own': 403, 'submitter-other': 403, reviewer: ok, admin: ok, outsider: 404 });
const adminsOnly = (ok: number) => ({ anonymous: 401, observer: 403, 'submitter-own': 403, 'submitter-other': 403, reviewer: 403, admin: ok, outsider: 404 });

let extra: Record<string, string> = {};
const openOne = async (s: Spectrum) => ({
  thread: (await openThread(await getEm(), sessionCaller(lab.reviewer), s.id, { anchor: null, body: 'Which supercell?' })).id,
});

const cases: Case[] = [
  { name: 'GET /spectra/{id}/threads', expect: readable(), run: (s, as) => call(threads.GET, as, { params: { id: s.id } }) },
  {
    name: 'POST /spectra/{id}/threads',
    expect: reviewersOnly(201),
    run: (s, as) => call(threads.POST, as, { params: { id: s.id }, body: { anchor: { revision: s.revisionId, index: 3, branch: 1 }, body: 'Look here.' } }),
  },
  {
    name: 'PATCH /threads/{id}',
    expect: reviewersOnly(200),
    prepare: openOne,
    run: (_s, as) => call(thread.PATCH, as, { method: 'PATCH', params: { id: extra.thread! }, body: { resolved: true } }),
  },
  {
    name: 'POST /threads/{id}/replies',
    expect: { ...reviewersOnly(201), 'submitter-own': 201 },
    prepare: openOne,
    run: (_s, as) => call(replies.POST, as, { params: { id: extra.thread! }, body: { body: 'A reply.' } }),
  },
  {
    name: 'GET /findings/{id}/waiver',
    expect: readable(),
    prepare: async (s) => {
      await waiveFinding(await getEm(), sessionCaller(lab.reviewer), s.findingIds[0]!, { reason: 'Real soft mode.' });
      return {};
    },
    run: (s, as) => call(waiver.GET, as, { params: { id: s.findingIds[0]! } }),
  },
  {
    name: 'POST /findings/{id}/waiver',
    expect: reviewersOnly(201),
    run: (s, as) => call(waiver.POST, as, { params: { id: s.findingIds[0]! }, body: { reason: 'Real soft mode.' } }),
  },
  {
    name: 'POST /revisions/{id}/waivers',
    expect: reviewersOnly(201),
    run: (s, as) => call(waivers.POST, as, { params: { id: s.revisionId }, body: { findingIds: s.findingIds, reason: 'Real soft mode.' } }),
  },
  { name: 'GET /spectra/{id}/decisions', expect: readable(), run: (s, as) => call(decisions.GET, as, { params: { id: s.id } }) },
  {
    name: 'POST /spectra/{id}/decisions',
    expect: reviewersOnly(201),
    run: (s, as) => call(decisions.POST, as, { params: { id: s.id }, body: { verdict: 'return', note: 'Fix the soft mode.', revision: s.revisionId } }),
  },
  {
    name: 'POST /spectra/{id}/withdraw',
    expect: { anonymous: 401, observer: 403, 'submitter-own': 200, 'submitter-other': 403, reviewer: 403, admin: 403, outsider: 404 },
    run: (s, as) => call(withdraw.POST, as, { params: { id: s.id }, body: {} }),
  },
  {
    name: 'POST /spectra/{id}/reopen',
    expect: adminsOnly(200),
    prepare: async (s) => {
      await decide(await getEm(), sessionCaller(lab.reviewer), s.id, { verdict: 'reject', note: 'Wrong cell.', revision: s.revisionId });
      return {};
    },
    run: (s, as) => call(reopen.POST, as, { params: { id: s.id }, body: {} }),
  },
  { name: 'GET /spectra/{id}/reviewers', expect: readable(), run: (s, as) => call(reviewers.GET, as, { params: { id: s.id } }) },
  {
    name: 'PUT /spectra/{id}/reviewers',
    expect: adminsOnly(200),
    run: (s, as) => call(reviewers.PUT, as, { method: 'PUT', params: { id: s.id }, body: { reviewers: [lab.reviewer.id] } }),
  },
  {
    name: 'GET /spectra/{id}/compare',
    expect: readable(),
    run: (s, as) => call(compare.GET, as, { params: { id: s.id }, query: { a: s.revisionId, b: s.revisionId } }),
  },
  { name: 'GET /spectra/{id}/audit', expect: adminsOnly(200), run: (s, as) => call(spectrumAudit.GET, as, { params: { id: s.id } }) },
  { name: 'GET /groups/{slug}/audit', expect: adminsOnly(200), run: (_s, as) => call(groupAudit.GET, as, { params: { slug: lab.group.slug } }) },
  { name: 'GET /groups/{slug}/members', expect: readable(), run: (_s, as) => call(members.GET, as, { params: { slug: lab.group.slug } }) },
  { name: 'GET /groups/{slug}/policy', expect: readable(), run: (_s, as) => call(policy.GET, as, { params: { slug: lab.group.slug } }) },
  {
    name: 'PUT /groups/{slug}/policy',
    expect: adminsOnly(200),
    run: (_s, as) => call(policy.PUT, as, { method: 'PUT', params: { slug: lab.group.slug }, body: { requiredApprovals: 1 } }),
  },
];

describe.each(cases)('$name', (c) => {
  it.each(who)('as %s', async (w) => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    extra = c.prepare ? await c.prepare(s) : {};
    const res = await c.run(s, person(w));
    expect(res.status, JSON.stringify(res.body)).toBe(c.expect[w]);
    if (res.status >= 400) expect(res.body.error.code).toEqual(expect.any(String));
    if (w === 'outsider') expect(JSON.stringify(res.body)).not.toContain(s.id);
  });
});

describe('answers', () => {
  it('an unknown or malformed id is a 404 like another group\'s', async () => {
    for (const id of ['not-a-uuid', '00000000-0000-4000-8000-000000000000']) {
      expect((await call(threads.GET, lab.admin, { params: { id } })).status).toBe(404);
      expect((await call(thread.PATCH, lab.admin, { method: 'PATCH', params: { id }, body: { resolved: true } })).status).toBe(404);
      expect((await call(waiver.GET, lab.admin, { params: { id } })).status).toBe(404);
      expect((await call(waivers.POST, lab.admin, { params: { id }, body: { findingIds: [id], reason: 'x' } })).status).toBe(404);
    }
  });

  it('bad bodies are 400 with the field named', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const r = await call(decisions.POST, lab.reviewer, { params: { id: s.id }, body: { verdict: 'maybe', note: '', revision: s.revisionId } });
    expect(r.status).toBe(400);
    expect(Object.keys(r.body.error.details.fieldErrors).sort()).toEqual(['note', 'verdict']);
    const p = await call(policy.PUT, lab.admin, { method: 'PUT', params: { slug: lab.group.slug }, body: { checks: { acousticGamma: { warn: 1, fail: 0.5 } } } });
    expect(p.status).toBe(400);
    expect(p.body.error.details.fieldErrors).toHaveProperty(['acousticGamma.warn']);
    const t = await call(thread.PATCH, lab.admin, { method: 'PATCH', params: { id: s.id }, body: {} });
    expect(t.status).toBe(400);
  });

  it('policy: defaults beside the values; a change is audited', async () => {
    const put = await call(policy.PUT, lab.admin, { method: 'PUT', params: { slug: lab.group.slug }, body: { checks: { imaginaryModes: { threshold: 0.08 } } } });
    expect(put.body.checks.imaginaryModes.threshold).toBe(0.08);
    expect(put.body.defaults.checks.imaginaryModes.threshold).toBe(0.05);
    expect(put.body.updatedBy).toMatchObject({ id: lab.admin.id });
    const log = await call(groupAudit.GET, lab.admin, { params: { slug: lab.group.slug }, query: { action: 'policy.updated', actor: lab.admin.id } });
    expect(log.body.total).toBeGreaterThan(0);
    expect(log.body.items[0]).toMatchObject({ action: 'policy.updated', actor: { id: lab.admin.id }, data: { change: { checks: { imaginaryModes: { threshold: 0.08 } } } } });
    await call(policy.PUT, lab.admin, { method: 'PUT', params: { slug: lab.group.slug }, body: { checks: { imaginaryModes: { threshold: 0.05 } } } });
  });

  it('group audit filters by action prefix and paginates; a spectrum\'s audit holds its threads and findings', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
    await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { body: 'Why?' } });
    await call(waiver.POST, lab.reviewer, { params: { id: s.findingIds[0]! }, body: { reason: 'Real.' } });
    await call(decisions.POST, lab.admin, { params: { id: s.id }, body: { verdict: 'approve', note: 'Fine.', revision: s.revisionId } });
    const trail = await call(spectrumAudit.GET, lab.admin, { params: { id: s.id } });
    expect(trail.body.items.map((e: { action: string }) => e.action)).toEqual(['thread.opened', 'finding.waived', 'decision.approve', 'spectrum.approved']);
    const page = await call(groupAudit.GET, lab.admin, { params: { slug: lab.group.slug }, query: { action: 'decision.', pageSize: '1', page: '1' } });
    expect(page.body.items).toHaveLength(1);
    expect(page.body.items[0].action).toMatch(/^decision\./);
    expect(page.body.total).toBeGreaterThanOrEqual(1);
    // Each event names its spectrum by title: as target, or through the thread it is on.
    expect(page.body.items[0].spectrum).toEqual({ id: s.id, title: expect.stringMatching(/^Invented crystal /) });
    const opened = await call(groupAudit.GET, lab.admin, { params: { slug: lab.group.slug }, query: { action: 'thread.opened', pageSize: '1', page: '1' } });
    expect(opened.body.items[0].target).toMatch(/^thread:/);
    expect(opened.body.items[0].spectrum).toEqual(page.body.items[0].spectrum);
  });

  it('members: every member with name, e-mail and role, by name; nothing secret; unknown group 404', async () => {
    const r = await call(members.GET, lab.submitter, { params: { slug: lab.group.slug } });
    expect(r.status).toBe(200);
    const mine = [lab.admin, lab.reviewer, lab.submitter, lab.observer, otherSubmitter];
    expect(r.body.items.map((m: { userId: string }) => m.userId).sort()).toEqual(mine.map((p) => p.id).sort());
    expect(r.body.items.find((m: { userId: string }) => m.userId === lab.reviewer.id)).toMatchObject({ name: lab.reviewer.name, email: lab.reviewer.email, role: 'reviewer' });
    const names = r.body.items.map((m: { name: string }) => m.name);
    expect(names).toEqual([...names].sort((a: string, b: string) => a.localeCompare(b)));
    expect(Object.keys(r.body.items[0]).sort()).toEqual(['email', 'joinedAt', 'name', 'role', 'userId']);
    expect((await call(members.GET, lab.admin, { params: { slug: 'no-such-group' } })).status).toBe(404);
  });

  it('members: a token reads its own group only; another group is a 404', async () => {
    const { token } = await createApiToken(await getEm(), sessionCaller(lab.observer), { group: lab.group.slug, name: 'members probe' });
    const own = await members.GET(request(`/api/v1/groups/${lab.group.slug}/members`, { bearer: token }), routeArgs({ slug: lab.group.slug }));
    expect(own.status).toBe(200);
    const em = await getEm();
    const other = await makeGroup(em, 'other');
    await addMember(em, lab.observer, other, 'admin');
    const cross = await members.GET(request(`/api/v1/groups/${other.slug}/members`, { bearer: token }), routeArgs({ slug: other.slug }));
    expect(cross.status).toBe(404);
  });

  it('reviewers: only reviewers and admins of the group, never the submitter', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const bad = await call(reviewers.PUT, lab.admin, { method: 'PUT', params: { id: s.id }, body: { reviewers: [lab.observer.id] } });
    expect(bad.status).toBe(400);
    const ok = await call(reviewers.PUT, lab.admin, { method: 'PUT', params: { id: s.id }, body: { reviewers: [lab.reviewer.id, lab.admin.id] } });
    expect(ok.body.reviewers.map((p: { id: string }) => p.id).sort()).toEqual([lab.reviewer.id, lab.admin.id].sort());
    expect(ok.body.candidates.map((p: { id: string }) => p.id)).not.toContain(lab.submitter.id);
    expect((await call(reviewers.GET, lab.observer, { params: { id: s.id } })).body.candidates).toBeNull();
  });
});
