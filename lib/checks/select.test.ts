import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { medianInPlace } from './select';

describe('medianInPlace', () => {
  it('agrees with sorting on any array and sub-range', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, min: -1e6, max: 1e6 }), { minLength: 1, maxLength: 60 }), (xs) => {
        const sorted = [...xs].sort((a, b) => a - b);
        const n = sorted.length;
        const expected = n % 2 ? sorted[(n - 1) / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2;
        const buf = Float64Array.from([7, ...xs, -7]);
        expect(medianInPlace(buf, 1, n + 1)).toBe(expected);
      }),
    );
  });
  it('handles ties and sorted input', () => {
    expect(medianInPlace(new Float64Array([1, 1, 1, 1]), 0, 4)).toBe(1);
    expect(medianInPlace(Float64Array.from({ length: 1001 }, (_, i) => i), 0, 1001)).toBe(500);
    expect(Number.isNaN(medianInPlace(new Float64Array(3), 1, 1))).toBe(true);
  });
});
