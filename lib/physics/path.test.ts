import { describe, expect, it } from 'vitest';
import type { Dispersion, Lattice, Segment } from '../dispersion/types';
import { isGammaLabel, pathGeometry } from './path';
import { fracToCart, reciprocal } from './lattice';

// Si: a = 5.431 Å (physics-ref §3.1); fcc cell and points of Setyawan & Curtarolo 2010 (§6.2–6.3).
const a = 5.431;
const fcc: Lattice = [
  [0, a / 2, a / 2],
  [a / 2, 0, a / 2],
  [a / 2, a / 2, 0],
];
const P = {
  G: [0, 0, 0],
  X: [0.5, 0, 0.5],
  W: [0.5, 0.25, 0.75],
  K: [0.375, 0.375, 0.75],
  L: [0.5, 0.5, 0.5],
  U: [0.625, 0.25, 0.625],
};

function line(from: number[], to: number[], n: number): number[][] {
  return Array.from({ length: n + 1 }, (_, i) => from.map((f, c) => f + ((to[c] - f) * i) / n));
}

function make(partial: Partial<Dispersion> & { nq: number }): Dispersion {
  return {
    format: 'columns',
    kind: 'path',
    nb: 1,
    frequencies: new Float64Array(partial.nq),
    q: null,
    coordinates: 'fractional',
    distance: null,
    weights: null,
    lattice: null,
    units: 'THz',
    labels: new Map(),
    segments: [{ start: 0, end: partial.nq - 1, connectedToNext: false }],
    atoms: null,
    polar: false,
    acoustic: 1,
    metadata: {},
    ...partial,
  };
}

