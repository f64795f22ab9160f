import { describe, expect, it } from 'vitest';
import type { Dispersion, Vec3 } from '../dispersion/types';
import { pathGeometry } from '../physics/path';
import { THZ_TO_CM1, THZ_TO_MEV } from '../physics/units';
import { defaultPolicy } from './policy';
import { buildPath, scPath, spectrumAt, structure } from './test-spectra';
import { unitsSuspect } from './units-suspect';

const run = (d: Dispersion) => unitsSuspect(d, pathGeometry(d), defaultPolicy);

/** The file's numbers were in `written` but it declared `declared`: what the parser hands over, in "THz". */
function misdeclared(scale: number, written: 'THz' | 'cm-1' | 'meV', declared: 'THz' | 'cm-1' | 'meV'): Dispersion {
  // Factors CODATA 2018 (physics-ref §1.1): 1 THz = 33.356 cm-1 = 4.1357 meV.
  const f = { THz: 1, 'cm-1': THZ_TO_CM1, meV: THZ_TO_MEV };
  return buildPath(scPath(), {
    units: declared,
    omega: (q: Vec3) => spectrumAt(q, 6).map((w) => (w * scale * f[written]) / f[declared]),
  });
}

describe('units-suspect', () => {
  it('clean spectra in every unit give no finding, soft or stiff', () => {
    for (const unit of ['THz', 'cm-1', 'meV'] as const)
      for (const scale of [0.12, 1, 2.5]) expect(run(misdeclared(scale, unit, unit))).toEqual([]);
  });

  it('cm-1 written but THz declared: suggests cm-1 (factor 33.356)', () => {
    const f = run(misdeclared(1, 'cm-1', 'THz'));
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ check: 'units-suspect', severity: 'warn', limit: 140, index: 0, branch: 5 });
    expect(f[0].value).toBeCloseTo(17 * THZ_TO_CM1, 4);
    expect(f[0].message).toMatch(/^The largest \|ω\| is 567\.059 THz/);
    expect(f[0].message).toMatch(/Dividing by 33\.356 brings it to 17 THz: the values look like cm-1/);
  });

  it('cm-1 written but meV declared: suggests cm-1 (factor 8.0655)', () => {
    const f = run(misdeclared(1.5, 'cm-1', 'meV')); // 25.5 THz → 850.6 cm-1 → read as meV: 205.7 THz
    expect(f).toHaveLength(1);
    expect(f[0].message).toMatch(/Dividing by 8\.0655 brings it to 25\.5 THz: the values look like cm-1/);
  });

  it('THz written but cm-1 declared (a soft solid): suggests THz', () => {
    const f = run(misdeclared(0.25, 'THz', 'cm-1')); // 4.25 read as cm-1: 0.127 THz
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ limit: 0.3 });
    expect(f[0].message).toMatch(/below 0\.3 THz/);
    expect(f[0].message).toMatch(/Multiplying by 33\.356 brings it to 4\.25 THz: the values look like THz/);
  });

  it('a spectrum no usual factor rescues says so', () => {
    const f = run(misdeclared(1e-4, 'THz', 'THz'));
    expect(f[0].message).toMatch(/No usual factor/);
  });

  it('ω² written as ω: every acoustic branch grows as distance² from Γ', () => {
    const d = buildPath(scPath(), { omega: (q) => spectrumAt(q, 6).map((w) => Math.sign(w) * w * w) });
    const f = run(d).filter((x) => x.message.includes('ω² (eigenvalues)'));
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'warn', index: 0, segment: 0, limit: 1.7 });
    expect(f[0].message).toMatch(/p between 1\.9\d* and 2/);
    // The squared values also exceed 140 THz (17² = 289): the range finding points at the square root.
    const r = run(d).find((x) => x.limit === 140);
    expect(r?.message).toMatch(/square root, 17, is also plausible/);
  });

  it('a 2-D-like spectrum with one quadratic flexural branch is not flagged', () => {
    // Flexural branch ω ∝ q² (bending), the two in-plane acoustic branches linear.
    const d = buildPath(scPath(), {
      omega: (q) => {
        const s = structure(q);
        return [0.8 * s, Math.sqrt(4 * s), Math.sqrt(9 * s), 12, 13, 14];
      },
    });
    expect(run(d)).toEqual([]);
  });

  it('skips branches with fewer than 3 points in the fit window', () => {
    const d = buildPath(scPath(undefined, 11), { omega: (q) => spectrumAt(q, 6).map((w) => w * w) });
    expect(run(d).filter((x) => x.message.includes('ω² (eigenvalues)'))).toEqual([]);
  });
});
