/**
 * Monatomic and diatomic chains with nearest-neighbour springs (Kittel, Introduction to Solid
 * State Physics, ch. 4), embedded in 3-D so that the usual checks apply to them.
 *
 * The chain runs along x with spacing a; the cell is [[a,0,0],[0,L,0],[0,0,L]] with L large
 * (a tetragonal cell that the label check does not try to recognise). Each bond carries the
 * longitudinal spring C and a transverse spring C_T, so every atom gives three branches:
 * one longitudinal and two degenerate transverse ones with the same sine law (C_T for C).
 * `branches: 1` (monatomic) or `2` (diatomic) keeps only the longitudinal motion: the
 * textbook 1-D form, with `atoms: null` and one acoustic branch.
 */
import type { Vec3 } from '../dispersion/types';
import { hermitianEigenvalues } from '../physics/eigen';
import { eigenvaluesToTHz } from './conversion';
import type { PhononModel } from './model';
import { bondsTo, dynamicalMatrix, springFrequencies, type SpringCrystal } from './spring-model';
import { reciprocal, fracToCart } from '../physics/lattice';

export interface MonatomicChainOptions {
  /** Spring constant, eV/Å² (default 1). */
  C?: number;
  /** Mass, amu (default 1). */
  M?: number;
  /** Spacing, Å (default 1). */
  a?: number;
  /** Transverse spring, eV/Å² (default C/4). */
  transverse?: number;
  /** 3 (default) or 1 (longitudinal only). */
  branches?: 1 | 3;
  /** Cell size across the chain, Å (default 10). */
  width?: number;
}

export interface DiatomicChainOptions {
  C?: number;
  /** Masses, amu (defaults 1 and 2); atom 1 at x = 0, atom 2 at x = a/2. */
  M1?: number;
  M2?: number;
  /** Repeat distance, Å (default 1). */
  a?: number;
  transverse?: number;
  /** 6 (default) or 2 (longitudinal only). */
  branches?: 2 | 6;
  width?: number;
}

const CHAIN_PATH = { points: { Γ: [0, 0, 0] as Vec3, X: [0.5, 0, 0] as Vec3 }, runs: [['Γ', 'X']] };

function longitudinalOnly(crystal: SpringCrystal, qFrac: Vec3): Float64Array {
  const { re, im, n } = dynamicalMatrix(crystal, fracToCart(qFrac, reciprocal(crystal.lattice)));
  const m = n / 3;
  const subRe = new Float64Array(m * m);
  const subIm = new Float64Array(m * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) {
    subRe[i * m + j] = re[3 * i * n + 3 * j];
    subIm[i * m + j] = im[3 * i * n + 3 * j];
  }
  return eigenvaluesToTHz(hermitianEigenvalues(subRe, subIm, m));
}

function positive(name: string, v: number): number {
  if (!(v > 0) || !Number.isFinite(v)) throw new Error(`${name} must be a positive number, got ${v}`);
  return v;
}

export function monatomicChain(options: MonatomicChainOptions = {}): PhononModel {
  const C = positive('C', options.C ?? 1);
  const M = positive('M', options.M ?? 1);
  const a = positive('a', options.a ?? 1);
  const CT = options.transverse ?? C / 4;
  const width = positive('width', options.width ?? 10);
  const branches = options.branches ?? 3;
  const crystal: SpringCrystal = {
    lattice: [[a, 0, 0], [0, width, 0], [0, 0, width]],
    masses: [M],
    positions: [[0, 0, 0]],
    bonds: bondsTo(0, 0, [[a, 0, 0], [-a, 0, 0]], C, CT),
  };
  return {
    name: 'chain',
    title: 'Monatomic chain (nearest-neighbour springs)',
    lattice: crystal.lattice,
    atoms: branches === 3 ? 1 : null,
    branches,
    acoustic: branches,
    polar: false,
    path: CHAIN_PATH,
    frequencies: (q) => (branches === 3 ? springFrequencies(crystal, q) : longitudinalOnly(crystal, q)),
    parameters: { C, M, a, transverse: CT, units: 'C in eV/Å², M in amu, a in Å' },
  };
}

export function diatomicChain(options: DiatomicChainOptions = {}): PhononModel {
  const C = positive('C', options.C ?? 1);
  const M1 = positive('M1', options.M1 ?? 1);
  const M2 = positive('M2', options.M2 ?? 2);
  const a = positive('a', options.a ?? 1);
  const CT = options.transverse ?? C / 4;
  const width = positive('width', options.width ?? 10);
  const branches = options.branches ?? 6;
  const h = a / 2;
  const crystal: SpringCrystal = {
    lattice: [[a, 0, 0], [0, width, 0], [0, 0, width]],
    masses: [M1, M2],
    positions: [[0, 0, 0], [h, 0, 0]],
    bonds: [...bondsTo(0, 1, [[h, 0, 0], [-h, 0, 0]], C, CT), ...bondsTo(1, 0, [[h, 0, 0], [-h, 0, 0]], C, CT)],
  };
  return {
    name: 'diatomic',
    title: 'Diatomic chain (nearest-neighbour springs)',
    lattice: crystal.lattice,
    atoms: branches === 6 ? 2 : null,
    branches,
    acoustic: branches === 6 ? 3 : 1,
    polar: false,
    path: CHAIN_PATH,
    frequencies: (q) => (branches === 6 ? springFrequencies(crystal, q) : longitudinalOnly(crystal, q)),
    parameters: { C, M1, M2, a, transverse: CT, units: 'C in eV/Å², masses in amu, a in Å' },
  };
}
