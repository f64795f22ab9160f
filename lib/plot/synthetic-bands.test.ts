import { describe, expect, it } from 'vitest';
import { decodePlotData, encodePlotData } from './wire';
import { syntheticBands } from './synthetic-bands';

describe('syntheticBands (demo data)', () => {
  it('makes the requested size, sorted at every point, with one path break', () => {
    const { dispersion: d, geometry } = syntheticBands({ branches: 12, points: 400, softMode: true });
    expect(d.nq).toBe(400);
    expect(d.nb).toBe(12);
    for (let i = 0; i < d.nq; i++) for (let k = 1; k < d.nb; k++) expect(d.frequencies[i * 12 + k]).toBeGreaterThanOrEqual(d.frequencies[i * 12 + k - 1]);
    expect(Math.min(...d.frequencies)).toBeLessThan(0);
    const p = decodePlotData(encodePlotData(d, geometry));
    expect(p.breaks).toHaveLength(1);
    expect(p.segments.at(-1)?.end).toBe(399);
  });
});
