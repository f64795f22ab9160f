/**
 * npm run bench:screen [-- --runs N] [--keep]
 *
 * How far parsing and screening are from the cost of merely reading the numbers.
 * Generates (in a temp folder) a columns file of 2,000 q-points × 1,500 branches (3 M values,
 * 11 significant digits: ~39 MB, with `Γ` labels in its header as real files have) and a YAML
 * file of 200 × 1,500 (300 k values), then times, each in a fresh child process:
 *   floor   — read the file and convert every number to a Float64Array in a tight loop over the
 *             file's bytes (no decoding to a string, no checks): the same bytes the parser gets;
 *   parse   — parseBandFile;
 *   screen  — parseBandFile + every check (screen from lib/checks).
 * Each phase is timed from reading the file to the end, so the ratios to the floor compare like
 * with like. Peak memory above baseline = the child's peak RSS (process.resourceUsage().maxRSS)
 * minus its RSS just before the phase (after imports and a GC); compared with the Float64 payload
 * (values × 8 B). The file's own bytes count (they are read inside the phase). Median of N runs
 * (default 3).
 * Targets (columns file): parse + checks ≤ 2 × floor; peak memory ≤ 4 × payload. Goal for the
 * YAML file: ≤ 10 × floor and ≤ 10 × payload.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Dispersion } from '../lib/dispersion/types';
import { benchSpectrum } from '../lib/models/bench-spectrum';
import { writeColumns, writeYaml } from '../lib/writers';

type Phase = 'floor' | 'parse' | 'screen';
const PHASES: Phase[] = ['floor', 'parse', 'screen'];

interface PhaseResult {
  ms: number;
  values: number;
  rssBefore: number;
  /** Peak RSS before the phase: if the phase never rose above it, its own peak is unknown. */
  peakBefore: number;
  peakRss: number;
}

const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

/**
 * Every number of a file into a Float64Array, straight from its bytes (numbers are ASCII):
 * digits accumulated in place (no substring per token), the decimal point and exponent applied
 * with a power-of-ten table; `#` lines skipped; anything that is not a number is stepped over.
 * The floor's whole job, nothing checked.
 */
function floor(path: string): number {
  const file = readFileSync(path);
  const text = new Uint8Array(file.buffer, file.byteOffset, file.byteLength);
  // A guess of one number per 8 bytes, doubled when short: the floor holds no more than it must.
  let out = new Float64Array(Math.max(1024, Math.ceil(text.length / 8)));
  let n = 0;
  const len = text.length;
  let i = 0;
  while (i < len) {
    let c = text[i];
    if (c === 35 /* # */) {
      const e = text.indexOf(10, i);
      i = e < 0 ? len : e + 1;
      continue;
    }
    const neg = c === 45;
    if (neg || c === 43) c = text[++i];
    if ((c < 48 || c > 57) && c !== 46) {
      i++;
      continue;
    }
    let m = 0;
    let scale = 0;
    while (c >= 48 && c <= 57) {
      m = m * 10 + (c - 48);
      c = text[++i];
    }
    if (c === 46) {
      c = text[++i];
      while (c >= 48 && c <= 57) {
        m = m * 10 + (c - 48);
        scale++;
        c = text[++i];
      }
    }
    if (c === 101 || c === 69) {
      c = text[++i];
      const eneg = c === 45;
      if (eneg || c === 43) c = text[++i];
      let e = 0;
      while (c >= 48 && c <= 57) {
        e = e * 10 + (c - 48);
        c = text[++i];
      }
      scale += eneg ? e : -e;
    }
    const v = scale > 0 ? m / (POW10[scale] ?? 10 ** scale) : scale < 0 ? m * (POW10[-scale] ?? 10 ** -scale) : m;
    if (n === out.length) {
      const bigger = new Float64Array(out.length * 2);
      bigger.set(out);
      out = bigger;
    }
    out[n++] = neg ? -v : v;
  }
  return n;
}

