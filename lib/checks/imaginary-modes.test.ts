import { describe, expect, it } from 'vitest';
import { pathGeometry } from '../physics/path';
import { imaginaryModes } from './imaginary-modes';
import { defaultPolicy } from './policy';
import { A_SC, buildPath, scPath, setFrequency } from './test-spectra';

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
});
