/**
 * Folding q into the first Brillouin zone: the Wigner–Seitz cell of the reciprocal lattice.
 *
 * A point x (fractional, in b1 b2 b3) is in the cell when, for every Voronoi-relevant
 * reciprocal vector v, 2 x·v ≤ |v|² (the bisecting plane of 0 and v). Per lattice we find
 * those vectors once (at most 14 in 3-D); per point we first round in a reduced basis, then
 * subtract the most violated v until none is violated. Every subtraction makes |x| strictly
 * shorter, so the loop ends, and it ends in the cell, i.e. at the shortest image.
 *
 * Everything works in fractional coordinates with the metric g_ij = b_i·b_j, so the folded
 * point is the input minus an integer vector (no round trip through Cartesian coordinates:
 * points already inside come back bit-identical).
 */
import type { Lattice, Vec3 } from '../dispersion/types';
import { dot, reciprocal } from './lattice';

/** Relative tolerance on the bisecting-plane test: a point this close to a face is on it. */
export const FOLD_TOLERANCE = 1e-6;

export interface BrillouinZone {
  lattice: Lattice;
  /** Reciprocal vectors (rows), 1/Å with 2π. */
  b: Lattice;
  /** Metric g_ij = b_i · b_j, row-major. */
  metric: Float64Array;
  /** Reduced basis as integer rows in the original b (R), and its integer inverse. */
  reduced: Float64Array;
  reducedInverse: Float64Array;
  /** Voronoi-relevant vectors: integer coordinates (3 each), g·n (3 each), |v|² (1 each). */
  relevant: Float64Array;
  relevantMetric: Float64Array;
  relevantNorm2: Float64Array;
}

function metricOf(b: Lattice): Float64Array {
  const g = new Float64Array(9);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) g[i * 3 + j] = dot(b[i], b[j]);
  return g;
}

function quad(g: Float64Array, x0: number, x1: number, x2: number, y0: number, y1: number, y2: number): number {
  return (
    x0 * (g[0] * y0 + g[1] * y1 + g[2] * y2) +
    x1 * (g[3] * y0 + g[4] * y1 + g[5] * y2) +
    x2 * (g[6] * y0 + g[7] * y1 + g[8] * y2)
  );
}

/**
 * Pairwise (Gauss) size reduction repeated until nothing shortens: a basis whose vectors are
 * short and nearly orthogonal. It only makes the searches below small; their bounds are
 * valid for any basis.
 */
function reduceBasis(g: Float64Array): number[][] {
  const R = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  const len2 = (r: number[]) => quad(g, r[0], r[1], r[2], r[0], r[1], r[2]);
  for (let pass = 0; pass < 200; pass++) {
    let changed = false;
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        if (i === j) continue;
        const ri = R[i];
        const rj = R[j];
        const m = Math.round(quad(g, ri[0], ri[1], ri[2], rj[0], rj[1], rj[2]) / len2(rj));
        if (m === 0) continue;
        const cand = [ri[0] - m * rj[0], ri[1] - m * rj[1], ri[2] - m * rj[2]];
        if (len2(cand) < len2(ri) * (1 - 1e-12)) {
          R[i] = cand;
          changed = true;
        }
      }
    }
    if (!changed) break;
  }
  return R;
}

function inverseInteger3(R: number[][]): number[][] {
  const [a, b, c] = R;
  const det = a[0] * (b[1] * c[2] - b[2] * c[1]) - a[1] * (b[0] * c[2] - b[2] * c[0]) + a[2] * (b[0] * c[1] - b[1] * c[0]);
  const inv = [
    [(b[1] * c[2] - b[2] * c[1]) / det, (a[2] * c[1] - a[1] * c[2]) / det, (a[1] * b[2] - a[2] * b[1]) / det],
    [(b[2] * c[0] - b[0] * c[2]) / det, (a[0] * c[2] - a[2] * c[0]) / det, (a[2] * b[0] - a[0] * b[2]) / det],
    [(b[0] * c[1] - b[1] * c[0]) / det, (a[1] * c[0] - a[0] * c[1]) / det, (a[0] * b[1] - a[1] * b[0]) / det],
  ];
  return inv.map((row) => row.map((v) => Math.round(v)));
}

