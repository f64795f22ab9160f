import { describe, expect, it } from 'vitest';
import type { Dispersion } from '../dispersion/types';
import { monatomicChain } from '../models/chain';
import { fccModel } from '../models/fcc';
import { meshDispersion } from '../models/model';
import { debyeEstimates, modeThermo, thermodynamics, thermoFromDos } from './thermo';

// Exact SI constants typed here (CODATA 2018, physics-ref §1), independent of units.ts.
const kB = 1.380649e-23;
const e = 1.602176634e-19;
const NA = 6.02214076e23;
const R = kB * NA;
const meV = e / 1e3;

describe('per-mode harmonic functions (physics-ref §5.2, mpmath at 30 digits)', () => {
  const rows: [number, number, number, number, number, number][] = [
    // ν THz, T K, ZPE meV, F meV, S/k_B, C_v/k_B
    [10, 300, 20.6783385, 14.846622, 0.6303975, 0.8114811],
    [5, 300, 10.339169, -5.087252, 1.24954, 0.9483467],
    [1, 300, 2.067834, -47.35241, 2.833805, 0.9978701],
    [30, 300, 62.035015, 61.821217, 0.0481248, 0.1928608],
    [10, 1000, 20.678338, -62.43674, 1.743669, 0.9810251],
  ];
  it.each(rows)('ν = %s THz, T = %s K', (nu, T, zpe, F, S, Cv) => {
    const m = modeThermo(nu, T);
    expect(m.zeroPoint / meV).toBeCloseTo(zpe, 5);
    expect(m.freeEnergy / meV).toBeCloseTo(F, 4);
    expect(m.entropy / kB).toBeCloseTo(S, 5);
    expect(m.heatCapacity / kB).toBeCloseTo(Cv, 6);
    expect(m.freeEnergy).toBeCloseTo(m.internalEnergy - T * m.entropy, 30); // F = U − TS
  });

  it('gives the per-mole values at 10 THz, 300 K: ZPE 1.995156 kJ/mol, S 5.241417 and C_v 6.747030 J/(mol K)', () => {
    const m = modeThermo(10, 300);
    expect((m.zeroPoint * NA) / 1e3).toBeCloseTo(1.995156, 6);
    expect(m.entropy * NA).toBeCloseTo(5.241417, 5);
    expect(m.heatCapacity * NA).toBeCloseTo(6.74703, 5);
  });
});

/** One q-point mesh with every branch at the same frequency: an Einstein solid. */
function einstein(nuTHz: number, branches = 3): Dispersion {
  return {
    format: 'columns', kind: 'mesh', nq: 1, nb: branches, frequencies: new Float64Array(branches).fill(nuTHz), q: new Float64Array(3),
    coordinates: 'fractional', distance: null, weights: new Float64Array([1]), lattice: null, units: 'THz', labels: new Map(),
    segments: [{ start: 0, end: 0, connectedToNext: false }], atoms: 1, polar: false, acoustic: 3, metadata: {},
  };
}

