/**
 * `npm run bench:plot`: how fast the dispersion plot draws and zooms large spectra, next to
 * ECharts drawing the same data alone (one series per branch, no decimation, no painted lines).
 *
 * Needs a production build (`npx next build`); builds nothing itself. Starts `next start` on a
 * free loopback port with DEV_PLOT_PAGE=1, opens /dev/plot in Debian's chromium (headless,
 * software rendering) and reads the page's own timings (performance.now() around setOption
 * and the chart's `finished` event). Median of 3 page loads per case.
 *
 * Options: --url http://127.0.0.1:PORT (use a running server instead), --runs N,
 * --branches 150,600,1500, --points 2000, --height 700.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser } from 'playwright';
import { freePort } from '@/fakes/free-port';

const root = path.resolve(import.meta.dirname, '..');
const CHROMIUM = '/usr/bin/chromium';
const TARGET_FIRST_MS = 1500;
const TARGET_ZOOM_MS = 100;

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

const runs = Number(arg('runs') ?? 3);
const branchList = (arg('branches') ?? '150,600,1500').split(',').map(Number);
const points = Number(arg('points') ?? 2000);
const height = Number(arg('height') ?? 700);

async function waitForHttp(url: string, ms: number, server: ChildProcess | null): Promise<void> {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    if (server && server.exitCode !== null) throw new Error(`next start exited with code ${server.exitCode}`);
    try {
      const r = await fetch(url);
      if (r.status === 200) return;
      if (r.status === 404) throw new Error(`${url} answered 404: is DEV_PLOT_PAGE=1 reaching the server, and is app/dev/plot in the build?`);
    } catch (e) {
      if ((e as Error).message.includes('404')) throw e;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer within ${ms / 1000} s`);
}

function startServer(port: number): ChildProcess {
  // The test environment's variables (scripts/env.sh), then our port and the page switch.
  const cmd = `source scripts/env.sh test && exec node node_modules/next/dist/bin/next start -H 127.0.0.1 -p ${port}`;
  const child = spawn('bash', ['-c', cmd], {
    cwd: root,
    env: { ...process.env, DEV_PLOT_PAGE: '1', NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  let log = '';
  child.stdout!.on('data', (b) => (log = (log + b).slice(-4000)));
  child.stderr!.on('data', (b) => (log = (log + b).slice(-4000)));
  child.on('exit', (code) => {
    if (code && code !== 0 && !stopping) process.stderr.write(`next start exited (${code}):\n${log}\n`);
  });
  return child;
}

let stopping = false;
function stopServer(child: ChildProcess | null) {
  if (!child || child.exitCode !== null || child.pid === undefined) return;
  stopping = true;
  try {
    process.kill(-child.pid, 'SIGTERM'); // its own process group: next and nothing else
  } catch {
    /* already gone */
  }
}

interface Sample {
  firstMs: number;
  loadMs: number;
  zoomMs: number;
  /** Of the zoom: our decimation, line painting and option building (the rest is the chart). */
  zoomBuildMs: number;
  points: number;
}

