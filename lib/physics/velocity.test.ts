import { describe, expect, it } from 'vitest';
import type { Dispersion } from '../dispersion/types';
import { diatomicChain, monatomicChain } from '../models/chain';
import { fccLattice, fccModel } from '../models/fcc';
import { pathDispersion, type PhononModel } from '../models/model';
import { christoffelVelocities } from './elastic';
import { groupVelocities, phaseVelocities, soundVelocities, VELOCITY_FACTOR } from './velocity';

// Monatomic chain, C = 1 eV/Å², M = 1 amu, a = 1 Å: Kittel ch. 4 closed forms, numbers from physics-ref §2.1.
const V_S = 9822.6948; // m/s, a√(C/M)

/** The chain along ξ = 0 … 1 in one segment, so the zone boundary is an interior point. */
function wholeZoneChain(points: number): Dispersion {
  const chain = monatomicChain({ branches: 1 });
  const model: PhononModel = { ...chain, path: { points: { Γ: [0, 0, 0], 'Γ′': [1, 0, 0] }, runs: [['Γ', 'Γ′']] } };
  return pathDispersion(model, { points });
}

describe('groupVelocities', () => {
  it('is 2π·100 × dν/dk (physics-ref §1.3)', () => {
    expect(VELOCITY_FACTOR).toBeCloseTo(628.3185, 4);
  });

  it('vanishes at the zone boundary of the chain and matches a√(C/M) cos(qa/2) (physics-ref §2.1 table)', () => {
    const d = wholeZoneChain(2001);
    const v = groupVelocities(d)!;
    expect(v.basis).toBe('cartesian');
    const at = (xi: number) => v.values[Math.round(xi * 2000)];
    expect(Math.abs(at(0.5))).toBeLessThan(1e-6);
    expect(at(0.1)).toBeCloseTo(9341.938, 1);
    expect(at(0.25)).toBeCloseTo(6945.694, 1);
    expect(at(0.75)).toBeCloseTo(-6945.694, 1);
  });

  it('does not difference across a break or a join', () => {
    const d = pathDispersion(fccModel(), { points: 11 });
    const v = groupVelocities(d)!;
    // Last point of Γ–X and first point of X–W are the same q: one-sided each, from their own segment.
    const endX = d.segments[0].end;
    const nb = d.nb;
    const oneSided = ((d.frequencies[endX * nb + 2] - d.frequencies[(endX - 1) * nb + 2]) / (d.distance![endX] - d.distance![endX - 1])) * VELOCITY_FACTOR;
    expect(v.values[endX * nb + 2]).toBeCloseTo(oneSided, 6);
  });

  it('is null without q or distances', () => {
    const d = { ...pathDispersion(fccModel(), { points: 5 }), q: null, distance: null };
    expect(groupVelocities(d)).toBeNull();
  });
});

describe('phaseVelocities', () => {
  it('is (2/π) v_s at the chain zone boundary and undefined at Γ (physics-ref §2.1: 6253.32 m/s)', () => {
    const d = wholeZoneChain(201);
    const v = phaseVelocities(d)!;
    expect(v[100]).toBeCloseTo(6253.32, 1);
    expect(Number.isNaN(v[0])).toBe(true);
    // ξ = 0.9 folds to −0.1: the phase velocity uses the reduced k.
    expect(v[180]).toBeCloseTo(v[20], 6);
  });
});