async function runPhase(phase: Phase, path: string): Promise<PhaseResult> {
  const gc = (globalThis as { gc?: () => void }).gc;
  // Import before the baseline so module code is not counted.
  const { parseBandFile } = await import('../lib/parsers');
  let screen: ((d: Dispersion) => unknown) | null = null;
  if (phase === 'screen') screen = (await import('../lib/checks')).screen;
  gc?.();
  const rssBefore = process.memoryUsage().rss;
  const peakBefore = process.resourceUsage().maxRSS * 1024;
  const t0 = performance.now();
  let values: number;
  if (phase === 'floor') {
    values = floor(path);
  } else {
    const d = parseBandFile(readFileSync(path), { filename: path });
    values = d.nq * d.nb;
    if (screen) screen(d);
  }
  const ms = performance.now() - t0;
  return { ms, values, rssBefore, peakBefore, peakRss: process.resourceUsage().maxRSS * 1024 };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const mb = (bytes: number) => `${(bytes / 2 ** 20).toFixed(1)} MiB`;

function child(phase: Phase, path: string): PhaseResult {
  const script = fileURLToPath(import.meta.url);
  const r = spawnSync(process.execPath, ['--expose-gc', '--import', 'tsx', script, '--phase', phase, '--file', path], {
    encoding: 'utf8',
    maxBuffer: 1 << 20,
  });
  if (r.status !== 0) throw new Error(`phase ${phase} on ${path} failed:\n${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop()!) as PhaseResult;
}

async function main(argv: string[]) {
  const pi = argv.indexOf('--phase');
  if (pi >= 0) {
    const phase = argv[pi + 1] as Phase;
    const path = argv[argv.indexOf('--file') + 1];
    process.stdout.write(`${JSON.stringify(await runPhase(phase, path))}\n`);
    return;
  }
  const ri = argv.indexOf('--runs');
  const runs = ri >= 0 ? Math.max(1, Number(argv[ri + 1]) || 3) : 3;
  const dir = mkdtempSync(join(tmpdir(), 'branchwise-bench-'));
  try {
    const files = [
      // The issue's targets are for the columns file; the YAML goal is ours (the yaml package reads the remainder).
      { name: 'columns', path: join(dir, 'big.txt'), make: () => writeColumns(benchSpectrum(400, 1500), { digits: 11 }), time: 2, memory: 4, goal: 'target' },
      { name: 'yaml', path: join(dir, 'mid.yaml'), make: () => writeYaml(benchSpectrum(40, 1500), { digits: 8 }), time: 10, memory: 10, goal: 'goal' },
    ];
    console.log(`bench:screen — ${runs} run(s) per phase, median; Node ${process.version}; files in ${dir}`);
    console.log('floor: a tight loop over the file\'s bytes (no string), every number into a Float64Array; parse gets the same bytes');
    for (const file of files) {
      writeFileSync(file.path, file.make());
      const results: Record<Phase, PhaseResult[]> = { floor: [], parse: [], screen: [] };
      for (let r = 0; r < runs; r++) for (const phase of PHASES) results[phase].push(child(phase, file.path));
      const values = results.parse[0].values;
      const payload = values * 8;
      const t = Object.fromEntries(PHASES.map((p) => [p, median(results[p].map((x) => x.ms))])) as Record<Phase, number>;
      const mem = Object.fromEntries(PHASES.map((p) => [p, median(results[p].map((x) => x.peakRss - x.rssBefore))])) as Record<Phase, number>;
      console.log(`\n${file.name}: ${mb(statSync(file.path).size)}, ${values.toLocaleString('en')} values (floor counted ${results.floor[0].values.toLocaleString('en')} numbers incl. q/distance), Float64 payload ${mb(payload)}`);
      const text = readFileSync(file.path, 'utf8');
      // V8 keeps a string in one byte per character only while every character is Latin-1.
      const wide = /[^\u0000-\u00ff]/.test(text);
      console.log(`  the file as a JS string would take ${mb(text.length * (wide ? 2 : 1))} (${wide ? 'two bytes per character: it holds a non-Latin-1 character such as Γ' : 'one byte per character'}); the columns reader never makes one`);
      console.log('  phase            time     ×floor   peak above baseline   ×payload');
      for (const p of PHASES) {
        const label = p === 'screen' ? 'parse + checks' : p;
        console.log(`  ${label.padEnd(15)} ${`${t[p].toFixed(0)} ms`.padStart(8)}  ${(t[p] / t.floor).toFixed(2).padStart(6)}   ${mb(mem[p]).padStart(19)}   ${(mem[p] / payload).toFixed(2).padStart(8)}`);
      }
      const hidden = PHASES.filter((p) => results[p].some((x) => x.peakRss <= x.peakBefore));
      if (hidden.length) console.log(`  note: in ${hidden.join(', ')} the process peak came before the phase (imports); the figure is a lower bound`);
      const okTime = t.screen <= file.time * t.floor;
      const okMem = mem.screen <= file.memory * payload;
      console.log(`  ${file.goal}: parse + checks ≤ ${file.time} × floor → ${(t.screen / t.floor).toFixed(2)} ${okTime ? 'met' : 'NOT met'}; peak memory ≤ ${file.memory} × payload → ${(mem.screen / payload).toFixed(2)} ${okMem ? 'met' : 'NOT met'}`);
    }
  } finally {
    if (!argv.includes('--keep')) rmSync(dir, { recursive: true, force: true });
  }
}

main(process.argv.slice(2)).catch((e) => {
  console.error(`bench:screen: ${(e as Error).message}`);
  process.exitCode = 1;
});
