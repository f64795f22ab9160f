import { describe, expect, it } from 'vitest';
import type { Lattice } from '../dispersion/types';
import { latticeType } from './lattice-type';

// Primitive vectors of Setyawan & Curtarolo (2010), as tabulated in physics-ref §6.2.
const a = 5.431; // Si lattice constant, Å (physics-ref §6.3 uses it for segment lengths)
const h = a / 2;
const fccSC2010: Lattice = [[0, h, h], [h, 0, h], [h, h, 0]];
const bccSC2010: Lattice = [[-h, h, h], [h, -h, h], [h, h, -h]];
const sc: Lattice = [[a, 0, 0], [0, a, 0], [0, 0, a]];
const ha = 3.19;
const hc = 5.19;
const s3 = Math.sqrt(3) / 2;
const hex120: Lattice = [[ha / 2, -ha * s3, 0], [ha / 2, ha * s3, 0], [0, 0, hc]];
const hex60: Lattice = [[ha, 0, 0], [ha / 2, ha * s3, 0], [0, 0, hc]];

function rotate(l: Lattice, angle: number): Lattice {
  // A rotation about (1,2,3)/√14 by `angle`: the lattice type must not depend on orientation.
  const n = [1, 2, 3].map((x) => x / Math.sqrt(14));
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const R = [
    [c + n[0] * n[0] * (1 - c), n[0] * n[1] * (1 - c) - n[2] * s, n[0] * n[2] * (1 - c) + n[1] * s],
    [n[1] * n[0] * (1 - c) + n[2] * s, c + n[1] * n[1] * (1 - c), n[1] * n[2] * (1 - c) - n[0] * s],
    [n[2] * n[0] * (1 - c) - n[1] * s, n[2] * n[1] * (1 - c) + n[0] * s, c + n[2] * n[2] * (1 - c)],
  ];
  return l.map((v) => R.map((r) => r[0] * v[0] + r[1] * v[1] + r[2] * v[2])) as Lattice;
}

describe('latticeType', () => {
  it('recognises the SC2010 cells with their conventional constants', () => {
    expect(latticeType(sc)).toEqual({ kind: 'sc', a: expect.closeTo(a, 12) });
    expect(latticeType(fccSC2010)).toEqual({ kind: 'fcc', a: expect.closeTo(a, 12) });
    expect(latticeType(bccSC2010)).toEqual({ kind: 'bcc', a: expect.closeTo(a, 12) });
    expect(latticeType(hex120)).toEqual({ kind: 'hex', a: expect.closeTo(ha, 12), c: expect.closeTo(hc, 12) });
    expect(latticeType(hex60)).toEqual({ kind: 'hex', a: expect.closeTo(ha, 12), c: expect.closeTo(hc, 12) });
  });

  it('does not depend on the choice of primitive cell or on orientation', () => {
    // Another fcc primitive cell (angles 90°, 60°, 60°; same volume a³/4) and a skewed one a1 + a2.
    const fccOther: Lattice = [[h, h, 0], [h, -h, 0], [0, h, h]];
    expect(latticeType(fccOther)?.kind).toBe('fcc');
    const skew: Lattice = [
      [fccSC2010[0][0] + 2 * fccSC2010[1][0], fccSC2010[0][1] + 2 * fccSC2010[1][1], fccSC2010[0][2] + 2 * fccSC2010[1][2]],
      fccSC2010[1],
      fccSC2010[2],
    ];
    expect(latticeType(skew)).toEqual({ kind: 'fcc', a: expect.closeTo(a, 10) });
    expect(latticeType(rotate(bccSC2010, 0.7))).toEqual({ kind: 'bcc', a: expect.closeTo(a, 10) });
    expect(latticeType(rotate(hex60, 1.1))).toEqual({ kind: 'hex', a: expect.closeTo(ha, 10), c: expect.closeTo(hc, 10) });
    // Hexagonal with c shorter than a, and with c = a (8 equal shortest vectors, like bcc).
    expect(latticeType([[1, 0, 0], [0.5, s3, 0], [0, 0, 0.6]])).toEqual({ kind: 'hex', a: expect.closeTo(1, 12), c: expect.closeTo(0.6, 12) });
    expect(latticeType([[1, 0, 0], [0.5, s3, 0], [0, 0, 1]])?.kind).toBe('hex');
  });

  it('accepts distortions within 1e-3 and rejects larger ones', () => {
    expect(latticeType([[a * (1 + 4e-4), 0, 0], [0, a, 0], [0, 0, a]])?.kind).toBe('sc');
    expect(latticeType([[a * 1.01, 0, 0], [0, a, 0], [0, 0, a]])).toBeNull(); // tetragonal
    expect(latticeType([[0, h, h], [h, 0, h], [h, h * 1.01, 0]])).toBeNull();
    expect(latticeType([[ha, 0, 0], [ha / 2, ha * s3 * 1.01, 0], [0, 0, hc]])).toBeNull();
  });

  it('rejects other lattices and degenerate cells', () => {
    expect(latticeType([[3, 0, 0], [0, 4, 0], [0, 0, 5]])).toBeNull(); // orthorhombic
    // Rhombohedral with α = 70°: equal lengths, but none of the four.
    const c70 = Math.cos((70 * Math.PI) / 180);
    const ty = Math.sqrt(1 - c70 * c70);
    const zx = c70;
    const zy = (c70 - c70 * c70) / ty;
    expect(latticeType([[1, 0, 0], [c70, ty, 0], [zx, zy, Math.sqrt(1 - zx * zx - zy * zy)]])).toBeNull();
    expect(latticeType([[1, 0, 0], [0, 1, 0], [1, 1, 0]])).toBeNull();
    expect(latticeType([[NaN, 0, 0], [0, 1, 0], [0, 0, 1]])).toBeNull();
  });
});
