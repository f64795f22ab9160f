import { describe, expect, it } from 'vitest';
import {
  AVOGADRO,
  ATOMIC_MASS_UNIT,
  BOLTZMANN,
  BOLTZMANN_MEV,
  CM1_TO_K,
  CM1_TO_MEV,
  CM1_TO_THZ,
  ELEMENTARY_CHARGE,
  EV_A2_AMU_TO_THZ,
  EV_TO_KJ_PER_MOL,
  GAS_CONSTANT,
  MEV_TO_CM1,
  MEV_TO_K,
  MEV_TO_THZ,
  PLANCK,
  SPEED_OF_LIGHT,
  THZ_TO_CM1,
  THZ_TO_K,
  THZ_TO_MEV,
  fromTHz,
  parseUnit,
  toTHz,
  unitFactor,
} from './units';

// Exact SI 2019 / CODATA 2018 constants typed in from the CODATA 2018 adjustment
// (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021); NIST physics.nist.gov/constants).
const c = 299792458;
const h = 6.62607015e-34;
const e = 1.602176634e-19;
const kB = 1.380649e-23;
const NA = 6.02214076e23;
const u = 1.6605390666e-27;

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('CODATA 2018 constants', () => {
  it('match the exact values', () => {
    expect(SPEED_OF_LIGHT).toBe(c);
    expect(PLANCK).toBe(h);
    expect(ELEMENTARY_CHARGE).toBe(e);
    expect(BOLTZMANN).toBe(kB);
    expect(AVOGADRO).toBe(NA);
    expect(ATOMIC_MASS_UNIT).toBe(u);
  });
});

describe('derived conversions', () => {
  // Values: physics-ref §1.1, computed from the exact constants (mpmath, 30 digits).
  const table: [string, number, number][] = [
    ['THz → cm-1', THZ_TO_CM1, 33.3564095198152],
    ['THz → meV', THZ_TO_MEV, 4.13566769692386],
    ['THz → K', THZ_TO_K, 47.992430733662],
    ['meV → cm-1', MEV_TO_CM1, 8.06554393734921],
    ['meV → THz', MEV_TO_THZ, 0.241798924208492],
    ['meV → K', MEV_TO_K, 11.6045181215501],
    ['cm-1 → meV', CM1_TO_MEV, 0.1239841984332],
    ['cm-1 → THz', CM1_TO_THZ, 0.0299792458],
    ['cm-1 → K', CM1_TO_K, 1.43877687750393],
    ['k_B in meV/K', BOLTZMANN_MEV, 0.0861733326214518],
    ['eV/atom → kJ/mol', EV_TO_KJ_PER_MOL, 96.48533212331],
    ['R', GAS_CONSTANT, 8.314462618153241],
    // physics-ref §8 reproduces this factor in Node as 15.633304239856193 (computed).
    ['√(eV/Å²/amu) → THz', EV_A2_AMU_TO_THZ, 15.633304239856193],
  ];
  for (const [name, got, want] of table) {
    it(name, () => expect(rel(got, want)).toBeLessThan(1e-12));
  }

  it('are built from the exact constants', () => {
    expect(rel(THZ_TO_CM1, 1e12 / (100 * c))).toBeLessThan(1e-15);
    expect(rel(THZ_TO_MEV, (h * 1e12 * 1e3) / e)).toBeLessThan(1e-15);
    expect(rel(THZ_TO_K, (h * 1e12) / kB)).toBeLessThan(1e-15);
  });
});

describe('parseUnit', () => {
  it('reads the spellings of band-files.md', () => {
    expect(parseUnit('THz')).toBe('THz');
    expect(parseUnit('thz')).toBe('THz');
    expect(parseUnit('cm-1')).toBe('cm-1');
    expect(parseUnit('cm^-1')).toBe('cm-1');
    expect(parseUnit('1/cm')).toBe('cm-1');
    expect(parseUnit('CM-1')).toBe('cm-1');
    expect(parseUnit(' meV ')).toBe('meV');
    expect(parseUnit('MEV')).toBe('meV');
  });
  it('refuses unknown units', () => {
    expect(parseUnit('Hz')).toBeNull();
    expect(parseUnit('eV')).toBeNull();
    expect(parseUnit('')).toBeNull();
    expect(parseUnit('rad/s')).toBeNull();
  });
});

describe('toTHz / fromTHz', () => {
  it('converts with the CODATA factors', () => {
    // Si Raman line 520.2 cm-1 = 15.595 THz = 64.50 meV (physics-ref §3.1, computed).
    expect(toTHz(520.2, 'cm-1')).toBeCloseTo(15.595, 3);
    expect(fromTHz(toTHz(520.2, 'cm-1'), 'meV')).toBeCloseTo(64.5, 2);
    expect(toTHz(4.13566769692386, 'meV')).toBeCloseTo(1, 13);
    expect(toTHz(7, 'THz')).toBe(7);
    expect(unitFactor('THz')).toBe(1);
    expect(unitFactor('cm-1')).toBe(THZ_TO_CM1);
  });
  it('round-trips', () => {
    for (const unit of ['THz', 'cm-1', 'meV'] as const) {
      for (const v of [-3.2, 0, 1e-3, 12.5, 1e4]) {
        const back = fromTHz(toTHz(v, unit), unit);
        if (v === 0) expect(back).toBe(0);
        else expect(rel(back, v)).toBeLessThan(1e-14);
      }
    }
  });
});
