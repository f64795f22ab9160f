import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { fccLattice, fccModel, FCC_POINTS } from './fcc';
import { meshDispersion, pathDispersion } from './model';
import { isInsideFirstZone } from '../physics/fold';

const a = 3.6, M = 63.5, k = 1.7;
const model = fccModel({ a, M, k });
const THZ = 15.6333042399; // √(eV Å⁻² amu⁻¹) → THz, CODATA 2018 (physics-ref §1.2)

/**
 * Independent construction: D(q) = (k/M) Σ_R (1 − cos q·R) R̂R̂ over the 12 neighbours
 * (textbook real form of a one-atom central-force model), diagonalised by ml-matrix.
 */
function oracle(qFrac: [number, number, number]): number[] {
  const b = [[-1, 1, 1], [1, -1, 1], [1, 1, -1]].map((r) => r.map((x) => (2 * Math.PI * x) / a));
  const q = [0, 1, 2].map((c) => qFrac[0] * b[0][c] + qFrac[1] * b[1][c] + qFrac[2] * b[2][c]);
  const D = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  for (const [x, y, z] of [[1, 1, 0], [1, -1, 0], [-1, 1, 0], [-1, -1, 0], [1, 0, 1], [1, 0, -1], [-1, 0, 1], [-1, 0, -1], [0, 1, 1], [0, 1, -1], [0, -1, 1], [0, -1, -1]]) {
    const R = [(x * a) / 2, (y * a) / 2, (z * a) / 2];
    const u = R.map((r) => r / Math.hypot(...R));
    const w = (k / M) * (1 - Math.cos(q[0] * R[0] + q[1] * R[1] + q[2] * R[2]));
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) D[i][j] += w * u[i] * u[j];
  }
  const e = new EigenvalueDecomposition(new Matrix(D), { assumeSymmetric: true });
  return [...e.realEigenvalues].sort((p, r) => p - r).map((l) => Math.sign(l) * Math.sqrt(Math.abs(l)) * THZ);
}

describe('fcc nearest-neighbour model', () => {
  it('agrees with an independent dynamical matrix diagonalised by ml-matrix', () => {
    fc.assert(
      fc.property(fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true })), (q) => {
        const ours = model.frequencies(q);
        oracle(q).forEach((v, i) => expect(Math.abs(ours[i] - v)).toBeLessThan(1e-6));
      }),
      { seed: 424242, numRuns: 200 },
    );
  });

  it('is periodic in the reciprocal lattice: ω(q + G) = ω(q) at random q (physics-ref §6.4)', () => {
    fc.assert(
      fc.property(
        fc.tuple(fc.double({ min: -0.6, max: 0.6, noNaN: true }), fc.double({ min: -0.6, max: 0.6, noNaN: true }), fc.double({ min: -0.6, max: 0.6, noNaN: true })),
        fc.tuple(fc.integer({ min: -3, max: 3 }), fc.integer({ min: -3, max: 3 }), fc.integer({ min: -3, max: 3 })),
        (q, g) => {
          const w0 = model.frequencies(q);
          const w1 = model.frequencies([q[0] + g[0], q[1] + g[1], q[2] + g[2]]);
          w0.forEach((v, i) => expect(Math.abs(w1[i] - v)).toBeLessThan(1e-6));
        },
      ),
      { seed: 1729, numRuns: 200 },
    );
  });

  it('has ω² = 8k/M (L) and 4k/M (T, ×2) at X', () => {
    // At X = (0, 2π/a, 0): 8 neighbours with q·R = ±π give (1 − cos) = 2; R̂_y² = ½ → D_yy = 8k/M, D_xx = D_zz = 4k/M.
    const f = model.frequencies(FCC_POINTS.X);
    expect(f[2]).toBeCloseTo(Math.sqrt((8 * k) / M) * THZ, 8);
    expect(f[0]).toBeCloseTo(Math.sqrt((4 * k) / M) * THZ, 8);
    expect(f[1]).toBeCloseTo(Math.sqrt((4 * k) / M) * THZ, 8);
  });

  it('gives equal spectra at K and U (K − U is a reciprocal-lattice vector up to cubic symmetry, physics-ref §6.4)', () => {
    const fk = model.frequencies(FCC_POINTS.K);
    const fu = model.frequencies(FCC_POINTS.U);
    fk.forEach((v, i) => expect(fu[i]).toBeCloseTo(v, 8));
  });

  it('builds the path Γ–X–W–K–Γ–L with repeated joins and zero at both Γ', () => {
    const d = pathDispersion(model, { points: 21 });
    expect(d.segments.map((s) => `${s.from}-${s.to}`)).toEqual(['Γ-X', 'X-W', 'W-K', 'K-Γ', 'Γ-L']);
    for (let s = 0; s + 1 < d.segments.length; s++) {
      expect(d.segments[s + 1].start).toBe(d.segments[s].end + 1);
      expect(d.segments[s].connectedToNext).toBe(true);
    }
    expect(d.segments[4].connectedToNext).toBe(false);
    for (const i of [0, d.segments[3].end, d.segments[4].start]) {
      for (let b = 0; b < 3; b++) expect(Math.abs(d.frequencies[i * 3 + b])).toBeLessThan(1e-4);
    }
    expect(d.lattice).toEqual(fccLattice(a));
  });

  it('builds a Γ-centred mesh with unit weights', () => {
    const d = meshDispersion(model, { mesh: [4, 4, 4] });
    expect(d.kind).toBe('mesh');
    expect(d.nq).toBe(64);
    expect([...d.weights!].every((w) => w === 1)).toBe(true);
    expect([...d.q!.subarray(0, 3)]).toEqual([0, 0, 0]);
    // Every point folded into the first zone: |q| no longer than that of any image.
    for (let i = 0; i < d.nq; i++) {
      const q = d.q!.subarray(i * 3, i * 3 + 3);
      expect(isInsideFirstZone(q, d.lattice!)).toBe(true);
    }
  });
});
