import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { coverageBuffer, paintCoverage, parseHex, rasterPolyline, type RasterWindow } from './raster';

// A window that maps data units 1:1 onto pixels (y up): pixel row r holds data y in [H-r-1, H-r].
const W = 40;
const H = 30;
const unit: RasterWindow = { x0: 0, x1: W, y0: 0, y1: H };
const total = (a: Float32Array) => a.reduce((s, v) => s + v, 0);
const line = (...pts: number[]) => new Float64Array(pts);

describe('rasterPolyline', () => {
  it('puts a horizontal line on the pixel row it passes through, one unit per column', () => {
    const b = coverageBuffer(W, H);
    // y = 10.5 in data is pixel-centre height: row H - 10.5 - 0.5 = 19, wholly.
    rasterPolyline(line(2, 10.5, 12, 10.5), 2, unit, b);
    for (let c = 0; c < W; c++) expect(b.coverage[19 * W + c]).toBe(c >= 2 && c < 12 ? 1 : 0);
    expect(total(b.coverage)).toBeCloseTo(10, 9);
  });

  it('splits a sample between the two nearest pixels by distance (Wu)', () => {
    const b = coverageBuffer(W, H);
    // y = 10.75: pixel y 19.25 from the top, 0.25 from row 19's centre (19.5) and 0.75 from
    // row 18's (18.5) → 0.75 in row 19, 0.25 in row 18.
    rasterPolyline(line(0, 10.75, 4, 10.75), 2, unit, b);
    expect(b.coverage[19 * W + 1]).toBeCloseTo(0.75, 6);
    expect(b.coverage[18 * W + 1]).toBeCloseTo(0.25, 6);
  });

  it('adds coverage equal to the length of any segment inside the grid, whatever its slope', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: W - 1, noNaN: true }), fc.double({ min: 1, max: H - 1, noNaN: true }), fc.double({ min: 1, max: W - 1, noNaN: true }), fc.double({ min: 1, max: H - 1, noNaN: true }), (ax, ay, bx, by) => {
        const b = coverageBuffer(W, H);
        rasterPolyline(line(ax, ay, bx, by), 2, unit, b);
        // One sample per column (or row) of the major axis: the count is within one of the span.
        const len = Math.hypot(bx - ax, by - ay);
        const perStep = len / Math.max(Math.abs(bx - ax), Math.abs(by - ay));
        expect(Math.abs(total(b.coverage) - len)).toBeLessThanOrEqual(perStep + 1e-6);
      }),
      { numRuns: 500 },
    );
  });

  it('draws the shared point of two joined segments once: a polyline equals the straight line it lies on', () => {
    const one = coverageBuffer(W, H);
    const two = coverageBuffer(W, H);
    rasterPolyline(line(3, 4, 33, 19), 2, unit, one);
    rasterPolyline(line(3, 4, 13, 9, 23, 14, 33, 19), 4, unit, two);
    for (let i = 0; i < one.coverage.length; i++) expect(two.coverage[i]).toBeCloseTo(one.coverage[i], 5);
  });

  it('leaves a gap at a NaN point', () => {
    const b = coverageBuffer(W, H);
    const n = rasterPolyline(line(1, 5.5, 10, 5.5, NaN, NaN, 20, 5.5, 30, 5.5), 5, unit, b);
    expect(n).toBe(2);
    const row = 24 * W;
    expect(b.coverage[row + 15]).toBe(0);
    expect(b.coverage[row + 5]).toBe(1);
    expect(b.coverage[row + 25]).toBe(1);
  });

  it('clips to the grid: far-away points cost nothing and draw only the visible part', () => {
    const clipped = coverageBuffer(W, H);
    const inside = coverageBuffer(W, H);
    // A line y = x/2 + 3 from x = -1e9 to 1e9, and the same line from x = -2 to 42.
    rasterPolyline(line(-1e9, -5e8 + 3, 1e9, 5e8 + 3), 2, unit, clipped);
    rasterPolyline(line(-2, 2, 42, 24), 2, unit, inside);
    for (let i = 0; i < inside.coverage.length; i++) expect(clipped.coverage[i]).toBeCloseTo(inside.coverage[i], 4);
    const none = coverageBuffer(W, H);
    expect(rasterPolyline(line(-50, 5, -10, 25, -10, 1e6), 3, unit, none)).toBe(0);
    expect(total(none.coverage)).toBe(0);
  });

  it('maps the window: the same line in other data units lands on the same pixels', () => {
    const a = coverageBuffer(W, H);
    const b = coverageBuffer(W, H);
    rasterPolyline(line(3, 4, 33, 19), 2, unit, a);
    // x in 0.1 units from 5, y in THz × 33.356 (a cm⁻¹-like factor) from −2.
    const k = 33.356;
    rasterPolyline(line(5 + 0.3, (4 - 2) * k, 5 + 3.3, (19 - 2) * k), 2, { x0: 5, x1: 5 + 4, y0: -2 * k, y1: (H - 2) * k }, b);
    for (let i = 0; i < a.coverage.length; i++) expect(b.coverage[i]).toBeCloseTo(a.coverage[i], 4);
  });

  it('dashes: about on / (on + off) of the length is drawn, and the pattern restarts after a gap', () => {
    const b = coverageBuffer(W, H);
    rasterPolyline(line(0, 5.5, 40, 5.5), 2, unit, b, { dash: [5, 3] });
    expect(total(b.coverage)).toBe(25); // 0–4, 8–12, 16–20, 24–28, 32–36
    const row = 24 * W;
    expect([...b.coverage.subarray(row, row + 10)]).toEqual([1, 1, 1, 1, 1, 0, 0, 0, 1, 1]);
  });
});

describe('paintCoverage', () => {
  it('paints source-over with alpha = min(1, coverage) × opacity', () => {
    const b = coverageBuffer(3, 1);
    b.coverage.set([0, 0.5, 7]);
    const rgba = new Uint8ClampedArray(12);
    paintCoverage(b, rgba, [200, 100, 0]);
    expect([...rgba]).toEqual([0, 0, 0, 0, 200, 100, 0, 128, 200, 100, 0, 255]);
    // A second colour at half opacity over the opaque pixel: an even mix, still opaque.
    b.coverage.set([0, 0, 1]);
    paintCoverage(b, rgba, [0, 0, 200], 0.5);
    expect([...rgba.subarray(8)]).toEqual([100, 50, 100, 255]);
  });

  it('reads #rrggbb colours and refuses anything else', () => {
    expect(parseHex('#0e3434')).toEqual([14, 52, 52]);
    expect(() => parseHex('teal')).toThrow(/#rrggbb/);
  });
});
