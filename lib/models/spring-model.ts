/**
 * Born–von Kármán crystals built from pair springs: the engine behind every model here.
 *
 * A bond from atom κ (cell 0) to a neighbour of species κ' at Cartesian offset d carries a
 * longitudinal spring k_L (along d) and an optional transverse spring k_T (perpendicular to d).
 * Its force-constant block is Φ = −(k_L d̂d̂ + k_T (1 − d̂d̂)); the on-site block takes minus the
 * sum of the bonds, so the acoustic sum rule holds by construction.
 *
 * The dynamical matrix uses the cell-origin phase e^{i q·R} (R the lattice vector of the
 * neighbour's cell), so D(q + G) = D(q) exactly, not only up to a unitary transformation.
 * Units: springs in eV/Å², masses in amu, so eigenvalues are in eV/(Å² amu).
 */
import type { Lattice, Vec3 } from '../dispersion/types';
import { dot, fracToCart, reciprocal } from '../physics/lattice';
import { hermitianEigenvalues } from '../physics/eigen';
import { eigenvaluesToTHz } from './conversion';

export interface Bond {
  /** Atom index in the cell the bond starts from. */
  from: number;
  /** Atom index (species) of the neighbour. */
  to: number;
  /** Cartesian offset from atom `from` to the neighbour, Å. */
  vector: Vec3;
  /** Spring constant along the bond, eV/Å². */
  longitudinal: number;
  /** Spring constant across the bond, eV/Å² (0 for a central force). */
  transverse?: number;
}

/** Extra dynamical-matrix term (e.g. a bending energy or a non-analytic polar term). */
export type ExtraTerm = (qCart: Vec3, re: Float64Array, im: Float64Array, context: { approach: Vec3 | null }) => void;

export interface SpringCrystal {
  lattice: Lattice;
  /** amu, one per atom. */
  masses: number[];
  /** Cartesian positions in the cell, Å. */
  positions: Vec3[];
  /** Every neighbour of every atom of cell 0 (each physical bond appears once from each end). */
  bonds: Bond[];
  extra?: ExtraTerm[];
}

/** Mass-weighted dynamical matrix at Cartesian q (Å⁻¹, 2π included), 3N×3N Hermitian. */
export function dynamicalMatrix(crystal: SpringCrystal, qCart: Vec3, approach: Vec3 | null = null) {
  const nAtoms = crystal.masses.length;
  const n = 3 * nAtoms;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (const bond of crystal.bonds) {
    const { from: i, to: j, vector: d } = bond;
    const len = Math.hypot(d[0], d[1], d[2]);
    if (!(len > 0)) throw new Error(`bond from atom ${i} to atom ${j} has zero length`);
    const u = [d[0] / len, d[1] / len, d[2] / len];
    const kl = bond.longitudinal;
    const kt = bond.transverse ?? 0;
    // Lattice vector of the neighbour's cell: d = R + τ_j − τ_i.
    const ti = crystal.positions[i];
    const tj = crystal.positions[j];
    const R: Vec3 = [d[0] - tj[0] + ti[0], d[1] - tj[1] + ti[1], d[2] - tj[2] + ti[2]];
    const phase = dot(qCart, R);
    const c = Math.cos(phase);
    const s = Math.sin(phase);
    const wij = 1 / Math.sqrt(crystal.masses[i] * crystal.masses[j]);
    const wii = 1 / crystal.masses[i];
    for (let a = 0; a < 3; a++) {
      for (let b = 0; b < 3; b++) {
        const k = kl * u[a] * u[b] + kt * ((a === b ? 1 : 0) - u[a] * u[b]);
        if (k === 0) continue;
        const ii = (3 * i + a) * n + (3 * i + b);
        re[ii] += k * wii;
        const ij = (3 * i + a) * n + (3 * j + b);
        re[ij] -= k * wij * c;
        im[ij] -= k * wij * s;
      }
    }
  }
  for (const term of crystal.extra ?? []) term(qCart, re, im, { approach });
  return { re, im, n };
}

/** Frequencies (THz, ascending, negative for imaginary modes) at fractional q. */
export function springFrequencies(crystal: SpringCrystal, qFrac: Vec3, approach: Vec3 | null = null): Float64Array {
  const b = reciprocal(crystal.lattice);
  const { re, im, n } = dynamicalMatrix(crystal, fracToCart(qFrac, b), approach);
  return eigenvaluesToTHz(hermitianEigenvalues(re, im, n));
}

/**
 * Adds to `bonds` every neighbour of atom `from` (species `to`) at the given Cartesian offsets.
 */
export function bondsTo(from: number, to: number, vectors: Vec3[], longitudinal: number, transverse = 0): Bond[] {
  return vectors.map((vector) => ({ from, to, vector, longitudinal, transverse }));
}

/** The 12 vectors (±h, ±h, 0) and permutations: nearest neighbours in fcc, h = a/2. */
export function faceDiagonals(h: number): Vec3[] {
  const out: Vec3[] = [];
  for (const s1 of [1, -1]) for (const s2 of [1, -1]) {
    out.push([s1 * h, s2 * h, 0], [s1 * h, 0, s2 * h], [0, s1 * h, s2 * h]);
  }
  return out;
}

/** The 6 vectors (±h, 0, 0) and permutations. */
export function cubeAxes(h: number): Vec3[] {
  return [[h, 0, 0], [-h, 0, 0], [0, h, 0], [0, -h, 0], [0, 0, h], [0, 0, -h]];
}
