/**
 * The visible window of the plot and how wheel, drag and keys move it. Our own zoom: the
 * chart only ever sees axis limits and freshly decimated data for them.
 */
export interface View {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

export interface ViewLimits {
  /** The full view (reset goes here); x never leaves [full.x0, full.x1]. */
  full: View;
  /** Smallest x span allowed (e.g. a few point spacings). */
  minSpanX: number;
  /** Smallest y span allowed. */
  minSpanY: number;
}

/** Zoom by `factor` (< 1 zooms in) about the anchor, along x, y or both. */
export function zoomView(v: View, factor: number, anchor: { x: number; y: number }, axes: 'x' | 'y' | 'xy', lim: ViewLimits): View {
  let { x0, x1, y0, y1 } = v;
  if (axes !== 'y') {
    const span = Math.max(lim.minSpanX, (x1 - x0) * factor);
    const t = x1 > x0 ? (anchor.x - x0) / (x1 - x0) : 0.5;
    x0 = anchor.x - t * span;
    x1 = x0 + span;
  }
  if (axes !== 'x') {
    const span = Math.max(lim.minSpanY, (y1 - y0) * factor);
    const t = y1 > y0 ? (anchor.y - y0) / (y1 - y0) : 0.5;
    y0 = anchor.y - t * span;
    y1 = y0 + span;
  }
  return clampView({ x0, x1, y0, y1 }, lim);
}

/** Move by (dx, dy) in data units. */
export function panView(v: View, dx: number, dy: number, lim: ViewLimits): View {
  return clampView({ x0: v.x0 + dx, x1: v.x1 + dx, y0: v.y0 + dy, y1: v.y1 + dy }, lim);
}

/**
 * Keeps x inside the full range (shifting, not shrinking, when a pan hits the edge) and y
 * within one full height beyond the full view, so the spectrum can never be lost off-screen.
 */
export function clampView(v: View, lim: ViewLimits): View {
  const f = lim.full;
  const fullX = f.x1 - f.x0;
  let span = Math.min(fullX, Math.max(lim.minSpanX, v.x1 - v.x0));
  let x0 = Math.min(Math.max(v.x0, f.x0), f.x1 - span);
  if (span >= fullX) {
    x0 = f.x0;
    span = fullX;
  }
  const fullY = f.y1 - f.y0;
  const ySpan = Math.min(3 * fullY, Math.max(lim.minSpanY, v.y1 - v.y0));
  const yLo = f.y0 - fullY;
  const yHi = f.y1 + fullY;
  const y0 = Math.min(Math.max(v.y0, yLo), yHi - ySpan);
  return { x0, x1: x0 + span, y0, y1: y0 + ySpan };
}

export function sameView(a: View, b: View): boolean {
  return a.x0 === b.x0 && a.x1 === b.x1 && a.y0 === b.y0 && a.y1 === b.y1;
}

/** A y range with some air around [lo, hi], always including 0 (imaginary modes show as below it). */
export function paddedRange(lo: number, hi: number): { y0: number; y1: number } {
  const a = Math.min(0, lo);
  const b = Math.max(0, hi);
  const pad = (b - a || 1) * 0.05;
  return { y0: a < 0 ? a - pad : 0, y1: b + pad };
}
