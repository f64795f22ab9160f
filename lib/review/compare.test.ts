import { describe, expect, it } from 'vitest';
import { compareRevisions } from './compare';
import { sampled } from './sampling';
import { curve, revisionA, revisionB } from './test-curves';

describe('compareRevisions', () => {
  it('same sampling: point by point, the largest deviation and where', () => {
    const a = revisionA();
    const b = curve({ distance: [0, 1, 2], rows: [[0, 1.2], [0.9, 2], [2, 3.05]] });
    const c = compareRevisions(sampled(a), sampled(b));
    expect(c.sampling).toBe('same');
    expect(c.compared).toBe(3);
    // Branch 0: |0.9 − 1| = 0.1 at index 1. Branch 1: |1.2 − 1| = 0.2 at index 0.
    expect(c.branches[0]).toMatchObject({ branch: 0, at: { index: 1, distance: 1 } });
    expect(c.branches[0]!.maxDeviation).toBeCloseTo(0.1, 12);
    expect(c.branches[0]!.signed).toBeCloseTo(-0.1, 12);
    expect(c.branches[1]).toMatchObject({ branch: 1, at: { index: 0, distance: 0 } });
    expect(c.branches[1]!.maxDeviation).toBeCloseTo(0.2, 12);
  });

  it('different sampling: B interpolated along the path at each point of A (hand-computed)', () => {
    const c = compareRevisions(sampled(revisionA()), sampled(revisionB()));
    expect(c.sampling).toBe('interpolated');
    expect(c.compared).toBe(3);
    // A's point 1 is half-way: distance 1.0 on B lies 2/3 of the way from 0.6 to 1.2.
    // Branch 0 there: 0.5 + (2/3)(1.4 − 0.5) = 1.1 → +0.1; at the ends: +0.05 and +0.02.
    expect(c.branches[0]!.maxDeviation).toBeCloseTo(0.1, 12);
    expect(c.branches[0]!.signed).toBeCloseTo(0.1, 12);
    expect(c.branches[0]!.at).toEqual({ index: 1, distance: 1 });
    // Branch 1: 1.3 + (2/3)(2.3 − 1.3) = 1.9667 → −0.0333; at the end 2.7 − 3 = −0.3.
    expect(c.branches[1]!.maxDeviation).toBeCloseTo(0.3, 12);
    expect(c.branches[1]!.signed).toBeCloseTo(-0.3, 12);
    expect(c.branches[1]!.at).toEqual({ index: 2, distance: 2 });
  });

  it('locates points by segment: a longer second segment is compared by fraction of its length', () => {
    // A: segments [0,2] (length 2) and [3,4] (length 1); B has the second segment twice as long.
    const a = curve({ distance: [0, 1, 2, 2, 3], rows: [[1], [2], [3], [3], [5]], segments: [{ start: 0, end: 2 }, { start: 3, end: 4 }] });
    const b = curve({ distance: [0, 2, 2, 3, 4], rows: [[1], [3], [3], [4], [5.5]], segments: [{ start: 0, end: 1 }, { start: 2, end: 4 }] });
    const c = compareRevisions(sampled(a), sampled(b));
    expect(c.sampling).toBe('interpolated');
    // Point 1 (middle of segment 0): B at distance 1 → 2, no deviation. Point 4 (end): 5.5 − 5.
    expect(c.branches[0]!.maxDeviation).toBeCloseTo(0.5, 12);
    expect(c.branches[0]!.at.index).toBe(4);
  });

  it('branch counts that differ: compares the common branches and says how many were left out', () => {
    const b = curve({ distance: [0, 1, 2], rows: [[0, 1, 5], [1, 2, 5], [2, 3, 5]] });
    const c = compareRevisions(sampled(revisionA()), sampled(b));
    expect(c.branches).toHaveLength(2);
    expect(c.branches.every((x) => x.maxDeviation === 0)).toBe(true);
    expect(c.branchesOnlyInB).toBe(1);
    expect(c.branchesOnlyInA).toBe(0);
  });

  it('meshes: only the q-points present in both', () => {
    const a = curve({ kind: 'mesh', distance: [], rows: [[1], [2], [3]], q: [[0, 0, 0], [0.5, 0, 0], [0, 0.5, 0]] });
    const b = curve({ kind: 'mesh', distance: [], rows: [[1.5], [2.2]], q: [[0.5, 0, 0], [0, 0, 0.5]] });
    const c = compareRevisions(sampled(a), sampled(b));
    expect(c.sampling).toBe('matched-q');
    expect(c.compared).toBe(1);
    expect(c.branches[0]!.maxDeviation).toBeCloseTo(0.5, 12);
    expect(c.branches[0]!.at.index).toBe(1);
  });
});
