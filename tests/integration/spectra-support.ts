/**
 * Set-up shared by the spectra and uploads integration tests: the upload fake in this process on
 * a free port, the REAL uploadthing route handler (app/api/uploadthing) on node:http so the fake
 * can call it back, the SDK pointed at both through the environment, and the screening worker.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { genUploader } from 'uploadthing/client';
import { Revision } from '@/entities';
import { makeUploadToken } from '@/fakes/uploads/config';
import { startUploadFake, type UploadFake } from '@/fakes/uploads/fake';
import { installXhrShim } from '@/fakes/uploads/testing/xhr-shim';
import type { UploadRouter } from '@/app/api/uploadthing/core';
import { getEm } from '@/lib/db/orm';
import type { Dispersion } from '@/lib/dispersion/types';
import { startWorker, stopWorker } from '@/lib/jobs/screening-queue';
import { fccModel } from '@/lib/models/fcc';
import { pathDispersion } from '@/lib/models/model';
import { writeColumns } from '@/lib/writers';
import { toRequest } from '@/fakes/uploads/testing/node-request';

const API_KEY = 'sk_spectra_integration_test';
const APP_ID = 'branchwise-spectra-test';

export interface Harness {
  fake: UploadFake;
  /** `http://127.0.0.1:<port>`: serves /api/uploadthing with the app's real handler. */
  appUrl: string;
  uploader: ReturnType<typeof genUploader<UploadRouter>>;
  close(): Promise<void>;
}

export async function startHarness(): Promise<Harness> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'branchwise-spectra-'));
  const fake = await startUploadFake({ port: 0, dir, apiKey: API_KEY, appId: APP_ID, callbackTimeoutMs: 60_000 });
  let handlers: { GET: (r: Request) => Promise<Response>; POST: (r: Request) => Promise<Response> } | null = null;
  let base = '';
  const server = http.createServer(async (req, res) => {
    try {
      if (!handlers || !(req.url ?? '').startsWith('/api/uploadthing')) return void res.writeHead(404).end();
      const request = toRequest(req, base);
      const response = await (req.method === 'GET' ? handlers.GET(request) : handlers.POST(request));
      const body = Buffer.from(await response.arrayBuffer());
      res.writeHead(response.status, Object.fromEntries(response.headers)).end(body);
    } catch (e) {
      res.writeHead(500).end(String(e));
    }
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  // What scripts/env.sh sets, pointed at this process's fake and server.
  Object.assign(process.env, {
    UPLOADTHING_TOKEN: makeUploadToken(API_KEY, APP_ID),
    UPLOADTHING_INGEST_URL: fake.url,
    UPLOADTHING_API_URL: fake.url,
    UPLOADTHING_UFS_HOST: `localhost:${fake.port}`,
    UPLOADTHING_UFS_APP_ID_LOCATION: 'path',
    UPLOADTHING_IS_DEV: 'false',
    UPLOADTHING_CALLBACK_URL: `${base}/api/uploadthing`,
  });
  const mod = await import('@/app/api/uploadthing/route');
  handlers = { GET: mod.GET as never, POST: mod.POST as never };
  await startWorker({ pollingIntervalSeconds: 0.5 });
  const uninstall = installXhrShim();

  return {
    fake,
    appUrl: base,
    uploader: genUploader<UploadRouter>({ url: `${base}/api/uploadthing`, package: 'branchwise-tests', fetch: globalThis.fetch }),
    close: async () => {
      uninstall();
      await stopWorker();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await fake.close();
      await rm(dir, { recursive: true, force: true });
    },
  };
}

/** Waits until the revision leaves `pending`; returns its final state. */
export async function waitForScreening(revisionId: string, timeoutMs = 20_000): Promise<Revision> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const em = await getEm();
    const r = await em.findOne(Revision, { id: revisionId });
    if (r && r.screeningStatus !== 'pending') return r;
    if (Date.now() > until) throw new Error(`revision ${revisionId} still ${r?.screeningStatus ?? 'missing'} after ${timeoutMs} ms`);
    await new Promise((res) => setTimeout(res, 100));
  }
}

/** A small clean model spectrum (fcc, from lib/models) as a columns file. */
export function modelFile(name = 'model-fcc.txt', transform: (d: Dispersion) => Dispersion = (d) => d): File {
  const d = transform(pathDispersion(fccModel(), { points: 12 }));
  return new File([writeColumns(d)], name, { type: 'text/plain' });
}

/** A columns file whose third data line has a word where a number belongs. */
export function brokenFile(name = 'broken.txt'): File {
  const text = writeColumns(pathDispersion(fccModel(), { points: 6 }));
  const lines = text.split('\n');
  const firstData = lines.findIndex((l) => /^\s*[-\d.]/.test(l));
  const i = firstData + 2;
  const parts = lines[i].trim().split(/\s+/);
  parts[parts.length - 1] = 'oops';
  lines[i] = parts.join(' ');
  return new File([lines.join('\n')], name, { type: 'text/plain' });
}
