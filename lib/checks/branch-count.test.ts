import { describe, expect, it } from 'vitest';
import { pathGeometry } from '../physics/path';
import { branchCount } from './branch-count';
import { defaultPolicy } from './policy';
import { buildPath, scPath } from './test-spectra';

describe('branch-count', () => {
  it('expects 3 × atoms branches', () => {
    const ok = buildPath(scPath(), { nb: 6, atoms: 2 });
    expect(branchCount(ok, pathGeometry(ok), defaultPolicy)).toEqual([]);
    const bad = buildPath(scPath(), { nb: 6, atoms: 3 });
    const f = branchCount(bad, pathGeometry(bad), defaultPolicy);
    expect(f).toMatchObject([{ check: 'branch-count', severity: 'fail', index: null, value: null }]);
    expect(f[0].message).toMatch(/6 branches.*3 × 3 = 9/);
  });

  it('is silent when the number of atoms is unknown', () => {
    const d = buildPath(scPath(), { nb: 5, atoms: null });
    expect(branchCount(d, pathGeometry(d), defaultPolicy)).toEqual([]);
  });
});
