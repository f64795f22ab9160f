/**
 * The readout under the pointer, found by binary search in our own arrays (the chart's own
 * tooltip scans every point of every series, which is far too slow at 1,500 branches).
 */
import { lowerBound, upperBound } from './decimate';
import type { FloatArray, PlotData } from './wire';

type Source = Pick<PlotData, 'distance' | 'frequencies' | 'nq' | 'nb'>;

export interface NearestPoint {
  index: number;
  /** The lowest of the branches that are degenerate there (see degenerateRange). */
  branch: number;
  /** THz. */
  frequency: number;
}

/**
 * Branches closer than this (THz) at a point count as degenerate: files write degenerate modes
 * with equal digits, diagonalisers leave them a few 1e-6 apart.
 */
export const DEGENERATE_THZ = 1e-5;

/**
 * The branches degenerate with `branch` at point `index`: a contiguous run, since frequencies
 * ascend with the branch at each point.
 */
export function degenerateRange(d: Source, index: number, branch: number, tol = DEGENERATE_THZ): { first: number; last: number } {
  const f = d.frequencies[branch * d.nq + index];
  let first = branch;
  let last = branch;
  while (first > 0 && Math.abs(d.frequencies[(first - 1) * d.nq + index] - f) <= tol) first--;
  while (last < d.nb - 1 && Math.abs(d.frequencies[(last + 1) * d.nq + index] - f) <= tol) last++;
  return { first, last };
}

/** Index of the x value nearest to v (the lower one on a tie); -1 when x is empty. */
export function nearestX(x: ArrayLike<number>, v: number, lo = 0, hi = x.length): number {
  if (hi <= lo) return -1;
  const i = lowerBound(x, v, lo, hi);
  if (i <= lo) return lo;
  if (i >= hi) return hi - 1;
  return v - x[i - 1] <= x[i] - v ? i - 1 : i;
}

/** Branch whose frequency at point iq is nearest to f (frequencies ascending in k at each point). */
export function nearestBranch(freq: FloatArray | ArrayLike<number>, nq: number, nb: number, iq: number, f: number): number {
  if (nb === 0) return -1;
  let lo = 0;
  let hi = nb;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (freq[mid * nq + iq] < f) lo = mid + 1;
    else hi = mid;
  }
  if (lo === 0) return 0;
  if (lo === nb) return nb - 1;
  return f - freq[(lo - 1) * nq + iq] <= freq[lo * nq + iq] - f ? lo - 1 : lo;
}

/**
 * The point of the spectrum nearest to (x, fTHz): the nearest q-point along x, then the
 * nearest branch there. Where two q-points share an x (a path break or a repeated point),
 * the one with the nearer frequency wins. `lo`/`hi` limit the search to the visible points.
 */
export function nearestPoint(d: Source, x: number, fTHz: number, lo = 0, hi = d.nq): NearestPoint | null {
  const i = nearestX(d.distance, x, lo, hi);
  if (i < 0 || d.nb === 0) return null;
  const xv = d.distance[i];
  const a = lowerBound(d.distance, xv, lo, hi);
  const b = upperBound(d.distance, xv, lo, hi);
  let best: NearestPoint | null = null;
  let bestD = Infinity;
  for (let iq = a; iq < b; iq++) {
    // Among degenerate branches the lowest, wherever the pointer is: hover and click agree.
    const k = degenerateRange(d, iq, nearestBranch(d.frequencies, d.nq, d.nb, iq, fTHz)).first;
    const f = d.frequencies[k * d.nq + iq];
    const dist = Math.abs(f - fTHz);
    if (dist < bestD) {
      bestD = dist;
      best = { index: iq, branch: k, frequency: f };
    }
  }
  return best;
}

export function frequencyAt(d: Source, index: number, branch: number): number {
  return d.frequencies[branch * d.nq + index];
}

/** q of a point: as given in the file (with its coordinates) and folded (fractional); null where unknown. */
export function qAt(d: Pick<PlotData, 'q' | 'qFolded' | 'coordinates'>, index: number): {
  given: [number, number, number] | null;
  coordinates: PlotData['coordinates'];
  folded: [number, number, number] | null;
} {
  const three = (a: Float64Array | null): [number, number, number] | null =>
    a ? [a[3 * index], a[3 * index + 1], a[3 * index + 2]] : null;
  return { given: three(d.q), coordinates: d.coordinates, folded: three(d.qFolded) };
}
