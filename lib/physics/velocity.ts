/**
 * Group, phase and sound velocities along a band path.
 *
 * Conversion (physics-ref §1.3): with ν in THz and k in Å⁻¹ including 2π,
 * v [m/s] = 2π · 10¹² · 10⁻¹⁰ · dν/dk = 628.3185 · dν/dk [THz·Å].
 * Branches are the frequencies sorted at each point, so velocities jump where sorted branches
 * cross: that is a property of the sorting, not an error.
 */
import type { Dispersion, Vec3 } from '../dispersion/types';
import { fracToCart, reciprocal } from './lattice';
import { pathGeometry, type PathGeometry } from './path';
import { ANGSTROM } from './units';

/** m/s per THz·Å (k with 2π). */
export const VELOCITY_FACTOR = 2 * Math.PI * 1e12 * ANGSTROM;

/** What the path coordinate is measured in. */
export type PathBasis = 'cartesian' | 'file-distance';

/** Cartesian q (Å⁻¹, 2π included), 3 per point, or null when the file gives no usable q. */
export function cartesianQ(d: Dispersion): Float64Array | null {
  if (!d.q) return null;
  if (d.coordinates === 'cartesian') return d.q;
  if (!d.lattice) return null;
  const b = reciprocal(d.lattice);
  const out = new Float64Array(d.nq * 3);
  for (let i = 0; i < d.nq; i++) out.set(fracToCart(d.q.subarray(i * 3, i * 3 + 3), b), i * 3);
  return out;
}

/**
 * Arc length along each segment from its first point (restarting at every segment), in Å⁻¹:
 * Cartesian |Δq| when q and a lattice (or Cartesian q) are known, else the file's distances
 * (taken as Å⁻¹ with 2π). Null when neither is known (the index is no length).
 */
export function segmentArcLength(d: Dispersion, geometry: PathGeometry = pathGeometry(d)): { s: Float64Array; basis: PathBasis } | null {
  const hasCartesian = !!d.q && (d.coordinates === 'cartesian' || !!d.lattice);
  if (!hasCartesian && !d.distance) return null;
  const s = new Float64Array(d.nq);
  const dist = geometry.distance;
  for (const seg of d.segments) {
    for (let i = seg.start; i <= seg.end; i++) s[i] = Math.abs(dist[i] - dist[seg.start]);
  }
  return { s, basis: hasCartesian ? 'cartesian' : 'file-distance' };
}

export interface GroupVelocities {
  /** m/s, row-major [iq * nb + k]; NaN where undefined (a one-point segment, repeated q). */
  values: Float64Array;
  basis: PathBasis;
}

/**
 * dν/dk per sorted branch along the path: central differences inside a segment, one-sided at
 * its ends, never across a join or a break. The sign follows the path direction.
 * Null when the file has neither q (with a lattice) nor distances.
 */
export function groupVelocities(d: Dispersion): GroupVelocities | null {
  const arc = segmentArcLength(d);
  if (!arc) return null;
  const { s } = arc;
  const { nb, frequencies: f } = d;
  const values = new Float64Array(d.nq * nb).fill(NaN);
  for (const seg of d.segments) {
    if (seg.end <= seg.start) continue;
    for (let i = seg.start; i <= seg.end; i++) {
      const lo = i === seg.start ? i : i - 1;
      const hi = i === seg.end ? i : i + 1;
      const ds = s[hi] - s[lo];
      if (!(ds > 0)) continue;
      const scale = VELOCITY_FACTOR / ds;
      for (let k = 0; k < nb; k++) values[i * nb + k] = (f[hi * nb + k] - f[lo * nb + k]) * scale;
    }
  }
  return { values, basis: arc.basis };
}

/**
 * Phase velocity 2πν/|k| (m/s) with k reduced to the first zone (ω/k is not invariant under
 * k → k + G). NaN where |k| = 0 (Γ: undefined for every branch, infinite for optical ones)
 * and where q is unknown. Meaningful for the acoustic branches near Γ.
 */
