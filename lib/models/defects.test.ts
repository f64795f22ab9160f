import { describe, expect, it } from 'vitest';
import { breakSumRule, injectSoftMode, noisePocketNearGamma, pushBeyondZone, scaleFrequencies, shiftSegment, squareFrequencies } from './defects';
import { fccModel } from './fcc';
import { pathDispersion } from './model';
import { foldToFirstZone } from '../physics/fold';

const base = pathDispersion(fccModel(), { points: 41 });
const nb = base.nb;
const sorted = (f: Float64Array) => {
  for (let i = 0; i < f.length / nb; i++) for (let k = 1; k < nb; k++) if (f[i * nb + k] < f[i * nb + k - 1]) return false;
  return true;
};

describe('defect injectors', () => {
  it('injectSoftMode digs an imaginary pocket at the point, leaves the input alone and the rest unchanged', () => {
    const before = base.frequencies.slice();
    const d = injectSoftMode(base, { index: 60, depthTHz: 1.2, widthPoints: 4 });
    expect(d.frequencies[60 * nb]).toBeCloseTo(-1.2, 12);
    expect(d.frequencies[65 * nb]).toBe(base.frequencies[65 * nb]);
    expect(d.frequencies[56 * nb]).toBeLessThan(base.frequencies[56 * nb]);
    expect(base.frequencies).toEqual(before);
    expect(sorted(d.frequencies)).toBe(true);
  });

  it('injectSoftMode moves both copies of a repeated join point, and refuses Γ', () => {
    const end = base.segments[0].end; // X, written twice
    const d = injectSoftMode(base, { index: end, depthTHz: 2 });
    expect(d.frequencies[end * nb]).toBe(d.frequencies[(end + 1) * nb]);
    expect(() => injectSoftMode(base, { index: 0, depthTHz: 1 })).toThrow(/Γ/);
  });

  it('breakSumRule lifts the acoustic branches at Γ and fades away from it', () => {
    const d = breakSumRule(base, { offsetTHz: 0.4 });
    for (let k = 0; k < 3; k++) expect(d.frequencies[k]).toBeCloseTo(0.4, 6);
    expect(d.frequencies[20 * nb]).toBeCloseTo(base.frequencies[20 * nb], 6);
  });

  it('shiftSegment opens a jump at the joins of one segment', () => {
    const d = shiftSegment(base, { segment: 1, deltaTHz: 0.8 });
    const s = base.segments[1];
    expect(d.frequencies[s.start * nb + 2] - d.frequencies[(s.start - 1) * nb + 2]).toBeCloseTo(0.8, 10);
    expect(() => shiftSegment(base, { segment: 9, deltaTHz: 1 })).toThrow(/out of range/);
  });

  it('pushBeyondZone moves q by G without changing ω; the points fold back', () => {
    const d = pushBeyondZone(base, { indices: [10, 11], g: [1, 0, 0] });
    expect(d.q![30]).toBeCloseTo(base.q![30] + 1, 12);
    expect(d.frequencies).toEqual(base.frequencies);
    const folded = foldToFirstZone(d.q!.subarray(30, 33), d.lattice);
    folded.forEach((v, c) => expect(v).toBeCloseTo(base.q![30 + c], 10));
  });

  it('noisePocketNearGamma dips the lowest branch just off Γ only', () => {
    const d = noisePocketNearGamma(base, { depthTHz: 0.1 });
    expect(d.frequencies[1 * nb]).toBeLessThan(0);
    expect(d.frequencies[1 * nb]).toBeGreaterThanOrEqual(-0.1);
    expect(d.frequencies[0]).toBe(base.frequencies[0]);
    expect(d.frequencies[10 * nb]).toBe(base.frequencies[10 * nb]);
    expect(sorted(d.frequencies)).toBe(true);
  });

  it('scaleFrequencies and squareFrequencies mis-state the unit', () => {
    expect(scaleFrequencies(base, 33.356).frequencies[50]).toBeCloseTo(base.frequencies[50] * 33.356, 10);
    const sq = squareFrequencies(injectSoftMode(base, { index: 60, depthTHz: 2 }));
    expect(sq.frequencies[60 * nb]).toBeCloseTo(-4, 10);
    expect(sq.frequencies[50]).toBeCloseTo(base.frequencies[50] ** 2, 10);
  });
});
