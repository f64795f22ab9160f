/**
 * npm run bench:upload  (after `source scripts/env.sh test` or `demo`)
 *
 * Uploads the 3 M-value columns file (2,000 q-points × 1,500 branches) through the API
 * (POST /api/v1/spectra with a token, multipart) and times request → screening stored (polling
 * GET /api/v1/revisions/{id}/screening every 50 ms), next to the engine alone on the same bytes
 * (parseBandFile + screen, in this process). Target: ratio ≤ 3×. Also prints the stored
 * dispersion's size next to the file's, and the time to read it back.
 *
 * If the app answers on APP_URL it is used as it runs (its worker screens). Otherwise this
 * script hosts the same route handlers on node:http with the worker in this process and an
 * upload fake in a child process (the upload service is never the app's own process). A throw-away group, person and token are made and removed afterwards.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { spawn } from 'node:child_process';
import http from 'node:http';
import net, { type AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { ApiToken, Group, Membership, StoredDispersion, User } from '@/entities';
import { makeUploadToken } from '@/fakes/uploads/config';
import { generateApiToken } from '@/lib/auth/tokens';
import { screen } from '@/lib/checks';
import { closeOrm, getEm } from '@/lib/db/orm';
import type { Dispersion } from '@/lib/dispersion/types';
import { startWorker, stopWorker } from '@/lib/jobs/screening-queue';
import { fromStoredColumns, loadStoredDispersion } from '@/lib/services/dispersion-store';
import { fccLattice, fccModel } from '@/lib/models/fcc';
import { pathDispersion } from '@/lib/models/model';
import { parseBandFile } from '@/lib/parsers';
import { writeColumns } from '@/lib/writers';
import { toRequest } from '@/fakes/uploads/testing/node-request';

/** The benchmark spectrum of bench-screen: fcc acoustic branches plus smooth optical bands. */
function syntheticSpectrum(pointsPerSegment: number, branches: number): Dispersion {
  const base = pathDispersion(fccModel(), { points: pointsPerSegment });
  const f = new Float64Array(base.nq * branches);
  for (let i = 0; i < base.nq; i++) {
    const row = f.subarray(i * branches, (i + 1) * branches);
    for (let k = 0; k < 3; k++) row[k] = base.frequencies[i * 3 + k];
    const x = base.q![i * 3] + 2 * base.q![i * 3 + 1] + 3 * base.q![i * 3 + 2];
    for (let k = 3; k < branches; k++) row[k] = 8 + (40 * k) / branches + 0.05 * Math.sin(2 * Math.PI * x + k);
    row.sort();
  }
  return { ...base, nb: branches, frequencies: f, atoms: branches / 3, title: 'Invented 500-atom cell (benchmark)', lattice: fccLattice(3.6) };
}

const mib = (n: number) => `${(n / 2 ** 20).toFixed(1)} MiB`;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function appIsUp(url: string): Promise<boolean> {
  try {
    const res = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(2000) });
    return res.ok;
  } catch {
    return false;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as AddressInfo;
      s.close(() => resolve(port));
    });
    s.on('error', reject);
  });
}