describe('soundVelocities', () => {
  it('recovers v_s = a√(C/M) = 9822.6948 m/s for the monatomic chain', () => {
    const d = pathDispersion(monatomicChain({ branches: 1 }), { points: 801 });
    const [est] = soundVelocities(d, { fraction: 0.01 });
    // A straight-line fit over the first 1 % of Γ–X: the sine's curvature costs about (qa/2)²/6 ≈ 4e-5.
    expect(Math.abs(est.velocities[0] - V_S) / V_S).toBeLessThan(1e-4);
    expect(est.toward).toBe('X');
  });

  it('recovers the diatomic acoustic velocity a√(C/(2(M1+M2))) = 4010.098 m/s (physics-ref §2.2)', () => {
    const d = pathDispersion(diatomicChain({ branches: 2 }), { points: 801 });
    const [est] = soundVelocities(d, { fraction: 0.01 });
    expect(Math.abs(est.velocities[0] - 4010.0983) / 4010.0983).toBeLessThan(1e-4);
  });

  it('matches the Christoffel closed forms for the fcc spring model along [100], [110], [111]', () => {
    // Long-wave limit of nearest-neighbour central springs k in fcc (derived here from the
    // dynamical matrix expansion): C11 = 2k/a, C12 = C44 = k/a, ρ = 4M/a³.
    const a = 3.6, M = 63.5, k = 1.7;
    const e = 1.602176634e-19, u = 1.6605390666e-27; // CODATA 2018 (exact e; m_u 2018)
    const C44 = (k / a) * (e / 1e-30); // Pa
    const C11 = 2 * C44, C12 = C44;
    const rho = ((4 * M) / a ** 3) * (u / 1e-30);
    // Christoffel closed forms, physics-ref §3.0 table (Korvink & Greiner §2.4.1).
    const expected: Record<string, number[]> = {
      X: [Math.sqrt(C44 / rho), Math.sqrt(C44 / rho), Math.sqrt(C11 / rho)],
      K: [Math.sqrt((C11 - C12) / (2 * rho)), Math.sqrt(C44 / rho), Math.sqrt((C11 + C12 + 2 * C44) / (2 * rho))],
      L: [Math.sqrt((C11 - C12 + C44) / (3 * rho)), Math.sqrt((C11 - C12 + C44) / (3 * rho)), Math.sqrt((C11 + 2 * C12 + 4 * C44) / (3 * rho))],
    };
    const d = pathDispersion(fccModel({ a, M, k }), { points: 401 });
    const found = soundVelocities(d, { fraction: 0.01 });
    expect(found.map((f) => f.toward).sort()).toEqual(['K', 'L', 'X']);
    for (const est of found) {
      const want = expected[est.toward!];
      est.velocities.forEach((v, i) => expect(Math.abs(v - want[i]) / want[i]).toBeLessThan(1e-4));
      // The library's own Christoffel solver agrees with the same closed forms.
      const viaSolver = christoffelVelocities({ C11: C11 / 1e9, C12: C12 / 1e9, C44: C44 / 1e9 }, rho, est.direction!);
      viaSolver.forEach((v, i) => expect(Math.abs(v - want[i]) / want[i]).toBeLessThan(1e-9));
    }
  });

  it('reads the Si [100] velocities back from a linear dispersion built from them (physics-ref §3.1)', () => {
    // ν = v k / (2π·100) along Γ–X of Si's fcc cell (a = 5.431 Å); velocities 5846.2, 5846.2, 8434.8 m/s.
    const vs = [5846.2, 5846.2, 8434.8];
    const a = 5.431;
    const n = 21;
    const q = new Float64Array(n * 3);
    const f = new Float64Array(n * 3);
    const kX = (2 * Math.PI) / a; // |Γ–X| in Å⁻¹
    for (let i = 0; i < n; i++) {
      const t = (0.5 * i) / (n - 1);
      q.set([t, 0, t], i * 3);
      vs.forEach((v, b) => (f[i * 3 + b] = (v * 2 * t * kX) / VELOCITY_FACTOR));
    }
    const d: Dispersion = {
      format: 'columns', kind: 'path', nq: n, nb: 3, frequencies: f, q, coordinates: 'fractional', distance: null,
      weights: null, lattice: fccLattice(a), units: 'THz', labels: new Map([[0, 'Γ'], [n - 1, 'X']]),
      segments: [{ start: 0, end: n - 1, from: 'Γ', to: 'X', connectedToNext: false }],
      atoms: 1, polar: false, acoustic: 3, metadata: {},
    };
    const [est] = soundVelocities(d);
    est.velocities.forEach((v, i) => expect(v).toBeCloseTo(vs[i], 6));
    expect(est.direction![1]).toBeCloseTo(1, 12); // Γ–X runs along (0, 1, 0) in this cell
  });
});
