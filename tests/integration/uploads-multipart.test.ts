/**
 * The multipart API's store-then-screen path: the bytes just stored are screened in this process
 * (in-memory handoff, no read-back) with the command line's findings; a parse error is recorded
 * on the revision; a store that fails leaves nothing; absurd values still screen.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Revision, Spectrum } from '@/entities';
import { POST as createRoute } from '@/app/api/v1/spectra/route';
import { screenFile } from '@/lib/checks';
import { closeOrm, getEm } from '@/lib/db/orm';
import { makeLab, routeArgs, sessionCookie } from './helpers';
import { call } from './review-fixtures';
import { GET as screeningRoute } from '@/app/api/v1/revisions/[id]/screening/route';
import { brokenFile, modelFile, startHarness, waitForScreening, type Harness } from './spectra-support';

let lab: Awaited<ReturnType<typeof makeLab>>;
let h: Harness;
beforeAll(async () => {
  h = await startHarness();
  lab = await makeLab('store-thread');
});
afterAll(async () => {
  await h?.close();
  await closeOrm();
});

async function upload(title: string, file: File) {
  const form = new FormData();
  form.append('group', lab.group.slug);
  form.append('title', title);
  form.append('material', 'Invented cubic solid (test)');
  form.append('file', file);
  const req = new Request(`${process.env.APP_URL}/api/v1/spectra`, { method: 'POST', headers: { cookie: await sessionCookie(lab.submitter) }, body: form });
  return createRoute(req, routeArgs());
}

describe('multipart upload, store, screen', () => {
  it('screens the bytes it just stored: the same findings as the command line', async () => {
    const file = modelFile('ahead.txt');
    const res = await upload('Screened from the handoff', file);
    expect(res.status).toBe(201);
    const { revision } = (await res.json()) as { revision: { id: string } };
    expect((await waitForScreening(revision.id)).screeningStatus).toBe('done');
    const body = (await call(screeningRoute, lab.submitter, { params: { id: revision.id } })).body;
    const expected = screenFile(new Uint8Array(await file.arrayBuffer()), { filename: 'ahead.txt' });
    expect(body.findings.map(({ id: _i, waived: _w, ...f }: { id: string; waived: unknown }) => f)).toEqual(expected.findings);
    expect(body.verdict).toBe(expected.verdict);
  });

  it('records a parse error on the revision, with line and column', async () => {
    const res = await upload('Broken file', brokenFile());
    expect(res.status).toBe(201);
    const { revision } = (await res.json()) as { revision: { id: string } };
    const r = await waitForScreening(revision.id);
    expect(r.screeningStatus).toBe('error');
    expect(r.screeningError).toMatchObject({ line: expect.any(Number), column: expect.any(Number) });
  });

  it('writes nothing when the file store cannot be reached (503), and the next upload works again', async () => {
    const ingest = process.env.UPLOADTHING_INGEST_URL;
    process.env.UPLOADTHING_INGEST_URL = 'http://127.0.0.1:1';
    let res: Response;
    try {
      res = await upload('Store unreachable', modelFile('lost.txt'));
    } finally {
      process.env.UPLOADTHING_INGEST_URL = ingest;
    }
    expect(res.status).toBe(503);
    const em = await getEm();
    expect(await em.count(Spectrum, { group: lab.group.id, title: 'Store unreachable' })).toBe(0);
    expect(await em.count(Revision, { originalName: 'lost.txt', spectrum: { group: lab.group.id } })).toBe(0);
    const again = await upload('Store back', modelFile('back.txt'));
    expect(again.status).toBe(201);
  });
});

describe('absurd values', () => {
  it('screens a file with values near the largest double: done, and findings as in the command line JSON', async () => {
    const file = modelFile('huge.txt', (d) => {
      const f = d.frequencies.slice();
      f[2] = Number.MAX_VALUE; // Γ, the top acoustic branch: some checks' values overflow to Infinity
      return { ...d, frequencies: f };
    });
    const res = await upload('Huge values', file);
    expect(res.status).toBe(201);
    const { revision } = (await res.json()) as { revision: { id: string } };
    expect((await waitForScreening(revision.id)).screeningStatus).toBe('done');
    const body = (await call(screeningRoute, lab.submitter, { params: { id: revision.id } })).body;
    const expected = JSON.parse(JSON.stringify(screenFile(new Uint8Array(await file.arrayBuffer()), { filename: 'huge.txt' })));
    expect(body.findings.map(({ id: _i, waived: _w, ...f }: { id: string; waived: unknown }) => f)).toEqual(expected.findings);
  });
});
