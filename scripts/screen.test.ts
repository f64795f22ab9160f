/**
 * The real command as a child process: one run per exit code, the JSON on stdout, errors on stderr.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = join(import.meta.dirname, '..');
const tsx = join(root, 'node_modules/.bin/tsx');
let dir: string;

function screen(...args: string[]) {
  const r = spawnSync(tsx, ['scripts/screen.ts', ...args], { cwd: root, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

// Monatomic-chain law along Γ–X of a simple cubic cell, a = 4 Å: ω = ω_max |sin(π ξ)|
// (Kittel, Introduction to Solid State Physics, ch. 4), written in cm-1.
function chain(mutate: (w: number[], i: number) => number[] = (w) => w): string {
  const rows = [0, 0.125, 0.25, 0.375, 0.5].map((x, i) => {
    const s = Math.sin(Math.PI * x);
    const w = mutate([100 * s, 100 * s, 180 * s], i);
    return `0 ${x} 0  ${w.map((v) => v.toFixed(4)).join(' ')}`;
  });
  return ['# units: cm-1', '# columns: q', '# lattice: 4 0 0 ; 0 4 0 ; 0 0 4', '# labels: 0=Γ 4=X', ...rows, ''].join('\n');
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'screen-cli-'));
  writeFileSync(join(dir, 'clean.txt'), chain());
  // A residual of 2 cm-1 (0.06 THz) on the acoustic branches at Γ: a warning.
  writeFileSync(join(dir, 'warn.txt'), chain((w, i) => (i === 0 ? [2, 2, 2] : w)));
  writeFileSync(join(dir, 'soft.txt'), chain((w, i) => (i === 2 ? [-60, w[1], w[2]] : w)));
  writeFileSync(join(dir, 'broken.txt'), chain().replace('0 0.25 0 ', '0 0.2x5 0 '));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('npm run screen', () => {
  it('exit 0 and a readable report for a clean file', () => {
    const r = screen(join(dir, 'clean.txt'));
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Verdict: PASS/);
    expect(r.stdout).toMatch(/a flagged soft mode may be a\s+real instability/);
    expect(r.stderr).toBe('');
  });

  it('exit 0 for a warning', () => {
    const r = screen(join(dir, 'warn.txt'), '--json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ verdict: 'warn', findings: [{ check: 'acoustic-gamma', severity: 'warn', index: 0 }] });
  });

  it('exit 1 for a fail; --json prints exactly one JSON object in the spec\'s shape', () => {
    const r = screen(join(dir, 'soft.txt'), '--json');
    expect(r.code).toBe(1);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(['format', 'qpoints', 'branches', 'segments', 'verdict', 'findings', 'folded']);
    expect(out).toMatchObject({ format: 'columns', qpoints: 5, branches: 3, segments: 1, verdict: 'fail', folded: [] });
    expect(out.findings[0]).toMatchObject({ check: 'imaginary-modes', severity: 'fail', segment: 0, index: 2, branch: 0, q: [0, 0.25, 0], limit: -0.05 });
    expect(out.findings[0].value).toBeCloseTo(-60 / 33.35641, 5); // CODATA 2018: 1 THz = 33.35641 cm-1
  });

  it('overrides from the command line reach the checks', () => {
    const r = screen(join(dir, 'clean.txt'), '--json', '--atoms', '2');
    expect(r.code).toBe(1);
    expect(JSON.parse(r.stdout).findings).toMatchObject([{ check: 'branch-count' }]);
    const t = screen(join(dir, 'clean.txt'), '--json', '--units', 'THz');
    expect(JSON.parse(t.stdout).findings).toMatchObject([{ check: 'units-suspect' }]); // 180 read as THz
  });

  it('exit 2 for unreadable input, naming line and column on stderr', () => {
    const r = screen(join(dir, 'broken.txt'), '--json');
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/broken\.txt: line 7, column 3: expected a number, found "0\.2x5"/);
    const missing = screen(join(dir, 'nope.txt'));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/cannot read .*nope\.txt: no such file/);
  });

  it('exit 2 for bad arguments', () => {
    const r = screen(join(dir, 'clean.txt'), '--units', 'Hz');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--units: expected THz, cm-1 or meV/);
    expect(r.stderr).toMatch(/Usage:/);
    expect(screen().code).toBe(2);
  });
});
