/**
 * Our own line rasterizer for the dense part of the dispersion plot.
 *
 * A chart library strokes a polyline by building a path of every point and handing it to the
 * canvas, which at a thousand branches costs most of a second per redraw. Here each segment
 * goes straight into a coverage buffer (one float per device pixel), anti-aliased the way
 * Xiaolin Wu's line algorithm does it: one sample per pixel column (or row, for steep
 * segments), its weight split between the two nearest pixels. Coverage adds up where
 * branches crowd, so dense bundles read darker, as they should; it is clamped when painted.
 *
 * Sample positions are pixel centres taken half-open along each segment, so the shared end
 * of two joined segments is drawn once, not twice (no dark dots at every point).
 */

export interface RasterWindow {
  /** Data x at the left and right edges of the pixel grid. */
  x0: number;
  x1: number;
  /** Data y at the bottom and top edges (y grows upward). */
  y0: number;
  y1: number;
}

export interface CoverageBuffer {
  width: number;
  height: number;
  /** Row-major, row 0 at the top; length width × height. */
  coverage: Float32Array;
}

export interface RasterOptions {
  /** Dash pattern in pixels along the line, `[on, off]`; restarts at every gap. */
  dash?: readonly [number, number];
  /** Coverage added by a fully covered pixel (default 1). */
  weight?: number;
}

export function coverageBuffer(width: number, height: number, reuse?: CoverageBuffer | null): CoverageBuffer {
  const w = Math.max(1, Math.round(width));
  const h = Math.max(1, Math.round(height));
  if (reuse && reuse.coverage.length >= w * h) {
    const coverage = reuse.coverage.length === w * h ? reuse.coverage : reuse.coverage.subarray(0, w * h);
    coverage.fill(0);
    return { width: w, height: h, coverage };
  }
  return { width: w, height: h, coverage: new Float32Array(w * h) };
}

/**
 * Adds the polyline `xy` (interleaved `[x, y, …]` in data units, a NaN point between runs)
 * to `target`, mapping `win` onto the whole pixel grid. Points are read up to `points`.
 * Returns the number of segments drawn (inside the window after clipping).
 */
export function rasterPolyline(xy: ArrayLike<number>, points: number, win: RasterWindow, target: CoverageBuffer, opts: RasterOptions = {}): number {
  const { width: W, height: H, coverage: cov } = target;
  const sx = W / (win.x1 - win.x0);
  const sy = H / (win.y1 - win.y0);
  if (!Number.isFinite(sx) || !Number.isFinite(sy) || sx <= 0 || sy <= 0) return 0;
  const weight = opts.weight ?? 1;
  const dashOn = opts.dash ? opts.dash[0] : Infinity;
  const period = opts.dash ? opts.dash[0] + opts.dash[1] : Infinity;
  let phase = 0;
  let drawn = 0;
  let havePrev = false;
  let px = 0;
  let py = 0;
  const n = Math.min(points, xy.length >> 1);
  for (let i = 0; i < n; i++) {
    const xd = xy[2 * i];
    const yd = xy[2 * i + 1];
    if (xd !== xd || yd !== yd) {
      havePrev = false;
      phase = 0;
      continue;
    }
    const cx = (xd - win.x0) * sx;
    const cy = (win.y1 - yd) * sy;
    if (havePrev) {
      phase = segment(px, py, cx, cy, W, H, cov, weight, dashOn, period, phase);
      if (phase >= 0) drawn++;
      else phase = -phase - 1;
    }
    px = cx;
    py = cy;
    havePrev = true;
  }
  return drawn;
}

/**
 * One segment in pixel coordinates. Returns the dash phase after it, or `-(phase + 1)` when
 * the segment lay wholly outside the grid (nothing drawn).
 */