describe('pathGeometry', () => {
  it('measures Γ–X–W–K–Γ–L in Å⁻¹ like the tabulated Si path', () => {
    // physics-ref §6.3, segment lengths for Si (2π included): Γ–X 1.15691, X–W 0.57846,
    // W–K 0.40903, K–Γ 1.22709, Γ–L 1.00191 Å⁻¹.
    const pts = [
      ...line(P.G, P.X, 10),
      ...line(P.X, P.W, 5).slice(1),
      ...line(P.W, P.K, 4).slice(1),
      ...line(P.K, P.G, 10).slice(1),
      ...line(P.G, P.L, 8).slice(1),
    ];
    const d = make({ nq: pts.length, q: Float64Array.from(pts.flat()), lattice: fcc });
    const g = pathGeometry(d);
    expect(g.foldMode).toBe('lattice');
    expect(g.distance[10]).toBeCloseTo(1.15691, 4);
    expect(g.distance[15]).toBeCloseTo(1.15691 + 0.57846, 4);
    expect(g.distance[19]).toBeCloseTo(1.15691 + 0.57846 + 0.40903, 4);
    expect(g.distance[29]).toBeCloseTo(1.15691 + 0.57846 + 0.40903 + 1.22709, 4);
    expect(g.distance[37]).toBeCloseTo(1.15691 + 0.57846 + 0.40903 + 1.22709 + 1.00191, 4);
    expect(g.folded).toEqual([]); // every point of the standard path is inside or on the boundary
    expect(g.gamma[0]).toBe(1);
    expect(g.gamma[29]).toBe(1);
    expect(g.gamma.reduce((s, x) => s + x, 0)).toBe(2);
  });

  it('folds points outside the zone and reports them, with Cartesian q of the folded point', () => {
    const q = Float64Array.from([0, 0, 0, 0.4, 0.4, -0.4, 1, 1, 1]);
    const g = pathGeometry(make({ nq: 3, q, lattice: fcc }));
    expect(g.folded.map((f) => f.index)).toEqual([1, 2]);
    expect(g.folded[0].q).toEqual([0.4, 0.4, -0.4]);
    g.folded[0].folded.forEach((v, i) => expect(v).toBeCloseTo([0.4, 0.4, 0.6][i], 12));
    // (1, 1, 1) is a reciprocal-lattice vector: it folds to Γ.
    expect(Array.from(g.qFolded!.subarray(6, 9))).toEqual([0, 0, 0]);
    expect(g.gamma[2]).toBe(1);
    // |k| 0.8718 (2π/a) after folding (physics-ref §6.4).
    const k = g.qCart!.subarray(3, 6);
    expect(Math.hypot(k[0], k[1], k[2]) / ((2 * Math.PI) / a)).toBeCloseTo(0.8718, 4);
    // The distance follows q as given, not the folded q.
    const b = reciprocal(fcc);
    const c1 = fracToCart([0.4, 0.4, -0.4], b);
    expect(g.distance[1]).toBeCloseTo(Math.hypot(...c1), 12);
  });

  it('does not advance the distance across a break or a repeated point', () => {
    // Γ–X, repeated X, X–W, break, K–Γ (K | U style jump).
    const pts = [...line(P.G, P.X, 2), ...line(P.X, P.W, 2), ...line(P.U, P.X, 2)];
    const segments: Segment[] = [
      { start: 0, end: 2, connectedToNext: true },
      { start: 3, end: 5, connectedToNext: false },
      { start: 6, end: 8, connectedToNext: false },
    ];
    const g = pathGeometry(make({ nq: 9, q: Float64Array.from(pts.flat()), lattice: fcc, segments }));
    expect(g.distance[3]).toBe(g.distance[2]);
    expect(g.distance[6]).toBe(g.distance[5]);
    expect(g.distance[8]).toBeGreaterThan(g.distance[6]);
  });

  it('converts Cartesian q with the lattice, and cannot fold it without one', () => {
    const b = reciprocal(fcc);
    const fr = [
      [0, 0, 0],
      [0.4, 0.4, -0.4],
    ];
    const cart = Float64Array.from(fr.flatMap((f) => fracToCart(f, b)));
    const g = pathGeometry(make({ nq: 2, q: cart, coordinates: 'cartesian', lattice: fcc }));
    expect(g.qFrac![3]).toBeCloseTo(0.4, 12);
    expect(g.qFrac![5]).toBeCloseTo(-0.4, 12);
    expect(g.folded).toHaveLength(1);
    const h = pathGeometry(make({ nq: 2, q: cart, coordinates: 'cartesian' }));
    expect(h.foldMode).toBe('none');
    expect(h.qFrac).toBeNull();
    expect(h.qFolded).toBeNull();
    expect(h.gamma[0]).toBe(1);
    expect(h.distance[1]).toBeCloseTo(Math.hypot(...fracToCart([0.4, 0.4, -0.4], b)), 12);
  });

  it('folds component-wise without a lattice', () => {
    const g = pathGeometry(make({ nq: 2, q: Float64Array.from([0.4, 0.4, -0.4, 0.7, 0, 0]) }));
    expect(g.foldMode).toBe('componentwise');
    expect(g.folded.map((f) => f.index)).toEqual([1]);
    expect(g.qCart).toBeNull();
    expect(Array.from(g.distance)).toEqual([0, 1]);
  });

  it('uses the file distances, else the index; labels mark Γ', () => {
    const labels = new Map([
      [0, 'Gamma'],
      [2, 'X'],
      [3, '\\Gamma'],
    ]);
    const g = pathGeometry(make({ nq: 4, distance: Float64Array.from([0, 0.1, 0.3, 0.6]), labels }));
    expect(g.foldMode).toBe('none');
    expect(Array.from(g.distance)).toEqual([0, 0.1, 0.3, 0.6]);
    expect(Array.from(g.gamma)).toEqual([1, 0, 0, 1]);
    const segments: Segment[] = [
      { start: 0, end: 1, connectedToNext: false },
      { start: 2, end: 3, connectedToNext: false },
    ];
    expect(Array.from(pathGeometry(make({ nq: 4, segments })).distance)).toEqual([0, 1, 1, 2]);
  });
});

describe('isGammaLabel', () => {
  it('knows the spellings of band-files.md', () => {
    for (const s of ['Γ', 'G', 'Gamma', 'GAMMA', '\\Gamma', ' Γ ']) expect(isGammaLabel(s)).toBe(true);
    for (const s of ['X', 'g', 'GM', 'Γ|X', '']) expect(isGammaLabel(s)).toBe(false);
  });
});
