import { describe, expect, it } from 'vitest';
// @ts-expect-error cephes ships no type declarations
import cephes from 'cephes';
import { debyeEntropy, debyeFunction3, debyeHeatCapacity, debyeThetaFromHeatCapacity } from './debye';

// Debye C_v/3Nk_B table: Abramowitz & Stegun §27.1 (eq. 27.1.1); values from physics-ref §5.4
// (V rows match Adv. Cond. Matter Phys. 2017, 9321439, Table 7).
const CV_TABLE: [number, number][] = [
  [0.02, 0.00062341818], [0.05, 0.009740757], [0.1, 0.07582100303], [0.15, 0.2129924], [0.2, 0.3686348236],
  [0.25, 0.5030593], [0.3, 0.6077028], [0.4, 0.745853], [0.5, 0.8254080384], [0.6, 0.8737958],
  [0.8, 0.9260334], [1, 0.9517321357], [1.5, 0.9781257], [2, 0.9876107521], [3, 0.9944664], [5, 0.9980029],
];

describe('Debye functions', () => {
  it('reproduce the C_v/3Nk_B table of physics-ref §5.4', () => {
    for (const [tOverTheta, cv] of CV_TABLE) {
      const digits = String(cv).split('.')[1].length;
      expect(Math.abs(debyeHeatCapacity(1 / tOverTheta) - cv)).toBeLessThan(0.6 * 10 ** -digits);
    }
  });

  it('give D₃(1, 2, 5, 10) = 0.6744155641, 0.4411284737, 0.1175974118, 0.01929576569 (physics-ref §5.4)', () => {
    expect(debyeFunction3(1)).toBeCloseTo(0.6744155641, 10);
    expect(debyeFunction3(2)).toBeCloseTo(0.4411284737, 10);
    expect(debyeFunction3(5)).toBeCloseTo(0.1175974118, 10);
    expect(debyeFunction3(10)).toBeCloseTo(0.01929576569, 11);
    expect(debyeFunction3(0.5)).toBeCloseTo(0.824962969, 9); // Table 7 of the 2017 article
  });

  it('agree with the polylogarithm closed form computed by cephes', async () => {
    await cephes.compiled;
    // ∫₀^y t³/(eᵗ−1) dt = π⁴/15 − [y³Li₁(e⁻ʸ) + 3y²Li₂(e⁻ʸ) + 6yLi₃(e⁻ʸ) + 6Li₄(e⁻ʸ)] (physics-ref §5.4)
    for (const y of [0.3, 0.7, 1.3, 2.9, 4.4, 8, 17, 33]) {
      const z = Math.exp(-y);
      const li = (n: number) => cephes.polylog(n, z);
      const integral = Math.PI ** 4 / 15 - (y ** 3 * li(1) + 3 * y * y * li(2) + 6 * y * li(3) + 6 * li(4));
      expect(Math.abs(debyeFunction3(y) - (3 / y ** 3) * integral)).toBeLessThan(1e-12);
    }
  });

  it('give the Debye entropy S/3Nk_B = 0.7335848, 1.3578959, 2.0327028 at T/θ = 0.5, 1, 2 (physics-ref §5.4)', () => {
    expect(debyeEntropy(2)).toBeCloseTo(0.7335848, 7);
    expect(debyeEntropy(1)).toBeCloseTo(1.3578959, 7);
    expect(debyeEntropy(0.5)).toBeCloseTo(2.0327028, 7);
  });

  it('follow the T³ law (12π⁴/5)(T/θ)³ = 233.78181848 (T/θ)³ far below θ (physics-ref §5.4)', () => {
    expect(3 * debyeHeatCapacity(1000) * 1e9).toBeCloseTo(233.78181848, 6);
  });

  it('invert: the θ that reproduces a Debye heat capacity is the θ it came from', () => {
    for (const theta of [105, 343, 645, 2230]) {
      for (const T of [30, 300, 1000]) {
        expect(debyeThetaFromHeatCapacity(debyeHeatCapacity(theta / T), T)).toBeCloseTo(theta, 6);
      }
    }
    expect(debyeThetaFromHeatCapacity(1.2, 300)).toBeNull();
  });
});
