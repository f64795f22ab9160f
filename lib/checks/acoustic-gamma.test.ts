import { describe, expect, it } from 'vitest';
import { pathGeometry } from '../physics/path';
import { acousticGamma } from './acoustic-gamma';
import { defaultPolicy } from './policy';
import { buildPath, scPath, setFrequency } from './test-spectra';

const run = (d: ReturnType<typeof buildPath>) => acousticGamma(d, pathGeometry(d), defaultPolicy);

// Thresholds: 0.03 THz (warn) and 0.1 THz (fail), common practice (physics-ref §7: residuals after
// imposing the acoustic sum rule stay below about 0.03 THz).
describe('acoustic-gamma', () => {
  it('passes exact zeros and residuals up to 0.03 THz', () => {
    const d = buildPath(scPath());
    expect(run(d)).toEqual([]);
    setFrequency(d, 0, 2, 0.03);
    expect(run(d)).toEqual([]);
  });

  it('warns above 0.03 THz up to 0.1 THz, and fails above 0.1 THz', () => {
    const d = buildPath(scPath());
    setFrequency(d, 0, 2, 0.031);
    expect(run(d)).toMatchObject([{ check: 'acoustic-gamma', severity: 'warn', index: 0, branch: 2, value: 0.031, limit: 0.03 }]);
    setFrequency(d, 0, 2, 0.1);
    expect(run(d)).toMatchObject([{ severity: 'warn', value: 0.1 }]);
    setFrequency(d, 0, 2, 0.101);
    const f = run(d);
    expect(f).toMatchObject([{ severity: 'fail', value: 0.101, limit: 0.1, q: [0, 0, 0], segment: 0 }]);
    expect(f[0].message).toMatch(/impose it on the force constants/);
  });

  it('uses |ω|, so an imaginary acoustic mode at Γ counts', () => {
    const d = buildPath(scPath());
    setFrequency(d, 0, 0, -0.5);
    expect(run(d)).toMatchObject([{ severity: 'fail', branch: 0, value: 0.5 }]);
  });

  it('reports each Γ once, a Γ written twice at a join counting as one point', () => {
    const d = buildPath(scPath()); // Γ at 0, at 122|123 (M–Γ end, Γ–R start)
    for (const i of [0, 122, 123]) setFrequency(d, i, 1, 0.2);
    setFrequency(d, 123, 1, 0.25);
    const f = run(d);
    expect(f.map((x) => [x.index, x.value])).toEqual([
      [0, 0.2],
      [123, 0.25],
    ]);
  });

  it('looks only at the file\'s acoustic branches', () => {
    const d = buildPath(scPath());
    setFrequency(d, 0, 2, 0.5);
    expect(run(d)).toHaveLength(1);
    expect(run({ ...d, acoustic: 2 })).toEqual([]);
  });
});
