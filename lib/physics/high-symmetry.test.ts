import { describe, expect, it } from 'vitest';
import type { Lattice, Vec3 } from '../dispersion/types';
import { fracToCart, norm, reciprocal } from './lattice';
import { latticeType } from './lattice-type';
import { standardName, standardPoints } from './high-symmetry';

// SC2010 primitive cells (physics-ref §6.2); lengths of §6.3 in units of 2π/a.
const a = 5.431;
const h = a / 2;
const cells: Record<string, Lattice> = {
  sc: [[a, 0, 0], [0, a, 0], [0, 0, a]],
  fcc: [[0, h, h], [h, 0, h], [h, h, 0]],
  bcc: [[-h, h, h], [h, -h, h], [h, h, -h]],
};
const ha = 3.19;
const hc = 5.19;
const s3 = Math.sqrt(3) / 2;
const hex120: Lattice = [[ha / 2, -ha * s3, 0], [ha / 2, ha * s3, 0], [0, 0, hc]];
const hex60: Lattice = [[ha, 0, 0], [ha / 2, ha * s3, 0], [0, 0, hc]];

const len = (l: Lattice, f: Vec3) => norm(fracToCart(f, reciprocal(l)));

describe('standardPoints', () => {
  it('gives the |q| of physics-ref §6.3 (Setyawan & Curtarolo 2010) in 2π/a', () => {
    const unit = (2 * Math.PI) / a;
    const table: Record<string, Record<string, number>> = {
      sc: { Γ: 0, X: 0.5, M: 0.7071, R: 0.866 },
      fcc: { Γ: 0, X: 1, L: 0.866, W: 1.118, K: 1.0607, U: 1.0607 },
      bcc: { Γ: 0, H: 1, N: 0.7071, P: 0.866 },
    };
    for (const kind of ['sc', 'fcc', 'bcc'] as const) {
      const pts = standardPoints({ kind, a });
      expect(Object.fromEntries(pts.map((p) => [p.name, +(p.length / unit).toFixed(4)]))).toEqual(table[kind]);
    }
  });

  it('places each SC2010 fractional point at its tabulated length in the SC2010 cell', () => {
    for (const [kind, cell] of Object.entries(cells)) {
      const t = latticeType(cell)!;
      expect(t.kind).toBe(kind);
      for (const p of standardPoints(t)) expect(len(cell, p.frac)).toBeCloseTo(p.length, 10);
    }
    const t = latticeType(hex120)!;
    for (const p of standardPoints(t)) expect(len(hex120, p.frac)).toBeCloseTo(p.length, 10);
  });

  it('hexagonal: M = 2π/(√3 a), K = 4π/(3a), A = π/c in both in-plane conventions (physics-ref §6.4)', () => {
    const pts = Object.fromEntries(standardPoints(latticeType(hex60)!).map((p) => [p.name, p.length]));
    expect(pts.M).toBeCloseTo((2 * Math.PI) / (Math.sqrt(3) * ha), 12);
    expect(pts.K).toBeCloseTo((4 * Math.PI) / (3 * ha), 12);
    expect(pts.A).toBeCloseTo(Math.PI / hc, 12);
    expect(pts.L).toBeCloseTo(Math.hypot(pts.M, pts.A), 12);
    expect(pts.H).toBeCloseTo(Math.hypot(pts.K, pts.A), 12);
    // 60° cell: K is (1/3, -1/3, 0) (physics-ref §6.4).
    expect(len(hex60, [1 / 3, -1 / 3, 0])).toBeCloseTo(pts.K, 10);
    expect(len(hex60, [0.5, 0, 0])).toBeCloseTo(pts.M, 10);
    // 120° cell: K is (1/3, 1/3, 0) and (-1/3, 1/3, 0) is not K (physics-ref §6.4, "HEX convention trap").
    expect(len(hex120, [1 / 3, 1 / 3, 0])).toBeCloseTo(pts.K, 10);
    expect(Math.abs(len(hex120, [-1 / 3, 1 / 3, 0]) - pts.K)).toBeGreaterThan(0.1);
  });
});

describe('standardName', () => {
  it('reads every spelling of Γ of band-files.md and TeX decorations', () => {
    for (const s of ['Γ', 'G', 'Gamma', 'GAMMA', '\\Gamma', '$\\Gamma$', ' Γ ']) expect(standardName(s)).toBe('Γ');
    expect(standardName('$X$')).toBe('X');
    expect(standardName('\\mathrm{K}')).toBe('K');
    expect(standardName('x')).toBe('x');
  });
});