describe('mesh thermodynamics', () => {
  it('reproduces the Einstein model C_v/3Nk_B (Einstein 1907; physics-ref §5.3)', () => {
    const thetaE = 240;
    const nu = (thetaE * kB) / 6.62607015e-34 / 1e12;
    const temps = [0.1, 0.2, 0.5, 1, 2].map((r) => r * thetaE);
    const t = thermodynamics(einstein(nu), temps);
    const want = [0.004540405, 0.1707418, 0.7240617, 0.9206736, 0.9794245];
    want.forEach((w, i) => expect(t.perAtom.heatCapacity[i] / (3 * R)).toBeCloseTo(w, 7));
    expect(thermodynamics(einstein(nu), [300]).perAtom.heatCapacity[0]).toBeCloseTo(23.65459, 4);
  });

  it('reaches Dulong–Petit 3R = 24.9434 J/(mol K) per atom at high T (fcc model mesh)', () => {
    const d = meshDispersion(fccModel(), { mesh: [6, 6, 6] });
    const t = thermodynamics(d, [3000]);
    expect(Math.abs(t.perAtom.heatCapacity[0] - 24.943387854) / 24.943387854).toBeLessThan(1e-3);
    // The three acoustic modes at Γ are counted apart (3 modes × weight 1/216) and enter C_v as k_B each.
    expect(t.excluded.zero).toBeCloseTo(3 / 216, 12);
    expect(t.excluded.imaginary).toBe(0);
    expect(t.excluded.modesPerCell).toBeCloseTo(3, 12);
  });

  it('converges to the full-zone averages of the monatomic chain at 300 K (physics-ref §5.7)', () => {
    const chain = monatomicChain({ branches: 1 });
    const d = meshDispersion(chain, { mesh: [20000, 1, 1], shift: [0.5, 0, 0] });
    const t = thermodynamics(d, [300]);
    expect(t.perCell.heatCapacity[0] / R).toBeCloseTo(0.4823193, 6);
    // ln ν is singular at q = 0, so the entropy converges only as O(1/N) on a mesh: 1e-4 here.
    expect(Math.abs(t.perCell.entropy[0] / R - 0.445932975)).toBeLessThan(1e-4);
    expect(((t.perCell.zeroPointEnergy * 1e3) / NA / meV)).toBeCloseTo(41.1601111, 4);
    // F carries k_BT ln(1 − e⁻ˣ), singular at q = 0 like S: O(1/N) on the mesh.
    expect(Math.abs((t.perCell.freeEnergy[0] * 1e3) / NA / meV - 35.5645083)).toBeLessThan(2e-3);
  });

  it('counts imaginary modes apart instead of summing them', () => {
    const d = einstein(-2);
    const t = thermodynamics(d, [300]);
    expect(t.excluded.imaginary).toBe(3);
    expect(t.perCell.heatCapacity[0]).toBe(0);
  });

  it('refuses a band path', () => {
    expect(() => thermodynamics({ ...einstein(5), kind: 'path' }, [300])).toThrow(/mesh/);
  });
});

describe('Debye DOS (physics-ref §5.6)', () => {
  // g(ν) = 9ν²/ν_D³ per atom (3 modes), on a fine grid including 0 and ν_D.
  const thetaD = 645;
  const nuD = (thetaD * kB) / 6.62607015e-34 / 1e12;
  const n = 200001;
  const frequencies = new Float64Array(n);
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    frequencies[i] = (nuD * i) / (n - 1);
    values[i] = (9 * frequencies[i] ** 2) / nuD ** 3;
  }
  const dos = { frequencies, values };

  it('gives C_v matching the Debye table (T/θ = 0.5, 1, 2: 0.8254080384, 0.9517321357, 0.9876107521)', () => {
    const t = thermoFromDos(dos, [0.5 * thetaD, thetaD, 2 * thetaD], 1);
    expect(t.perAtom.heatCapacity[0] / (3 * R)).toBeCloseTo(0.8254080384, 7);
    expect(t.perAtom.heatCapacity[1] / (3 * R)).toBeCloseTo(0.9517321357, 7);
    expect(t.perAtom.heatCapacity[2] / (3 * R)).toBeCloseTo(0.9876107521, 7);
    // Debye zero-point energy (9/8) N k_B θ: Si, θ = 645 K → 6.033 kJ/mol.
    expect(t.perAtom.zeroPointEnergy).toBeCloseTo(6.033, 3);
  });

  it('returns the same θ by every definition', () => {
    const w = new Float64Array(n);
    for (let i = 0; i + 1 < n; i++) {
      const h = frequencies[i + 1] - frequencies[i];
      w[i] += (h / 2) * values[i];
      w[i + 1] += (h / 2) * values[i + 1];
    }
    const est = debyeEstimates({ frequencies, weights: w }, 1, [100, 300, 1000]);
    for (const theta of [est.secondMoment, est.firstMoment, est.logarithmic, est.minusTwoMoment, est.cutoff]) {
      expect(Math.abs(theta - thetaD) / thetaD).toBeLessThan(1e-5);
    }
    for (const fit of est.heatCapacityFit) expect(Math.abs(fit.theta! - thetaD) / thetaD).toBeLessThan(1e-5);
  });
});
