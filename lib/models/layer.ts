/**
 * An invented 2-D sheet: square lattice (spacing a) of one atom, in-plane central springs to the
 * nearest (k1) and second (k2) neighbours, and an out-of-plane bending energy
 * (κ/2) Σ (discrete Laplacian of u_z)², whose dynamical-matrix element is
 *   D_zz(q) = (κ/M) [ (2 − 2cos q_x a) + (2 − 2cos q_y a) ]².
 * The flexural (ZA) branch therefore starts quadratically, ν ≈ (√(κ/M)/2π) a² q², while the
 * two in-plane acoustic branches start linearly. Vacuum of c = 15 Å separates the sheets.
 */
import type { Vec3 } from '../dispersion/types';
import type { PhononModel } from './model';
import { bondsTo, springFrequencies, type ExtraTerm, type SpringCrystal } from './spring-model';

export interface LayerOptions {
  /** Spacing, Å (default 2.5). */
  a?: number;
  /** Mass, amu (default 12). */
  M?: number;
  /** Nearest-neighbour spring, eV/Å² (default 6). */
  k1?: number;
  /** Second-neighbour spring, eV/Å² (default 3). */
  k2?: number;
  /** Bending stiffness κ, eV/Å² (default 1). */
  bending?: number;
  /** Interlayer spacing (vacuum), Å (default 15). */
  c?: number;
}

export function layerModel(options: LayerOptions = {}): PhononModel {
  const a = options.a ?? 2.5;
  const M = options.M ?? 12;
  const k1 = options.k1 ?? 6;
  const k2 = options.k2 ?? 3;
  const kappa = options.bending ?? 1;
  const c = options.c ?? 15;
  for (const [name, v] of Object.entries({ a, M, k1, k2, bending: kappa, c })) {
    if (!(v > 0) || !Number.isFinite(v)) throw new Error(`${name} must be a positive number, got ${v}`);
  }
  const bending: ExtraTerm = (q, re) => {
    const lap = 2 - 2 * Math.cos(q[0] * a) + (2 - 2 * Math.cos(q[1] * a));
    re[2 * 3 + 2] += (kappa / M) * lap * lap;
  };
  const d = a;
  const crystal: SpringCrystal = {
    lattice: [[a, 0, 0], [0, a, 0], [0, 0, c]],
    masses: [M],
    positions: [[0, 0, 0]],
    bonds: [
      ...bondsTo(0, 0, [[d, 0, 0], [-d, 0, 0], [0, d, 0], [0, -d, 0]], k1),
      ...bondsTo(0, 0, [[d, d, 0], [-d, -d, 0], [d, -d, 0], [-d, d, 0]], k2),
    ],
    extra: [bending],
  };
  const points: Record<string, Vec3> = { Γ: [0, 0, 0], X: [0.5, 0, 0], M: [0.5, 0.5, 0] };
  return {
    name: 'layer',
    title: 'Invented square sheet with a flexural branch',
    lattice: crystal.lattice,
    atoms: 1,
    branches: 3,
    acoustic: 3,
    polar: false,
    path: { points, runs: [['Γ', 'X', 'M', 'Γ']] },
    frequencies: (q) => springFrequencies(crystal, q),
    parameters: { a, M, k1, k2, bending: kappa, c, units: 'a, c in Å, M in amu, springs and κ in eV/Å²' },
  };
}
