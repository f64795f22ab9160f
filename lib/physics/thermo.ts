/**
 * Harmonic thermodynamics of a phonon spectrum (Landau & Lifshitz, Statistical Physics, ch. VI;
 * Ashcroft & Mermin ch. 23). Per mode of frequency ν, with x = hν/k_BT:
 *   E_zp = hν/2,  F = hν/2 + k_BT ln(1 − e⁻ˣ),  S = k_B[x/(eˣ − 1) − ln(1 − e⁻ˣ)],
 *   C_v = k_B x² eˣ/(eˣ − 1)²,  U = hν/2 + hν/(eˣ − 1).
 * Imaginary modes (ν < −zero) are left out of every sum and counted in the result. Zero modes
 * (|ν| ≤ zero, e.g. the acoustic modes at Γ) are counted too; they enter C_v and U with their
 * ν → 0 limits (k_B and k_BT; nothing to the zero-point energy) and are left out of S and F,
 * which diverge logarithmically there (physics-ref §5.1).
 */
import type { Dispersion } from '../dispersion/types';
import { debyeThetaFromHeatCapacity, cutoffTheta, momentTheta, type ModeSample } from './debye';
import { AVOGADRO, BOLTZMANN, PLANCK } from './units';

/** Below this |ν| (THz) a mode counts as zero (common practice: ≥ 1e-4 THz, physics-ref §7). */
export const DEFAULT_ZERO_THZ = 1e-3;

export interface ModeThermo {
  /** J per mode. */
  zeroPoint: number;
  internalEnergy: number;
  freeEnergy: number;
  /** J/K per mode. */
  entropy: number;
  heatCapacity: number;
}

/** One real mode of ν THz at T kelvin (T = 0 allowed). */
export function modeThermo(nuTHz: number, temperature: number): ModeThermo {
  if (!(nuTHz > 0)) throw new Error(`modeThermo: the frequency must be positive, got ${nuTHz} THz`);
  if (!(temperature >= 0)) throw new Error(`modeThermo: the temperature must be ≥ 0 K, got ${temperature}`);
  const e = PLANCK * nuTHz * 1e12;
  const zeroPoint = e / 2;
  if (temperature === 0) return { zeroPoint, internalEnergy: zeroPoint, freeEnergy: zeroPoint, entropy: 0, heatCapacity: 0 };
  const kT = BOLTZMANN * temperature;
  const x = e / kT;
  const bose = 1 / Math.expm1(x); // 1/(eˣ − 1)
  const lnOneMinus = Math.log1p(-Math.exp(-x)); // ln(1 − e⁻ˣ)
  const half = x / 2;
  const sh = Math.sinh(half);
  return {
    zeroPoint,
    internalEnergy: zeroPoint + e * bose,
    freeEnergy: zeroPoint + kT * lnOneMinus,
    entropy: BOLTZMANN * (x * bose - lnOneMinus),
    heatCapacity: x > 700 ? 0 : BOLTZMANN * (half / sh) ** 2,
  };
}

export interface ThermoTable {
  temperatures: number[];
  /** Atoms per cell used for the per-atom columns. */
  atoms: number;
  perCell: ThermoColumns;
  perAtom: ThermoColumns;
  /** Modes left out, per cell (weighted average over the mesh), and modes per cell. */
  excluded: { imaginary: number; zero: number; modesPerCell: number };
}

export interface ThermoColumns {
  /** J/(mol K) — per mole of cells, or of atoms. */
  heatCapacity: Float64Array;
  entropy: Float64Array;
  /** kJ/mol. */
  freeEnergy: Float64Array;
  internalEnergy: Float64Array;
  zeroPointEnergy: number;
}

export interface ThermoOptions {
  zeroTHz?: number;
}

/** Weighted modes per cell: every mode carries weight w_q / Σw. Imaginary and zero modes counted apart. */
export function meshModes(d: Dispersion, zeroTHz = DEFAULT_ZERO_THZ) {
  if (d.kind !== 'mesh') throw new Error('thermodynamics and the DOS need a q-point mesh (kind: mesh), not a band path');
  let wsum = 0;
  for (let i = 0; i < d.nq; i++) {
    const w = d.weights ? d.weights[i] : 1;
    if (!(w >= 0) || !Number.isFinite(w)) throw new Error(`mesh weight at q-point ${i} must be a finite number ≥ 0, got ${w}`);
    wsum += w;
  }
  if (!(wsum > 0)) throw new Error('the mesh weights add up to zero');
  const frequencies: number[] = [];
  const weights: number[] = [];
  let imaginary = 0;
  let zero = 0;
  for (let i = 0; i < d.nq; i++) {
    const w = (d.weights ? d.weights[i] : 1) / wsum;
    for (let k = 0; k < d.nb; k++) {
      const nu = d.frequencies[i * d.nb + k];
      if (nu < -zeroTHz) imaginary += w;
      else if (nu <= zeroTHz) zero += w;
      else {
        frequencies.push(nu);
        weights.push(w);
      }
    }
  }
  return { frequencies: Float64Array.from(frequencies), weights: Float64Array.from(weights), imaginary, zero };
}

