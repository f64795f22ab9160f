/**
 * Physical constants and frequency-unit conversions.
 *
 * Constants: CODATA 2018 (Tiesinga, Mohr, Newell & Taylor, Rev. Mod. Phys. 93, 025010 (2021);
 * the same values are on physics.nist.gov/constants). c, h, e, k_B and N_A are exact in the
 * 2019 SI; the atomic mass constant is the measured 2018 value.
 * The derived factors are computed from the exact constants, not typed in, so they stay
 * consistent with each other to the last bit.
 */
import type { FrequencyUnit } from '../dispersion/types';

/** Speed of light in vacuum, m/s (exact, SI 2019). */
export const SPEED_OF_LIGHT = 299_792_458;
/** Planck constant, J s (exact, SI 2019). */
export const PLANCK = 6.626_070_15e-34;
/** Reduced Planck constant ħ = h/2π, J s. */
export const HBAR = PLANCK / (2 * Math.PI);
/** Elementary charge, C; also J per eV (exact, SI 2019). */
export const ELEMENTARY_CHARGE = 1.602_176_634e-19;
/** Boltzmann constant, J/K (exact, SI 2019). */
export const BOLTZMANN = 1.380_649e-23;
/** Avogadro constant, 1/mol (exact, SI 2019). */
export const AVOGADRO = 6.022_140_76e23;
/** Atomic mass constant m_u = 1 Da, kg (CODATA 2018: 1.660 539 066 60(50) × 10⁻²⁷). */
export const ATOMIC_MASS_UNIT = 1.660_539_066_60e-27;
/** Molar gas constant R = N_A k_B, J/(mol K). */
export const GAS_CONSTANT = AVOGADRO * BOLTZMANN;
/** Ångström in metres. */
export const ANGSTROM = 1e-10;

/** 1 THz in cm⁻¹: 10¹² / (100 c) = 33.356 409 519 815 2. */
export const THZ_TO_CM1 = 1e12 / (100 * SPEED_OF_LIGHT);
/** 1 THz in meV: h · 10¹² / e · 10³ = 4.135 667 696 923 86. */
export const THZ_TO_MEV = ((PLANCK * 1e12) / ELEMENTARY_CHARGE) * 1e3;
/** 1 THz in K (hν/k_B): 47.992 430 733 662. */
export const THZ_TO_K = (PLANCK * 1e12) / BOLTZMANN;
/** 1 meV in cm⁻¹: 8.065 543 937 349 21. */
export const MEV_TO_CM1 = THZ_TO_CM1 / THZ_TO_MEV;
/** 1 meV in THz: 0.241 798 924 208 492. */
export const MEV_TO_THZ = 1 / THZ_TO_MEV;
/** 1 meV in K: 11.604 518 121 550 1. */
export const MEV_TO_K = THZ_TO_K / THZ_TO_MEV;
/** 1 cm⁻¹ in THz: 0.029 979 245 8 (exact). */
export const CM1_TO_THZ = (100 * SPEED_OF_LIGHT) / 1e12;
/** 1 cm⁻¹ in meV: 0.123 984 198 433 2. */
export const CM1_TO_MEV = THZ_TO_MEV / THZ_TO_CM1;
/** 1 cm⁻¹ in K: 1.438 776 877 503 93. */
export const CM1_TO_K = THZ_TO_K / THZ_TO_CM1;
/** Boltzmann constant in meV/K: 0.086 173 332 621 451 8. */
export const BOLTZMANN_MEV = (BOLTZMANN / ELEMENTARY_CHARGE) * 1e3;
/** 1 eV per atom in kJ/mol: 96.485 332 123 31. */
export const EV_TO_KJ_PER_MOL = (ELEMENTARY_CHARGE * AVOGADRO) / 1e3;
/**
 * √(eV Å⁻² amu⁻¹) in THz (ν = ω/2π): 15.633 304 239 9 with the CODATA 2018 m_u.
 * The eigenvalue of a mass-weighted dynamical matrix in eV/(Å² amu) is ω²; this turns √λ into ν.
 */
export const EV_A2_AMU_TO_THZ = Math.sqrt(ELEMENTARY_CHARGE / (ANGSTROM * ANGSTROM * ATOMIC_MASS_UNIT)) / (2 * Math.PI) / 1e12;

export const FREQUENCY_UNITS: readonly FrequencyUnit[] = ['THz', 'cm-1', 'meV'];

/**
 * Reads a unit name as written in a file or on the command line.
 * Accepts THz, cm-1, cm^-1, cm⁻¹, 1/cm, meV in any letter case (there is no
 * ambiguity between milli and mega here: "MeV" phonons do not exist).
 */
export function parseUnit(s: string): FrequencyUnit | null {
  const t = s.trim().toLowerCase().replace(/\s+/g, '');
  switch (t) {
    case 'thz':
      return 'THz';
    case 'cm-1':
    case 'cm^-1':
    case 'cm^{-1}':
    case 'cm⁻¹':
    case '1/cm':
    case 'cm**-1':
    case 'invcm':
      return 'cm-1';
    case 'mev':
      return 'meV';
    default:
      return null;
  }
}

/** value_in_unit = THz × factor. */
export function unitFactor(unit: FrequencyUnit): number {
  switch (unit) {
    case 'THz':
      return 1;
    case 'cm-1':
      return THZ_TO_CM1;
    case 'meV':
      return THZ_TO_MEV;
  }
}

/** THz = value_in_unit × factor (the exact 0.029 979 245 8 for cm⁻¹, rather than 1/33.356…). */
export function toTHzFactor(unit: FrequencyUnit): number {
  switch (unit) {
    case 'THz':
      return 1;
    case 'cm-1':
      return CM1_TO_THZ;
    case 'meV':
      return MEV_TO_THZ;
  }
}

export function toTHz(value: number, unit: FrequencyUnit): number {
  return unit === 'THz' ? value : value * toTHzFactor(unit);
}

export function fromTHz(valueTHz: number, unit: FrequencyUnit): number {
  return unit === 'THz' ? valueTHz : valueTHz * unitFactor(unit);
}
