/**
 * Export of an approved spectrum through the route: YAML that reads back to the same numbers,
 * CSV columns, the SVG plot, and the review record with findings, waivers, threads, decisions,
 * audit entries and the screening caution; refusals for unapproved spectra and outsiders.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as exportRoute from '@/app/api/v1/spectra/[id]/export/route';
import { StoredDispersion } from '@/entities';
import { closeOrm, getEm } from '@/lib/db/orm';
import type { Dispersion } from '@/lib/dispersion/types';
import { dispersionCsv, dispersionYaml, SCREENING_CAUTION } from '@/lib/export';
import { parseBandFile } from '@/lib/parsers';
import { decide } from '@/lib/services/decisions';
import { fromStoredColumns } from '@/lib/services/dispersion-store';
import { openThread, replyToThread } from '@/lib/services/threads';
import { waiveFinding } from '@/lib/services/waivers';
import { addMember, makeLab, makeUser, request, routeArgs, sessionCaller, sessionCookie, type TestUser } from './helpers';
import { model, screenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
let outsiders: Awaited<ReturnType<typeof makeLab>>;
let d: Dispersion;
let approved: Awaited<ReturnType<typeof screenedSpectrum>>;
let pending: Awaited<ReturnType<typeof screenedSpectrum>>;

async function get(who: TestUser | null, id: string, query: Record<string, string>) {
  const req = request(`/api/v1/spectra/${id}/export?${new URLSearchParams(query)}`, { cookie: who ? await sessionCookie(who) : undefined });
  const res = await exportRoute.GET(req, routeArgs({ id }));
  return { status: res.status, headers: res.headers, text: await res.text() };
}

beforeAll(async () => {
  lab = await makeLab('export');
  outsiders = await makeLab('elsewhere');
  d = model({ defect: 'soft-mode' });
  approved = await screenedSpectrum(lab.group, lab.submitter, d);
  expect(approved.findingIds.length).toBeGreaterThan(0);
  for (const id of approved.findingIds) {
    await waiveFinding(await getEm(), sessionCaller(lab.reviewer), id, { reason: 'The soft mode is real in this invented <phase>; kept.' });
  }
  const t = await openThread(await getEm(), sessionCaller(lab.reviewer), approved.id, { anchor: null, body: 'Is the dip near Γ a real instability?' });
  await replyToThread(await getEm(), sessionCaller(lab.submitter), t.id, { body: 'Yes: the invented structure is unstable there & we keep it.' });
  await openThread(await getEm(), sessionCaller(lab.reviewer), approved.id, { anchor: { revision: approved.revisionId, index: 5, branch: 1 }, body: 'This point of the middle branch.' });
  const r = await decide(await getEm(), sessionCaller(lab.reviewer), approved.id, { verdict: 'approve', note: 'Approved with the soft mode kept.', revision: approved.revisionId });
  expect(r.state.status).toBe('approved');
  pending = await screenedSpectrum(lab.group, lab.submitter);
});
afterAll(closeOrm);

describe('export of an approved spectrum', () => {
  it('YAML reads back through parseBandFile to the same frequencies', async () => {
    const res = await get(lab.admin, approved.id, { format: 'yaml' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^application\/yaml/);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="Invented-crystal-[\w-]+-r1\.yaml"/);
    const back = parseBandFile(res.text, { filename: 'export.yaml' });
    expect(back.nq).toBe(d.nq);
    expect(back.nb).toBe(d.nb);
    expect(Array.from(back.frequencies)).toEqual(Array.from(d.frequencies));
    expect(back.metadata.review).toMatchObject({ spectrum: approved.id, revision: 1, status: 'approved' });
  });

  it('CSV has a header with units and labels and a column per branch', async () => {
    const res = await get(lab.observer, approved.id, { format: 'csv', units: 'meV' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toMatch(/-r1-meV\.csv"/);
    const rows = res.text.trimEnd().split('\r\n');
    const header = rows[0]!.split(',');
    expect(header.slice(0, 3)).toEqual(['index', 'segment', 'label']);
    expect(header.filter((h) => /^branch \d+ \(meV\)$/.test(h))).toHaveLength(d.nb);
    expect(rows).toHaveLength(d.nq + 1);
    expect(rows[1]!.split(',')[2]).toBe(d.labels.get(0));
  });

  it('YAML and CSV are byte for byte what the writers make of the dispersion as the ORM reads it', async () => {
    // The reference is the stored row read through the ORM (metadata keys come back in jsonb's
    // order, so the uploaded object is not the reference for YAML).
    const row = await (await getEm()).findOneOrFail(StoredDispersion, { revision: approved.revisionId }, { populate: ['frequencies', 'q', 'distances', 'weights'] });
    const stored = fromStoredColumns(row);
    const csv = await get(lab.admin, approved.id, { format: 'csv', units: 'cm-1' });
    expect(csv.text === dispersionCsv(stored, { units: 'cm-1' })).toBe(true);
    expect(csv.text === dispersionCsv(d, { units: 'cm-1' })).toBe(true);
    const yaml = await get(lab.admin, approved.id, { format: 'yaml' });
    const review = parseBandFile(yaml.text, { filename: 'export.yaml' }).metadata.review as Record<string, string & number>;
    const provenance = { spectrumId: review.spectrum, title: review.title, group: review.group, revision: review.revision, status: review.status, exportedAt: new Date(review.exported), link: review.link };
    expect(yaml.text === dispersionYaml(stored, provenance)).toBe(true);
  });

  it('SVG is drawn on the server', async () => {
    const res = await get(lab.reviewer, approved.id, { format: 'svg', width: '640', height: '400' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^image\/svg\+xml/);
    expect(res.text.startsWith('<svg')).toBe(true);
    expect(res.text).toContain('width="640"');
  });

  it('the review record holds findings, waivers with reasons, threads, decisions, audit entries and the caution', async () => {
    const res = await get(lab.admin, approved.id, { format: 'record' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/html/);
    expect(res.headers.get('content-disposition')).toMatch(/^inline; filename=".+-r1-review-record\.html"/);
    expect(res.headers.get('content-security-policy')).toContain("default-src 'none'");
    const html = res.text;
    expect(html).toContain(SCREENING_CAUTION.replace(/'/g, '&#39;'));
    expect(html).toContain('imaginary-modes');
    expect(html).toContain('The soft mode is real in this invented &lt;phase&gt;; kept.');
    expect(html).not.toContain('<phase>');
    expect(html).toContain('Is the dip near Γ a real instability?');
    expect(html).toContain('Yes: the invented structure is unstable there &amp; we keep it.');
    expect(html).toContain('Approved with the soft mode kept.');
    // A point thread is named as the workspace names it (0-based q-point and branch).
    expect(html).toMatch(/q-point 5, branch 1 \([\d.]+ THz\)/);
    expect(html).toContain('Revision history');
    // Audit actions, checked as booleans so that a failure does not print the whole page.
    for (const action of ['finding.waived', 'thread.opened', 'thread.replied', 'decision.approve', 'spectrum.approved']) {
      expect(html.includes(`<td>${action}</td>`), action).toBe(true);
    }
    expect(html).toContain('data:image/svg+xml;base64,');
  });

  it('the record leaves the audit trail out for roles that may not read it', async () => {
    const res = await get(lab.reviewer, approved.id, { format: 'record' });
    expect(res.status).toBe(200);
    expect(res.text).toContain('included when an admin of the group exports');
    expect(res.text.includes('<td>decision.approve</td>')).toBe(false);
  });

  it('409 for a spectrum that is not approved; 404 for another group; 401 signed out; 400 for an unknown format', async () => {
    const refused = await get(lab.admin, pending.id, { format: 'yaml' });
    expect(refused.status).toBe(409);
    expect(JSON.parse(refused.text).error.message).toContain('in-review');
    expect((await get(outsiders.admin, approved.id, { format: 'csv' })).status).toBe(404);
    expect((await get(null, approved.id, { format: 'csv' })).status).toBe(401);
    expect((await get(lab.admin, approved.id, { format: 'png' })).status).toBe(400);
    expect((await get(lab.admin, 'not-a-uuid', { format: 'csv' })).status).toBe(404);
  });

  it('every role of the group may export (spectrum.export); outsiders get 404', async () => {
    const em = await getEm();
    const otherSubmitter = await makeUser(em, 'submitter');
    await addMember(em, otherSubmitter, lab.group, 'submitter');
    const cases: [string, TestUser | null, number][] = [
      ['anonymous', null, 401],
      ['observer', lab.observer, 200],
      ['submitter (own)', lab.submitter, 200],
      ['submitter (another\'s)', otherSubmitter, 200],
      ['reviewer', lab.reviewer, 200],
      ['admin', lab.admin, 200],
      ['member of another group', outsiders.reviewer, 404],
    ];
    for (const [who, user, status] of cases) {
      expect((await get(user, approved.id, { format: 'csv' })).status, who).toBe(status);
    }
  });
});