/** The upload fake as its own process, as the upload service is another machine for the app. */
async function startFakeProcess(env: NodeJS.ProcessEnv): Promise<{ close: () => Promise<void> }> {
  const child = spawn(process.execPath, [...process.execArgv, 'fakes/uploads/server.ts'], { env, stdio: ['ignore', 'pipe', 'inherit'] });
  await new Promise<void>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the upload fake exited (${code})`)));
    child.stdout!.on('data', (d: Buffer) => {
      if (String(d).includes('listening')) resolve();
    });
  });
  return {
    close: () =>
      new Promise<void>((resolve) => {
        child.removeAllListeners('exit');
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

/** The app's own route handlers on node:http, with the worker here and an upload fake beside. */
async function hostInProcess(): Promise<{ url: string; close: () => Promise<void> }> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'branchwise-bench-upload-'));
  const apiKey = 'sk_bench_upload_local';
  const appId = 'branchwise-bench';
  const port = await freePort();
  const fakeUrl = `http://127.0.0.1:${port}`;
  Object.assign(process.env, {
    UPLOADTHING_TOKEN: makeUploadToken(apiKey, appId),
    UPLOADTHING_INGEST_URL: fakeUrl,
    UPLOADTHING_API_URL: fakeUrl,
    UPLOADTHING_UFS_HOST: `localhost:${port}`,
    UPLOADTHING_UFS_APP_ID_LOCATION: 'path',
  });
  const fake = await startFakeProcess({ ...process.env, FAKE_UPLOADS_PORT: String(port), FAKE_UPLOADS_DIR: dir });
  const spectra = await import('@/app/api/v1/spectra/route');
  const screening = await import('@/app/api/v1/revisions/[id]/screening/route');
  let base = '';
  const server = http.createServer(async (req, res) => {
    const url = new URL(req.url ?? '/', base);
    let response: Response;
    const m = /^\/api\/v1\/revisions\/([^/]+)\/screening$/.exec(url.pathname);
    if (req.method === 'POST' && url.pathname === '/api/v1/spectra') response = await spectra.POST(toRequest(req, base), { params: Promise.resolve({}) });
    else if (req.method === 'GET' && m) response = await screening.GET(toRequest(req, base), { params: Promise.resolve({ id: m[1] }) });
    else response = new Response('not here', { status: 404 });
    res.writeHead(response.status, Object.fromEntries(response.headers)).end(Buffer.from(await response.arrayBuffer()));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  await startWorker({ pollingIntervalSeconds: 0.5 });
  return {
    url: base,
    close: async () => {
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

async function makeBenchCaller(): Promise<{ slug: string; token: string; cleanup: () => Promise<void> }> {
  const em = await getEm();
  const tag = Math.random().toString(36).slice(2, 8);
  const group = em.create(Group, { slug: `bench-${tag}`, name: `Benchmark group ${tag} (temporary)` });
  const user = em.create(User, { email: `bench-${tag}@bench.invalid`, name: 'Benchmark script', emailVerified: new Date() });
  em.create(Membership, { user, group, role: 'submitter' });
  const t = generateApiToken();
  em.create(ApiToken, { user, group, name: 'bench', hash: t.hash, prefix: t.prefix, lastUsedAt: null, revokedAt: null });
  await em.flush();
  return {
    slug: group.slug,
    token: t.token,
    cleanup: async () => {
      const e = await getEm();
      await e.nativeDelete(Group, { id: group.id });
      await e.nativeDelete(User, { id: user.id });
    },
  };
}

/** Reading the stored dispersion back: through the ORM (bytea as hex text) and as the routes do. */
async function readBack(revisionId: string): Promise<void> {
  const orm: number[] = [];
  const routes: number[] = [];
  for (let i = 0; i < 3; i++) {
    let t = performance.now();
    const em = (await getEm()).fork();
    fromStoredColumns(await em.findOneOrFail(StoredDispersion, { revision: revisionId }, { populate: ['frequencies', 'q', 'distances', 'weights'] }));
    orm.push(performance.now() - t);
    t = performance.now();
    await loadStoredDispersion((await getEm()).fork(), revisionId);
    routes.push(performance.now() - t);
  }
  console.log(`read back, ORM populate (hex text):                                   ${median(orm).toFixed(0)} ms (median of 3)`);
  console.log(`read back, loadStoredDispersion (base64, as the data route):          ${median(routes).toFixed(0)} ms (median of 3)`);
}

async function main() {
  if (!process.env.DATABASE_URL) throw new Error('run `source scripts/env.sh test` (or demo) first');
  const appUrl = process.env.APP_URL ?? 'http://127.0.0.1:3100';
  console.log('bench:upload — generating the columns file (2,000 q × 1,500 branches)…');
  const text = writeColumns(syntheticSpectrum(400, 1500), { digits: 8 });
  const bytes = new TextEncoder().encode(text);
  const d0 = parseBandFile(bytes, { filename: 'bench.txt' });
  console.log(`file: ${mib(bytes.byteLength)}, ${d0.nq} q-points × ${d0.nb} branches = ${(d0.nq * d0.nb).toLocaleString('en')} values`);

  const engine: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t = performance.now();
    screen(parseBandFile(bytes, { filename: 'bench.txt' }));
    engine.push(performance.now() - t);
  }
  const engineMs = median(engine);

  const running = await appIsUp(appUrl);
  const host = running ? { url: appUrl, close: async () => {} } : await hostInProcess();
  console.log(running ? `using the running app on ${appUrl} (its worker screens)` : `app not running on ${appUrl}: hosting the API route handlers, an upload fake and the worker in this process`);
  const bench = await makeBenchCaller();
  try {
    const form = new FormData();
    form.append('group', bench.slug);
    form.append('title', 'Benchmark upload (invented 500-atom cell)');
    form.append('material', 'Benchmarkium (invented)');
    form.append('file', new File([bytes], 'bench.txt', { type: 'text/plain' }));
    const t0 = performance.now();
    const res = await fetch(`${host.url}/api/v1/spectra`, { method: 'POST', headers: { authorization: `Bearer ${bench.token}` }, body: form });
    if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${await res.text()}`);
    const created = (await res.json()) as { revision: { id: string } };
    const tAccepted = performance.now();
    let status = 'pending';
    while (status === 'pending') {
      if (performance.now() - t0 > 10 * 60_000) throw new Error('screening did not finish within 10 minutes');
      await new Promise((r) => setTimeout(r, 50));
      const s = await fetch(`${host.url}/api/v1/revisions/${created.revision.id}/screening`, { headers: { authorization: `Bearer ${bench.token}` } });
      status = ((await s.json()) as { status: string }).status;
    }
    const totalMs = performance.now() - t0;
    if (status !== 'done') throw new Error(`screening ended in ${status}`);
    const em = await getEm();
    const stored = await em.findOneOrFail(StoredDispersion, { revision: created.revision.id });
    const [{ on_disk: onDisk }] = await em
      .getConnection()
      .execute<{ on_disk: string }[]>(
        'select coalesce(pg_column_size(frequencies),0) + coalesce(pg_column_size(q),0) + coalesce(pg_column_size(distances),0) + coalesce(pg_column_size(weights),0) as on_disk from stored_dispersion where revision_id = ?',
        [created.revision.id],
      );
    const ratio = totalMs / engineMs;
    console.log('');
    console.log(`request → 201 (multipart in, stored with the upload service, queued): ${(tAccepted - t0).toFixed(0)} ms`);
    console.log(`request → screening stored:                                           ${totalMs.toFixed(0)} ms`);
    console.log(`engine only (parseBandFile + screen, median of 3):                    ${engineMs.toFixed(0)} ms`);
    console.log(`ratio: ${ratio.toFixed(2)}× (target ≤ 3×: ${ratio <= 3 ? 'met' : 'NOT met'})`);
    console.log(`stored dispersion: ${mib(Number(stored.byteSize))} of Float64 arrays (${mib(Number(onDisk))} in the table) vs ${mib(bytes.byteLength)} file = ${(Number(stored.byteSize) / bytes.byteLength).toFixed(2)} of the file`);
    await readBack(created.revision.id);
  } finally {
    await bench.cleanup();
    await host.close();
  }
}

main()
  .catch((e: unknown) => {
    console.error(`bench:upload: ${(e as Error).message}`);
    process.exitCode = 1;
  })
  .finally(() => closeOrm());
