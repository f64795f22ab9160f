/**
 * Sound velocities of a cubic crystal from its elastic constants: the Christoffel equation
 * det(Γ − ρv²) = 0 with Γ_ik = C_ijkl n_j n_l (Korvink & Greiner, Semiconductors for Micro and
 * Nanotechnology, §2.4.1).
 */
import type { Vec3 } from '../dispersion/types';
import { symmetricEigenvalues } from './eigen';

export interface CubicElastic {
  /** GPa. */
  C11: number;
  C12: number;
  C44: number;
}

/** Velocities (m/s, ascending) along direction n (any length) for density ρ in kg/m³. */
export function christoffelVelocities(c: CubicElastic, density: number, n: Vec3): [number, number, number] {
  const len = Math.hypot(n[0], n[1], n[2]);
  if (!(len > 0)) throw new Error('christoffelVelocities: the direction must be a non-zero vector');
  if (!(density > 0)) throw new Error(`christoffelVelocities: density must be positive, got ${density}`);
  const u = [n[0] / len, n[1] / len, n[2] / len];
  const m = new Float64Array(9);
  for (let i = 0; i < 3; i++) {
    for (let k = 0; k < 3; k++) {
      m[i * 3 + k] = i === k ? c.C11 * u[i] ** 2 + c.C44 * (1 - u[i] ** 2) : (c.C12 + c.C44) * u[i] * u[k];
    }
  }
  const ev = symmetricEigenvalues(m, 3);
  const v = Array.from(ev, (lambda) => Math.sqrt((Math.max(0, lambda) * 1e9) / density));
  return [v[0], v[1], v[2]];
}
