import { describe, expect, it } from 'vitest';
import type { PlotData } from '@/lib/plot/wire';
import { MeasuredCsvError, measuredDeviation, parseMeasuredCsv } from './measured-points';

// Two straight branches on 0..1: ω0 = x, ω1 = 2 + x (THz), three points.
const data = {
  nq: 3,
  nb: 2,
  distance: Float64Array.from([0, 0.5, 1]),
  frequencies: Float32Array.from([0, 0.5, 1, 2, 2.5, 3]),
  breaks: [] as number[],
} as unknown as PlotData;

describe('parseMeasuredCsv', () => {
  it('reads distance, frequency, uncertainty with an optional header and comments', () => {
    const rows = parseMeasuredCsv('distance,frequency,uncertainty\n# a comment\n0.25, 0.3, 0.05\n0.75;2.7\n');
    expect(rows).toEqual([
      { line: 3, distance: 0.25, frequencyTHz: 0.3, uncertaintyTHz: 0.05 },
      { line: 4, distance: 0.75, frequencyTHz: 2.7 },
    ]);
  });

  it('reads q-point indices when the header says index, and converts the unit', () => {
    const rows = parseMeasuredCsv('index frequency\n1 33.35641\n', 'cm-1');
    expect(rows[0].index).toBe(1);
    // 1 THz = 33.35641 cm⁻¹ (CODATA 2018 speed of light: 1e12 / (100 c)).
    expect(rows[0].frequencyTHz).toBeCloseTo(1, 5);
  });

  it('names the line and the cell that is wrong', () => {
    expect(() => parseMeasuredCsv('0.1, 1\n0.2, abc\n')).toThrow(new MeasuredCsvError(2, '"abc" in column 2 is not a number.'));
    expect(() => parseMeasuredCsv('0.1, 1, 2, 3\n')).toThrow(/Line 1: expected 2 or 3 values/);
    expect(() => parseMeasuredCsv('0.1, 1, -2\n')).toThrow(/Line 1: the uncertainty must not be negative/);
    expect(() => parseMeasuredCsv('\n\n')).toThrow(/no data lines/);
  });
});

describe('measuredDeviation', () => {
  it('is the RMS distance to the nearest branch, interpolated along the path', () => {
    // At x = 0.25 the branches are 0.25 and 2.25: 0.35 is 0.1 off; at 0.75: 2.75 vs 2.55 is 0.2 off.
    const d = measuredDeviation(data, parseMeasuredCsv('0.25,0.35\n0.75,2.55\n5,1\n'));
    expect(d.used).toBe(2);
    expect(d.outside).toBe(1);
    expect(d.rms).toBeCloseTo(Math.sqrt((0.1 ** 2 + 0.2 ** 2) / 2), 6);
  });
});
