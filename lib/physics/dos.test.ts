import { describe, expect, it } from 'vitest';
import type { Dispersion } from '../dispersion/types';
import { fccModel } from '../models/fcc';
import { meshDispersion } from '../models/model';
import { phononDos } from './dos';

/** One q-point mesh with every branch at the same frequency: an Einstein solid. */
function einstein(nuTHz: number, branches = 3): Dispersion {
  return {
    format: 'columns', kind: 'mesh', nq: 1, nb: branches, frequencies: new Float64Array(branches).fill(nuTHz), q: new Float64Array(3),
    coordinates: 'fractional', distance: null, weights: new Float64Array([1]), lattice: null, units: 'THz', labels: new Map(),
    segments: [{ start: 0, end: 0, connectedToNext: false }], atoms: 1, polar: false, acoustic: 3, metadata: {},
  };
}

describe('phononDos', () => {
  it('integrates to 3N modes per cell and keeps imaginary modes at negative frequency', () => {
    const d = meshDispersion(fccModel(), { mesh: [8, 8, 8] });
    const g = phononDos(d);
    expect(g.total).toBeCloseTo(3, 6);
    expect(g.sigmaTHz).toBeGreaterThanOrEqual(0.01);
    const neg = phononDos(einstein(-2), { sigmaTHz: 0.1 });
    const peak = neg.frequencies[neg.values.indexOf(Math.max(...neg.values))];
    expect(peak).toBeCloseTo(-2, 1);
  });

  it('agrees with the mesh modes on the mean square frequency within the smearing', () => {
    const d = meshDispersion(fccModel(), { mesh: [8, 8, 8] });
    const g = phononDos(d, { sigmaTHz: 0.05, points: 4001 });
    let m2 = 0, ws = 0;
    d.frequencies.forEach((v) => { m2 += v * v; ws += 1; });
    let g2 = 0, gs = 0;
    const h = g.frequencies[1] - g.frequencies[0];
    g.values.forEach((v, i) => { g2 += v * g.frequencies[i] ** 2 * h; gs += v * h; });
    // Gaussian smearing adds σ² to ⟨ν²⟩.
    expect(g2 / gs).toBeCloseTo(m2 / ws + 0.05 ** 2, 3);
  });
});