function segment(ax: number, ay: number, bx: number, by: number, W: number, H: number, cov: Float32Array, weight: number, dashOn: number, period: number, phase: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const steep = Math.abs(dy) > Math.abs(dx);
  // Along the major axis: start, end (start < end), and the minor coordinate as a function of it.
  let m0: number, m1: number, n0: number, slope: number;
  if (steep) {
    if (ay <= by) {
      m0 = ay;
      m1 = by;
      n0 = ax;
    } else {
      m0 = by;
      m1 = ay;
      n0 = bx;
    }
    slope = dx / dy;
  } else {
    if (ax <= bx) {
      m0 = ax;
      m1 = bx;
      n0 = ay;
    } else {
      m0 = bx;
      m1 = ax;
      n0 = by;
    }
    slope = dx === 0 ? 0 : dy / dx;
  }
  const mLimit = steep ? H : W;
  const nLimit = steep ? W : H;
  const stepLength = Math.sqrt(1 + slope * slope);
  // Samples at pixel centres c + 0.5 with m0 <= c + 0.5 < m1, kept to the grid along the major axis.
  let c0 = Math.ceil(m0 - 0.5);
  let c1 = Math.ceil(m1 - 0.5); // exclusive
  const steps = c1 - c0;
  if (c0 < 0) c0 = 0;
  if (c1 > mLimit) c1 = mLimit;
  // The minor axis: skip the part of the range whose samples fall wholly off the grid.
  const n1 = n0 + (m1 - m0) * slope;
  const minorInside = n0 >= 0 && n0 < nLimit && n1 >= 0 && n1 < nLimit;
  if (minorInside) {
    // The usual case: nothing to cut along the minor axis.
  } else if (slope !== 0 && c0 < c1) {
    // n(c) = n0 + (c + 0.5 - m0) * slope must lie in (-1, nLimit).
    const ca = (-1 - n0) / slope + m0 - 0.5;
    const cb = (nLimit - n0) / slope + m0 - 0.5;
    const lo = Math.floor(Math.min(ca, cb));
    const hi = Math.ceil(Math.max(ca, cb)) + 1;
    if (lo > c0) c0 = lo;
    if (hi < c1) c1 = hi;
  } else if (n0 <= -1 || n0 >= nLimit) {
    c1 = c0;
  }
  const dashed = period !== Infinity;
  if (c0 >= c1) return dashed ? -(((phase + Math.max(0, steps) * stepLength) % period) + 1) : -1;
  const base = Math.ceil(m0 - 0.5);
  const w = weight * stepLength;
  // Minor coordinate of the first sample, relative to pixel centres; then one slope per step.
  // The clipping above is generous by a sample, so both pixels are still bounds-checked.
  let v = n0 + (c0 + 0.5 - m0) * slope - 0.5;
  // Dash phase of the first sample; advanced only when dashed (a modulo per pixel otherwise).
  let ph = dashed ? phase + (c0 - base) * stepLength : 0;
  if (steep) {
    for (let c = c0, row = c0 * W; c < c1; c++, v += slope, row += W) {
      if (dashed) {
        const at = ph;
        ph += stepLength;
        if (at % period >= dashOn) continue;
      }
      const k = Math.floor(v);
      const f = v - k;
      if (k >= 0 && k < W) cov[row + k] += w * (1 - f);
      if (k >= -1 && k + 1 < W) cov[row + k + 1] += w * f;
    }
  } else {
    for (let c = c0; c < c1; c++, v += slope) {
      if (dashed) {
        const at = ph;
        ph += stepLength;
        if (at % period >= dashOn) continue;
      }
      const k = Math.floor(v);
      const f = v - k;
      if (k >= 0 && k < H) cov[k * W + c] += w * (1 - f);
      if (k >= -1 && k + 1 < H) cov[(k + 1) * W + c] += w * f;
    }
  }
  return dashed ? (phase + steps * stepLength) % period : 0;
}

/** `#rrggbb` → [r, g, b]. */
export function parseHex(color: string): [number, number, number] {
  const m = /^#([0-9a-f]{6})$/i.exec(color);
  if (!m) throw new Error(`expected a colour as #rrggbb, got ${color}`);
  const v = parseInt(m[1], 16);
  return [(v >> 16) & 255, (v >> 8) & 255, v & 255];
}

/**
 * Paints coverage in one colour over what `rgba` (non-premultiplied, as canvas ImageData
 * holds it) already has: source-over with alpha = min(1, coverage) × opacity.
 */
export function paintCoverage(buf: CoverageBuffer, rgba: Uint8ClampedArray, color: readonly [number, number, number], opacity = 1): void {
  const cov = buf.coverage;
  const n = buf.width * buf.height;
  const [r, g, b] = color;
  for (let i = 0; i < n; i++) {
    const c = cov[i];
    if (c <= 0) continue;
    const as = (c >= 1 ? 1 : c) * opacity;
    const j = 4 * i;
    const ad = rgba[j + 3] / 255;
    if (ad === 0) {
      rgba[j] = r;
      rgba[j + 1] = g;
      rgba[j + 2] = b;
      rgba[j + 3] = as * 255 + 0.5;
      continue;
    }
    const keep = ad * (1 - as);
    const ao = as + keep;
    rgba[j] = (r * as + rgba[j] * keep) / ao + 0.5;
    rgba[j + 1] = (g * as + rgba[j + 1] * keep) / ao + 0.5;
    rgba[j + 2] = (b * as + rgba[j + 2] * keep) / ao + 0.5;
    rgba[j + 3] = ao * 255 + 0.5;
  }
}
