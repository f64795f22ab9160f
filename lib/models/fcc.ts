/**
 * Face-centred cubic crystal, one atom per cell, central springs between nearest neighbours
 * (the 12 at (a/2)(±1, ±1, 0) and permutations). Path Γ–X–W–K–Γ–L with the points of
 * Setyawan & Curtarolo, Comput. Mater. Sci. 49, 299 (2010).
 *
 * Its long-wave limit is a cubic elastic medium with C11 = 2k/a, C12 = C44 = k/a (a Cauchy
 * solid, as central pair forces require) and density ρ = 4M/a³; see `fccElasticConstants`.
 */
import type { Vec3 } from '../dispersion/types';
import { ANGSTROM, ATOMIC_MASS_UNIT, ELEMENTARY_CHARGE } from '../physics/units';
import type { PhononModel } from './model';
import { bondsTo, faceDiagonals, springFrequencies, type SpringCrystal } from './spring-model';

export interface FccOptions {
  /** Conventional cubic lattice constant, Å (default 3.6). */
  a?: number;
  /** Atomic mass, amu (default 63.5). */
  M?: number;
  /** Nearest-neighbour spring constant, eV/Å² (default 1.7). */
  k?: number;
}

/** Setyawan–Curtarolo fcc points in fractions of the reciprocal vectors. */
export const FCC_POINTS: Record<string, Vec3> = {
  Γ: [0, 0, 0],
  X: [0.5, 0, 0.5],
  W: [0.5, 0.25, 0.75],
  K: [0.375, 0.375, 0.75],
  L: [0.5, 0.5, 0.5],
  U: [0.625, 0.25, 0.625],
};

export function fccLattice(a: number): [Vec3, Vec3, Vec3] {
  const h = a / 2;
  return [[0, h, h], [h, 0, h], [h, h, 0]];
}

export function fccModel(options: FccOptions = {}): PhononModel {
  const a = options.a ?? 3.6;
  const M = options.M ?? 63.5;
  const k = options.k ?? 1.7;
  for (const [name, v] of Object.entries({ a, M, k })) {
    if (!(v > 0) || !Number.isFinite(v)) throw new Error(`${name} must be a positive number, got ${v}`);
  }
  const crystal: SpringCrystal = {
    lattice: fccLattice(a),
    masses: [M],
    positions: [[0, 0, 0]],
    bonds: bondsTo(0, 0, faceDiagonals(a / 2), k),
  };
  return {
    name: 'fcc',
    title: 'Invented fcc metal (nearest-neighbour central springs)',
    lattice: crystal.lattice,
    atoms: 1,
    branches: 3,
    acoustic: 3,
    polar: false,
    path: { points: FCC_POINTS, runs: [['Γ', 'X', 'W', 'K', 'Γ', 'L']] },
    frequencies: (q) => springFrequencies(crystal, q),
    parameters: { a, M, k, units: 'a in Å, M in amu, k in eV/Å²' },
  };
}

/**
 * Elastic constants of the model in GPa and its density in kg/m³ (long-wave limit of the
 * dynamical matrix: C11 = 2k/a, C12 = C44 = k/a).
 */
export function fccElasticConstants(options: FccOptions = {}) {
  const a = options.a ?? 3.6;
  const M = options.M ?? 63.5;
  const k = options.k ?? 1.7;
  const evPerA3InGPa = ELEMENTARY_CHARGE / ANGSTROM ** 3 / 1e9;
  const amuPerA3InKgPerM3 = ATOMIC_MASS_UNIT / ANGSTROM ** 3;
  return {
    C11: ((2 * k) / a) * evPerA3InGPa,
    C12: (k / a) * evPerA3InGPa,
    C44: (k / a) * evPerA3InGPa,
    density: ((4 * M) / a ** 3) * amuPerA3InKgPerM3,
  };
}
