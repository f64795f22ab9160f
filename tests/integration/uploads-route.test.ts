import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Revision, Spectrum } from '@/entities';
import { GET as getScreeningRoute } from '@/app/api/v1/revisions/[id]/screening/route';
import type { BandFileServerData } from '@/app/api/uploadthing/core';
import { screenFile } from '@/lib/checks';
import { closeOrm, getEm } from '@/lib/db/orm';
import { MAX_BAND_FILE_BYTES } from '@/lib/storage/limits';
import { makeLab, request, routeArgs, sessionCookie } from './helpers';
import { brokenFile, modelFile, startHarness, waitForScreening, type Harness } from './spectra-support';

// Uploads through the real uploadthing client and server SDKs and the local upload fake:
// presign (middleware: session, role, type, size), PUT, signed callback, onUploadComplete.

let h: Harness;
let lab: Awaited<ReturnType<typeof makeLab>>;
let cookies: Record<'submitter' | 'observer' | 'reviewer', string>;

beforeAll(async () => {
  h = await startHarness();
  lab = await makeLab('uploads');
  cookies = {
    submitter: await sessionCookie(lab.submitter),
    observer: await sessionCookie(lab.observer),
    reviewer: await sessionCookie(lab.reviewer),
  };
});
afterAll(async () => {
  await h?.close();
  await closeOrm();
});

const meta = (title: string) => ({ group: lab.group.slug, title, material: 'Invented fcc solid (test)', formula: 'Xx', code: 'model 1.0' });

async function upload(file: File, input: Record<string, unknown>, cookie: string) {
  const [result] = await h.uploader.uploadFiles('bandFile', { files: [file], input: input as never, headers: { cookie } });
  return result;
}

async function presignStatus(input: unknown, files: { name: string; size: number; type: string }[], cookie?: string) {
  const res = await fetch(`${h.appUrl}/api/uploadthing?actionType=upload&slug=bandFile`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) },
    body: JSON.stringify({ files: files.map((f) => ({ ...f, lastModified: Date.now() })), input }),
  });
  return { status: res.status, body: (await res.json()) as { message?: string } };
}

async function screeningJson(revisionId: string, cookie: string) {
  const res = await getScreeningRoute(request(`/api/v1/revisions/${revisionId}/screening`, { cookie }), routeArgs({ id: revisionId }));
  return { status: res.status, body: await res.json() };
}