/** Thermodynamics from weighted real modes (weights = modes per cell). */
export function thermoFromModes(modes: ModeSample, temperatures: number[], atoms: number, excluded = { imaginary: 0, zero: 0 }): ThermoTable {
  if (!(atoms > 0)) throw new Error(`atoms per cell must be positive, got ${atoms}`);
  const nT = temperatures.length;
  const cell: ThermoColumns = {
    heatCapacity: new Float64Array(nT), entropy: new Float64Array(nT), freeEnergy: new Float64Array(nT), internalEnergy: new Float64Array(nT), zeroPointEnergy: 0,
  };
  let modesPerCell = excluded.imaginary + excluded.zero;
  let zp = 0;
  for (let i = 0; i < modes.frequencies.length; i++) {
    const nu = modes.frequencies[i];
    const w = modes.weights[i];
    if (!(nu > 0) || !(w > 0)) continue;
    modesPerCell += w;
    zp += w * PLANCK * nu * 1e12 * 0.5;
    for (let t = 0; t < nT; t++) {
      const m = modeThermo(nu, temperatures[t]);
      cell.heatCapacity[t] += w * m.heatCapacity;
      cell.entropy[t] += w * m.entropy;
      cell.freeEnergy[t] += w * m.freeEnergy;
      cell.internalEnergy[t] += w * m.internalEnergy;
    }
  }
  for (let t = 0; t < nT; t++) {
    cell.heatCapacity[t] += excluded.zero * BOLTZMANN;
    cell.internalEnergy[t] += excluded.zero * BOLTZMANN * temperatures[t];
  }
  const perMol = AVOGADRO;
  for (let t = 0; t < nT; t++) {
    cell.heatCapacity[t] *= perMol;
    cell.entropy[t] *= perMol;
    cell.freeEnergy[t] *= perMol / 1e3;
    cell.internalEnergy[t] *= perMol / 1e3;
  }
  cell.zeroPointEnergy = (zp * perMol) / 1e3;
  const div = (a: Float64Array) => a.map((v) => v / atoms);
  return {
    temperatures: [...temperatures],
    atoms,
    perCell: cell,
    perAtom: {
      heatCapacity: div(cell.heatCapacity), entropy: div(cell.entropy), freeEnergy: div(cell.freeEnergy), internalEnergy: div(cell.internalEnergy), zeroPointEnergy: cell.zeroPointEnergy / atoms,
    },
    excluded: { ...excluded, modesPerCell },
  };
}

/** Harmonic thermodynamics of a mesh spectrum; atoms from the file, else branches / 3. */
export function thermodynamics(d: Dispersion, temperatures: number[], options: ThermoOptions = {}): ThermoTable {
  const modes = meshModes(d, options.zeroTHz);
  const atoms = d.atoms ?? d.nb / 3;
  return thermoFromModes(modes, temperatures, atoms, { imaginary: modes.imaginary, zero: modes.zero });
}

/** A DOS on a grid: frequencies (THz, ascending) and states per THz per cell. */
export interface Dos {
  frequencies: Float64Array;
  values: Float64Array;
}

/** Trapezoid weights of a grid (states per cell in each grid point's share). */
export function dosWeights(dos: Dos): Float64Array {
  const n = dos.frequencies.length;
  const w = new Float64Array(n);
  for (let i = 0; i + 1 < n; i++) {
    const h = dos.frequencies[i + 1] - dos.frequencies[i];
    if (!(h > 0)) throw new Error(`DOS frequencies must increase; they do not at grid point ${i + 1}`);
    w[i] += (h / 2) * dos.values[i];
    w[i + 1] += (h / 2) * dos.values[i + 1];
  }
  return w;
}

/** Thermodynamics from a DOS (trapezoid rule; only ν > zero contributes). */
export function thermoFromDos(dos: Dos, temperatures: number[], atoms: number): ThermoTable {
  return thermoFromModes({ frequencies: dos.frequencies, weights: dosWeights(dos) }, temperatures, atoms);
}

export interface DebyeEstimates {
  /** K. θ(2): from the second moment of the DOS. */
  secondMoment: number;
  /** θ(1), θ(0) (logarithmic), θ(−2). */
  firstMoment: number;
  logarithmic: number;
  minusTwoMoment: number;
  /** hν_max/k_B. */
  cutoff: number;
  /** θ of the Debye model with the same heat capacity per atom, at each temperature (null where undefined). */
  heatCapacityFit: { temperature: number; theta: number | null }[];
}

/** Debye-temperature estimates from weighted modes (see debye.ts for the definitions). */
export function debyeEstimates(modes: ModeSample, atoms: number, temperatures: number[] = [300]): DebyeEstimates {
  const table = thermoFromModes(modes, temperatures, atoms);
  const R = AVOGADRO * BOLTZMANN;
  return {
    secondMoment: momentTheta(modes, 2),
    firstMoment: momentTheta(modes, 1),
    logarithmic: momentTheta(modes, 0),
    minusTwoMoment: momentTheta(modes, -2),
    cutoff: cutoffTheta(modes),
    heatCapacityFit: temperatures.map((T, i) => ({ temperature: T, theta: debyeThetaFromHeatCapacity(table.perAtom.heatCapacity[i] / (3 * R), T) })),
  };
}
