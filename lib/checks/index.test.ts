import { describe, expect, it } from 'vitest';
import {
  breakSumRule,
  injectSoftMode,
  MODEL_NAMES,
  modelSpectrum,
  noisePocketNearGamma,
  pushBeyondZone,
  scaleFrequencies,
  shiftSegment,
  squareFrequencies,
} from '../models';
import { ParseError } from '../parsers';
import { THZ_TO_CM1 } from '../physics/units';
import { pathGeometry } from '../physics/path';
import { compareFindings, screen, screenFile, verdictOf } from './index';
import { defaultPolicy } from './policy';
import { unitsSuspect } from './units-suspect';
import type { Finding } from './types';

const counted = (fs: Finding[]) => fs.filter((f) => f.severity !== 'info');

describe('screen on the model spectra', () => {
  for (const name of MODEL_NAMES)
    for (const polar of [false, true])
      it(`${name}${polar ? ' (polar where the model has it)' : ''}: clean, no warn or fail`, () => {
        const r = screen(modelSpectrum(name, { polar }));
        expect(counted(r.findings)).toEqual([]);
        expect(r.verdict).toBe('pass');
      });

  it('polar LO–TO jumps at Γ are info only when the file says polar', () => {
    const polar = modelSpectrum('cubic2', { polar: true });
    const r = screen(polar);
    const loto = r.findings.filter((f) => f.check === 'continuity');
    expect(loto.length).toBeGreaterThan(0);
    expect(loto.every((f) => f.severity === 'info')).toBe(true);
    // The same spectrum in a file that does not say polar: the jumps fail.
    const undeclared = screen({ ...polar, polar: false });
    expect(undeclared.verdict).toBe('fail');
    expect(undeclared.findings.filter((f) => f.check === 'continuity').map((f) => f.severity)).toEqual(loto.map(() => 'fail'));
  });

  const fcc = () => modelSpectrum('fcc');

  it('a soft mode away from Γ fails at its centre, with the supercell suggestion', () => {
    const d = fcc();
    const r = screen(injectSoftMode(d, { index: 60, depthTHz: 1.2, widthPoints: 4 }));
    const f = r.findings.filter((x) => x.check === 'imaginary-modes');
    expect(f).toMatchObject([{ severity: 'fail', index: 60, branch: 0, value: -1.2 }]);
    expect(f[0].message).toMatch(/2π\/Δq ≈ [\d.]+ Å/);
    expect(r.verdict).toBe('fail');
  });

  it('a broken sum rule warns at 0.05 THz and fails at 0.3 THz, at every Γ', () => {
    const warn = screen(breakSumRule(fcc(), { offsetTHz: 0.05 }));
    const ag = warn.findings.filter((f) => f.check === 'acoustic-gamma');
    expect(ag.length).toBeGreaterThan(0);
    expect(ag.every((f) => f.severity === 'warn' && f.value === 0.05)).toBe(true);
    expect(warn.verdict).toBe('warn');
    const fail = screen(breakSumRule(fcc(), { offsetTHz: 0.3 }));
    expect(fail.findings.filter((f) => f.check === 'acoustic-gamma').every((f) => f.severity === 'fail')).toBe(true);
  });

  it('a shifted segment fails continuity at its joins', () => {
    const d = fcc();
    const r = screen(shiftSegment(d, { segment: 1, deltaTHz: 0.7 }));
    const f = r.findings.filter((x) => x.check === 'continuity');
    expect(f.map((x) => [x.severity, x.index])).toEqual([
      ['fail', d.segments[1].start],
      ['fail', d.segments[2].start],
    ]);
  });

  it('points pushed beyond the zone are folded (info) and change nothing else', () => {
    const d = fcc();
    const r = screen(pushBeyondZone(d, { indices: [10, 11, 12], g: [1, 0, 0] }));
    expect(r.findings).toMatchObject([{ check: 'zone-folding', severity: 'info', index: 10 }]);
    expect(r.folded.map((f) => f.index)).toEqual([10, 11, 12]);
    expect(r.verdict).toBe('pass');
  });

  it('a shallow noise pocket near Γ only warns', () => {
    const r = screen(noisePocketNearGamma(fcc(), { depthTHz: 0.2 }));
    const f = r.findings.filter((x) => x.check === 'imaginary-modes');
    expect(f.length).toBeGreaterThan(0);
    expect(f.every((x) => x.severity === 'warn')).toBe(true);
    expect(r.verdict).toBe('warn');
  });

  it('THz values read as cm-1, and ω² written as ω, are caught by units-suspect', () => {
    // A THz file declared cm-1: the parser divides by 33.356 and the file says cm-1.
    const scaled = screen({ ...scaleFrequencies(fcc(), 1 / THZ_TO_CM1), units: 'cm-1' });
    expect(scaled.findings.find((f) => f.check === 'units-suspect')?.message).toMatch(/look like THz/);
    const squared = screen(squareFrequencies(fcc()));
    expect(squared.findings.some((f) => f.check === 'units-suspect' && /ω² \(eigenvalues\)/.test(f.message))).toBe(true);
  });
});

