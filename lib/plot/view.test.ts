import { describe, expect, it } from 'vitest';
import { clampView, panView, paddedRange, zoomView } from './view';

const lim = { full: { x0: 0, x1: 10, y0: 0, y1: 50 }, minSpanX: 0.1, minSpanY: 0.5 };

describe('view', () => {
  it('zooms about the anchor, which stays where it was', () => {
    const v = zoomView(lim.full, 0.5, { x: 2, y: 10 }, 'x', lim);
    expect(v).toEqual({ x0: 1, x1: 6, y0: 0, y1: 50 });
    const w = zoomView(lim.full, 0.5, { x: 2, y: 10 }, 'xy', lim);
    expect(w.y0).toBeCloseTo(5);
    expect(w.y1).toBeCloseTo(30);
  });

  it('never zooms below the smallest span nor out past the full x range', () => {
    const v = zoomView(lim.full, 1e-6, { x: 5, y: 5 }, 'x', lim);
    expect(v.x1 - v.x0).toBeCloseTo(0.1);
    expect(zoomView(lim.full, 4, { x: 5, y: 5 }, 'x', lim)).toEqual(lim.full);
  });

  it('pans and stops at the ends without shrinking', () => {
    const v = { x0: 2, x1: 4, y0: 0, y1: 50 };
    expect(panView(v, -5, 0, lim)).toEqual({ x0: 0, x1: 2, y0: 0, y1: 50 });
    expect(panView(v, 100, 0, lim)).toEqual({ x0: 8, x1: 10, y0: 0, y1: 50 });
    expect(clampView({ x0: 0, x1: 10, y0: 500, y1: 510 }, lim).y1).toBe(100);
  });

  it('pads the y range and keeps zero in it', () => {
    expect(paddedRange(1, 11)).toEqual({ y0: 0, y1: 11.55 });
    const r = paddedRange(-2, 8);
    expect(r.y0).toBeCloseTo(-2.5);
    expect(r.y1).toBeCloseTo(8.5);
  });
});
