/**
 * Path geometry, the first step of screening (screening.md "Path geometry first"): fractional q,
 * q folded into the first Brillouin zone, Cartesian q, the cumulative path distance and the Γ
 * points of a parsed dispersion.
 */
import type { Dispersion } from '../dispersion/types';
import { brillouinZone, foldComponentwiseInto, foldPointInto } from './fold';
import { reciprocal } from './lattice';

export interface PathGeometry {
  /**
   * Fractional q as given (converted from Cartesian when the file gives Cartesian q and a
   * lattice), 3 per point. May be the Dispersion's own `q` array: do not write to it.
   */
  qFrac: Float64Array | null;
  /** Fractional, folded into the first zone. */
  qFolded: Float64Array | null;
  /** Cartesian (1/Å, 2π included) of the FOLDED q, when a lattice is known. */
  qCart: Float64Array | null;
  /**
   * Cumulative path distance: Cartesian |Δq| along q as given when q and lattice are known
   * (also when the file gives Cartesian q without a lattice), else the file's distances, else
   * the index. It does not increase across a path break or a repeated point. Meshes: the index.
   */
  distance: Float64Array;
  /**
   * Points that moved when folded: index, q as given (fractional; converted when the file
   * gives Cartesian q), and the folded q (fractional).
   */
  folded: { index: number; q: number[]; folded: number[] }[];
  /**
   * 'lattice': exact Wigner–Seitz folding; 'componentwise': no lattice, fractions folded into
   * [−½, ½] (exact only for orthogonal lattices); 'none': distances only, or Cartesian q
   * without a lattice (which cannot be folded).
   */
  foldMode: 'lattice' | 'componentwise' | 'none';
  /** 1 where the point is Γ: folds to 0 (|q| < 1e-6) or carries a Γ label. */
  gamma: Uint8Array;
}

const GAMMA_LABELS = new Set(['Γ', 'G', 'Gamma', 'GAMMA', 'gamma', '\\Gamma', '$\\Gamma$']);

export function isGammaLabel(label: string): boolean {
  return GAMMA_LABELS.has(label.trim());
}

/** Threshold below which a folded q is Γ (band-files.md). */
export const GAMMA_TOLERANCE = 1e-6;

/** 1 at every index whose distance must not grow from the previous point (break or repeated point). */
function noStepMask(d: Dispersion): Uint8Array {
  const mask = new Uint8Array(d.nq);
  const segs = d.segments;
  for (let s = 1; s < segs.length; s++) {
    const prev = segs[s - 1];
    const cur = segs[s];
    if (cur.start > prev.end && cur.start < d.nq) mask[cur.start] = 1;
  }
  return mask;
}

export function pathGeometry(d: Dispersion): PathGeometry {
  const nq = d.nq;
  const lattice = d.lattice;
  const b = lattice ? reciprocal(lattice) : null;

  let qFrac: Float64Array | null = null;
  let qGivenCart: Float64Array | null = null; // Cartesian q as given, when the file has Cartesian q
  if (d.q) {
    if (d.coordinates === 'fractional') {
      qFrac = d.q;
    } else {
      qGivenCart = d.q;
      if (lattice) {
        // fraction along b_i = k · a_i / 2π, since b_i · a_j = 2π δ_ij.
        const s = 1 / (2 * Math.PI);
        const a = lattice;
        qFrac = new Float64Array(nq * 3);
        for (let i = 0; i < nq; i++) {
          const k0 = d.q[i * 3];
          const k1 = d.q[i * 3 + 1];
          const k2 = d.q[i * 3 + 2];
          for (let c = 0; c < 3; c++) qFrac[i * 3 + c] = (k0 * a[c][0] + k1 * a[c][1] + k2 * a[c][2]) * s;
        }
      }
    }
  }

  const folded: PathGeometry['folded'] = [];
  let qFolded: Float64Array | null = null;
  let qCart: Float64Array | null = null;
  let foldMode: PathGeometry['foldMode'] = 'none';
  if (qFrac) {
    qFolded = new Float64Array(nq * 3);
    if (lattice) {
      foldMode = 'lattice';
      const z = brillouinZone(lattice);
      for (let i = 0; i < nq; i++) {
        if (foldPointInto(z, qFrac, i * 3, qFolded, i * 3)) folded.push(movedEntry(i, qFrac, qFolded));
      }
    } else {
      foldMode = 'componentwise';
      for (let i = 0; i < nq; i++) {
        if (foldComponentwiseInto(qFrac, i * 3, qFolded, i * 3)) folded.push(movedEntry(i, qFrac, qFolded));
      }
    }
    if (b) {
      qCart = new Float64Array(nq * 3);
      toCartesian(qFolded, b, qCart, nq);
    }
  }

  // Distance.
  const distance = new Float64Array(nq);
  const mask = noStepMask(d);
  let cartGiven: Float64Array | null = null;
  if (d.kind === 'path') {
    if (qFrac && b) {
      cartGiven = qGivenCart ?? new Float64Array(nq * 3);
      if (!qGivenCart) toCartesian(qFrac, b, cartGiven, nq);
    } else if (qGivenCart) {
      cartGiven = qGivenCart;
    }
  }
  if (cartGiven) {
    for (let i = 1; i < nq; i++) {
      if (mask[i]) {
        distance[i] = distance[i - 1];
        continue;
      }
      const dx = cartGiven[i * 3] - cartGiven[i * 3 - 3];
      const dy = cartGiven[i * 3 + 1] - cartGiven[i * 3 - 2];
      const dz = cartGiven[i * 3 + 2] - cartGiven[i * 3 - 1];
      distance[i] = distance[i - 1] + Math.sqrt(dx * dx + dy * dy + dz * dz);
    }
  } else if (d.kind === 'path' && d.distance) {
    distance.set(d.distance);
  } else {
    const isPath = d.kind === 'path';
    for (let i = 1; i < nq; i++) distance[i] = isPath && mask[i] ? distance[i - 1] : distance[i - 1] + 1;
  }

  // Γ points.
  const gamma = new Uint8Array(nq);
  const g2 = GAMMA_TOLERANCE * GAMMA_TOLERANCE;
  const probe = qCart ?? qFolded ?? qGivenCart;
  if (probe) {
    for (let i = 0; i < nq; i++) {
      const x = probe[i * 3];
      const y = probe[i * 3 + 1];
      const z = probe[i * 3 + 2];
      if (x * x + y * y + z * z < g2) gamma[i] = 1;
    }
  }
  for (const [i, label] of d.labels) if (i >= 0 && i < nq && isGammaLabel(label)) gamma[i] = 1;

  return { qFrac, qFolded, qCart, distance, folded, foldMode, gamma };
}

function movedEntry(i: number, q: Float64Array, f: Float64Array) {
  return { index: i, q: [q[i * 3], q[i * 3 + 1], q[i * 3 + 2]], folded: [f[i * 3], f[i * 3 + 1], f[i * 3 + 2]] };
}

function toCartesian(frac: Float64Array, b: number[][], out: Float64Array, nq: number): void {
  for (let i = 0; i < nq; i++) {
    const f0 = frac[i * 3];
    const f1 = frac[i * 3 + 1];
    const f2 = frac[i * 3 + 2];
    for (let c = 0; c < 3; c++) out[i * 3 + c] = f0 * b[0][c] + f1 * b[1][c] + f2 * b[2][c];
  }
}
