import { describe, expect, it } from 'vitest';
import { diatomicChain, monatomicChain } from './chain';
import { pathDispersion } from './model';

// Closed forms: Kittel, Introduction to Solid State Physics, ch. 4 (monatomic and diatomic chain).
// Numbers: physics-ref §2.1–2.2 (C = 1 eV/Å², M = 1 amu, a = 1 Å, CODATA 2018).
const NU_MAX = 31.2666084797; // THz, 2√(C/M)/2π

describe('monatomic chain', () => {
  const chain = monatomicChain({ branches: 1 });
  const nu = (xi: number) => chain.frequencies([xi, 0, 0])[0];

  it('reaches ω(π/a) = 2√(C/M) at the zone boundary', () => {
    expect(nu(0.5)).toBeCloseTo(NU_MAX, 9);
  });

  it('follows 2√(C/M)|sin(qa/2)| (physics-ref §2.1 table)', () => {
    expect(nu(0)).toBe(0);
    expect(nu(0.1)).toBeCloseTo(9.661913, 6);
    expect(nu(0.25)).toBeCloseTo(22.108831, 6);
    for (let xi = 0; xi <= 0.5; xi += 0.03125) {
      expect(nu(xi)).toBeCloseTo(NU_MAX * Math.abs(Math.sin(Math.PI * xi)), 9);
    }
  });

  it('is periodic: ω(q + 2π/a) = ω(q)', () => {
    expect(nu(0.75)).toBeCloseTo(nu(-0.25), 10);
    expect(nu(0.75)).toBeCloseTo(22.108831, 6);
    expect(nu(1.5)).toBeCloseTo(NU_MAX, 9);
    expect(Math.abs(nu(1.0))).toBeLessThan(1e-6);
    for (const xi of [0.07, 0.21, 0.33, 0.49]) expect(nu(xi + 1)).toBeCloseTo(nu(xi), 9);
  });

  it('in its 3-D form has two transverse branches with C_T for C and one longitudinal', () => {
    const c3 = monatomicChain({ transverse: 0.25 });
    const f = c3.frequencies([0.5, 0, 0]);
    expect(f[0]).toBeCloseTo(NU_MAX / 2, 9); // 2√(C_T/M), C_T = C/4
    expect(f[1]).toBeCloseTo(NU_MAX / 2, 9);
    expect(f[2]).toBeCloseTo(NU_MAX, 9);
    expect(c3.atoms).toBe(1);
  });

  it('rejects a non-positive parameter', () => {
    expect(() => monatomicChain({ M: 0 })).toThrow(/M must be a positive number/);
  });
});

describe('diatomic chain (M1 = 1, M2 = 2 amu)', () => {
  const chain = diatomicChain({ branches: 2 });
  const f = (xi: number) => chain.frequencies([xi, 0, 0]);

  it('has the optical mode √(2C(1/M1 + 1/M2)) and an acoustic zero at Γ', () => {
    const g = f(0);
    expect(Math.abs(g[0])).toBeLessThan(1e-6); // round-off floor of a float64 eigen-solve (physics-ref §7)
    expect(g[1]).toBeCloseTo(27.0776772336, 9);
  });

  it('opens the zone-boundary gap between √(2C/M1) and √(2C/M2)', () => {
    const x = f(0.5);
    expect(x[0]).toBeCloseTo(15.6333042399, 9); // √(2C/M2)
    expect(x[1]).toBeCloseTo(22.1088308807, 9); // √(2C/M1)
  });

  it('matches the qa = π/2 values of physics-ref §2.2', () => {
    const x = f(0.25);
    expect(x[0]).toBeCloseTo(9.6619133767, 9);
    expect(x[1]).toBeCloseTo(25.2952176166, 9);
  });

  it('agrees with the closed form ω±² = C(1/M1+1/M2) ± C√((1/M1+1/M2)² − 4sin²(qa/2)/(M1M2)) everywhere', () => {
    const s = 1 / 1 + 1 / 2;
    for (let xi = -1; xi <= 1.5; xi += 0.0625) {
      const sin2 = Math.sin(Math.PI * xi) ** 2;
      const root = Math.sqrt(s * s - (4 * sin2) / 2);
      const factor = 15.6333042399; // √(eV Å⁻² amu⁻¹) → THz, physics-ref §1.2
      const x = f(xi);
      expect(x[0]).toBeCloseTo(Math.sqrt(Math.max(0, s - root)) * factor, 6);
      expect(x[1]).toBeCloseTo(Math.sqrt(s + root) * factor, 8);
    }
  });

  it('builds a path Γ–X with a valid Dispersion', () => {
    const d = pathDispersion(diatomicChain(), { points: 11 });
    expect(d.nq).toBe(11);
    expect(d.nb).toBe(6);
    expect(d.atoms).toBe(2);
    expect(d.labels.get(0)).toBe('Γ');
    expect(d.labels.get(10)).toBe('X');
    expect(d.distance![10]).toBeCloseTo(Math.PI, 12); // |b1|/2 = π/a with a = 1 Å
  });
});
