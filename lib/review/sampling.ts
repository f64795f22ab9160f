/**
 * Where a q-point of one revision lies on another revision's path. Two revisions of a spectrum
 * usually follow the same path but may sample it differently (more points, another code), so a
 * point is located by its segment and its fraction of that segment's length, and the other
 * revision's frequency there is interpolated linearly in path distance.
 */
import type { Dispersion } from '../dispersion/types';
import { pathGeometry } from '../physics/path';

export interface Sampled {
  kind: 'path' | 'mesh';
  nq: number;
  nb: number;
  /** THz, [iq * nb + k], ascending at each point. */
  frequencies: Float64Array;
  /** Cumulative path distance (lib/physics/path). */
  distance: Float64Array;
  /** Inclusive index ranges drawn as one line; one range over every point when the file has none. */
  segments: { start: number; end: number }[];
  /** q as given, 3 per point, or null. */
  q: Float64Array | null;
}

export function sampled(d: Dispersion): Sampled {
  const segments = d.segments.length ? d.segments.map((s) => ({ start: s.start, end: s.end })) : [{ start: 0, end: d.nq - 1 }];
  return { kind: d.kind, nq: d.nq, nb: d.nb, frequencies: d.frequencies, distance: pathGeometry(d).distance, segments, q: d.q };
}

/** The largest |ω| of a revision (THz). */
export function maxAbs(s: Sampled): number {
  let m = 0;
  for (let i = 0; i < s.frequencies.length; i++) m = Math.max(m, Math.abs(s.frequencies[i]));
  return m;
}

/** The same q-points in the same order: compare index by index. */
export function sameSampling(a: Sampled, b: Sampled): boolean {
  if (a.nq !== b.nq || a.segments.length !== b.segments.length) return false;
  if (a.segments.some((s, i) => s.start !== b.segments[i]!.start || s.end !== b.segments[i]!.end)) return false;
  const scale = Math.max(Math.abs(a.distance[a.nq - 1] ?? 0), Math.abs(b.distance[b.nq - 1] ?? 0), 1e-12);
  for (let i = 0; i < a.nq; i++) if (Math.abs(a.distance[i] - b.distance[i]) > 1e-6 * scale) return false;
  return true;
}

export interface PathPosition {
  segment: number;
  /** 0 at the segment's start, 1 at its end (by path distance). */
  t: number;
}

/**
 * The ranges positions refer to: each revision's own segments when both have as many, else the
 * whole path as one range (a path re-cut into other segments is still comparable end to end).
 */
export function commonRanges(a: Sampled, b: Sampled): [Sampled['segments'], Sampled['segments']] {
  if (a.segments.length === b.segments.length) return [a.segments, b.segments];
  return [[{ start: 0, end: a.nq - 1 }], [{ start: 0, end: b.nq - 1 }]];
}

export function positionOf(s: Sampled, ranges: Sampled['segments'], index: number): PathPosition | null {
  for (let k = 0; k < ranges.length; k++) {
    const r = ranges[k]!;
    if (index < r.start || index > r.end) continue;
    const length = s.distance[r.end] - s.distance[r.start];
    const t = length > 0 ? (s.distance[index] - s.distance[r.start]) / length : 0;
    return { segment: k, t: Math.min(1, Math.max(0, t)) };
  }
  return null;
}

/** ω of `branch` at a position on `s` (linear in path distance), or null when out of range. */
export function frequencyAt(s: Sampled, ranges: Sampled['segments'], pos: PathPosition, branch: number): number | null {
  const r = ranges[pos.segment];
  if (!r || branch < 0 || branch >= s.nb) return null;
  const d0 = s.distance[r.start];
  const target = d0 + pos.t * (s.distance[r.end] - d0);
  // Last index j in [start, end] with distance[j] <= target.
  let lo = r.start;
  let hi = r.end;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (s.distance[mid] <= target) lo = mid;
    else hi = mid - 1;
  }
  const j = lo;
  const w = (i: number) => s.frequencies[i * s.nb + branch];
  if (j >= r.end) return w(r.end);
  const span = s.distance[j + 1] - s.distance[j];
  if (span <= 0) return w(j);
  const f = (target - s.distance[j]) / span;
  return w(j) + f * (w(j + 1) - w(j));
}

/** Index of the point of `b` whose q equals q[i] of `a` (within 1e-6), for meshes. */
export function matchByQ(a: Sampled, b: Sampled): Map<number, number> | null {
  if (!a.q || !b.q) return null;
  const key = (q: Float64Array, i: number) => [0, 1, 2].map((c) => Math.round(q[i * 3 + c] * 1e6)).join(',');
  const inB = new Map<string, number>();
  for (let i = 0; i < b.nq; i++) if (!inB.has(key(b.q, i))) inB.set(key(b.q, i), i);
  const out = new Map<number, number>();
  for (let i = 0; i < a.nq; i++) {
    const j = inB.get(key(a.q, i));
    if (j !== undefined) out.set(i, j);
  }
  return out;
}
