/**
 * The benchmarks' large spectrum (invented, not a material): the fcc model's three acoustic
 * branches plus smooth optical bands up to `branches`, sorted at each point, on the fcc path
 * with `pointsPerSegment` points a segment. Written to temporary band files by bench:screen.
 */
import type { Dispersion } from '../dispersion/types';
import { fccLattice, fccModel } from './fcc';
import { pathDispersion } from './model';

export function benchSpectrum(pointsPerSegment: number, branches: number): Dispersion {
  const base = pathDispersion(fccModel(), { points: pointsPerSegment });
  const f = new Float64Array(base.nq * branches);
  for (let i = 0; i < base.nq; i++) {
    const row = f.subarray(i * branches, (i + 1) * branches);
    for (let k = 0; k < 3; k++) row[k] = base.frequencies[i * 3 + k];
    const x = base.q![i * 3] + 2 * base.q![i * 3 + 1] + 3 * base.q![i * 3 + 2];
    for (let k = 3; k < branches; k++) row[k] = 8 + (40 * k) / branches + 0.05 * Math.sin(2 * Math.PI * x + k);
    row.sort();
  }
  return { ...base, nb: branches, frequencies: f, atoms: branches / 3, title: 'Invented 500-atom cell (benchmark)', lattice: fccLattice(3.6) };
}
