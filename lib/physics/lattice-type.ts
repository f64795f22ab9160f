/**
 * Recognises the cubic (simple, face-centred, body-centred) and hexagonal Bravais lattices
 * from any primitive cell, so that labelled points can be compared with the standard points of
 * Setyawan & Curtarolo (2010) whatever cell the file used.
 *
 * The test works on the lattice, not on the given vectors: it reduces the cell, lists the
 * shortest lattice vectors and compares their count, lengths and the cell volume with each
 * lattice type. In 3-D, 12 equal shortest vectors occur only in the fcc lattice, and the
 * volume ties the shortest vectors to the cell, so no other lattice is mistaken for these.
 */
import type { Lattice, Vec3 } from '../dispersion/types';
import { cross, dot, norm } from './lattice';

export type LatticeKind = 'sc' | 'fcc' | 'bcc' | 'hex';

export interface LatticeType {
  kind: LatticeKind;
  /** Conventional cubic edge, or the hexagonal in-plane constant, Å. */
  a: number;
  /** Hexagonal c, Å (absent for cubic lattices). */
  c?: number;
}

const sub = (u: Vec3, v: Vec3, s: number): Vec3 => [u[0] - s * v[0], u[1] - s * v[1], u[2] - s * v[2]];

/** Pairwise (Lagrange–Gauss) reduction: short, nearly orthogonal vectors spanning the same lattice. */
function reduce(a: Lattice): Vec3[] {
  const v: Vec3[] = a.map((x) => [...x] as Vec3);
  for (let pass = 0; pass < 100; pass++) {
    let changed = false;
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) {
        if (i === j) continue;
        const m = Math.round(dot(v[i], v[j]) / dot(v[j], v[j]));
        if (m !== 0) {
          const w = sub(v[i], v[j], m);
          if (dot(w, w) < dot(v[i], v[i]) * (1 - 1e-12)) {
            v[i] = w;
            changed = true;
          }
        }
      }
    if (!changed) break;
  }
  return v;
}

/** Lattice vectors n1 a1 + n2 a2 + n3 a3 with |n_i| ≤ 2 (enough after reduction), shortest first. */
function shortVectors(v: Vec3[]): Vec3[] {
  const out: Vec3[] = [];
  for (let i = -2; i <= 2; i++)
    for (let j = -2; j <= 2; j++)
      for (let k = -2; k <= 2; k++) {
        if (i === 0 && j === 0 && k === 0) continue;
        out.push([
          i * v[0][0] + j * v[1][0] + k * v[2][0],
          i * v[0][1] + j * v[1][1] + k * v[2][1],
          i * v[0][2] + j * v[1][2] + k * v[2][2],
        ]);
      }
  return out.sort((x, y) => dot(x, x) - dot(y, y));
}

const close = (x: number, y: number, tol: number) => Math.abs(x - y) <= tol * Math.max(Math.abs(x), Math.abs(y));

/**
 * The lattice type and its conventional constants, or null when the cell is none of
 * sc, fcc, bcc or hexagonal within `tol` (relative, on lengths and on cosines of angles).
 */
export function latticeType(a: Lattice, tol = 1e-3): LatticeType | null {
  if (!a.every((r) => r.every(Number.isFinite))) return null;
  const volume = Math.abs(dot(a[0], cross(a[1], a[2])));
  if (!(volume > 0)) return null;
  const vs = shortVectors(reduce(a));
  const d = norm(vs[0]);
  let count = 0;
  while (count < vs.length && close(norm(vs[count]), d, tol)) count++;
  // Volume: three length factors, each within tol.
  const volTol = 3.5 * tol;

  if (count === 6 && close(volume, d ** 3, volTol)) return { kind: 'sc', a: d };
  if (count === 12 && close(volume, d ** 3 / Math.SQRT2, volTol)) return { kind: 'fcc', a: d * Math.SQRT2 };
  if (count === 8) {
    const a0 = (2 * d) / Math.sqrt(3);
    // The eight shortest bcc vectors are the half body diagonals: any two non-parallel ones meet at cos = ±1/3.
    const diag = vs.slice(0, 8);
    const skewOk = diag.every((u) =>
      diag.every((w) => {
        const c = Math.abs(dot(u, w)) / (d * d);
        return close(c, 1, tol) || Math.abs(c - 1 / 3) <= tol;
      }),
    );
    if (skewOk && close(volume, a0 ** 3 / 2, volTol)) return { kind: 'bcc', a: a0 };
  }
  return hexagonal(vs, volume, tol);
}

/** Two equal vectors at 60° and a third perpendicular to both that together span the lattice. */
function hexagonal(vs: Vec3[], volume: number, tol: number): LatticeType | null {
  const cand = vs.slice(0, 40);
  for (const u of cand) {
    const lu = norm(u);
    for (const v of cand) {
      if (!close(norm(v), lu, tol) || Math.abs(dot(u, v) / (lu * lu) - 0.5) > tol) continue;
      const area = norm(cross(u, v));
      for (const w of cand) {
        const lw = norm(w);
        if (Math.abs(dot(u, w)) > tol * lu * lw || Math.abs(dot(v, w)) > tol * lu * lw) continue;
        if (close(volume, area * lw, 3.5 * tol)) return { kind: 'hex', a: lu, c: lw };
      }
    }
  }
  return null;
}
