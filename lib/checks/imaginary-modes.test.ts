import { describe, expect, it } from 'vitest';
import { pathGeometry } from '../physics/path';
import { imaginaryModes } from './imaginary-modes';
import { defaultPolicy } from './policy';
import type { Lattice, Vec3 } from '../dispersion/types';
import { A_SC, buildMesh, buildPath, scPath, setFrequency } from './test-spectra';

const run = (d: ReturnType<typeof buildPath>) => imaginaryModes(d, pathGeometry(d), defaultPolicy);

describe('imaginary-modes', () => {
  it('finds nothing in a clean spectrum', () => {
    expect(run(buildPath(scPath()))).toEqual([]);
  });

  it('warns for a shallow dip confined to 10 % of the segment next to Γ (common practice, physics-ref §7)', () => {
    const d = buildPath(scPath());
    // Γ–X has 41 points; 10 % of its length is 4 steps.
    setFrequency(d, 1, 0, -0.12);
    setFrequency(d, 2, 0, -0.2);
    setFrequency(d, 3, 0, -0.08);
    const f = run(d);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ check: 'imaginary-modes', severity: 'warn', segment: 0, index: 2, branch: 0, value: -0.2, limit: -0.05 });
    expect(f[0].q).toEqual([0, 0.025, 0]);
    expect(f[0].message).toMatch(/noise/);
    expect(f[0].message).toMatch(/real physics.*reviewer decides/);
  });

  it('treats the Γ end of a segment that runs towards Γ the same way', () => {
    const d = buildPath(scPath()); // segment 2 is M–Γ, points 82..122
    setFrequency(d, 121, 0, -0.3);
    expect(run(d)).toMatchObject([{ severity: 'warn', segment: 2, index: 121 }]);
  });

  it('fails a near-Γ dip deeper than 0.5 THz', () => {
    const d = buildPath(scPath());
    setFrequency(d, 2, 0, -0.6);
    expect(run(d)).toMatchObject([{ severity: 'fail', index: 2, value: -0.6 }]);
    expect(run(d)[0].message).toMatch(/deeper than 0.5 THz/);
  });

  it('fails a shallow dip that reaches beyond 10 % of the segment', () => {
    const d = buildPath(scPath());
    for (let i = 1; i <= 6; i++) setFrequency(d, i, 0, -0.1);
    const f = run(d);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'fail', index: 1, branch: 0 });
  });

  it('fails a dip away from Γ and ignores values between −0.05 THz and 0', () => {
    const d = buildPath(scPath());
    setFrequency(d, 60, 0, -0.2); // middle of X–M
    setFrequency(d, 20, 0, -0.04); // middle of Γ–X, above the threshold
    const f = run(d);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'fail', segment: 1, index: 60, branch: 0, value: -0.2 });
  });

  it('reports one finding per run and branch, split by a path break', () => {
    const legs = scPath();
    legs[0].broken = true; // break between Γ–X and X–M
    const d = buildPath(legs);
    // Branch 0 imaginary at the end of segment 0 and the start of segment 1 (X written twice).
    for (const i of [39, 40, 41, 42]) setFrequency(d, i, 0, -1);
    for (const i of [39, 40]) setFrequency(d, i, 1, -0.9);
    const f = run(d);
    expect(f.map((x) => [x.segment, x.branch])).toEqual([
      [0, 0],
      [0, 1],
      [1, 0],
    ]);
    // Connected instead: one run over the join.
    const c = buildPath(scPath());
    for (const i of [39, 40, 41, 42]) setFrequency(c, i, 0, -1);
    expect(run(c)).toHaveLength(1);
  });

  it('suggests the supercell length 2π/Δq for a soft mode of known q-extent', () => {
    // Branch 0 is imaginary exactly for 0.4 < t < 0.6 along X–M (t = fraction of the leg),
    // continuous and positive elsewhere.
    // |X–M| = 0.5 × 2π/a, so Δq = 0.2 × π/a and 2π/Δq = 10 a = 40 Å for a = 4 Å.
    const legs = scPath();
    const d = buildPath(legs, {
      omega: (f, i) => {
        const base = [2, 3, 4, 12, 13, 14];
        const t = i >= 41 && i <= 81 ? (i - 41) / 40 : -1;
        if (t >= 0.3 && t <= 0.7) base[0] = -2 * Math.sin((Math.PI * (t - 0.4)) / 0.2);
        return base;
      },
    });
    const f = run(d);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'fail', segment: 1, index: 61, branch: 0, value: -2 });
    const dq = 0.2 * (Math.PI / A_SC);
    expect(f[0].message).toContain(`Δq ≈ ${Number(dq.toFixed(3))} 1/Å`);
    expect(f[0].message).toContain(`2π/Δq ≈ ${Number(((2 * Math.PI) / dq).toFixed(1))} Å`);
    expect(f[0].message).toContain('40 Å');
    expect(f[0].message).toContain("from about q = (0.2, 0.5, 0) to q = (0.3, 0.5, 0)");
    expect(f[0].message).toMatch(/X–M/);
    expect(f[0].message).toMatch(/real physics.*reviewer decides/);
  });

  it('gives no length in Å when the path distance is not Cartesian', () => {
    const d = buildPath(scPath(), { distancesOnly: true, lattice: null });
    setFrequency(d, 60, 0, -1);
    const f = run(d);
    expect(f).toMatchObject([{ severity: 'fail', q: null }]);
    expect(f[0].message).not.toMatch(/Å/);
    expect(f[0].message).toMatch(/increase the supercell/);
  });

  it('respects the policy', () => {
    const d = buildPath(scPath());
    setFrequency(d, 60, 0, -0.2);
    const p = { ...defaultPolicy, imaginaryModes: { ...defaultPolicy.imaginaryModes, threshold: 0.3 } };
    expect(imaginaryModes(d, pathGeometry(d), p)).toEqual([]);
    const off = { ...defaultPolicy, imaginaryModes: { ...defaultPolicy.imaginaryModes, enabled: false } };
    expect(imaginaryModes(d, pathGeometry(d), off)).toEqual([]);
  });

  describe('on a mesh', () => {
    const runMesh = (d: ReturnType<typeof buildMesh>) => imaginaryModes(d, pathGeometry(d), defaultPolicy);
    const severities = (d: ReturnType<typeof buildMesh>) => Object.fromEntries(runMesh(d).map((f) => [f.index, f.severity]));

    it('warns for a shallow dip within 10 % of the way from Γ to the zone boundary, fails beyond', () => {
      // Simple cubic: the boundary is at ½ along each axis, at (½, ½, ½) along the diagonal.
      const qs: Vec3[] = [[0, 0, 0], [0.05, 0, 0], [0, 0.06, 0], [0.05, 0.05, 0.05], [0.04, -0.03, 0.02], [0.3, 0.2, 0], [0.95, 0, 0]];
      const d = buildMesh(qs);
      for (let i = 0; i < qs.length; i++) setFrequency(d, i, 0, -0.2);
      // (0.95, 0, 0) folds to (−0.05, 0, 0): near.
      expect(severities(d)).toEqual({ 0: 'warn', 1: 'warn', 2: 'fail', 3: 'warn', 4: 'warn', 5: 'fail', 6: 'warn' });
      const near = runMesh(d).find((f) => f.index === 1)!;
      expect(near).toMatchObject({ check: 'imaginary-modes', branch: 0, value: -0.2, limit: -0.05, q: [0.05, 0, 0] });
      expect(near.message).toContain('within 10 % of the way from Γ to the zone boundary');
      expect(near.message).toMatch(/noise/);
      expect(runMesh(d).find((f) => f.index === 5)!.message).toMatch(/away from Γ/);
    });

    it('fails a near-Γ point deeper than 0.5 THz, and ignores values above −0.05 THz', () => {
      const d = buildMesh([[0.02, 0, 0], [0.03, 0, 0], [0.25, 0.25, 0]]);
      setFrequency(d, 0, 0, -0.6);
      setFrequency(d, 1, 0, -0.04);
      setFrequency(d, 2, 0, -0.04);
      expect(runMesh(d)).toMatchObject([{ index: 0, severity: 'fail', value: -0.6 }]);
      expect(runMesh(d)[0].message).toMatch(/deeper than 0.5 THz/);
    });

    it('measures |q| with the reciprocal metric when the lattice is known, else in fractional coordinates', () => {
      // fcc (a = 3.6 Å): fractional (0.04, 0.04, −0.04) is 4/3 × 0.1 of the way to the boundary
      // in the lattice metric, but only 0.08 of the cube [−½, ½]³ in fractional terms.
      const fcc: Lattice = [[0, 1.8, 1.8], [1.8, 0, 1.8], [1.8, 1.8, 0]];
      const q: Vec3[] = [[0.04, 0.04, -0.04], [0.04, 0.04, 0.04]];
      const withLattice = buildMesh(q, { lattice: fcc });
      const without = buildMesh(q, { lattice: null });
      for (const d of [withLattice, without]) for (let i = 0; i < 2; i++) setFrequency(d, i, 0, -0.1);
      // (0.04, 0.04, 0.04) points at L: 0.08 of the way in both measures.
      expect(severities(withLattice)).toEqual({ 0: 'fail', 1: 'warn' });
      expect(severities(without)).toEqual({ 0: 'warn', 1: 'warn' });
    });

    it('with Cartesian q and no lattice only Γ itself is near', () => {
      const d = buildMesh([[0, 0, 0], [0.01, 0, 0]], { lattice: null, coordinates: 'cartesian' });
      setFrequency(d, 0, 0, -0.2);
      setFrequency(d, 1, 0, -0.2);
      expect(severities(d)).toEqual({ 0: 'warn', 1: 'fail' });
    });

    it('follows the policy fraction', () => {
      const d = buildMesh([[0.08, 0, 0]]);
      setFrequency(d, 0, 0, -0.2);
      expect(severities(d)).toEqual({ 0: 'fail' });
      const wide = { ...defaultPolicy, imaginaryModes: { ...defaultPolicy.imaginaryModes, nearGammaFraction: 0.2 } };
      expect(imaginaryModes(d, pathGeometry(d), wide)).toMatchObject([{ severity: 'warn' }]);
      expect(imaginaryModes(d, pathGeometry(d), wide)[0].message).toContain('within 20 % of the way');
    });
  });
});
