import { describe, expect, it } from 'vitest';
import { axisMarks, displayLabel } from './path-axis';

describe('axisMarks', () => {
  it('joins the labels on both sides of a break into one tick and shows G as Γ', () => {
    const marks = axisMarks({
      nq: 6,
      distance: Float64Array.from([0, 0.5, 1, 1, 1.5, 2]),
      labels: [
        { index: 0, label: 'G' },
        { index: 2, label: 'X' },
        { index: 3, label: 'K' },
        { index: 5, label: 'Gamma' },
      ],
      segments: [
        { start: 0, end: 2, from: 'Γ', to: 'X', connectedToNext: false },
        { start: 3, end: 5, from: 'K', to: 'Γ', connectedToNext: false },
      ],
      breaks: [2],
    });
    expect(marks).toEqual([
      { x: 0, text: 'Γ', isBreak: false },
      { x: 1, text: 'X|K', isBreak: true },
      { x: 2, text: 'Γ', isBreak: false },
    ]);
  });

  it('keeps a file label that already marks a break, once', () => {
    const marks = axisMarks({
      nq: 3,
      distance: Float64Array.from([0, 1, 2]),
      labels: [{ index: 1, label: 'U|K' }],
      segments: [{ start: 0, end: 2, connectedToNext: false }],
      breaks: [],
    });
    expect(marks).toEqual([{ x: 1, text: 'U|K', isBreak: false }]);
  });

  it('normalises the usual spellings of the zone centre', () => {
    expect(['G', 'gamma', '\\Gamma', 'Γ'].map(displayLabel)).toEqual(['Γ', 'Γ', 'Γ', 'Γ']);
    expect(displayLabel(' L ')).toBe('L');
  });
});
