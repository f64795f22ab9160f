import { describe, expect, it } from 'vitest';
import { pathDispersion } from './model';
import { rocksaltModel } from './rocksalt';

const THZ = 15.6333042399; // physics-ref §1.2

describe('rocksalt-type two-atom model', () => {
  it('has three zero acoustic modes and a triple TO mode √(2k1(1/M1 + 1/M2)) at Γ (acoustic sum rule by construction)', () => {
    const m = rocksaltModel({ k1: 1.5, M1: 23, M2: 35.5 });
    const f = m.frequencies([0, 0, 0]);
    for (let b = 0; b < 3; b++) expect(Math.abs(f[b])).toBeLessThan(1e-4); // float64 floor, physics-ref §7
    // Six A–B springs along the cube axes: Σ k d̂d̂ = 2k1 per Cartesian direction.
    const to = Math.sqrt(2 * 1.5 * (1 / 23 + 1 / 35.5)) * THZ;
    for (let b = 3; b < 6; b++) expect(f[b]).toBeCloseTo(to, 8);
  });

  it('splits LO from TO near Γ when polar, ω_LO² = ω_TO² + S(1/M1 + 1/M2), in every direction', () => {
    const S = 3.75;
    const m = rocksaltModel({ polar: true, polarStrength: S });
    const to2 = 2 * 1.5 * (1 / 23 + 1 / 35.5);
    const lo = Math.sqrt(to2 + S * (1 / 23 + 1 / 35.5)) * THZ;
    for (const q of [[1e-7, 0, 1e-7], [1e-7, 1e-7, 1e-7], [0.75e-7, 0.75e-7, 1.5e-7]] as [number, number, number][]) {
      const f = m.frequencies(q);
      expect(f[5]).toBeCloseTo(lo, 5);
      expect(f[3]).toBeCloseTo(Math.sqrt(to2) * THZ, 5);
      expect(f[4]).toBeCloseTo(Math.sqrt(to2) * THZ, 5);
    }
    expect(lo / (Math.sqrt(to2) * THZ)).toBeCloseTo(1.5, 10);
  });

  it("writes the analytic part only at Γ by default (a jump at Γ), or the approach direction's LO with gamma: 'approach'", () => {
    const analytic = pathDispersion(rocksaltModel({ polar: true }), { points: 41 });
    const jump = analytic.frequencies[1 * 6 + 5] - analytic.frequencies[0 * 6 + 5];
    expect(jump).toBeGreaterThan(2);
    const approach = pathDispersion(rocksaltModel({ polar: true, gamma: 'approach' }), { points: 41 });
    expect(Math.abs(approach.frequencies[1 * 6 + 5] - approach.frequencies[5])).toBeLessThan(0.2);
    expect(approach.polar).toBe(true);
  });

  it('is periodic: ω(q + G) = ω(q), also with the polar term', () => {
    const m = rocksaltModel({ polar: true });
    for (const q of [[0.1, 0.02, -0.05], [0.3, 0.4, 0.1]] as [number, number, number][]) {
      const f0 = m.frequencies(q);
      const f1 = m.frequencies([q[0] + 1, q[1] - 2, q[2] + 1]);
      f0.forEach((v, i) => expect(f1[i]).toBeCloseTo(v, 8));
    }
  });
});