function buildZone(a: Lattice): BrillouinZone {
  const b = reciprocal(a);
  const g = metricOf(b);
  const R = reduceBasis(g);
  const Rinv = inverseInteger3(R);
  // Reduced basis in Cartesian and its dual (rows d_i with d_i · b'_j = δ_ij).
  const bp: Lattice = R.map((r) => [
    r[0] * b[0][0] + r[1] * b[1][0] + r[2] * b[2][0],
    r[0] * b[0][1] + r[1] * b[1][1] + r[2] * b[2][1],
    r[0] * b[0][2] + r[1] * b[1][2] + r[2] * b[2][2],
  ]) as Lattice;
  const dual = reciprocal(bp).map((v) => v.map((c) => c / (2 * Math.PI)));
  // Relevant vectors are at most twice the covering radius long, and the covering radius is at
  // most ½ √(Σ|b'_i|²); a vector of length ≤ L has |coefficient_i| ≤ L |d_i| in that basis.
  const L = Math.sqrt(dot(bp[0], bp[0]) + dot(bp[1], bp[1]) + dot(bp[2], bp[2]));
  const K = dual.map((d) => Math.floor(L * Math.sqrt(dot(d, d)) + 1e-9));
  if ((2 * K[0] + 1) * (2 * K[1] + 1) * (2 * K[2] + 1) > 4_000_000) {
    // Only for cells whose axes differ by more than ~1000×; no real crystal or slab model gets here.
    throw new Error('the lattice is too anisotropic to fold (lengths differ by more than ~1000×)');
  }

  const cands: { n: Vec3; n2: number }[] = [];
  for (let i = -K[0]; i <= K[0]; i++)
    for (let j = -K[1]; j <= K[1]; j++)
      for (let k = -K[2]; k <= K[2]; k++) {
        if (i === 0 && j === 0 && k === 0) continue;
        const n: Vec3 = [
          i * R[0][0] + j * R[1][0] + k * R[2][0],
          i * R[0][1] + j * R[1][1] + k * R[2][1],
          i * R[0][2] + j * R[1][2] + k * R[2][2],
        ];
        const n2 = quad(g, n[0], n[1], n[2], n[0], n[1], n[2]);
        if (n2 <= L * L * (1 + 1e-9)) cands.push({ n, n2 });
      }
  cands.sort((p, q) => p.n2 - q.n2);

  // Voronoi's criterion: v is relevant unless another lattice point w lies in the closed ball
  // with diameter [0, v], i.e. w·(v − w) ≥ 0. Near-ties count as "in the ball" (the vector's
  // face is then at most ~1e-10 |v|² away from faces we keep, far below FOLD_TOLERANCE).
  const rel: { n: Vec3; n2: number }[] = [];
  for (const v of cands) {
    let relevant = true;
    for (const w of cands) {
      if (w.n2 > v.n2) break;
      if (w.n[0] === v.n[0] && w.n[1] === v.n[1] && w.n[2] === v.n[2]) continue;
      const wv = quad(g, w.n[0], w.n[1], w.n[2], v.n[0], v.n[1], v.n[2]);
      if (wv - w.n2 >= -1e-10 * v.n2) {
        relevant = false;
        break;
      }
    }
    if (relevant) rel.push(v);
  }
  // Deterministic order (shortest first, then lexicographic) so ties always resolve the same way.
  rel.sort((p, q) => p.n2 - q.n2 || p.n[0] - q.n[0] || p.n[1] - q.n[1] || p.n[2] - q.n[2]);

  const relevant = new Float64Array(rel.length * 3);
  const relevantMetric = new Float64Array(rel.length * 3);
  const relevantNorm2 = new Float64Array(rel.length);
  rel.forEach((v, idx) => {
    for (let c = 0; c < 3; c++) {
      relevant[idx * 3 + c] = v.n[c];
      relevantMetric[idx * 3 + c] = g[c * 3] * v.n[0] + g[c * 3 + 1] * v.n[1] + g[c * 3 + 2] * v.n[2];
    }
    relevantNorm2[idx] = v.n2;
  });
  return {
    lattice: a,
    b,
    metric: g,
    reduced: Float64Array.from(R.flat()),
    reducedInverse: Float64Array.from(Rinv.flat()),
    relevant,
    relevantMetric,
    relevantNorm2,
  };
}