export function phaseVelocities(d: Dispersion): Float64Array | null {
  const cart = pathGeometry(d).qCart;
  if (!cart) return null;
  const { nb, frequencies: f } = d;
  const values = new Float64Array(d.nq * nb).fill(NaN);
  for (let i = 0; i < d.nq; i++) {
    const k = Math.hypot(cart[i * 3], cart[i * 3 + 1], cart[i * 3 + 2]);
    if (!(k > 1e-9)) continue;
    for (let b = 0; b < nb; b++) values[i * nb + b] = (VELOCITY_FACTOR * f[i * nb + b]) / k;
  }
  return values;
}

export interface SoundVelocity {
  segment: number;
  /** Index of the Γ point the fit starts from. */
  gammaIndex: number;
  /** Label at the other end of the segment, when known. */
  toward: string | null;
  /** Cartesian unit vector from Γ into the segment, or null without Cartesian q. */
  direction: Vec3 | null;
  /** m/s, one per acoustic branch (ascending branch rank). */
  velocities: number[];
  /** Fitted intercepts, THz (ideally 0: a large one points at the acoustic sum rule). */
  intercepts: number[];
  /** Points used in the fit, Γ included. */
  points: number;
  basis: PathBasis;
}

export interface SoundVelocityOptions {
  /** Fit window as a fraction of the segment length (default 0.05). */
  fraction?: number;
}

/**
 * Sound velocities from the acoustic branches leaving each Γ end of each segment: a straight
 * line ν = c0 + c1·s fitted by least squares over the points within `fraction` of the
 * segment's length from Γ (at least Γ and two more points), v = 628.3185 · c1.
 * The window trades curvature (too wide) against round-off (too narrow); 5 % keeps the error
 * of a sine-like branch below 0.1 %.
 */
export function soundVelocities(d: Dispersion, options: SoundVelocityOptions = {}): SoundVelocity[] {
  const fraction = options.fraction ?? 0.05;
  const geometry = pathGeometry(d);
  const arc = segmentArcLength(d, geometry);
  if (!arc) return [];
  const { s, basis } = arc;
  const gamma = geometry.gamma;
  const cart = cartesianQ(d);
  const nAc = Math.min(d.acoustic, d.nb);
  const out: SoundVelocity[] = [];
  d.segments.forEach((seg, segment) => {
    const length = s[seg.end];
    if (!(length > 0) || seg.end - seg.start < 2) return;
    for (const end of [seg.start, seg.end]) {
      if (!gamma[end]) continue;
      const step = end === seg.start ? 1 : -1;
      const other = end === seg.start ? seg.end : seg.start;
      const idx: number[] = [];
      for (let i = end; step > 0 ? i <= seg.end : i >= seg.start; i += step) {
        const dist = Math.abs(s[i] - s[end]);
        if (idx.length >= 3 && dist > fraction * length) break;
        idx.push(i);
      }
      const velocities: number[] = [];
      const intercepts: number[] = [];
      for (let k = 0; k < nAc; k++) {
        let sx = 0, sy = 0, sxx = 0, sxy = 0;
        for (const i of idx) {
          const x = Math.abs(s[i] - s[end]);
          const y = d.frequencies[i * d.nb + k];
          sx += x; sy += y; sxx += x * x; sxy += x * y;
        }
        const n = idx.length;
        const slope = (n * sxy - sx * sy) / (n * sxx - sx * sx);
        velocities.push(slope * VELOCITY_FACTOR);
        intercepts.push((sy - slope * sx) / n);
      }
      let direction: Vec3 | null = null;
      if (cart) {
        const far = idx[idx.length - 1];
        const v: Vec3 = [cart[far * 3] - cart[end * 3], cart[far * 3 + 1] - cart[end * 3 + 1], cart[far * 3 + 2] - cart[end * 3 + 2]];
        const len = Math.hypot(...v);
        if (len > 0) direction = [v[0] / len, v[1] / len, v[2] / len];
      }
      out.push({
        segment,
        gammaIndex: end,
        toward: d.labels.get(other) ?? (end === seg.start ? seg.to : seg.from) ?? null,
        direction,
        velocities,
        intercepts,
        points: idx.length,
        basis,
      });
    }
  });
  return out;
}
