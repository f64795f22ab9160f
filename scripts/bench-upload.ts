/**
 * npm run bench:upload  (after `source scripts/env.sh test` or `demo`; BENCH_RUNS=5 by default)
 *
 * Uploads the 3 M-value columns file (2,000 q-points × 1,500 branches) through the API
 * (POST /api/v1/spectra with a token, multipart) and times request → screening stored (polling
 * GET /api/v1/revisions/{id}/screening every 50 ms), next to the engine alone on the same bytes
 * (parseBandFile + screen, in this process). Target: ratio ≤ 3×. One cold upload is shown, then
 * BENCH_RUNS warm ones (each after one engine run) give medians and spreads, with each phase of
 * the route and the worker (lib/timing) and the machine's load average. Also prints the stored
 * dispersion's size next to the file's, and the time to read it back.
 *
 * The client runs in a process of its own (a script on a cluster is another machine for the
 * app); BENCH_CLIENT=inprocess puts it in this one. If the app answers on APP_URL it is used as
 * it runs (its worker screens; its phases are not seen from here). Otherwise this script hosts
 * the same route handlers on node:http with the worker in this process and an upload fake in a
 * child process (the upload service is never the app's own process). A throw-away group,
 * person and token are made and removed afterwards.
 */
import { readFileSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
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
import { startWorker, stopWorker } from '@/lib/jobs/screening-queue';
import { fromStoredColumns, loadStoredDispersion } from '@/lib/services/dispersion-store';
import { benchSpectrum } from '@/lib/models/bench-spectrum';
import { parseBandFile } from '@/lib/parsers';
import { writeColumns } from '@/lib/writers';
import { onPhase, timed, type PhaseRecord } from '@/lib/timing';
import { toRequest } from '@/fakes/uploads/testing/node-request';
import { freePort } from '@/fakes/free-port';


/** How often the client asks whether the screening is stored (the resolution of the total). */
const POLL_MS = 10;

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


/** The upload fake as its own process, as the upload service is another machine for the app. */
async function startFakeProcess(env: NodeJS.ProcessEnv): Promise<{ pid: number; close: () => Promise<void> }> {
  const child = spawn(process.execPath, [...process.execArgv, 'fakes/uploads/server.ts'], { env, stdio: ['ignore', 'pipe', 'inherit'] });
  await new Promise<void>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the upload fake exited (${code})`)));
    child.stdout!.on('data', (d: Buffer) => {
      if (String(d).includes('listening')) resolve();
    });
  });
  return {
    pid: child.pid!,
    close: () =>
      new Promise<void>((resolve) => {
        child.removeAllListeners('exit');
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

/** The app's own route handlers on node:http, with the worker here and an upload fake beside. */
async function hostInProcess(): Promise<{ url: string; fakePid: number; close: () => Promise<void> }> {
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
    if (req.method === 'POST' && url.pathname === '/api/v1/spectra') response = await timed('request', () => spectra.POST(toRequest(req, base), { params: Promise.resolve({}) }));
    else if (req.method === 'GET' && m) response = await screening.GET(toRequest(req, base), { params: Promise.resolve({ id: m[1] }) });
    else response = new Response('not here', { status: 404 });
    res.writeHead(response.status, Object.fromEntries(response.headers)).end(Buffer.from(await response.arrayBuffer()));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  await startWorker({ pollingIntervalSeconds: 0.5 });
  return {
    url: base,
    fakePid: fake.pid,
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

interface UploadRun {
  /** Client: request sent (0), 201 read, the poll that saw `done`; and every server phase. */
  acceptedMs: number;
  totalMs: number;
  engineMs: number;
  phases: Map<string, number>;
  revisionId: string;
  /** CPU ms spent by this process (app and worker), the upload fake and the database. */
  cpu: { app: number; fake: number | null; db: number | null };
}

/** The phases reported by the route and the worker, and the gaps between them (in-process only). */
const PHASE_ROWS: [string, string][] = [
  ['client → handler', 'request sent until the route handler starts'],
  ['upload.multipart', 'multipart body read (includes waiting for the client to send it)'],
  ['upload.authorize', 'caller may create a spectrum in the group (looked up while the body arrives)'],
  ['upload.store', 'UTApi.uploadFiles to the upload service'],
  ['upload.rows', 'spectrum + revision rows, then queued'],
  ['upload.enqueue', '  of which pg-boss send'],
  ['handler → client', '201 written until the client has read it'],
  ['queue pick-up', 'queued until the worker starts the job'],
  ['screen.load', 'revision row'],
  ['screen.read-file', 'file read back from the upload service (0 when handed off in memory)'],
  ['screen.parse', 'parseBandFile'],
  ['screen.policy', "group's policy"],
  ['screen.checks', 'screen()'],
  ['screen.store', 'the one transaction: dispersion, findings, states, commit'],
  ['screen.store.dispersion', '  of which the bytea INSERT'],
  ['screen.store.rows', '  of which findings + states flush'],
  ['commit → client sees done', `job finished until the ${POLL_MS} ms poll reads \`done\``],
];

