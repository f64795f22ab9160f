import { describe, expect, it } from 'vitest';
import { defaultPolicy, policySchema, resolvePolicy } from './policy';

describe('policy', () => {
  it('defaults are the values of screening.md', () => {
    expect(defaultPolicy.imaginaryModes).toMatchObject({ threshold: 0.05, nearGammaFraction: 0.1, nearGammaDepth: 0.5 });
    expect(defaultPolicy.acousticGamma).toMatchObject({ warn: 0.03, fail: 0.1 });
    expect(defaultPolicy.continuity).toMatchObject({ minDelta: 0.05, relativeDelta: 0.01, coincidence: 1e-6, minStep: 0.5, medianFactor: 8 });
    expect(defaultPolicy.pathLabels).toMatchObject({ tolerance: 1e-3, latticeTolerance: 1e-3 });
    expect(defaultPolicy.unitsSuspect).toMatchObject({ maxTHz: 140, minTHz: 0.3, plausibleLow: 0.5, plausibleHigh: 60, fitFrom: 0.02, fitTo: 0.1, minFitPoints: 3, squaredExponent: 1.7 });
    expect(policySchema.parse(defaultPolicy)).toEqual(defaultPolicy);
  });

  it('merges a partial policy over the defaults', () => {
    const p = resolvePolicy({ continuity: { minStep: 1 }, zoneFolding: { enabled: false } });
    expect(p.continuity).toEqual({ ...defaultPolicy.continuity, minStep: 1 });
    expect(p.zoneFolding.enabled).toBe(false);
    expect(p.imaginaryModes).toEqual(defaultPolicy.imaginaryModes);
    expect(resolvePolicy()).toBe(defaultPolicy);
  });

  it('rejects bad values and unknown keys with the path of the problem', () => {
    expect(() => resolvePolicy({ imaginaryModes: { threshold: -1 } })).toThrow(/threshold/);
    expect(() => resolvePolicy({ unitsSuspect: { fitFrom: 0.2, fitTo: 0.1 } })).toThrow(/fitFrom must be below fitTo/);
    expect(() => resolvePolicy({ continuity: { typo: 1 } } as never)).toThrow(/typo/);
    expect(() => resolvePolicy({ nonsense: {} } as never)).toThrow(/nonsense/);
  });
});
