/**
 * Min/max decimation of many branches into one joined polyline for the chart.
 *
 * The visible x range is cut into pixel columns; inside each column, each connected run of
 * each branch keeps only its lowest and its highest point (in path order), plus the first and
 * last point of the run so lines start and end exactly at labels and breaks. A line drawn
 * through these points covers the same pixels as the full line, to within one column.
 * All branches go into one interleaved array `[x0, y0, x1, y1, …]` with a NaN point after
 * every run: the chart draws one series, and NaN leaves a gap (between branches and at
 * path breaks).
 */
import { connectedRuns } from './path-breaks';
import type { FloatArray } from './wire';

export interface DecimateSource {
  /** x of each q-point, non-decreasing. */
  x: ArrayLike<number>;
  /** Branch-major `[k * nq + iq]`. */
  y: FloatArray | ArrayLike<number>;
  nq: number;
  nb: number;
  /** Indices i with no line from point i to i + 1. */
  breaks: readonly number[];
}

export interface DecimateWindow {
  x0: number;
  x1: number;
  /** Number of pixel columns across [x0, x1] (e.g. plot width / 2). */
  columns: number;
}

export interface DecimateOptions {
  /** Only these branches (default: all). */
  branches?: readonly number[];
  /** Multiply every y by this (unit conversion), default 1. */
  scale?: number;
  /** Also return the source point index of every output point (-1 at separators). */
  withIndex?: boolean;
  /**
   * Write the points into this array when it is large enough (the result is a view of it):
   * redraws then allocate nothing. Check `Decimated.xy.buffer` to keep the larger one.
   */
  out?: Float64Array;
}

export interface Decimated {
  /** Interleaved x, y; NaN, NaN between runs. Length 2 × points. */
  xy: Float64Array;
  points: number;
  /** Source q-point index of each output point, -1 at separators (with `withIndex`). */
  index: Int32Array | null;
  /** Source branch of each output point, -1 at separators (with `withIndex`). */
  branch: Int32Array | null;
}

/** First i in [lo, hi) with a[i] >= v (a non-decreasing), hi when none. */
export function lowerBound(a: ArrayLike<number>, v: number, lo = 0, hi = a.length): number {
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] < v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** First i in [lo, hi) with a[i] > v (a non-decreasing), hi when none. */
export function upperBound(a: ArrayLike<number>, v: number, lo = 0, hi = a.length): number {
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] <= v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The index range drawn for a window: every point inside plus one neighbour on each side, so
 * lines run on to the edge of the plot (the chart clips them).
 */
export function visibleRange(x: ArrayLike<number>, x0: number, x1: number): [number, number] {
  const n = x.length;
  if (n === 0) return [0, -1];
  const i0 = Math.max(0, lowerBound(x, x0) - 1);
  const i1 = Math.min(n - 1, upperBound(x, x1));
  return [i0, i1];
}

export function decimate(src: DecimateSource, win: DecimateWindow, opts: DecimateOptions = {}): Decimated {
  const { x, y, nq, nb } = src;
  const scale = opts.scale ?? 1;
  const branches = opts.branches ?? null;
  const nBranches = branches ? branches.length : nb;
  const columns = Math.max(1, Math.floor(win.columns));
  const span = win.x1 - win.x0;
  if (!(span > 0) || !Number.isFinite(span)) throw new RangeError(`decimate: window [${win.x0}, ${win.x1}] must have x1 > x0`);

  const [i0, i1] = visibleRange(x, win.x0, win.x1);
  const runs = connectedRuns(src.breaks, nq)
    .map(([a, b]) => [Math.max(a, i0), Math.min(b, i1)] as [number, number])
    .filter(([a, b]) => a <= b);

  // The column of each visible point, shared by all branches.
  const m = i1 - i0 + 1;
  const col = new Int32Array(Math.max(0, m));
  const k = columns / span;
  for (let i = i0; i <= i1; i++) {
    let c = Math.floor((x[i] - win.x0) * k);
    if (c < -1) c = -1;
    else if (c > columns) c = columns;
    col[i - i0] = c;
  }

  let bound = 0;
  for (const [a, b] of runs) bound += Math.min(b - a + 1, 2 * (columns + 2) + 2) + 1;
  bound *= nBranches;
  // At full size a fresh array would be tens of MB per redraw, and garbage for the next one.
  const xy = opts.out && opts.out.length >= 2 * bound ? opts.out : new Float64Array(2 * bound);
  const idx = opts.withIndex ? new Int32Array(bound) : null;
  const br = opts.withIndex ? new Int32Array(bound) : null;

  // The hot loop: no closures, no per-point allocation (3 M values per redraw at full size).
  let p = 0;
  for (let bi = 0; bi < nBranches; bi++) {
    const kb = branches ? branches[bi] : bi;
    if (kb < 0 || kb >= nb) throw new RangeError(`decimate: branch ${kb} outside 0..${nb - 1}`);
    const off = kb * nq;
    for (let r = 0; r < runs.length; r++) {
      const a = runs[r][0];
      const b = runs[r][1];
      // The run's first point.
      xy[2 * p] = x[a];
      xy[2 * p + 1] = y[off + a] * scale;
      if (idx) {
        idx[p] = a;
        br![p] = kb;
      }
      p++;
      let c = -2;
      let minI = -1;
      let maxI = -1;
      let minV = Infinity;
      let maxV = -Infinity;
      // Interior points: per column, the lowest and the highest, in path order.
      for (let i = a + 1; i <= b; i++) {
        const ci = i < b ? col[i - i0] : -3;
        if (ci !== c) {
          if (minI >= 0) {
            const lo = minI < maxI ? minI : maxI;
            const hi = minI < maxI ? maxI : minI;
            xy[2 * p] = x[lo];
            xy[2 * p + 1] = y[off + lo] * scale;
            if (idx) {
              idx[p] = lo;
              br![p] = kb;
            }
            p++;
            if (hi !== lo) {
              xy[2 * p] = x[hi];
              xy[2 * p + 1] = y[off + hi] * scale;
              if (idx) {
                idx[p] = hi;
                br![p] = kb;
              }
              p++;
            }
          }
          if (i === b) break;
          c = ci;
          minI = maxI = -1;
          minV = Infinity;
          maxV = -Infinity;
        }
        const v = y[off + i];
        if (v < minV) {
          minV = v;
          minI = i;
        }
        if (v > maxV) {
          maxV = v;
          maxI = i;
        }
      }
      // The run's last point.
      if (b > a) {
        xy[2 * p] = x[b];
        xy[2 * p + 1] = y[off + b] * scale;
        if (idx) {
          idx[p] = b;
          br![p] = kb;
        }
        p++;
      }
      // Separator.
      xy[2 * p] = NaN;
      xy[2 * p + 1] = NaN;
      if (idx) {
        idx[p] = -1;
        br![p] = -1;
      }
      p++;
    }
  }
  return {
    xy: xy.subarray(0, 2 * p),
    points: p,
    index: idx ? idx.subarray(0, p) : null,
    branch: br ? br.subarray(0, p) : null,
  };
}