const cache = new Map<string, BrillouinZone>();

/** The zone of a real-space lattice, built once and cached (a handful of lattices per process). */
export function brillouinZone(a: Lattice): BrillouinZone {
  const key = a.flat().join(',');
  let z = cache.get(key);
  if (!z) {
    z = buildZone(a);
    if (cache.size > 64) cache.clear();
    cache.set(key, z);
  }
  return z;
}

/** Largest relative violation max_v (2 x·v − |v|²) / |v|² and the index of its v. */
function worstFace(z: BrillouinZone, x0: number, x1: number, x2: number): [number, number] {
  const w = z.relevantMetric;
  const nn = z.relevantNorm2;
  let worst = -Infinity;
  let at = -1;
  for (let j = 0; j < nn.length; j++) {
    const viol = (2 * (x0 * w[j * 3] + x1 * w[j * 3 + 1] + x2 * w[j * 3 + 2]) - nn[j]) / nn[j];
    if (viol > worst) {
      worst = viol;
      at = j;
    }
  }
  return [worst, at];
}

export function isInsideFirstZone(qFrac: ArrayLike<number>, a: Lattice, tol = FOLD_TOLERANCE): boolean {
  return worstFace(brillouinZone(a), qFrac[0], qFrac[1], qFrac[2])[0] <= tol;
}

/**
 * How far q (fractional, inside the first zone) is from Γ towards the zone boundary along its
 * own direction: 0 at Γ, 1 on the boundary, measured with the reciprocal metric. Along the
 * ray t·q the cell ends at the first face 2 x·v = |v|², so the ratio is max_v 2 q·v / |v|².
 */
export function zoneFraction(z: BrillouinZone, src: ArrayLike<number>, so = 0): number {
  return worstFace(z, src[so], src[so + 1], src[so + 2])[0] + 1;
}

/** The same without a lattice, for the cube [−½, ½]³ of the component-wise fold: 2 max |q_c|. */
export function cubeZoneFraction(src: ArrayLike<number>, so = 0): number {
  return 2 * Math.max(Math.abs(src[so]), Math.abs(src[so + 1]), Math.abs(src[so + 2]));
}

/**
 * Folds one point src[so..so+2] into dst[do..do+2] (they may be the same array and offset).
 * Returns true when the point moved. No allocation: this runs on millions of points.
 */
