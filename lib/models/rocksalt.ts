/**
 * A two-atom cubic crystal of rocksalt type (invented): fcc lattice, atom A at 0 and atom B at
 * (a/2, 0, 0). Springs: A–B nearest neighbours along the cube axes (k1) and A–A, B–B
 * second neighbours along the face diagonals (k2, needed for shear stability).
 *
 * Optional LO–TO splitting, a rigid-ion simplification: charges ±1 and a non-analytic term
 *   D_{κα,κ'β} += S z_κ z_κ' q̂_α q̂_β / √(M_κ M_κ') · exp(−(|q|/q_c)²)
 * where q is reduced to the nearest reciprocal-lattice point. Approaching Γ along any
 * direction this lifts one optical mode to ω_LO² = ω_TO² + S (1/M_A + 1/M_B) and leaves the
 * two TO modes alone, as in a cubic polar crystal. The Gaussian (q_c = 0.15 |b1|) stands in
 * for the Ewald sum, so away from Γ the spectrum relaxes to the non-polar one: good for a
 * Γ-jump demonstration, not a quantitative polar model.
 * At q = 0 itself the direction is undefined: by default ('analytic') the point carries the
 * analytic part only (3 × TO), as many producers write it; 'approach' uses the direction of
 * the segment the point belongs to.
 */
import type { Vec3 } from '../dispersion/types';
import { cartToFrac, fracToCart, norm, reciprocal } from '../physics/lattice';
import { FCC_POINTS, fccLattice } from './fcc';
import type { PhononModel } from './model';
import { bondsTo, cubeAxes, faceDiagonals, springFrequencies, type ExtraTerm, type SpringCrystal } from './spring-model';

export interface RocksaltOptions {
  /** Conventional lattice constant, Å (default 5.0). */
  a?: number;
  /** Masses of A and B, amu (defaults 23 and 35.5). */
  M1?: number;
  M2?: number;
  /** A–B spring, eV/Å² (default 1.5). */
  k1?: number;
  /** A–A and B–B spring, eV/Å² (default 0.2). */
  k2?: number;
  /** Add the non-analytic polar term (default false). */
  polar?: boolean;
  /** Strength S of the polar term, eV/Å² (default 2.5 k1, giving ω_LO/ω_TO = 1.5). */
  polarStrength?: number;
  /** What the point exactly at Γ carries in a polar model (default 'analytic'). */
  gamma?: 'analytic' | 'approach';
}

function nearestLatticeRemainder(qCart: Vec3, b: [Vec3, Vec3, Vec3]): Vec3 {
  const f = cartToFrac(qCart, b);
  const base = f.map(Math.round);
  let best: Vec3 = qCart;
  let bestLen = Infinity;
  for (let i = -1; i <= 1; i++) for (let j = -1; j <= 1; j++) for (let k = -1; k <= 1; k++) {
    const g = fracToCart([base[0] + i, base[1] + j, base[2] + k], b);
    const r: Vec3 = [qCart[0] - g[0], qCart[1] - g[1], qCart[2] - g[2]];
    const len = norm(r);
    if (len < bestLen - 1e-12) {
      best = r;
      bestLen = len;
    }
  }
  return best;
}

export function rocksaltModel(options: RocksaltOptions = {}): PhononModel {
  const a = options.a ?? 5.0;
  const M1 = options.M1 ?? 23;
  const M2 = options.M2 ?? 35.5;
  const k1 = options.k1 ?? 1.5;
  const k2 = options.k2 ?? 0.2;
  const polar = options.polar ?? false;
  const S = options.polarStrength ?? 2.5 * k1;
  const gamma = options.gamma ?? 'analytic';
  for (const [name, v] of Object.entries({ a, M1, M2, k1, k2, S })) {
    if (!(v >= 0) || !Number.isFinite(v) || (name !== 'k2' && name !== 'S' && v === 0)) {
      throw new Error(`${name} must be a positive number, got ${v}`);
    }
  }
  const lattice = fccLattice(a);
  const b = reciprocal(lattice);
  const qc = 0.15 * norm(b[0]);
  const masses = [M1, M2];
  const z = [1, -1];
  const polarTerm: ExtraTerm = (qCart, re, _im, { approach }) => {
    const r = nearestLatticeRemainder(qCart, b);
    const len = norm(r);
    let dir: Vec3;
    if (len > 1e-10) dir = [r[0] / len, r[1] / len, r[2] / len];
    else if (gamma === 'approach' && approach) dir = approach;
    else return;
    const damp = Math.exp(-((len / qc) ** 2));
    const n = 6;
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) {
      const w = (S * z[i] * z[j] * damp) / Math.sqrt(masses[i] * masses[j]);
      for (let x = 0; x < 3; x++) for (let y = 0; y < 3; y++) re[(3 * i + x) * n + 3 * j + y] += w * dir[x] * dir[y];
    }
  };
  const crystal: SpringCrystal = {
    lattice,
    masses,
    positions: [[0, 0, 0], [a / 2, 0, 0]],
    bonds: [
      ...bondsTo(0, 1, cubeAxes(a / 2), k1),
      ...bondsTo(1, 0, cubeAxes(a / 2), k1),
      ...bondsTo(0, 0, faceDiagonals(a / 2), k2),
      ...bondsTo(1, 1, faceDiagonals(a / 2), k2),
    ],
    extra: polar ? [polarTerm] : [],
  };
  return {
    name: 'cubic2',
    title: `Invented rocksalt-type crystal AB${polar ? ' (polar, rigid-ion LO–TO term)' : ''}`,
    lattice,
    atoms: 2,
    branches: 6,
    acoustic: 3,
    polar,
    path: { points: FCC_POINTS, runs: [['Γ', 'X', 'W', 'K', 'Γ', 'L']] },
    frequencies: (q, approach) => springFrequencies(crystal, q, approach ?? null),
    parameters: { a, M1, M2, k1, k2, ...(polar ? { polarStrength: S, gamma } : {}), units: 'a in Å, masses in amu, springs in eV/Å²' },
  };
}
