import { describe, expect, it } from 'vitest';
import { christoffelVelocities } from './elastic';

// Silicon: C11 = 165.7, C12 = 63.9, C44 = 79.6 GPa, ρ = 2329 kg/m³; velocities from the
// Christoffel closed forms (Korvink & Greiner, §2.4.1; values as tabulated in physics-ref §3.1).
const Si = { C11: 165.7, C12: 63.9, C44: 79.6 };
const rho = 2329;

describe('christoffelVelocities (cubic)', () => {
  it('gives the Si [100] velocities L 8434.8, T 5846.2 (×2) m/s', () => {
    const [t1, t2, l] = christoffelVelocities(Si, rho, [1, 0, 0]);
    expect(l).toBeCloseTo(8434.8, 0);
    expect(t1).toBeCloseTo(5846.2, 0);
    expect(t2).toBeCloseTo(5846.2, 0);
  });

  it('gives the Si [110] velocities L 9136.2, T 5846.2 and 4674.9 m/s', () => {
    const [t1, t2, l] = christoffelVelocities(Si, rho, [1, 1, 0]);
    expect(l).toBeCloseTo(9136.2, 0);
    expect(t2).toBeCloseTo(5846.2, 0);
    expect(t1).toBeCloseTo(4674.9, 0);
  });

  it('gives the Si [111] velocities L 9358.3, T 5095.3 (×2) m/s', () => {
    const [t1, t2, l] = christoffelVelocities(Si, rho, [1, 1, 1]);
    expect(l).toBeCloseTo(9358.3, 0);
    expect(t1).toBeCloseTo(5095.3, 0);
    expect(t2).toBeCloseTo(5095.3, 0);
  });

  it('rejects a zero direction', () => {
    expect(() => christoffelVelocities(Si, rho, [0, 0, 0])).toThrow(/non-zero/);
  });
});
