/**
 * Phonon density of states of a mesh spectrum by Gaussian smearing.
 * Each mode adds a unit-area Gaussian times its weight w_q/Σw, so the DOS integrates to the
 * number of branches per cell (3N). Imaginary modes appear at negative frequency.
 * Default width σ: 1 % of the largest |ν| on the mesh, at least 0.01 THz (common practice:
 * wide enough to smooth a moderate mesh, narrow against the features of the spectrum).
 */
import type { Dispersion } from '../dispersion/types';
import type { Dos } from './thermo';

export interface DosOptions {
  /** Gaussian standard deviation, THz. */
  sigmaTHz?: number;
  /** Grid points (default 1001). */
  points?: number;
  /** Grid range, THz (default: the spectrum's range widened by 5σ, and 0 included). */
  min?: number;
  max?: number;
}

export interface PhononDos extends Dos {
  sigmaTHz: number;
  /** ∫ g dν over the grid (≈ branches when the grid covers the spectrum). */
  total: number;
}

export function phononDos(d: Dispersion, options: DosOptions = {}): PhononDos {
  if (d.kind !== 'mesh') throw new Error('the DOS needs a q-point mesh (kind: mesh), not a band path');
  const f = d.frequencies;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < f.length; i++) {
    if (f[i] < lo) lo = f[i];
    if (f[i] > hi) hi = f[i];
  }
  const sigma = options.sigmaTHz ?? Math.max(0.01, 0.01 * Math.max(Math.abs(lo), Math.abs(hi)));
  if (!(sigma > 0)) throw new Error(`the DOS smearing width must be positive, got ${sigma} THz`);
  const n = options.points ?? 1001;
  if (!Number.isInteger(n) || n < 2) throw new Error(`the DOS needs at least 2 grid points, got ${n}`);
  const min = options.min ?? Math.min(0, lo) - 5 * sigma;
  const max = options.max ?? hi + 5 * sigma;
  if (!(max > min)) throw new Error(`the DOS range is empty (${min} … ${max} THz)`);
  const h = (max - min) / (n - 1);
  const grid = new Float64Array(n);
  for (let i = 0; i < n; i++) grid[i] = min + i * h;
  const values = new Float64Array(n);
  let wsum = 0;
  for (let i = 0; i < d.nq; i++) wsum += d.weights ? d.weights[i] : 1;
  if (!(wsum > 0)) throw new Error('the mesh weights add up to zero');
  const norm = 1 / (sigma * Math.sqrt(2 * Math.PI));
  const reach = 6 * sigma;
  for (let iq = 0; iq < d.nq; iq++) {
    const w = ((d.weights ? d.weights[iq] : 1) / wsum) * norm;
    if (w === 0) continue;
    for (let k = 0; k < d.nb; k++) {
      const nu = f[iq * d.nb + k];
      const a = Math.max(0, Math.ceil((nu - reach - min) / h));
      const b = Math.min(n - 1, Math.floor((nu + reach - min) / h));
      for (let j = a; j <= b; j++) {
        const x = (grid[j] - nu) / sigma;
        values[j] += w * Math.exp(-0.5 * x * x);
      }
    }
  }
  let total = 0;
  for (let i = 0; i + 1 < n; i++) total += 0.5 * h * (values[i] + values[i + 1]);
  return { frequencies: grid, values, sigmaTHz: sigma, total };
}