describe('one scan shared inside a run', () => {
  it('units-suspect reports the same largest |ω| inside screen() as on its own', () => {
    const d = scaleFrequencies(modelSpectrum('cubic2'), THZ_TO_CM1); // cm-1 numbers declared THz
    const alone = unitsSuspect(d, pathGeometry(d), defaultPolicy);
    const inRun = screen(d).findings.filter((f) => f.check === 'units-suspect');
    expect(inRun).toEqual(alone);
    expect(alone).toHaveLength(1);
  });
});

describe('verdictOf', () => {
  it('fail beats warn beats pass; waived findings do not count', () => {
    expect(verdictOf([])).toBe('pass');
    expect(verdictOf([{ severity: 'info' }])).toBe('pass');
    expect(verdictOf([{ severity: 'info' }, { severity: 'warn' }])).toBe('warn');
    expect(verdictOf([{ severity: 'warn' }, { severity: 'fail' }])).toBe('fail');
    expect(verdictOf([{ severity: 'warn' }, { severity: 'fail', waived: true }])).toBe('warn');
    expect(verdictOf([{ severity: 'warn', waived: true }, { severity: 'fail', waived: true }])).toBe('pass');
  });
});

describe('screen result', () => {
  it('has the spec\'s shape and sorts findings by index, branch, check', () => {
    const d = modelSpectrum('fcc');
    const bad = injectSoftMode(breakSumRule(d, { offsetTHz: 0.3 }), { index: 60, depthTHz: 1 });
    const r = screen({ ...bad, atoms: 2 });
    expect(Object.keys(r)).toEqual(['format', 'qpoints', 'branches', 'segments', 'verdict', 'findings', 'folded']);
    expect(r).toMatchObject({ format: d.format, qpoints: d.nq, branches: 3, segments: d.segments.length, verdict: 'fail' });
    expect(r.findings[0].check).toBe('branch-count'); // whole-file findings first
    expect([...r.findings].sort(compareFindings)).toEqual(r.findings);
    for (const f of r.findings)
      expect(Object.keys(f)).toEqual(['check', 'severity', 'segment', 'index', 'branch', 'q', 'value', 'limit', 'message']);
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it('applies a group policy', () => {
    const d = breakSumRule(modelSpectrum('fcc'), { offsetTHz: 0.05 });
    expect(screen(d).verdict).toBe('warn');
    expect(screen(d, { acousticGamma: { warn: 0.06, fail: 0.2 } }).verdict).toBe('pass');
    expect(screen(d, { acousticGamma: { enabled: false } }).verdict).toBe('pass');
    expect(() => screen(d, { acousticGamma: { warn: 0.5, fail: 0.2 } })).toThrow(/warn must be below fail/);
  });
});

describe('screenFile', () => {
  const file = [
    '# units: cm-1',
    '# columns: q',
    '# lattice: 4 0 0 ; 0 4 0 ; 0 0 4',
    '# labels: 0=Γ 4=X',
    ...[0, 0.125, 0.25, 0.375, 0.5].map((x) => {
      // Monatomic-chain law along Γ–X: ω = ω_max |sin(π x)| (Kittel ch. 4), 3 branches, in cm-1.
      const w = Math.sin(Math.PI * x);
      return `0 ${x} 0  ${(100 * w).toFixed(4)} ${(100 * w).toFixed(4)} ${(180 * w).toFixed(4)}`;
    }),
  ].join('\n');

  it('parses and screens', () => {
    const r = screenFile(file, { filename: 'chain.txt' });
    expect(r).toMatchObject({ format: 'columns', qpoints: 5, branches: 3, segments: 1, verdict: 'pass', findings: [] });
  });

  it('reads YAML too, and finds a mismatch at a connected join', () => {
    const yaml = (xEnd: string) =>
      [
        'format: branchwise-dispersion/1',
        'lattice: [[4, 0, 0], [0, 4, 0], [0, 0, 4]]',
        'segments:',
        '  - {from: Γ, to: X, q: [[0, 0, 0], [0, 0.25, 0], [0, 0.5, 0]], frequencies: [[0, 0, 0], [2.1, 2.1, 3.5], [3, 3, 5]]}',
        `  - {from: X, to: M, q: [[0, 0.5, 0], [0.25, 0.5, 0], [0.5, 0.5, 0]], frequencies: [${xEnd}, [3.5, 3.9, 5.5], [4, 4.5, 6]]}`,
      ].join('\n');
    expect(screenFile(yaml('[3, 3, 5]'), { filename: 'a.yaml' })).toMatchObject({ format: 'yaml', segments: 2, verdict: 'pass' });
    const r = screenFile(yaml('[3, 3, 6]'), { filename: 'a.yaml' });
    expect(r.findings).toMatchObject([{ check: 'continuity', severity: 'fail', segment: 1, index: 3, branch: 2, value: 1, limit: 0.06 }]);
  });

  it('passes overrides to the parser', () => {
    const r = screenFile(file, { filename: 'chain.txt', overrides: { atoms: 2 } });
    expect(r.findings).toMatchObject([{ check: 'branch-count', severity: 'fail' }]);
  });

  it('throws the parser\'s ParseError with line and column', () => {
    let err: unknown;
    try {
      screenFile(file.replace('0.375', '0.3x5'), { filename: 'chain.txt' });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(ParseError);
    expect((err as ParseError).line).toBe(8);
  });
});