/** What the client saw of one upload, on the wall clock (performance.timeOrigin + now) in ms. */
interface ClientSeen {
  t0: number;
  tAccepted: number;
  tDone: number;
  revisionId: string;
  status: string;
}

interface UploadClient {
  upload(n: number): Promise<ClientSeen>;
  close(): void;
}


// The client: multipart POST with the token, then GET …/screening every POLL_MS until it is not
// pending. Plain JavaScript so that it runs as it is in a child process (see childClient).
const CLIENT_SOURCE = `
const wall = () => performance.timeOrigin + performance.now();
async function uploadOnce(url, token, slug, bytes, n, pollMs) {
  const form = new FormData();
  form.append('group', slug);
  form.append('title', 'Benchmark upload ' + n + ' (invented 500-atom cell)');
  form.append('material', 'Benchmarkium (invented)');
  form.append('file', new File([bytes], 'bench.txt', { type: 'text/plain' }));
  const t0 = wall();
  const res = await fetch(url + '/api/v1/spectra', { method: 'POST', headers: { authorization: 'Bearer ' + token }, body: form });
  if (res.status !== 201) throw new Error('upload answered ' + res.status + ': ' + (await res.text()));
  const created = await res.json();
  const tAccepted = wall();
  let status = 'pending';
  while (status === 'pending') {
    if (wall() - t0 > 10 * 60000) throw new Error('screening did not finish within 10 minutes');
    await new Promise((r) => setTimeout(r, pollMs));
    const s = await fetch(url + '/api/v1/revisions/' + created.revision.id + '/screening', { headers: { authorization: 'Bearer ' + token } });
    status = (await s.json()).status;
  }
  return { t0, tAccepted, tDone: wall(), revisionId: created.revision.id, status };
}
`;

const inProcessUpload = new Function(`${CLIENT_SOURCE}; return uploadOnce;`)() as (
  url: string,
  token: string,
  slug: string,
  bytes: Uint8Array,
  n: number,
  pollMs: number,
) => Promise<ClientSeen>;

/** The client in this process: its sending and polling share the event loop with the app. */
function inProcessClient(url: string, token: string, slug: string, bytes: Uint8Array): UploadClient {
  return { upload: (n) => inProcessUpload(url, token, slug, bytes, n, POLL_MS), close: () => {} };
}

