/**
 * Closed-form spectra for the checks' tests (not demo data). A nearest-neighbour-like model
 * on any lattice: ω_k(q)² = c_k Σ_i 2 sin²(q·a_i / 2) for the acoustic branches (zero at Γ,
 * linear near Γ, periodic in the reciprocal lattice, so ω(q + G) = ω(q)) and a weakly
 * dispersive optical band above them. For a 1-D chain this is the monatomic-chain law
 * ω = 2√(C/M)|sin(qa/2)| (Kittel, Introduction to Solid State Physics, ch. 4).
 */
import type { Dispersion, Lattice, Segment, Vec3 } from '../dispersion/types';
import { fracToCart, norm, reciprocal } from '../physics/lattice';

export const A_SC = 4;
export const SC: Lattice = [[A_SC, 0, 0], [0, A_SC, 0], [0, 0, A_SC]];

/** Σ_i 2 sin²(2π f_i / 2) = Σ_i (1 − cos 2π f_i), with f fractional (q·a_i = 2π f_i). */
export function structure(f: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < 3; i++) s += 1 - Math.cos(2 * Math.PI * f[i]);
  return s;
}

/** Acoustic scales (THz² per unit of `structure`) and the optical band. */
export function spectrumAt(f: ArrayLike<number>, nb: number): number[] {
  const s = structure(f);
  const out: number[] = [];
  const scales = [4, 6, 16];
  for (let k = 0; k < nb; k++) {
    if (k < 3) out.push(Math.sqrt(scales[k] * s));
    else out.push(12 + k - 0.3 * s);
  }
  return out.sort((a, b) => a - b);
}

export interface Leg {
  from: string;
  to: string;
  q0: Vec3;
  q1: Vec3;
  /** Points in this segment, both ends included. */
  n?: number;
  /** Path break after this leg (default: connected, the end point written twice). */
  broken?: boolean;
}

export interface BuildOptions {
  lattice?: Lattice | null;
  nb?: number;
  polar?: boolean;
  atoms?: number | null;
  units?: Dispersion['units'];
  /** Frequencies at fractional q (default: spectrumAt). */
  omega?: (f: Vec3, index: number) => number[];
  /** Drop q and keep only distances. */
  distancesOnly?: boolean;
}

/** A path Dispersion from legs, each leg's end written again as the next leg's start (a connected join). */
export function buildPath(legs: Leg[], o: BuildOptions = {}): Dispersion {
  const lattice = o.lattice === undefined ? SC : o.lattice;
  const nb = o.nb ?? 6;
  const omega = o.omega ?? ((f: Vec3) => spectrumAt(f, nb));
  const b = lattice ? reciprocal(lattice) : null;
  const qs: Vec3[] = [];
  const dist: number[] = [];
  const segments: Segment[] = [];
  const labels = new Map<number, string>();
  let x = 0;
  for (const leg of legs) {
    const n = leg.n ?? 41;
    const start = qs.length;
    for (let j = 0; j < n; j++) {
      const t = j / (n - 1);
      const q: Vec3 = [0, 1, 2].map((c) => leg.q0[c] + t * (leg.q1[c] - leg.q0[c])) as Vec3;
      if (j > 0) {
        const prev = qs[qs.length - 1];
        const dq: Vec3 = [q[0] - prev[0], q[1] - prev[1], q[2] - prev[2]];
        x += b ? norm(fracToCart(dq, b)) : norm(dq);
      }
      qs.push(q);
      dist.push(x);
    }
    labels.set(start, leg.from);
    labels.set(qs.length - 1, leg.to);
    segments.push({ start, end: qs.length - 1, from: leg.from, to: leg.to, connectedToNext: !leg.broken });
  }
  segments[segments.length - 1].connectedToNext = false;
  const nq = qs.length;
  const frequencies = new Float64Array(nq * nb);
  qs.forEach((q, i) => {
    const row = omega(q, i).slice().sort((a, b2) => a - b2);
    if (row.length !== nb) throw new Error(`omega gave ${row.length} values, expected ${nb}`);
    frequencies.set(row, i * nb);
  });
  return {
    format: 'columns',
    kind: 'path',
    nq,
    nb,
    frequencies,
    q: o.distancesOnly ? null : Float64Array.from(qs.flat()),
    coordinates: 'fractional',
    distance: Float64Array.from(dist),
    weights: null,
    lattice,
    units: o.units ?? 'THz',
    labels,
    segments,
    atoms: o.atoms === undefined ? nb / 3 : o.atoms,
    polar: o.polar ?? false,
    acoustic: Math.min(3, nb),
    metadata: {},
  };
}

/** Simple cubic Γ–X–M–Γ–R (SC2010 points, physics-ref §6.3). */
export const SC_POINTS: Record<string, Vec3> = { Γ: [0, 0, 0], X: [0, 0.5, 0], M: [0.5, 0.5, 0], R: [0.5, 0.5, 0.5] };

export function scPath(names = ['Γ', 'X', 'M', 'Γ', 'R'], n = 41): Leg[] {
  const legs: Leg[] = [];
  for (let i = 0; i + 1 < names.length; i++)
    legs.push({ from: names[i], to: names[i + 1], q0: SC_POINTS[names[i]], q1: SC_POINTS[names[i + 1]], n });
  return legs;
}

/** Writes a new value into branch `k` (by rank) of point i, keeping the row sorted. */
export function setFrequency(d: Dispersion, i: number, k: number, value: number) {
  const row = Array.from(d.frequencies.subarray(i * d.nb, (i + 1) * d.nb));
  row[k] = value;
  row.sort((a, b) => a - b);
  d.frequencies.set(row, i * d.nb);
}

/** Adds `delta` THz to the given branches (default: all) of points from..to (inclusive). */
export function shiftPoints(d: Dispersion, from: number, to: number, delta: number, branches?: number[]) {
  for (let i = from; i <= to; i++) for (const k of branches ?? [...Array(d.nb).keys()]) setFrequency(d, i, k, d.frequencies[i * d.nb + k] + delta);
}

/**
 * A mesh Dispersion at the given q (fractional unless `coordinates` says otherwise), weight 1
 * each; the frequencies are the closed form at q read as fractional.
 */
export function buildMesh(qs: Vec3[], o: { lattice?: Lattice | null; nb?: number; coordinates?: Dispersion['coordinates'] } = {}): Dispersion {
  const lattice = o.lattice === undefined ? SC : o.lattice;
  const nb = o.nb ?? 6;
  const nq = qs.length;
  const frequencies = new Float64Array(nq * nb);
  qs.forEach((q, i) => frequencies.set(spectrumAt(q, nb), i * nb));
  return {
    format: 'columns',
    kind: 'mesh',
    nq,
    nb,
    frequencies,
    q: Float64Array.from(qs.flat()),
    coordinates: o.coordinates ?? 'fractional',
    distance: null,
    weights: new Float64Array(nq).fill(1),
    lattice,
    units: 'THz',
    labels: new Map(),
    segments: [{ start: 0, end: nq - 1, connectedToNext: false }],
    atoms: nb / 3,
    polar: false,
    acoustic: Math.min(3, nb),
    metadata: {},
  };
}
