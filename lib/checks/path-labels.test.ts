import { describe, expect, it } from 'vitest';
import type { Lattice, Vec3 } from '../dispersion/types';
import { pathGeometry } from '../physics/path';
import { pathLabels } from './path-labels';
import { defaultPolicy } from './policy';
import { buildPath, type Leg } from './test-spectra';

// Primitive cells and point coordinates of Setyawan & Curtarolo (2010), physics-ref §6.2–6.4.
const a = 5.431;
const h = a / 2;
const s3 = Math.sqrt(3) / 2;
const ha = 3.19;
const hc = 5.19;
const cells: Record<string, { lattice: Lattice; points: Record<string, Vec3>; path: string[] }> = {
  fcc: {
    lattice: [[0, h, h], [h, 0, h], [h, h, 0]],
    points: { Γ: [0, 0, 0], X: [0.5, 0, 0.5], W: [0.5, 0.25, 0.75], K: [0.375, 0.375, 0.75], L: [0.5, 0.5, 0.5], U: [0.625, 0.25, 0.625] },
    path: ['Γ', 'X', 'W', 'K', 'Γ', 'L', 'U', 'W', 'L', 'K'],
  },
  bcc: {
    lattice: [[-h, h, h], [h, -h, h], [h, h, -h]],
    points: { Γ: [0, 0, 0], H: [0.5, -0.5, 0.5], N: [0, 0, 0.5], P: [0.25, 0.25, 0.25] },
    path: ['Γ', 'H', 'N', 'Γ', 'P', 'H'],
  },
  sc: {
    lattice: [[a, 0, 0], [0, a, 0], [0, 0, a]],
    points: { Γ: [0, 0, 0], X: [0, 0.5, 0], M: [0.5, 0.5, 0], R: [0.5, 0.5, 0.5] },
    path: ['Γ', 'X', 'M', 'Γ', 'R', 'X'],
  },
  'hex (120°)': {
    lattice: [[ha / 2, -ha * s3, 0], [ha / 2, ha * s3, 0], [0, 0, hc]],
    points: { Γ: [0, 0, 0], M: [0.5, 0, 0], K: [1 / 3, 1 / 3, 0], A: [0, 0, 0.5], L: [0.5, 0, 0.5], H: [1 / 3, 1 / 3, 0.5] },
    path: ['Γ', 'M', 'K', 'Γ', 'A', 'L', 'H', 'A'],
  },
  'hex (60°)': {
    lattice: [[ha, 0, 0], [ha / 2, ha * s3, 0], [0, 0, hc]],
    // In the 60° cell K is (1/3, −1/3, 0) (physics-ref §6.4, "HEX convention trap").
    points: { Γ: [0, 0, 0], M: [0.5, 0, 0], K: [1 / 3, -1 / 3, 0], A: [0, 0, 0.5], L: [0.5, 0, 0.5], H: [1 / 3, -1 / 3, 0.5] },
    path: ['Γ', 'M', 'K', 'Γ', 'A', 'L', 'H', 'A'],
  },
};

function legs(points: Record<string, Vec3>, names: string[], at: (n: string) => Vec3 = (n) => points[n]): Leg[] {
  return names.slice(1).map((to, i) => ({ from: names[i], to, q0: at(names[i]), q1: at(to), n: 11 }));
}

const run = (d: ReturnType<typeof buildPath>) => pathLabels(d, pathGeometry(d), defaultPolicy);

describe('path-labels', () => {
  for (const [name, c] of Object.entries(cells)) {
    it(`${name}: the standard path gives no finding`, () => {
      expect(run(buildPath(legs(c.points, c.path), { lattice: c.lattice }))).toEqual([]);
    });
  }

  it('fcc: catches X and L swapped, naming label, place and where it belongs', () => {
    const c = cells.fcc;
    const d = buildPath(legs(c.points, ['Γ', 'X', 'W'], (n) => c.points[n === 'X' ? 'L' : n]), { lattice: c.lattice });
    const f = run(d);
    expect(f.length).toBeGreaterThanOrEqual(1);
    expect(f[0]).toMatchObject({ check: 'path-labels', severity: 'warn', index: 10, segment: 0, q: [0.5, 0.5, 0.5] });
    expect(f[0].message).toMatch(/Label X at q-point 10/);
    expect(f[0].message).toMatch(/\|q\| = 0\.866 × 2π\/a .*where L belongs/);
    expect(f[0].message).toMatch(/X belongs at \|q\| = 1 × 2π\/a/);
    expect(f[0].message).toMatch(/face-centred cubic/);
  });

  it('bcc: catches N labelled P', () => {
    const c = cells.bcc;
    const d = buildPath(legs(c.points, ['Γ', 'P'], (n) => c.points[n === 'P' ? 'N' : n]), { lattice: c.lattice });
    expect(run(d)).toMatchObject([{ severity: 'warn', index: 10 }]);
    expect(run(d)[0].message).toMatch(/where N belongs/);
  });

  it('sc: catches M labelled R', () => {
    const c = cells.sc;
    const d = buildPath(legs(c.points, ['Γ', 'R'], (n) => c.points[n === 'R' ? 'M' : n]), { lattice: c.lattice });
    expect(run(d)).toMatchObject([{ severity: 'warn', index: 10 }]);
  });

  it('hexagonal: catches the 120° K coordinates used in a 60° cell', () => {
    const c = cells['hex (60°)'];
    const d = buildPath(legs(c.points, ['Γ', 'K'], (n) => (n === 'K' ? [1 / 3, 1 / 3, 0] : c.points[n])), { lattice: c.lattice });
    const f = run(d);
    expect(f).toMatchObject([{ severity: 'warn', index: 10 }]);
    expect(f[0].message).toMatch(/K belongs at \|q\| = 1\.3131 1\/Å/); // 4π/(3a), a = 3.19 Å
  });

  it('hexagonal 120°: catches A labelled L', () => {
    const c = cells['hex (120°)'];
    const d = buildPath(legs(c.points, ['Γ', 'L'], (n) => c.points[n === 'L' ? 'A' : n]), { lattice: c.lattice });
    expect(run(d)).toMatchObject([{ severity: 'warn', index: 10 }]);
  });

  it('Γ must fold to 0; points outside the zone are compared after folding', () => {
    const c = cells.fcc;
    const shifted = buildPath(legs(c.points, ['Γ', 'X'], (n) => (n === 'Γ' ? [1, 0, 0] : c.points[n])), { lattice: c.lattice });
    expect(run(shifted)).toEqual([]); // (1, 0, 0) is a reciprocal-lattice vector: it is Γ
    const wrong = buildPath(legs(c.points, ['Γ', 'X'], (n) => (n === 'Γ' ? [0.1, 0, 0] : c.points[n])), { lattice: c.lattice });
    expect(run(wrong)).toMatchObject([{ index: 0 }]);
  });

  it('skips unknown labels, unrecognised lattices and files without a lattice', () => {
    const c = cells.fcc;
    const d = buildPath(legs(c.points, ['Γ', 'X'], (n) => c.points[n === 'X' ? 'L' : n]), { lattice: c.lattice });
    d.segments[0].to = 'Δ';
    d.labels.set(10, 'Δ');
    expect(run(d)).toEqual([]);
    const ortho = buildPath(legs(c.points, ['Γ', 'X']), { lattice: [[3, 0, 0], [0, 4, 0], [0, 0, 5]] });
    expect(run(ortho)).toEqual([]);
    expect(run(buildPath(legs(c.points, ['Γ', 'X']), { lattice: null }))).toEqual([]);
  });
});