/** The client in a process of its own, as a script on a cluster is another machine for the app. */
async function childClient(url: string, token: string, slug: string, file: string): Promise<UploadClient> {
  const source = `${CLIENT_SOURCE}
const bytes = require('node:fs').readFileSync(${JSON.stringify(file)});
process.on('message', (m) => uploadOnce(${JSON.stringify(url)}, ${JSON.stringify(token)}, ${JSON.stringify(slug)}, bytes, m.n, ${POLL_MS}).then(
  (seen) => process.send({ seen }),
  (e) => process.send({ error: String((e && e.message) || e) }),
));
process.send({ ready: true });`;
  const child = spawn(process.execPath, ['-e', source], { stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  type Reply = { ready?: true; seen?: ClientSeen; error?: string };
  let waiting: ((r: Reply) => void) | null = null;
  child.on('message', (r: Reply) => waiting?.(r));
  const next = () => new Promise<Reply>((resolve) => (waiting = resolve));
  await next();
  return {
    async upload(n) {
      const reply = next();
      child.send({ n });
      const r = await reply;
      if (r.error || !r.seen) throw new Error(r.error ?? 'the client process did not answer');
      return r.seen;
    },
    close: () => child.kill(),
  };
}

/**
 * CPU time (user + system, ms) of processes by pid from /proc (Linux; clock ticks of 10 ms),
 * or null where it cannot be read. Wall times on a loaded machine mostly measure the load; the
 * CPU an upload costs each process says what the work itself is.
 */
function procCpuMs(pids: number[]): Map<number, number> | null {
  const out = new Map<number, number>();
  for (const pid of pids) {
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      out.set(pid, (Number(f[11]) + Number(f[12])) * 10);
    } catch {
      if (pids.length === 1) return null;
    }
  }
  return out;
}

/** The server processes of the database (its backends and background workers). */
async function databasePids(): Promise<number[]> {
  const rows = await (await getEm()).getConnection().execute<{ pid: number }[]>('select pid from pg_stat_activity');
  return rows.map((r) => Number(r.pid));
}

function cpuSince(before: Map<number, number> | null, after: Map<number, number> | null): number | null {
  if (!before || !after) return null;
  let ms = 0;
  for (const [pid, t] of after) ms += t - (before.get(pid) ?? 0);
  return ms;
}

async function uploadOnce(client: UploadClient, n: number, fakePid: number | null): Promise<Omit<UploadRun, 'engineMs'>> {
  const records: PhaseRecord[] = [];
  const stop = onPhase((p) => records.push({ ...p, start: p.start + performance.timeOrigin, end: p.end + performance.timeOrigin }));
  try {
    const dbPids = await databasePids();
    const cpu0 = { app: process.cpuUsage(), fake: fakePid ? procCpuMs([fakePid]) : null, db: procCpuMs(dbPids) };
    const { t0, tAccepted, tDone, revisionId, status } = await client.upload(n);
    const app = process.cpuUsage(cpu0.app);
    const cpu = {
      app: (app.user + app.system) / 1000,
      fake: fakePid ? cpuSince(cpu0.fake, procCpuMs([fakePid])) : null,
      db: cpuSince(cpu0.db, procCpuMs([...new Set([...dbPids, ...(await databasePids())])])),
    };
    if (status !== 'done') throw new Error(`screening ended in ${status}`);
    const phases = new Map<string, number>();
    const first = (name: string) => records.find((r) => r.name === name);
    for (const r of records) phases.set(r.name, (phases.get(r.name) ?? 0) + (r.end - r.start));
    const handler = first('request');
    const enqueue = first('upload.enqueue');
    const job = first('screen.job');
    if (handler) {
      phases.set('client → handler', handler.start - t0);
      phases.set('handler → client', tAccepted - handler.end);
    }
    if (enqueue && job) phases.set('queue pick-up', job.start - enqueue.end);
    if (job) phases.set('commit → client sees done', tDone - job.end);
    if (!phases.has('screen.read-file') && job) phases.set('screen.read-file', 0);
    return { acceptedMs: tAccepted - t0, totalMs: tDone - t0, phases, revisionId, cpu };
  } finally {
    stop();
  }
}

function engineOnce(bytes: Uint8Array): number {
  const t = performance.now();
  screen(parseBandFile(bytes, { filename: 'bench.txt' }));
  return performance.now() - t;
}

const spread = (xs: number[]) => `${median(xs).toFixed(0).padStart(6)} ms  (${Math.min(...xs).toFixed(0)}–${Math.max(...xs).toFixed(0)})`;
const load = () => os.loadavg().map((x) => x.toFixed(2)).join(' ');

/**
 * What moving the bytes costs on this machine with nothing of ours in the way: the file POSTed
 * (multipart) over loopback to a server that only drains it (one hop; an upload makes two: client → app →
 * upload service), and one committed INSERT of a bytea the size of the stored dispersion.
 */
async function ioFloors(bytes: Uint8Array, storedBytes: number): Promise<{ hop: number[]; insert: number[] }> {
  const server = http.createServer((req, res) => {
    req.on('data', () => {});
    req.on('end', () => res.end('ok'));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
  const hop: number[] = [];
  const insert: number[] = [];
  try {
    for (let i = 0; i < 4; i++) {
      const t = performance.now();
      // Sent as the client sends it: multipart, the file as a File.
      const form = new FormData();
      form.append('file', new File([bytes as Uint8Array<ArrayBuffer>], 'bench.txt', { type: 'text/plain' }));
      const res = await fetch(url, { method: 'POST', body: form });
      await res.text();
      if (i > 0) hop.push(performance.now() - t);
    }
  } finally {
    await new Promise<void>((resolve) => server.close(() => resolve()));
  }
  // Through knex with bound parameters, as the screening job writes it (the ORM's execute()
  // would inline the bytes as text).
  const knex = (await getEm()).getConnection().getKnex();
  const table = `bench_floor_${process.pid}`;
  // Random doubles, stored as the dispersion columns are (no compression attempt).
  const payload = Buffer.from(new Float64Array(Math.ceil(storedBytes / 8)).map(() => Math.random() * 50).buffer);
  await knex.raw(`create table ${table} (b bytea)`);
  try {
    await knex.raw(`alter table ${table} alter column b set storage external`);
    for (let i = 0; i < 4; i++) {
      const t = performance.now();
      await knex.raw(`insert into ${table} values (?)`, [payload]);
      if (i > 0) insert.push(performance.now() - t);
    }
  } finally {
    await knex.raw(`drop table ${table}`);
  }
  return { hop, insert };
}

async function main() {
  if (!process.env.DATABASE_URL) throw new Error('run `source scripts/env.sh test` (or demo) first');
  const appUrl = process.env.APP_URL ?? 'http://127.0.0.1:3100';
  const runs = Math.max(1, Number(process.env.BENCH_RUNS ?? 5));
  console.log('bench:upload — generating the columns file (2,000 q × 1,500 branches)…');
  const text = writeColumns(benchSpectrum(400, 1500), { digits: 8 });
  const bytes = new TextEncoder().encode(text);
  const d0 = parseBandFile(bytes, { filename: 'bench.txt' });
  console.log(`file: ${mib(bytes.byteLength)}, ${d0.nq} q-points × ${d0.nb} branches = ${(d0.nq * d0.nb).toLocaleString('en')} values`);

  const running = await appIsUp(appUrl);
  const host = running ? { url: appUrl, close: async () => {} } : await hostInProcess();
  console.log(running ? `using the running app on ${appUrl} (its worker screens; no phases from it)` : `app not running on ${appUrl}: hosting the API route handlers, an upload fake and the worker in this process`);
  console.log(`load average at start (1, 5, 15 min): ${load()} on ${os.availableParallelism()} cores`);
  const bench = await makeBenchCaller();
  const inProcess = process.env.BENCH_CLIENT === 'inprocess';
  const fileDir = await mkdtemp(path.join(os.tmpdir(), 'branchwise-bench-file-'));
  const file = path.join(fileDir, 'bench.txt');
  await writeFile(file, bytes);
  const client = inProcess ? inProcessClient(host.url, bench.token, bench.slug, bytes) : await childClient(host.url, bench.token, bench.slug, file);
  console.log(inProcess ? 'client: in this process (BENCH_CLIENT=inprocess)' : 'client: its own process (BENCH_CLIENT=inprocess to share this one)');
  try {
    // The first upload pays for loading the SDK, the routes and the queries: shown, not counted.
    const fakePid = 'fakePid' in host ? host.fakePid : null;
    const cold = await uploadOnce(client, 0, fakePid);
    console.log(`first (cold) upload: request → 201 ${cold.acceptedMs.toFixed(0)} ms, → screening stored ${cold.totalMs.toFixed(0)} ms`);
    const results: UploadRun[] = [];
    // Engine and upload alternate, so a change in the machine's load reaches both.
    for (let i = 1; i <= runs; i++) {
      const engineMs = engineOnce(bytes);
      const run = await uploadOnce(client, i, fakePid);
      results.push({ ...run, engineMs });
      console.log(`run ${i}/${runs}: engine ${engineMs.toFixed(0)} ms, request → 201 ${run.acceptedMs.toFixed(0)} ms, → screening stored ${run.totalMs.toFixed(0)} ms (${(run.totalMs / engineMs).toFixed(2)}×)`);
    }
    const last = results[results.length - 1];
    const em = await getEm();
    const stored = await em.findOneOrFail(StoredDispersion, { revision: last.revisionId });
    const [{ on_disk: onDisk }] = await em
      .getConnection()
      .execute<{ on_disk: string }[]>(
        'select coalesce(pg_column_size(frequencies),0) + coalesce(pg_column_size(q),0) + coalesce(pg_column_size(distances),0) + coalesce(pg_column_size(weights),0) as on_disk from stored_dispersion where revision_id = ?',
        [last.revisionId],
      );
    const col = (f: (r: UploadRun) => number) => results.map(f);
    const ratios = col((r) => r.totalMs / r.engineMs);
    console.log('');
    console.log(`median of ${runs} warm runs (min–max):`);
    if (!running) {
      for (const [name, what] of PHASE_ROWS) {
        const xs = results.map((r) => r.phases.get(name)).filter((x): x is number => x !== undefined);
        if (xs.length) console.log(`  ${name.padEnd(27)} ${spread(xs)}  ${what}`);
      }
      console.log('');
    }
    const cpuRow = (label: string, f: (r: UploadRun) => number | null) => {
      const xs = results.map(f).filter((x): x is number => x !== null);
      if (xs.length) console.log(`  ${label.padEnd(27)} ${spread(xs)}`);
    };
    console.log('CPU time per upload (user + system; the database and the fake read from /proc in 10 ms ticks):');
    cpuRow('app process (route, worker)', (r) => (running ? null : r.cpu.app));
    cpuRow('upload fake process', (r) => r.cpu.fake);
    cpuRow('database processes', (r) => r.cpu.db);
    console.log('');
    console.log(`request → 201 (multipart in, stored with the upload service, queued): ${spread(col((r) => r.acceptedMs))}`);
    console.log(`request → screening stored:                                           ${spread(col((r) => r.totalMs))}`);
    console.log(`engine only (parseBandFile + screen, one before each upload):         ${spread(col((r) => r.engineMs))}`);
    const ratio = median(ratios);
    console.log(`ratio: ${ratio.toFixed(2)}× median (${Math.min(...ratios).toFixed(2)}–${Math.max(...ratios).toFixed(2)}) (target ≤ 3×: ${ratio <= 3 ? 'met' : 'NOT met'})`);
    console.log(`load average at end (1, 5, 15 min): ${load()}`);
    console.log(`stored dispersion: ${mib(Number(stored.byteSize))} of Float64 arrays (${mib(Number(onDisk))} in the table) vs ${mib(bytes.byteLength)} file = ${(Number(stored.byteSize) / bytes.byteLength).toFixed(2)} of the file`);
    const floors = await ioFloors(bytes, Number(stored.byteSize));
    const hopMs = median(floors.hop);
    const insertMs = median(floors.insert);
    const engineMs = median(col((r) => r.engineMs));
    const floorMs = 2 * hopMs + insertMs + engineMs;
    console.log('');
    console.log('floors on this machine (median of 3, nothing of ours in the way):');
    console.log(`  one loopback hop of the file (POST, drained)  ${spread(floors.hop)}  an upload makes two: client → app → upload service`);
    console.log(`  one committed INSERT of ${mib(Number(stored.byteSize))} bytea      ${spread(floors.insert)}`);
    console.log(`  two hops + insert + engine:                   ${floorMs.toFixed(0).padStart(6)} ms = ${(floorMs / engineMs).toFixed(2)}× the engine alone`);
    console.log(`request → screening stored is ${(median(col((r) => r.totalMs)) / floorMs).toFixed(2)}× that floor`);
    await readBack(last.revisionId);
  } finally {
    client.close();
    await rm(fileDir, { recursive: true, force: true });
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
