import { describe, expect, it } from 'vitest';
import { screen } from '../checks';
import { benchSpectrum } from './bench-spectrum';

describe('benchSpectrum', () => {
  it('is the fcc path with the requested branches, sorted at every point, and screens clean', () => {
    const d = benchSpectrum(8, 30);
    expect(d.nb).toBe(30);
    expect(d.atoms).toBe(10);
    expect(d.frequencies.length).toBe(d.nq * 30);
    for (let i = 0; i < d.nq; i++) {
      const row = d.frequencies.subarray(i * 30, (i + 1) * 30);
      for (let k = 1; k < 30; k++) expect(row[k]).toBeGreaterThanOrEqual(row[k - 1]);
    }
    expect(screen(d).findings.filter((f) => f.severity === 'fail')).toEqual([]);
  });
});
