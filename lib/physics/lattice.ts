/**
 * Real and reciprocal lattices. Rows are vectors: a = [a1, a2, a3] in Å, b = [b1, b2, b3]
 * in 1/Å with the 2π included (b_i · a_j = 2π δ_ij).
 */
import type { Lattice, Vec3 } from '../dispersion/types';

export function dot(u: ArrayLike<number>, v: ArrayLike<number>): number {
  return u[0] * v[0] + u[1] * v[1] + u[2] * v[2];
}

export function cross(u: ArrayLike<number>, v: ArrayLike<number>): Vec3 {
  return [u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]];
}

export function norm(v: ArrayLike<number>): number {
  return Math.sqrt(dot(v, v));
}

/** Signed cell volume a1 · (a2 × a3). */
export function det3(m: Lattice): number {
  return dot(m[0], cross(m[1], m[2]));
}

export function reciprocal(a: Lattice): Lattice {
  const v = det3(a);
  if (!Number.isFinite(v) || Math.abs(v) < 1e-12 * Math.max(1, norm(a[0]) * norm(a[1]) * norm(a[2]))) {
    throw new Error('lattice vectors are coplanar or not finite: the cell has no volume');
  }
  const s = (2 * Math.PI) / v;
  const c0 = cross(a[1], a[2]);
  const c1 = cross(a[2], a[0]);
  const c2 = cross(a[0], a[1]);
  return [
    [c0[0] * s, c0[1] * s, c0[2] * s],
    [c1[0] * s, c1[1] * s, c1[2] * s],
    [c2[0] * s, c2[1] * s, c2[2] * s],
  ];
}

/** q_cart = Σ q_i b_i. */
export function fracToCart(q: ArrayLike<number>, b: Lattice): Vec3 {
  return [
    q[0] * b[0][0] + q[1] * b[1][0] + q[2] * b[2][0],
    q[0] * b[0][1] + q[1] * b[1][1] + q[2] * b[2][1],
    q[0] * b[0][2] + q[1] * b[1][2] + q[2] * b[2][2],
  ];
}

/**
 * Inverse of fracToCart. Since b_i · a_j = 2π δ_ij, the fraction along b_i is k · a_i / 2π;
 * the real lattice is recovered from b by the same reciprocal construction.
 */
export function cartToFrac(k: ArrayLike<number>, b: Lattice): Vec3 {
  const a = reciprocal(b); // reciprocal of the reciprocal is the real lattice (2π conventions cancel)
  const s = 1 / (2 * Math.PI);
  return [dot(k, a[0]) * s, dot(k, a[1]) * s, dot(k, a[2]) * s];
}

export interface LatticeSyntaxProblem {
  /** 0-based character offset in the input where the problem is. */
  offset: number;
  message: string;
}

/**
 * Reads 9 numbers "a1x a1y a1z ; a2x a2y a2z ; a3x a3y a3z" (separators: whitespace, commas,
 * semicolons; brackets are ignored). Returns the lattice or where and what the problem is,
 * so the parsers can report a column.
 */
export function readLattice(s: string): Lattice | LatticeSyntaxProblem {
  const nums: number[] = [];
  const re = /[^\s,;[\]()]+/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(s)) !== null) {
    const tok = m[0];
    if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(tok)) {
      return { offset: m.index, message: `expected a number in the lattice, found "${tok}"` };
    }
    const v = Number(tok);
    if (!Number.isFinite(v)) return { offset: m.index, message: `expected a finite number in the lattice, found "${tok}"` };
    if (nums.length === 9) return { offset: m.index, message: 'expected 9 numbers in the lattice, found more' };
    nums.push(v);
  }
  if (nums.length !== 9) {
    return { offset: s.length, message: `expected 9 numbers in the lattice (a1; a2; a3 in Å), found ${nums.length}` };
  }
  const lat: Lattice = [
    [nums[0], nums[1], nums[2]],
    [nums[3], nums[4], nums[5]],
    [nums[6], nums[7], nums[8]],
  ];
  const v = det3(lat);
  if (Math.abs(v) < 1e-9 * Math.max(1e-30, norm(lat[0]) * norm(lat[1]) * norm(lat[2]))) {
    return { offset: 0, message: 'the lattice vectors are coplanar (cell volume 0); expected three independent vectors' };
  }
  return lat;
}

export function parseLattice(s: string): Lattice {
  const r = readLattice(s);
  if (!Array.isArray(r)) {
    throw new Error(`${r.message} (at character ${r.offset + 1} of "${s}")`);
  }
  return r;
}

/** Cell volume in Å³ (positive). */
export function cellVolume(a: Lattice): number {
  return Math.abs(det3(a));
}