async function sample(browser: Browser, base: string, branches: number, mode: 'ours' | 'naive'): Promise<Sample> {
  const context = await browser.newContext({ viewport: { width: 1280, height: height + 420 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  try {
    const url = `${base}/dev/plot?branches=${branches}&points=${points}&mode=${mode}&height=${height}`;
    await page.goto(url, { waitUntil: 'load', timeout: 120_000 });
    await page.waitForFunction(() => window.__plot?.ready === true, null, { timeout: 180_000, polling: 50 });
    const first = await page.evaluate(() => ({ ms: window.__plot!.firstDrawMs!, at: window.__plot!.firstDrawAt!, points: window.__plot!.points }));
    // Let the page settle (fonts, layout) before timing zooms: two zooms in, the median kept.
    await page.waitForTimeout(300);
    const zoom = () => page.evaluate(async () => ({ ms: await window.__plot!.zoom(0.5), build: window.__plot!.last?.phases?.build ?? NaN }));
    const z1 = await zoom();
    await page.waitForTimeout(100);
    const z2 = await zoom();
    if (errors.length) throw new Error(`page errors: ${errors.join('; ')}`);
    return { firstMs: first.ms, loadMs: first.at, zoomMs: (z1.ms + z2.ms) / 2, zoomBuildMs: (z1.build + z2.build) / 2, points: first.points };
  } finally {
    await context.close();
  }
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const fmt = (ms: number) => `${ms.toFixed(0).padStart(6)} ms`;

async function main() {
  const external = arg('url');
  if (!external && !existsSync(path.join(root, '.next', 'BUILD_ID'))) {
    console.error('bench:plot needs a production build and builds nothing itself: run `npx next build` first (no .next/BUILD_ID found).');
    process.exit(2);
  }
  if (!existsSync(CHROMIUM)) {
    console.error(`bench:plot drives Debian's chromium at ${CHROMIUM}; not found (apt-get install chromium).`);
    process.exit(2);
  }
  let server: ChildProcess | null = null;
  let base = external ?? '';
  const cleanup = () => stopServer(server);
  process.on('SIGINT', () => {
    cleanup();
    process.exit(130);
  });
  try {
    if (!external) {
      const port = await freePort();
      base = `http://127.0.0.1:${port}`;
      server = startServer(port);
      await waitForHttp(`${base}/dev/plot?branches=1&points=24`, 60_000, server);
    }
    const browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run', '--disable-sync'],
    });
    console.log(`dispersion plot benchmark: ${points} q-points per branch, chart ${height} px high in a 1280 px window, headless chromium, median of ${runs}`);
    console.log(`targets at 1,500 branches: first draw <= ${TARGET_FIRST_MS} ms, zoom redraw <= ${TARGET_ZOOM_MS} ms\n`);
    const rows: string[][] = [];
    try {
      // One warm-up load so the first measured case does not pay for compiling the page's scripts.
      await sample(browser, base, 10, 'ours');
      for (const nb of branchList) {
        const ours: Sample[] = [];
        const naive: Sample[] = [];
        for (let r = 0; r < runs; r++) {
          ours.push(await sample(browser, base, nb, 'ours'));
          naive.push(await sample(browser, base, nb, 'naive'));
        }
        const o = {
          first: median(ours.map((s) => s.firstMs)),
          load: median(ours.map((s) => s.loadMs)),
          zoom: median(ours.map((s) => s.zoomMs)),
          zoomBuild: median(ours.map((s) => s.zoomBuildMs)),
        };
        const n = { first: median(naive.map((s) => s.firstMs)), load: median(naive.map((s) => s.loadMs)), zoom: median(naive.map((s) => s.zoomMs)) };
        const big = nb >= 1500;
        rows.push([
          `${nb} × ${points}`,
          `${fmt(o.first)}${big ? (o.first <= TARGET_FIRST_MS ? ' ok ' : ' MISS') : '     '}`,
          fmt(n.first),
          `${(n.first / o.first).toFixed(1)}×`,
          `${fmt(o.zoom)}${big ? (o.zoom <= TARGET_ZOOM_MS ? ' ok ' : ' MISS') : '     '}`,
          fmt(o.zoomBuild),
          fmt(n.zoom),
          `${(n.zoom / o.zoom).toFixed(1)}×`,
          fmt(o.load),
          fmt(n.load),
          `${ours[0].points.toLocaleString('en')}`,
        ]);
        console.log(`  measured ${nb} branches`);
      }
    } finally {
      await browser.close();
    }
    const head = ['size', 'first draw', 'ECharts alone', 'ratio', 'zoom redraw', 'of it ours', 'ECharts alone', 'ratio', 'page to drawn', 'ECharts alone', 'points drawn'];
    const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
    const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i])).join('  ');
    console.log('');
    console.log(line(head));
    for (const r of rows) console.log(line(r));
    console.log('');
    console.log('first draw: setOption (with our decimation) to the chart\'s `finished` event, data already in memory.');
    console.log('zoom redraw: a 2× zoom along q (re-decimation + setOption) to `finished`; ECharts alone: new axis limits only.');
    console.log('of it ours: the part of the zoom spent in our decimation, painting the branch lines and option building (the rest is ECharts drawing axes, markers and the painted image).');
    console.log('page to drawn: navigation start to the first `finished`, including script load and generating the synthetic bands.');
    console.log('ratio: ECharts alone ÷ ours (above 1 means ours is faster).');
  } finally {
    cleanup();
  }
}

main().catch((e) => {
  console.error(`bench:plot failed: ${(e as Error).message}`);
  process.exit(1);
});
