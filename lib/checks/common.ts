/** Small helpers the checks share: path topology, point names, number formatting. */
import type { Dispersion, Segment } from '../dispersion/types';
import type { PathGeometry } from '../physics/path';
import type { CheckId, Finding, Severity } from './types';

/** The file's segments, or one segment over every point when the file gives none. */
export function segmentsOf(d: Dispersion): Segment[] {
  if (d.segments.length > 0) return d.segments;
  return d.nq > 0 ? [{ start: 0, end: d.nq - 1, connectedToNext: false }] : [];
}

/** link[i] = 1 when point i and point i + 1 are connected (same segment, or a connected join). */
export function linkNext(d: Dispersion): Uint8Array {
  const link = new Uint8Array(d.nq);
  if (d.kind === 'mesh') return link;
  const segs = segmentsOf(d);
  for (let s = 0; s < segs.length; s++) {
    const { start, end } = segs[s];
    for (let i = start; i < end; i++) link[i] = 1;
    const next = segs[s + 1];
    if (next && next.start === end + 1 && segs[s].connectedToNext) link[end] = 1;
  }
  return link;
}

/** For each point, the first segment that contains it (-1 when none does). */
export function segmentOfPoint(d: Dispersion): Int32Array {
  const out = new Int32Array(d.nq).fill(-1);
  const segs = segmentsOf(d);
  for (let s = segs.length - 1; s >= 0; s--) for (let i = segs[s].start; i <= segs[s].end; i++) out[i] = s;
  return out;
}

/** Path length of a segment along the geometry's distance. */
export function segmentLength(g: PathGeometry, s: Segment): number {
  return Math.abs(g.distance[s.end] - g.distance[s.start]);
}

/** The folded q of point i as a plain array (fractional when known, else as given), or null. */
export function qAt(d: Dispersion, g: PathGeometry, i: number): number[] | null {
  const src = g.qFolded ?? g.qFrac ?? d.q;
  if (!src) return null;
  return [round(src[3 * i]), round(src[3 * i + 1]), round(src[3 * i + 2])];
}

/** Rounds to 1e-6 so that JSON shows what the numbers mean, not float noise; -0 becomes 0. */
export function round(x: number, step = 1e-6): number {
  const r = Math.round(x / step) * step;
  const s = Number(r.toPrecision(12));
  return s === 0 ? 0 : s;
}

export function fmt(x: number, digits = 3): string {
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e4 || a < 1e-3) return x.toExponential(2);
  return String(Number(x.toFixed(digits)));
}

export function fmtQ(q: ArrayLike<number> | null): string {
  if (!q) return '';
  return `(${fmt(q[0], 4)}, ${fmt(q[1], 4)}, ${fmt(q[2], 4)})`;
}

/** "q-point 57 (X; q = (0.5, 0, 0.5))" — what a submitter can find in the file. */
export function pointName(d: Dispersion, g: PathGeometry, i: number): string {
  const label = d.labels.get(i);
  const q = qAt(d, g, i);
  const parts = [label, q ? `q = ${fmtQ(q)}` : null].filter(Boolean);
  return `q-point ${i}${parts.length ? ` (${parts.join('; ')})` : ''}`;
}

export function finding(
  check: CheckId,
  severity: Severity,
  f: Partial<Omit<Finding, 'check' | 'severity' | 'message'>> & { message: string },
): Finding {
  return {
    check,
    severity,
    segment: f.segment ?? null,
    index: f.index ?? null,
    branch: f.branch ?? null,
    q: f.q ?? null,
    value: f.value == null ? null : round(f.value),
    limit: f.limit == null ? null : round(f.limit),
    message: f.message,
  };
}

/**
 * Largest |ω| in the file (THz) and its flat index. Two checks need it; inside one screening
 * run (`withScanMemo`) the scan is remembered so a 3 M-value file is read once for it. Outside
 * a run nothing is remembered, so a caller that edits frequencies in place never sees a stale value.
 */
export function largest(freq: Float64Array): { max: number; at: number } {
  const hit = largestMemo?.get(freq);
  if (hit) return hit;
  let max = 0;
  let at = 0;
  for (let i = 0; i < freq.length; i++) {
    const a = Math.abs(freq[i]);
    if (a > max) {
      max = a;
      at = i;
    }
  }
  const r = { max, at };
  largestMemo?.set(freq, r);
  return r;
}
let largestMemo: WeakMap<Float64Array, { max: number; at: number }> | null = null;

/** Lets a check that already read every value hand the largest |ω| to the others (inside a run only). */
export function rememberLargest(freq: Float64Array, max: number, at: number) {
  largestMemo?.set(freq, { max, at });
}

/** Runs f (synchronous) with whole-file scans remembered; screen() wraps all checks in it. */
export function withScanMemo<T>(f: () => T): T {
  const outer = largestMemo;
  largestMemo = new WeakMap();
  try {
    return f();
  } finally {
    largestMemo = outer;
  }
}

export const maxAbs = (freq: Float64Array) => largest(freq).max;

/** Whether a Γ end: the geometry's flag (q folds to 0 or a Γ label). */
export const isGammaPoint = (g: PathGeometry, i: number) => g.gamma[i] === 1;
