import { describe, expect, it } from 'vitest';
import { anchorMoved, toleranceFor } from './anchor-moved';
import { sampled } from './sampling';
import { curve, revisionA, revisionB } from './test-curves';

describe('anchorMoved', () => {
  const a = sampled(revisionA());
  const b = sampled(revisionB());

  it('δ = max(0.05 THz, 1 % of the largest |ω|) over both revisions', () => {
    expect(toleranceFor(a, b)).toBe(0.05); // largest |ω| is 3 THz: 1 % is 0.03
    const big = sampled(curve({ distance: [0, 1], rows: [[0, 20], [1, 21]] }));
    expect(toleranceFor(a, big)).toBeCloseTo(0.21, 12);
  });

  it('the same revision has not moved', () => {
    expect(anchorMoved(a, a, { index: 1, branch: 0 })).toMatchObject({ moved: false, then: 1, now: 1, delta: 0 });
  });

  it('interpolates on the current revision when the sampling differs', () => {
    // Branch 0 at A's point 1: 1 → 1.1 (see compare.test.ts): 0.1 > δ = 0.05.
    const m = anchorMoved(a, b, { index: 1, branch: 0 });
    expect(m.moved).toBe(true);
    expect(m.delta).toBeCloseTo(0.1, 12);
    // Branch 1 there: 2 → 1.9667, |Δ| = 0.033 < 0.05.
    const n = anchorMoved(a, b, { index: 1, branch: 1 });
    expect(n.moved).toBe(false);
    expect(n.now).toBeCloseTo(2 - 1 / 30, 12);
  });

  it('exactly at δ is not a move; just above is', () => {
    const c = sampled(curve({ distance: [0, 1, 2], rows: [[0, 1], [1.0625, 2], [2, 3]] }));
    // 0.0625 is exact in binary, so the comparison is at δ exactly.
    expect(anchorMoved(a, c, { index: 1, branch: 0 }, { minDelta: 0.0625, relativeDelta: 0 }).moved).toBe(false);
    expect(anchorMoved(a, c, { index: 1, branch: 0 }, { minDelta: 0.0624, relativeDelta: 0 }).moved).toBe(true);
  });

  it('null when the current revision lacks the branch; out-of-range anchors are null too', () => {
    const one = sampled(curve({ distance: [0, 1, 2], rows: [[0], [1], [2]] }));
    expect(anchorMoved(a, one, { index: 1, branch: 1 }).moved).toBeNull();
    expect(anchorMoved(a, b, { index: 7, branch: 0 }).moved).toBeNull();
  });
});
