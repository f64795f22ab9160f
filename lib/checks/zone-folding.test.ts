import { describe, expect, it } from 'vitest';
import type { Lattice, Vec3 } from '../dispersion/types';
import { pathGeometry } from '../physics/path';
import { defaultPolicy } from './policy';
import { buildPath, scPath } from './test-spectra';
import { zoneFolding } from './zone-folding';

const run = (d: ReturnType<typeof buildPath>) => zoneFolding(d, pathGeometry(d), defaultPolicy);

describe('zone-folding', () => {
  it('says nothing when every point is inside the first zone (boundary points count as inside)', () => {
    expect(run(buildPath(scPath()))).toEqual([]);
  });

  it('gives one info finding with the count and the first folded point', () => {
    // fcc (physics-ref §6.4): (0.4, 0.4, −0.4) lies outside and folds to (0.4, 0.4, 0.6).
    const h = 5.431 / 2;
    const fcc: Lattice = [[0, h, h], [h, 0, h], [h, h, 0]];
    const d = buildPath([{ from: 'Γ', to: 'Z', q0: [0, 0, 0], q1: [0.4, 0.4, -0.4] as Vec3, n: 5 }], { lattice: fcc });
    const g = pathGeometry(d);
    const f = zoneFolding(d, g, defaultPolicy);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ check: 'zone-folding', severity: 'info', index: g.folded[0].index, segment: 0 });
    expect(f[0].message).toMatch(new RegExp(`^${g.folded.length} q-points? lie`));
    expect(g.folded.at(-1)!.folded.map((x) => +x.toFixed(9))).toEqual([0.4, 0.4, 0.6]);
    expect(f[0].message).not.toMatch(/orthogonal/);
  });

  it('says that a componentwise fold (no lattice) is exact only for orthogonal lattices', () => {
    const d = buildPath([{ from: 'Γ', to: 'Z', q0: [0, 0, 0], q1: [0.8, 0, 0] as Vec3, n: 5 }], { lattice: null });
    const f = run(d);
    expect(f).toMatchObject([{ severity: 'info', index: 3 }]);
    expect(f[0].message).toMatch(/2 q-points lie outside/);
    expect(f[0].message).toMatch(/exact only for orthogonal lattices/);
  });
});
