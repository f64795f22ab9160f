import { describe, expect, it } from 'vitest';
import type { Lattice } from '../dispersion/types';
import { cartToFrac, dot, fracToCart, parseLattice, readLattice, reciprocal } from './lattice';

// Primitive vectors of Setyawan & Curtarolo, Comput. Mater. Sci. 49, 299 (2010) (physics-ref §6.2).
const a = 5.431; // Si lattice constant, Å (physics-ref §3.1)
const fcc: Lattice = [
  [0, a / 2, a / 2],
  [a / 2, 0, a / 2],
  [a / 2, a / 2, 0],
];
const bcc: Lattice = [
  [-a / 2, a / 2, a / 2],
  [a / 2, -a / 2, a / 2],
  [a / 2, a / 2, -a / 2],
];
const c = 1.6 * a;
const hex: Lattice = [
  [a / 2, (-a * Math.sqrt(3)) / 2, 0],
  [a / 2, (a * Math.sqrt(3)) / 2, 0],
  [0, 0, c],
];
// An arbitrary oblique cell (invented numbers, no symmetry).
const triclinic: Lattice = [
  [3.1, 0.2, -0.1],
  [0.9, 2.7, 0.3],
  [-0.6, 1.1, 4.2],
];

describe('reciprocal', () => {
  for (const [name, lat] of Object.entries({ fcc, bcc, hex, triclinic })) {
    it(`b_i · a_j = 2π δ_ij for ${name}`, () => {
      const b = reciprocal(lat);
      for (let i = 0; i < 3; i++)
        for (let j = 0; j < 3; j++) expect(dot(b[i], lat[j])).toBeCloseTo(i === j ? 2 * Math.PI : 0, 12);
    });
  }

  it('gives the tabulated fcc and bcc reciprocal vectors', () => {
    // physics-ref §6.2: fcc b = (2π/a)(−1,1,1), (1,−1,1), (1,1,−1); bcc b = (2π/a)(0,1,1), (1,0,1), (1,1,0).
    const s = (2 * Math.PI) / a;
    const bf = reciprocal(fcc);
    const wantF = [
      [-1, 1, 1],
      [1, -1, 1],
      [1, 1, -1],
    ];
    const bb = reciprocal(bcc);
    const wantB = [
      [0, 1, 1],
      [1, 0, 1],
      [1, 1, 0],
    ];
    for (let i = 0; i < 3; i++)
      for (let k = 0; k < 3; k++) {
        expect(bf[i][k]).toBeCloseTo(wantF[i][k] * s, 12);
        expect(bb[i][k]).toBeCloseTo(wantB[i][k] * s, 12);
      }
  });

  it('hexagonal reciprocal vectors and a* = 4π/(√3 a)', () => {
    // physics-ref §6.2: (2π/a)(1, −1/√3, 0), (2π/a)(1, 1/√3, 0), (2π/c)(0,0,1).
    const b = reciprocal(hex);
    const s = (2 * Math.PI) / a;
    expect(b[0][0]).toBeCloseTo(s, 12);
    expect(b[0][1]).toBeCloseTo(-s / Math.sqrt(3), 12);
    expect(b[1][1]).toBeCloseTo(s / Math.sqrt(3), 12);
    expect(b[2][2]).toBeCloseTo((2 * Math.PI) / c, 12);
    expect(Math.sqrt(dot(b[0], b[0]))).toBeCloseTo((4 * Math.PI) / (Math.sqrt(3) * a), 12);
  });

  it('refuses a flat cell', () => {
    expect(() =>
      reciprocal([
        [1, 0, 0],
        [0, 1, 0],
        [1, 1, 0],
      ]),
    ).toThrow(/coplanar/);
  });
});

describe('fracToCart / cartToFrac', () => {
  it('round-trips on every lattice', () => {
    for (const lat of [fcc, bcc, hex, triclinic]) {
      const b = reciprocal(lat);
      const q: [number, number, number] = [0.31, -0.7, 0.125];
      const back = cartToFrac(fracToCart(q, b), b);
      for (let i = 0; i < 3; i++) expect(back[i]).toBeCloseTo(q[i], 13);
    }
  });
  it('fcc X (½, 0, ½) is (0, 1, 0) 2π/a', () => {
    // physics-ref §6.3 (Setyawan & Curtarolo 2010).
    const k = fracToCart([0.5, 0, 0.5], reciprocal(fcc));
    const s = (2 * Math.PI) / a;
    expect(k[0]).toBeCloseTo(0, 12);
    expect(k[1]).toBeCloseTo(s, 12);
    expect(k[2]).toBeCloseTo(0, 12);
  });
});

describe('parseLattice', () => {
  it('reads 9 numbers with or without ";"', () => {
    expect(parseLattice('0 2.7155 2.7155 ; 2.7155 0 2.7155 ; 2.7155 2.7155 0')).toEqual([
      [0, 2.7155, 2.7155],
      [2.7155, 0, 2.7155],
      [2.7155, 2.7155, 0],
    ]);
    expect(parseLattice('1,0,0 0,1,0 0,0,1')[2]).toEqual([0, 0, 1]);
    expect(parseLattice('[[1,0,0],[0,1,0],[0,0,2]]')[2]).toEqual([0, 0, 2]);
  });
  it('says what is wrong', () => {
    expect(() => parseLattice('1 0 0 0 1 0 0 0')).toThrow(/expected 9 numbers.*found 8/);
    expect(() => parseLattice('1 0 0 0 1 0 0 0 1 4')).toThrow(/found more/);
    expect(() => parseLattice('1 0 0 0 x 0 0 0 1')).toThrow(/expected a number in the lattice, found "x"/);
    expect(() => parseLattice('1 0 0 0 1 0 1 1 0')).toThrow(/coplanar/);
    const r = readLattice('1 0 0 0 abc 0 0 0 1');
    expect(Array.isArray(r)).toBe(false);
    if (!Array.isArray(r)) expect(r.offset).toBe(8);
  });
});