export function foldPointInto(
  z: BrillouinZone,
  src: ArrayLike<number>,
  so: number,
  dst: { [i: number]: number },
  dof: number,
  tol = FOLD_TOLERANCE,
): boolean {
  let x0 = src[so];
  let x1 = src[so + 1];
  let x2 = src[so + 2];
  const w = z.relevantMetric;
  const nn = z.relevantNorm2;
  const rv = z.relevant;
  const m = nn.length;

  let inside = true;
  for (let j = 0; j < m; j++) {
    if (2 * (x0 * w[j * 3] + x1 * w[j * 3 + 1] + x2 * w[j * 3 + 2]) - nn[j] > tol * nn[j]) {
      inside = false;
      break;
    }
  }
  if (inside) {
    dst[dof] = x0;
    dst[dof + 1] = x1;
    dst[dof + 2] = x2;
    return false;
  }

  // Round in the reduced basis: y = x R⁻¹, x ← x − round(y) R.
  const R = z.reduced;
  const Ri = z.reducedInverse;
  const n0 = Math.round(x0 * Ri[0] + x1 * Ri[3] + x2 * Ri[6]);
  const n1 = Math.round(x0 * Ri[1] + x1 * Ri[4] + x2 * Ri[7]);
  const n2 = Math.round(x0 * Ri[2] + x1 * Ri[5] + x2 * Ri[8]);
  x0 -= n0 * R[0] + n1 * R[3] + n2 * R[6];
  x1 -= n0 * R[1] + n1 * R[4] + n2 * R[7];
  x2 -= n0 * R[2] + n1 * R[5] + n2 * R[8];

  for (let iter = 0; iter < 256; iter++) {
    let worst = tol;
    let at = -1;
    for (let j = 0; j < m; j++) {
      const viol = (2 * (x0 * w[j * 3] + x1 * w[j * 3 + 1] + x2 * w[j * 3 + 2]) - nn[j]) / nn[j];
      if (viol > worst) {
        worst = viol;
        at = j;
      }
    }
    if (at < 0) break;
    x0 -= rv[at * 3];
    x1 -= rv[at * 3 + 1];
    x2 -= rv[at * 3 + 2];
  }
  // A component within 1e-15 of zero is round-off of an integer subtraction: make it 0 so
  // images of Γ compare exactly.
  dst[dof] = Math.abs(x0) < 1e-15 ? 0 : x0;
  dst[dof + 1] = Math.abs(x1) < 1e-15 ? 0 : x1;
  dst[dof + 2] = Math.abs(x2) < 1e-15 ? 0 : x2;
  return true;
}

/** Component-wise fold into [−½, ½] (exact only for orthogonal lattices). Returns true when moved. */
export function foldComponentwiseInto(
  src: ArrayLike<number>,
  so: number,
  dst: { [i: number]: number },
  dof: number,
  tol = FOLD_TOLERANCE,
): boolean {
  let moved = false;
  for (let c = 0; c < 3; c++) {
    let x = src[so + c];
    if (Math.abs(x) > 0.5 + tol) {
      x -= Math.round(x);
      if (Math.abs(x) < 1e-15) x = 0;
      moved = true;
    }
    dst[dof + c] = x;
  }
  return moved;
}

export function foldToFirstZone(qFrac: ArrayLike<number>, a: Lattice | null): Vec3 {
  const out: Vec3 = [0, 0, 0];
  if (a) foldPointInto(brillouinZone(a), qFrac, 0, out, 0);
  else foldComponentwiseInto(qFrac, 0, out, 0);
  return out;
}

/**
 * Folds n points (3 per point) from src into dst. Returns a byte per point, 1 where it moved.
 */
export function foldMany(src: Float64Array, a: Lattice | null, dst: Float64Array): Uint8Array {
  const n = Math.floor(src.length / 3);
  const moved = new Uint8Array(n);
  if (a) {
    const z = brillouinZone(a);
    for (let i = 0; i < n; i++) moved[i] = foldPointInto(z, src, i * 3, dst, i * 3) ? 1 : 0;
  } else {
    for (let i = 0; i < n; i++) moved[i] = foldComponentwiseInto(src, i * 3, dst, i * 3) ? 1 : 0;
  }
  return moved;
}

/** |q| in 1/Å for fractional q and reciprocal vectors b. */
export function cartesianLength(qFrac: ArrayLike<number>, b: Lattice): number {
  let s = 0;
  for (let c = 0; c < 3; c++) {
    const v = qFrac[0] * b[0][c] + qFrac[1] * b[1][c] + qFrac[2] * b[2][c];
    s += v * v;
  }
  return Math.sqrt(s);
}
