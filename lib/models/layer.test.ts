import { describe, expect, it } from 'vitest';
import { layerModel } from './layer';
import { pathDispersion } from './model';

/** Log–log slope of branch k between 2 % and 10 % of Γ–X. */
function exponent(k: number): number {
  const d = pathDispersion(layerModel(), { points: 201 });
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 4; i <= 20; i++) {
    xs.push(Math.log(d.distance![i]));
    ys.push(Math.log(d.frequencies[i * 3 + k]));
  }
  const n = xs.length;
  const mx = xs.reduce((p, c) => p + c) / n;
  const my = ys.reduce((p, c) => p + c) / n;
  let sxy = 0, sxx = 0;
  for (let i = 0; i < n; i++) { sxy += (xs[i] - mx) * (ys[i] - my); sxx += (xs[i] - mx) ** 2; }
  return sxy / sxx;
}

describe('layer model', () => {
  it('has one quadratic (flexural) branch and two linear in-plane acoustic branches', () => {
    expect(exponent(0)).toBeGreaterThan(1.9);
    expect(exponent(1)).toBeLessThan(1.1);
    expect(exponent(2)).toBeLessThan(1.1);
  });

  it('follows ν_ZA = (√(κ/M)/2π)(qa)² near Γ, in THz with the CODATA 2018 factor (physics-ref §1.2)', () => {
    const m = layerModel({ a: 2.5, M: 12, bending: 1 });
    const xi = 0.001;
    const qa = 2 * Math.PI * xi;
    const lap = 2 - 2 * Math.cos(qa);
    expect(m.frequencies([xi, 0, 0])[0]).toBeCloseTo(Math.sqrt(1 / 12) * lap * 15.6333042399, 10);
  });
});
