import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Revision, Spectrum } from '@/entities';
import { GET as listRoute, POST as createRoute } from '@/app/api/v1/spectra/route';
import { GET as spectrumRoute } from '@/app/api/v1/spectra/[id]/route';
import { POST as revisionRoute } from '@/app/api/v1/spectra/[id]/revisions/route';
import { GET as screeningRoute } from '@/app/api/v1/revisions/[id]/screening/route';
import { GET as dataRoute } from '@/app/api/v1/revisions/[id]/data/route';
import { POST as createToken } from '@/app/api/v1/tokens/route';
import { screenFile } from '@/lib/checks';
import { closeOrm, getEm } from '@/lib/db/orm';
import { breakSumRule, injectSoftMode } from '@/lib/models/defects';
import { decodePlotData, PLOT_CONTENT_TYPE } from '@/lib/plot/wire';
import { parseBandFile } from '@/lib/parsers';
import { MAX_BAND_FILE_BYTES } from '@/lib/storage/limits';
import { makeLab, request, routeArgs, sessionCookie } from './helpers';
import { brokenFile, modelFile, startHarness, waitForScreening, type Harness } from './spectra-support';

// The spectra API as a script on a compute cluster uses it: a personal token, multipart uploads
// through the same storage (UTApi → upload fake) and the same queue as the browser.

let h: Harness;
let lab: Awaited<ReturnType<typeof makeLab>>;
let otherLab: Awaited<ReturnType<typeof makeLab>>;
const tokens = {} as Record<'submitter' | 'observer' | 'other', string>;

async function tokenFor(user: { id: string; email: string; name: string }, group: string): Promise<string> {
  const res = await createToken(request('/api/v1/tokens', { method: 'POST', cookie: await sessionCookie(user), body: { group, name: 'cluster' } }), routeArgs());
  expect(res.status).toBe(201);
  return ((await res.json()) as { token: string }).token;
}

function multipart(path: string, bearer: string, fields: Record<string, string>, file?: File): Request {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  if (file) form.append('file', file);
  return new Request(`${process.env.APP_URL}${path}`, { method: 'POST', headers: { authorization: `Bearer ${bearer}` }, body: form });
}

const createSpectrum = (bearer: string, fields: Record<string, string>, file?: File) =>
  createRoute(multipart('/api/v1/spectra', bearer, fields, file), routeArgs());
const get = (route: typeof spectrumRoute, path: string, bearer: string, params: Record<string, string> = {}) =>
  route(request(path, { bearer }), routeArgs(params));

beforeAll(async () => {
  h = await startHarness();
  lab = await makeLab('api-spectra');
  otherLab = await makeLab('api-other');
  tokens.submitter = await tokenFor(lab.submitter, lab.group.slug);
  tokens.observer = await tokenFor(lab.observer, lab.group.slug);
  tokens.other = await tokenFor(otherLab.admin, otherLab.group.slug);
});
afterAll(async () => {
  await h?.close();
  await closeOrm();
});

