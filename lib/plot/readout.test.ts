import { describe, expect, it } from 'vitest';
import { degenerateRange, nearestBranch, nearestPoint, nearestX, qAt } from './readout';

// 4 q-points, the middle two share x (a break drawn as a gap at one position); 3 branches, branch-major.
const d = {
  nq: 4,
  nb: 3,
  distance: Float64Array.from([0, 1, 1, 2]),
  frequencies: Float64Array.from([
    0, 1, 1.5, 2, // branch 0
    3, 4, 6, 5, // branch 1
    7, 8, 9, 10, // branch 2
  ]),
};

describe('readout', () => {
  it('finds the nearest x, the lower one on a tie', () => {
    expect(nearestX(d.distance, -5)).toBe(0);
    expect(nearestX(d.distance, 0.4)).toBe(0);
    expect(nearestX(d.distance, 0.5)).toBe(0);
    expect(nearestX(d.distance, 0.6)).toBe(1);
    expect(nearestX(d.distance, 9)).toBe(3);
    expect(nearestX(new Float64Array(0), 1)).toBe(-1);
  });

  it('finds the nearest branch by bisection over the sorted frequencies of one point', () => {
    expect(nearestBranch(d.frequencies, 4, 3, 0, -1)).toBe(0);
    expect(nearestBranch(d.frequencies, 4, 3, 0, 1.4)).toBe(0);
    expect(nearestBranch(d.frequencies, 4, 3, 0, 1.6)).toBe(1);
    expect(nearestBranch(d.frequencies, 4, 3, 0, 100)).toBe(2);
  });

  it('picks, among points sharing an x, the one with the nearer frequency', () => {
    expect(nearestPoint(d, 1.01, 5.9)).toEqual({ index: 2, branch: 1, frequency: 6 });
    expect(nearestPoint(d, 0.99, 4.1)).toEqual({ index: 1, branch: 1, frequency: 4 });
    expect(nearestPoint(d, 1.9, 0)).toEqual({ index: 3, branch: 0, frequency: 2 });
    // Limited to a visible index range.
    expect(nearestPoint(d, 0, 0, 2, 4)?.index).toBe(2);
  });

  it('names degenerate branches and always picks the lowest of them, from above or below', () => {
    // Two points, three branches; at point 0 branches 1 and 2 are degenerate (4 THz, 2e-6 apart).
    const g = { nq: 2, nb: 3, distance: Float64Array.from([0, 1]), frequencies: Float64Array.from([1, 1.5, 4, 5, 4.000002, 6]) };
    expect(degenerateRange(g, 0, 2)).toEqual({ first: 1, last: 2 });
    expect(degenerateRange(g, 0, 0)).toEqual({ first: 0, last: 0 });
    expect(degenerateRange(g, 1, 1)).toEqual({ first: 1, last: 1 });
    expect(nearestPoint(g, 0, 4.3)?.branch).toBe(1);
    expect(nearestPoint(g, 0, 3.7)?.branch).toBe(1);
  });

  it('gives q as written and folded', () => {
    const q = Float64Array.from([0, 0, 0, 0.75, 0, 0]);
    const f = Float64Array.from([0, 0, 0, -0.25, 0, 0]);
    expect(qAt({ q, qFolded: f, coordinates: 'fractional' }, 1)).toEqual({ given: [0.75, 0, 0], coordinates: 'fractional', folded: [-0.25, 0, 0] });
    expect(qAt({ q: null, qFolded: null, coordinates: 'fractional' }, 1)).toEqual({ given: null, coordinates: 'fractional', folded: null });
  });
});
