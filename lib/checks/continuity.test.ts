import { describe, expect, it } from 'vitest';
import { pathGeometry } from '../physics/path';
import { continuity } from './continuity';
import { defaultPolicy } from './policy';
import { buildPath, scPath, setFrequency, shiftPoints, SC_POINTS } from './test-spectra';

const run = (d: ReturnType<typeof buildPath>) => continuity(d, pathGeometry(d), defaultPolicy);
const OPTICAL = [3, 4, 5];

// The largest |ω| of the test spectrum is 17 THz at Γ, so δ = max(0.05, 1 % × 17) = 0.17 THz.
describe('continuity', () => {
  it('finds nothing in a clean spectrum', () => {
    expect(run(buildPath(scPath()))).toEqual([]);
  });

  it('(a) fails a shifted segment at both joins, naming the labels and the jump', () => {
    const d = buildPath(scPath()); // segments: Γ–X 0..40, X–M 41..81, M–Γ 82..122, Γ–R 123..163
    shiftPoints(d, 41, 81, 0.8, OPTICAL);
    const f = run(d);
    expect(f.map((x) => [x.severity, x.segment, x.index])).toEqual([
      ['fail', 1, 41],
      ['fail', 2, 82],
    ]);
    // The shift raises the largest |ω| to 16.4 + 0.8 = 17.2 THz (at X), so δ = 0.172 THz here.
    expect(f[0]).toMatchObject({ value: 0.8, limit: 0.172, branch: 3 });
    expect(f[0].message).toMatch(/join between X .* and X /);
    expect(f[0].message).toMatch(/differs by 0\.8 THz \(allowed 0\.172 THz\)/);
    expect(f[0].message).toMatch(/same calculation and the same units/);
  });

  it('(a) uses δ = max(0.05 THz, 1 % of the largest |ω|)', () => {
    const d = buildPath(scPath());
    setFrequency(d, 41, 5, d.frequencies[41 * 6 + 5] + 0.16);
    expect(run(d)).toEqual([]);
    const e = buildPath(scPath());
    setFrequency(e, 41, 5, e.frequencies[41 * 6 + 5] + 0.18);
    expect(run(e)).toMatchObject([{ index: 41, severity: 'fail' }]);
  });

  it('(b) compares points that differ by a reciprocal-lattice vector: ω(q) = ω(q + G)', () => {
    // Γ–X, break, X'–M with X' = X − (0, 1, 0): the same point of the zone, but not a join.
    const legs = [
      { from: 'Γ', to: 'X', q0: SC_POINTS.Γ, q1: SC_POINTS.X, broken: true },
      { from: 'X', to: 'M', q0: [0, -0.5, 0] as [number, number, number], q1: [0.5, -0.5, 0] as [number, number, number] },
    ];
    expect(run(buildPath(legs))).toEqual([]);
    const d = buildPath(legs);
    shiftPoints(d, 41, 81, 0.5, OPTICAL);
    const f = run(d);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'fail', index: 41, segment: 1, value: 0.5 });
    expect(f[0].message).toMatch(/^Q-point 41 \(X; .* and q-point 40 \(X; .* same point of the zone/);
  });

  it('(b) finds coincidences among many points in linear time', () => {
    // 20 000 points on a closed loop written twice: every point of the second pass repeats one of the first.
    const n = 10_000;
    const legs = [
      { from: 'Γ', to: 'X', q0: SC_POINTS.Γ, q1: [0, 1, 0] as [number, number, number], n, broken: true },
      { from: 'Γ', to: 'X', q0: [1, 0, 0] as [number, number, number], q1: [1, 1, 0] as [number, number, number], n },
    ];
    const d = buildPath(legs);
    const t0 = performance.now();
    expect(run(d)).toEqual([]);
    shiftPoints(d, n + 5000, n + 5000, 1, [5]);
    const f = run(d).filter((x) => x.message.includes('same point of the zone'));
    expect(performance.now() - t0).toBeLessThan(2000);
    expect(f.map((x) => x.index)).toEqual([n + 5000]);
  });

  it('(c) fails a jump inside a segment, once per step, with the branch that jumps most', () => {
    const d = buildPath(scPath());
    shiftPoints(d, 55, 65, 1); // inside X–M
    const f = run(d);
    expect(f.map((x) => [x.segment, x.index, x.severity])).toEqual([
      [1, 55, 'fail'],
      [1, 66, 'fail'],
    ]);
    expect(f[0].message).toMatch(/between q-points 54 and 55/);
    expect(f[0].message).toMatch(/6 branches jump there/);
  });

  it('(c) says which term set the limit: the floor on a nearly flat branch, else the median step', () => {
    const d = buildPath(scPath());
    shiftPoints(d, 55, 65, 1, [5]); // the highest optical branch is nearly flat along X–M
    const [flat] = run(d);
    expect(flat).toMatchObject({ branch: 5, limit: 0.5 });
    expect(flat.message).toMatch(/above 0\.5 THz \(the floor; the branch is (nearly )?flat here, median step \d[\d.]* THz\)/);
    expect(flat.message).not.toMatch(/larger of|e-\d/);

    // A coarse path: the steep acoustic branches step by about 0.7 THz, so 8 × that is the limit.
    const c = buildPath(scPath(undefined, 10));
    shiftPoints(c, 2, 2, 15, [0]);
    const [steep] = run(c);
    expect(steep.limit).toBeGreaterThan(0.5);
    expect(steep.message).toMatch(/\(8 × the branch's median step of [\d.]+ THz, above the 0\.5 THz floor\)/);
  });

  it('(c) ignores steps below 0.5 THz and steps within 8 × the median step', () => {
    const d = buildPath(scPath());
    shiftPoints(d, 55, 65, 0.45, [5]); // > 8 × median for a nearly flat optical branch, but < 0.5 THz
    expect(run(d)).toEqual([]);
    // A coarse path: steps of about 1 THz everywhere are not jumps.
    expect(run(buildPath(scPath(undefined, 5)))).toEqual([]);
  });

  it('is info for mismatches and steps at Γ in a polar file, fail otherwise', () => {
    for (const polar of [false, true]) {
      const d = buildPath(scPath(), { polar });
      // LO–TO: the optical branches leaving Γ towards R start 1 THz higher than elsewhere at Γ.
      shiftPoints(d, 123, 123, 1, OPTICAL);
      const f = run(d);
      expect(f.length).toBeGreaterThanOrEqual(2);
      expect(new Set(f.map((x) => x.severity))).toEqual(new Set([polar ? 'info' : 'fail']));
      if (polar) expect(f[0].message).toMatch(/LO–TO/);
    }
    // Polar, but the jump is away from Γ: still a failure.
    const d = buildPath(scPath(), { polar: true });
    shiftPoints(d, 41, 81, 0.8, OPTICAL);
    expect(run(d).map((x) => x.severity)).toEqual(['fail', 'fail']);
  });
});
