/**
 * The standard high-symmetry points of Setyawan & Curtarolo, Comput. Mater. Sci. 49, 299 (2010),
 * by name, with the length of their Cartesian wave vector (1/Å, 2π included). Lengths do not
 * change under the lattice's point symmetry nor under folding, so they identify a point
 * whatever primitive cell or orientation a file uses.
 */
import type { LatticeKind, LatticeType } from './lattice-type';
import { isGammaLabel } from './path';

export interface StandardPoint {
  name: string;
  /** |q| in 1/Å, with the 2π. */
  length: number;
  /** Fractional coordinates in the SC2010 primitive reciprocal cell (one representative). */
  frac: [number, number, number];
}

/**
 * |q| in units of 2π/a for the cubic lattices (physics-ref §6.3: fcc and bcc verified against
 * the SC2010 tables; sc from the Wigner–Seitz computation there).
 */
const CUBIC: Record<Exclude<LatticeKind, 'hex'>, [string, number, [number, number, number]][]> = {
  sc: [
    ['Γ', 0, [0, 0, 0]],
    ['X', 0.5, [0, 0.5, 0]],
    ['M', Math.SQRT2 / 2, [0.5, 0.5, 0]],
    ['R', Math.sqrt(3) / 2, [0.5, 0.5, 0.5]],
  ],
  fcc: [
    ['Γ', 0, [0, 0, 0]],
    ['X', 1, [0.5, 0, 0.5]],
    ['L', Math.sqrt(3) / 2, [0.5, 0.5, 0.5]],
    ['W', Math.sqrt(5) / 2, [0.5, 0.25, 0.75]],
    ['K', (3 * Math.SQRT2) / 4, [0.375, 0.375, 0.75]],
    ['U', (3 * Math.SQRT2) / 4, [0.625, 0.25, 0.625]],
  ],
  bcc: [
    ['Γ', 0, [0, 0, 0]],
    ['H', 1, [0.5, -0.5, 0.5]],
    ['N', Math.SQRT2 / 2, [0, 0, 0.5]],
    ['P', Math.sqrt(3) / 2, [0.25, 0.25, 0.25]],
  ],
};

/** The standard points of a recognised lattice with their lengths in 1/Å. */
export function standardPoints(t: LatticeType): StandardPoint[] {
  if (t.kind !== 'hex') {
    const unit = (2 * Math.PI) / t.a;
    return CUBIC[t.kind].map(([name, l, frac]) => ({ name, length: l * unit, frac }));
  }
  const c = t.c ?? NaN;
  // Hexagonal (SC2010, 120° cell): M = 2π/(√3 a), K = 4π/(3a), A = π/c, L = |M + A|, H = |K + A|.
  const M = (2 * Math.PI) / (Math.sqrt(3) * t.a);
  const K = (4 * Math.PI) / (3 * t.a);
  const A = Math.PI / c;
  return [
    { name: 'Γ', length: 0, frac: [0, 0, 0] },
    { name: 'M', length: M, frac: [0.5, 0, 0] },
    { name: 'K', length: K, frac: [1 / 3, 1 / 3, 0] },
    { name: 'A', length: A, frac: [0, 0, 0.5] },
    { name: 'L', length: Math.hypot(M, A), frac: [0.5, 0, 0.5] },
    { name: 'H', length: Math.hypot(K, A), frac: [1 / 3, 1 / 3, 0.5] },
  ];
}

/**
 * A label as the table names it: Γ in any of its spellings becomes 'Γ'; TeX decorations
 * ($…$, \mathrm{…}) are dropped. Anything else is kept as written (case matters: the table
 * only knows capital letters).
 */
export function standardName(label: string): string {
  const s = label.trim();
  if (isGammaLabel(s)) return 'Γ';
  const bare = s
    .replace(/^\$(.*)\$$/, '$1')
    .replace(/\\mathrm\{(.*)\}/, '$1')
    .trim();
  return isGammaLabel(bare) ? 'Γ' : bare;
}

/** Human name of a lattice kind. */
export function latticeName(t: LatticeType): string {
  switch (t.kind) {
    case 'sc':
      return `simple cubic (a = ${t.a.toFixed(4)} Å)`;
    case 'fcc':
      return `face-centred cubic (a = ${t.a.toFixed(4)} Å)`;
    case 'bcc':
      return `body-centred cubic (a = ${t.a.toFixed(4)} Å)`;
    case 'hex':
      return `hexagonal (a = ${t.a.toFixed(4)} Å, c = ${(t.c ?? NaN).toFixed(4)} Å)`;
  }
}