describe('spectra API with a token', () => {
  let created: { id: string; status: string; revision: { id: string; number: number } };
  let fileBytes: Uint8Array;

  it('creates a spectrum from a multipart upload: 201 with the revision, then screened in the background', async () => {
    const file = modelFile('soft.txt', (d) => injectSoftMode(d, { index: 20, depthTHz: 1.2 }));
    fileBytes = new Uint8Array(await file.arrayBuffer());
    const res = await createSpectrum(tokens.submitter, { group: lab.group.slug, title: 'Soft pocket', material: 'Invented cubic solid (test)', formula: 'Xy2', qmesh: '', notes: 'from a job' }, file);
    expect(res.status).toBe(201);
    created = await res.json();
    expect(created).toMatchObject({ status: 'screening', revision: { number: 1 } });
    expect((await waitForScreening(created.revision.id)).screeningStatus).toBe('done');

    const screening = await get(screeningRoute, `/api/v1/revisions/${created.revision.id}/screening`, tokens.submitter, { id: created.revision.id });
    const body = await screening.json();
    const expected = screenFile(fileBytes, { filename: 'soft.txt' });
    expect(body.status).toBe('done');
    expect(body.verdict).toBe(expected.verdict);
    expect(body.findings.map(({ id: _id, waived: _w, ...f }: { id: string; waived: unknown }) => f)).toEqual(expected.findings);
    expect(body.verdictWithWaivers).toBe(expected.verdict);
    expect(body.findings.some((f: { check: string; severity: string }) => f.check === 'imaginary-modes' && f.severity === 'fail')).toBe(true);
  });

  it('fetches the spectrum with its revisions and what the caller may do', async () => {
    const res = await get(spectrumRoute, `/api/v1/spectra/${created.id}`, tokens.submitter, { id: created.id });
    expect(res.status).toBe(200);
    const s = await res.json();
    expect(s).toMatchObject({ id: created.id, status: 'in-review', verdict: 'fail', title: 'Soft pocket', formula: 'Xy2', qmesh: null, role: 'submitter' });
    expect(s.revisions).toHaveLength(1);
    expect(s.revisions[0]).toMatchObject({ number: 1, screeningStatus: 'done', originalName: 'soft.txt' });
    expect(s.can.revise).toBe(true);
    expect(s.group.slug).toBe(lab.group.slug);
  });

  it('serves the stored dispersion as binary plot data equal to the parsed file', async () => {
    const res = await get(dataRoute, `/api/v1/revisions/${created.revision.id}/data`, tokens.observer, { id: created.revision.id });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe(PLOT_CONTENT_TYPE);
    const plot = decodePlotData(new Uint8Array(await res.arrayBuffer()));
    const d = parseBandFile(fileBytes, { filename: 'soft.txt' });
    expect([plot.nq, plot.nb]).toEqual([d.nq, d.nb]);
    // Branch-major Float32 on the wire vs point-major Float64 parsed: equal to Float32 precision.
    for (const [iq, k] of [[0, 0], [20, 0], [d.nq - 1, d.nb - 1]]) {
      expect(plot.frequencies[k * d.nq + iq]).toBeCloseTo(d.frequencies[iq * d.nb + k], 5);
    }
    expect(plot.labels.length).toBe(d.labels.size);
  });

  it('lists the group\'s spectra with filter, search, sort and pagination in the database', async () => {
    const clean = await createSpectrum(tokens.submitter, { group: lab.group.slug, title: 'Clean alpha', material: 'Invented metal A (test)' }, modelFile('a.txt'));
    const sumRule = await createSpectrum(tokens.submitter, { group: lab.group.slug, title: 'Sum rule beta', material: 'Invented metal B (test)' }, modelFile('b.txt', (d) => breakSumRule(d, { offsetTHz: 0.4 })));
    for (const r of [clean, sumRule]) await waitForScreening(((await r.json()) as typeof created).revision.id);

    const list = async (qs: string, bearer = tokens.submitter) => {
      const res = await get(listRoute, `/api/v1/spectra?${qs}`, bearer);
      return { status: res.status, body: await res.json() };
    };
    const all = await list(`group=${lab.group.slug}&sort=title`);
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(3);
    expect(all.body.items.map((i: { title: string }) => i.title)).toEqual(['Clean alpha', 'Soft pocket', 'Sum rule beta']);
    // A token may leave out its group.
    expect((await list('sort=-title')).body.items[0].title).toBe('Sum rule beta');
    const fails = await list(`verdict=fail&sort=title`);
    expect(fails.body.items.map((i: { title: string }) => i.title)).toEqual(['Soft pocket', 'Sum rule beta']);
    expect(fails.body.items[0].findings.fail).toBeGreaterThan(0);
    const search = await list(`q=metal%20b`);
    expect(search.body.items.map((i: { title: string }) => i.title)).toEqual(['Sum rule beta']);
    const page2 = await list(`sort=title&page=2&pageSize=2`);
    expect(page2.body).toMatchObject({ total: 3, items: [{ title: 'Sum rule beta' }] });
    expect((await list('status=in-review,returned')).body.total).toBe(3);
    expect((await list('status=approved')).body.total).toBe(0);
    const bad = await list('sort=colour');
    expect(bad.status).toBe(400);
  });

  it('hides a group\'s spectra from another group\'s token (404) and lets no observer upload (403)', async () => {
    const s = await get(spectrumRoute, `/api/v1/spectra/${created.id}`, tokens.other, { id: created.id });
    expect(s.status).toBe(404);
    const sc = await get(screeningRoute, `/api/v1/revisions/${created.revision.id}/screening`, tokens.other, { id: created.revision.id });
    expect(sc.status).toBe(404);
    const data = await get(dataRoute, `/api/v1/revisions/${created.revision.id}/data`, tokens.other, { id: created.revision.id });
    expect(data.status).toBe(404);
    const list = await get(listRoute, `/api/v1/spectra?group=${lab.group.slug}`, tokens.other);
    expect(list.status).toBe(404);
    const into = await createSpectrum(tokens.other, { group: lab.group.slug, title: 'Intruder', material: 'x' }, modelFile());
    expect(into.status).toBe(404);

    const before = (await h.fake.store.list()).length;
    const obs = await createSpectrum(tokens.observer, { group: lab.group.slug, title: 'Observer try', material: 'x' }, modelFile());
    expect(obs.status).toBe(403);
    expect((await obs.json()).error.code).toBe('forbidden');
    expect((await h.fake.store.list()).length).toBe(before);
    const rev = await revisionRoute(multipart(`/api/v1/spectra/${created.id}/revisions`, tokens.observer, {}, modelFile()), routeArgs({ id: created.id }));
    expect(rev.status).toBe(403);
  });

  it('refuses an oversize file (413), a wrong type (400) and a missing file (400), storing nothing', async () => {
    const em = await getEm();
    const count = () => em.fork().count(Spectrum, { group: lab.group.id });
    const n = await count();
    const big = new File([new Uint8Array(MAX_BAND_FILE_BYTES + 1).fill(0x31)], 'big.txt');
    const tooBig = await createSpectrum(tokens.submitter, { group: lab.group.slug, title: 'Too big', material: 'x' }, big);
    expect(tooBig.status).toBe(413);
    expect((await tooBig.json()).error.code).toBe('too_large');
    const pdf = await createSpectrum(tokens.submitter, { group: lab.group.slug, title: 'PDF', material: 'x' }, new File(['%PDF'], 'bands.pdf'));
    expect(pdf.status).toBe(400);
    const none = await createSpectrum(tokens.submitter, { group: lab.group.slug, title: 'None', material: 'x' });
    expect(none.status).toBe(400);
    const noTitle = await createSpectrum(tokens.submitter, { group: lab.group.slug, material: 'x' }, modelFile());
    expect(noTitle.status).toBe(400);
    expect((await noTitle.json()).error.details.fieldErrors.title).toBeTruthy();
    expect(await count()).toBe(n);
  });

  it('accepts an unparsable file (201); its screening shows line, column and expectation', async () => {
    const res = await createSpectrum(tokens.submitter, { group: lab.group.slug, title: 'Garbled', material: 'x' }, brokenFile('garbled.dat'));
    expect(res.status).toBe(201);
    const { id, revision } = await res.json();
    await waitForScreening(revision.id);
    const body = await (await get(screeningRoute, `/api/v1/revisions/${revision.id}/screening`, tokens.submitter, { id: revision.id })).json();
    expect(body).toMatchObject({ status: 'error', error: { line: expect.any(Number), column: expect.any(Number), expected: expect.stringMatching(/number/i) } });
    const data = await get(dataRoute, `/api/v1/revisions/${revision.id}/data`, tokens.submitter, { id: revision.id });
    expect(data.status).toBe(409);

    // The spectrum stays `screening` (nothing else is written); the queue row carries the current
    // revision's screening status so pages can say the file was not read, and can filter by it.
    const list = async (query: string) =>
      (await (await get(listRoute, `/api/v1/spectra?group=${lab.group.slug}&pageSize=100${query}`, tokens.submitter)).json()) as {
        items: { id: string; status: string; currentRevision: { id: string; number: number; screeningStatus: string } | null }[];
      };
    const row = (await list('')).items.find((i) => i.id === id)!;
    expect(row).toMatchObject({ status: 'screening', currentRevision: { id: revision.id, number: 1, screeningStatus: 'error' } });
    const notRead = await list('&screening=error');
    expect(notRead.items.map((i) => i.id)).toContain(id);
    expect(notRead.items.every((i) => i.currentRevision?.screeningStatus === 'error')).toBe(true);
    const read = await list('&screening=done,pending');
    expect(read.items.map((i) => i.id)).not.toContain(id);
    expect(read.items.length).toBeGreaterThan(0);
    const bad = await get(listRoute, `/api/v1/spectra?group=${lab.group.slug}&screening=broken`, tokens.submitter);
    expect(bad.status).toBe(400);
  });

  it('adds revisions with sequential numbers, also when they arrive at once', async () => {
    const results = await Promise.all(
      [0, 1, 2].map((i) =>
        revisionRoute(multipart(`/api/v1/spectra/${created.id}/revisions`, tokens.submitter, { note: `try ${i}` }, modelFile(`r${i}.txt`)), routeArgs({ id: created.id })),
      ),
    );
    expect(results.map((r) => r.status)).toEqual([201, 201, 201]);
    const bodies = await Promise.all(results.map((r) => r.json()));
    expect(bodies.map((b) => b.number).sort()).toEqual([2, 3, 4]);
    for (const b of bodies) await waitForScreening(b.id);
    const em = await getEm();
    const spectrum = await em.findOneOrFail(Spectrum, { id: created.id });
    const latest = bodies.find((b) => b.number === 4);
    expect(spectrum.currentRevisionId).toBe(latest.id);
    expect(spectrum.status).toBe('in-review');
    expect(spectrum.verdict).not.toBe('fail');
    expect(await em.count(Revision, { spectrum: created.id })).toBe(4);
  });

  it('looks up the group while the file arrives, yet answers a malformed form 400 first and checks a group sent after the file', async () => {
    const before = (await h.fake.store.list()).length;
    // Not allowed (observer) or not a member (other group), and no title: the form's 400 comes first.
    for (const bearer of [tokens.observer, tokens.other]) {
      const res = await createSpectrum(bearer, { group: lab.group.slug, material: 'x' }, modelFile());
      expect(res.status).toBe(400);
      expect((await res.json()).error.details.fieldErrors.title).toBeTruthy();
    }
    const rev = await revisionRoute(multipart(`/api/v1/spectra/${created.id}/revisions`, tokens.observer, { note: 'no file' }), routeArgs({ id: created.id }));
    expect(rev.status).toBe(400);

    const post = (bearer: string, form: FormData) =>
      createRoute(new Request(`${process.env.APP_URL}/api/v1/spectra`, { method: 'POST', headers: { authorization: `Bearer ${bearer}` }, body: form }), routeArgs());
    // The group after the file: still refused for an observer.
    const late = new FormData();
    late.append('file', modelFile());
    late.append('title', 'Late group');
    late.append('material', 'x');
    late.append('group', lab.group.slug);
    expect((await post(tokens.observer, late)).status).toBe(403);
    expect((await h.fake.store.list()).length).toBe(before);

    // A group given twice: the form's value (the last) decides, not the first one looked up early.
    const twice = new FormData();
    twice.append('group', otherLab.group.slug);
    twice.append('group', lab.group.slug);
    twice.append('title', 'Group twice');
    twice.append('material', 'x');
    twice.append('file', modelFile('twice.txt'));
    const res = await post(tokens.submitter, twice);
    expect(res.status).toBe(201);
    const { id, revision } = (await res.json()) as typeof created;
    const em = await getEm();
    expect((await em.fork().findOneOrFail(Spectrum, { id })).group.id).toBe(lab.group.id);
    await waitForScreening(revision.id);
  });
});