describe('band-file upload route', () => {
  it('creates the spectrum and revision 1, screens it, and stores findings equal to the command line JSON', async () => {
    const file = modelFile('clean-fcc.txt');
    const result = await upload(file, meta('Clean fcc'), cookies.submitter);
    const data = result.serverData as BandFileServerData;
    expect('error' in data).toBe(false);
    if ('error' in data) return;
    expect(data.revisionNumber).toBe(1);

    const revision = await waitForScreening(data.revisionId);
    expect(revision.screeningStatus).toBe('done');
    const em = await getEm();
    const spectrum = await em.findOneOrFail(Spectrum, { id: data.spectrumId });
    expect(spectrum.status).toBe('in-review');
    expect(spectrum.currentRevisionId).toBe(data.revisionId);

    const { status, body } = await screeningJson(data.revisionId, cookies.reviewer);
    expect(status).toBe(200);
    const expected = screenFile(new Uint8Array(await file.arrayBuffer()), { filename: file.name });
    // The command line's JSON plus the revision, finding ids and waivers (none yet).
    const { status: st, revision: rid, findings, verdictWithWaivers, ...rest } = body;
    expect(st).toBe('done');
    expect(rid).toBe(data.revisionId);
    expect(verdictWithWaivers).toBe(expected.verdict);
    const bare = findings.map(({ id, waived, ...f }: { id: string; waived: unknown }) => (expect(id).toMatch(/^[0-9a-f-]{36}$/), expect(waived).toBeNull(), f));
    expect({ ...rest, findings: bare }).toEqual(expected);
  });

  it('refuses a forged callback and makes no second revision from a replayed one', async () => {
    const result = await upload(modelFile('replayed.txt'), meta('Replayed'), cookies.submitter);
    const data = result.serverData as Extract<BandFileServerData, { revisionId: string }>;
    await waitForScreening(data.revisionId);

    const forged = await h.fake.sendForgedCallback();
    expect(forged.status).toBe(400);
    const replay = await h.fake.replayLastCallback();
    expect(replay.status).toBe(200);
    // onUploadComplete runs after the answer: give it time to finish before counting.
    await new Promise((r) => setTimeout(r, 500));

    const em = await getEm();
    expect(await em.count(Revision, { fileKey: result.key })).toBe(1);
    expect(await em.count(Revision, { spectrum: data.spectrumId })).toBe(1);
    expect(await em.count(Spectrum, { title: 'Replayed', group: lab.group.id })).toBe(1);
  });

  it('refuses oversize and wrong-type files, strangers and observers before any bytes move', async () => {
    const before = h.fake.hooks.length;
    const big = await presignStatus(meta('Too big'), [{ name: 'big.txt', size: MAX_BAND_FILE_BYTES + 1, type: 'text/plain' }], cookies.submitter);
    expect(big.status).toBe(413);
    expect(big.body.message).toMatch(/64 MiB/);
    const pdf = await presignStatus(meta('Wrong type'), [{ name: 'bands.pdf', size: 1000, type: 'application/pdf' }], cookies.submitter);
    expect(pdf.status).toBe(400);
    expect(pdf.body.message).toMatch(/\.txt/);
    const anonymous = await presignStatus(meta('Anonymous'), [{ name: 'a.txt', size: 1000, type: 'text/plain' }]);
    expect(anonymous.status).toBe(403);
    const observer = await presignStatus(meta('Observer'), [{ name: 'a.txt', size: 1000, type: 'text/plain' }], cookies.observer);
    expect(observer.status).toBe(403);
    const stranger = await presignStatus({ ...meta('Elsewhere'), group: 'no-such-group' }, [{ name: 'a.txt', size: 1000, type: 'text/plain' }], cookies.submitter);
    expect(stranger.status).toBe(404);
    expect(h.fake.hooks.length).toBe(before);
    const em = await getEm();
    expect(await em.count(Spectrum, { group: lab.group.id, title: { $in: ['Too big', 'Wrong type', 'Anonymous', 'Observer'] } })).toBe(0);
  });

  it('keeps an unparsable file as a revision in error with line, column and expectation, and writes nothing else', async () => {
    const result = await upload(brokenFile(), meta('Broken'), cookies.submitter);
    const data = result.serverData as Extract<BandFileServerData, { revisionId: string }>;
    const revision = await waitForScreening(data.revisionId);
    expect(revision.screeningStatus).toBe('error');
    const { body } = await screeningJson(data.revisionId, cookies.submitter);
    expect(body.status).toBe('error');
    expect(body.error.line).toBeGreaterThan(1);
    expect(body.error.column).toBeGreaterThan(1);
    expect(body.error.expected).toMatch(/number/i);
    const em = await getEm();
    const spectrum = await em.findOneOrFail(Spectrum, { id: data.spectrumId });
    expect(spectrum.status).toBe('screening');
    expect(spectrum.verdict).toBeNull();
  });

  it('gives concurrent revision uploads sequential numbers', async () => {
    const first = await upload(modelFile('v1.txt'), meta('Revised'), cookies.submitter);
    const { spectrumId, revisionId } = first.serverData as Extract<BandFileServerData, { revisionId: string }>;
    await waitForScreening(revisionId);
    const results = await Promise.all(
      [1, 2, 3].map((i) => upload(modelFile(`v${i + 1}.txt`), { spectrumId, note: `take ${i}` }, cookies.submitter)),
    );
    for (const r of results) expect(r.serverData).not.toHaveProperty('error');
    const numbers = results.map((r) => (r.serverData as Extract<BandFileServerData, { revisionId: string }>).revisionNumber).sort();
    expect(numbers).toEqual([2, 3, 4]);
    const em = await getEm();
    const spectrum = await em.findOneOrFail(Spectrum, { id: spectrumId });
    expect(spectrum.revisionCount).toBe(4);
  });

  it('does not let another member upload a revision of someone else\'s spectrum', async () => {
    const first = await upload(modelFile('mine.txt'), meta('Mine'), cookies.submitter);
    const { spectrumId } = first.serverData as Extract<BandFileServerData, { revisionId: string }>;
    const other = await presignStatus({ spectrumId, note: null }, [{ name: 'x.txt', size: 100, type: 'text/plain' }], await sessionCookie(lab.admin));
    expect(other.status).toBe(403);
  });
});
