/**
 * Parse speed of the columns reader against a plain "read the file and Number() every token"
 * loop, on 2,000 q-points × 1,500 branches (~35 MB). Run: npx tsx lib/parsers/columns.bench.ts
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseColumns } from './columns';

const NQ = 2000;
const NB = 1500;

function median(f: () => unknown, reps = 7): number {
  const ts: number[] = [];
  for (let i = 0; i < reps; i++) {
    const t = performance.now();
    f();
    ts.push(performance.now() - t);
  }
  ts.sort((a, b) => a - b);
  return ts[reps >> 1];
}

const dir = mkdtempSync(join(tmpdir(), 'bw-bench-'));
try {
  for (const sorted of [true, false]) {
    const lines: string[] = ['# units: THz', '# columns: distance'];
    let s = 1;
    for (let i = 0; i < NQ; i++) {
      const v: number[] = [];
      for (let k = 0; k < NB; k++) {
        s = (s * 16807) % 2147483647;
        v.push((s / 2147483647) * 60 - 1);
      }
      if (sorted) v.sort((a, b) => a - b);
      lines.push([(i * 0.001).toFixed(6), ...v.map((x) => x.toFixed(8))].join(' '));
    }
    const file = join(dir, 'bench.dat');
    writeFileSync(file, lines.join('\n') + '\n');
    const read = () => readFileSync(file, 'utf8');
    const baseline = median(() => {
      let sum = 0;
      for (const line of read().split('\n')) {
        if (line === '' || line[0] === '#') continue;
        for (const tok of line.split(' ')) sum += Number(tok);
      }
      return sum;
    });
    const ours = median(() => parseColumns(read()));
    const mb = (read().length / 1e6).toFixed(1);
    console.log(
      `${sorted ? 'sorted rows ' : 'shuffled rows'} ${mb} MB: read + Number() loop ${baseline.toFixed(0)} ms, ` +
        `read + parseColumns ${ours.toFixed(0)} ms, ratio ${(ours / baseline).toFixed(2)}`,
    );
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
