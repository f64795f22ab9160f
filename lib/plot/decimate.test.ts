import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decimate, visibleRange } from './decimate';
import { connectedRuns, pathBreaks } from './path-breaks';

interface Case {
  nq: number;
  nb: number;
  x: Float64Array;
  y: Float64Array;
  breaks: number[];
}

const arbCase: fc.Arbitrary<Case> = fc
  .record({
    nq: fc.integer({ min: 2, max: 300 }),
    nb: fc.integer({ min: 1, max: 5 }),
    seed: fc.integer(),
    breakProb: fc.double({ min: 0, max: 0.1, noNaN: true }),
    dupProb: fc.double({ min: 0, max: 0.2, noNaN: true }),
  })
  .map(({ nq, nb, seed, breakProb, dupProb }) => {
    let s = seed >>> 0 || 1;
    const rnd = () => {
      s ^= s << 13;
      s ^= s >>> 17;
      s ^= s << 5;
      return (s >>> 0) / 4294967296;
    };
    const x = new Float64Array(nq);
    for (let i = 1; i < nq; i++) x[i] = x[i - 1] + (rnd() < dupProb ? 0 : rnd());
    const y = new Float64Array(nq * nb);
    for (let i = 0; i < y.length; i++) y[i] = (rnd() - 0.5) * 100;
    const breaks: number[] = [];
    for (let i = 0; i < nq - 1; i++) if (rnd() < breakProb) breaks.push(i);
    return { nq, nb, x, y, breaks };
  });

const arbWindow = fc.record({
  a: fc.double({ min: -0.2, max: 1.1, noNaN: true }),
  w: fc.double({ min: 0.01, max: 1.3, noNaN: true }),
  columns: fc.integer({ min: 1, max: 80 }),
});

describe('decimate', () => {
  it('keeps the lowest and highest value of every branch in every pixel column, per connected run', () => {
    fc.assert(
      fc.property(arbCase, arbWindow, (c, wv) => {
        const xmax = c.x[c.nq - 1] || 1;
        const win = { x0: wv.a * xmax, x1: (wv.a + wv.w) * xmax, columns: wv.columns };
        const out = decimate(c, win, { withIndex: true });
        const [i0, i1] = visibleRange(c.x, win.x0, win.x1);
        const colOf = (i: number) => Math.min(win.columns, Math.max(-1, Math.floor(((c.x[i] - win.x0) * win.columns) / (win.x1 - win.x0))));
        for (let k = 0; k < c.nb; k++) {
          const kept = new Set<number>();
          for (let p = 0; p < out.points; p++) if (out.branch![p] === k) kept.add(out.index![p]);
          for (const [a0, b0] of connectedRuns(c.breaks, c.nq)) {
            const a = Math.max(a0, i0);
            const b = Math.min(b0, i1);
            if (a > b) continue;
            // Group the run's points by column and check both extremes survive.
            const groups = new Map<number, number[]>();
            for (let i = a; i <= b; i++) groups.set(colOf(i), [...(groups.get(colOf(i)) ?? []), i]);
            for (const members of groups.values()) {
              const vals = members.map((i) => c.y[k * c.nq + i]);
              const lo = Math.min(...vals);
              const hi = Math.max(...vals);
              const keptVals = members.filter((i) => kept.has(i)).map((i) => c.y[k * c.nq + i]);
              expect(keptVals).toContain(lo);
              expect(keptVals).toContain(hi);
            }
            // The run's ends are always drawn, so lines meet labels and breaks exactly.
            expect(kept.has(a)).toBe(true);
            expect(kept.has(b)).toBe(true);
          }
        }
      }),
      { numRuns: 150 },
    );
  });

  it('never draws a line across a path break or between branches, and keeps path order', () => {
    fc.assert(
      fc.property(arbCase, arbWindow, (c, wv) => {
        const xmax = c.x[c.nq - 1] || 1;
        const win = { x0: wv.a * xmax, x1: (wv.a + wv.w) * xmax, columns: wv.columns };
        const out = decimate(c, win, { withIndex: true, scale: 2 });
        const breaks = new Set(c.breaks);
        for (let p = 0; p < out.points; p++) {
          const i = out.index![p];
          if (i < 0) {
            expect(Number.isNaN(out.xy[2 * p + 1])).toBe(true);
            continue;
          }
          // Values are the source's, scaled.
          expect(out.xy[2 * p]).toBe(c.x[i]);
          expect(out.xy[2 * p + 1]).toBe(2 * c.y[out.branch![p] * c.nq + i]);
          if (p + 1 < out.points && out.index![p + 1] >= 0) {
            const j = out.index![p + 1];
            expect(out.branch![p + 1]).toBe(out.branch![p]);
            expect(j).toBeGreaterThan(i);
            for (let s = i; s < j; s++) expect(breaks.has(s)).toBe(false);
          }
        }
        // Every run ends with a separator.
        if (out.points > 0) expect(out.index![out.points - 1]).toBe(-1);
      }),
      { numRuns: 150 },
    );
  });

  it('reduces a long branch to about two points per column', () => {
    const nq = 20_000;
    const x = Float64Array.from({ length: nq }, (_, i) => i);
    const y = Float64Array.from({ length: nq }, (_, i) => Math.sin(i / 50));
    const out = decimate({ x, y, nq, nb: 1, breaks: [] }, { x0: 0, x1: nq - 1, columns: 500 });
    expect(out.points).toBeLessThanOrEqual(2 * 501 + 3);
    expect(out.points).toBeGreaterThan(500);
  });

  it('re-decimates a zoomed window at full resolution', () => {
    const nq = 10_000;
    const x = Float64Array.from({ length: nq }, (_, i) => i / 100);
    const y = Float64Array.from({ length: nq }, (_, i) => Math.cos(i));
    const out = decimate({ x, y, nq, nb: 1, breaks: [] }, { x0: 10, x1: 11, columns: 600 }, { withIndex: true });
    // 101 points inside [10, 11] plus one neighbour each side, all kept, in order.
    expect([...out.index!].filter((i) => i >= 0)).toEqual(Array.from({ length: 103 }, (_, j) => 999 + j));
  });

  it('splits at the breaks of a segmented path', () => {
    const segments = [
      { start: 0, end: 3, connectedToNext: false },
      { start: 4, end: 7, connectedToNext: true },
      { start: 8, end: 9, connectedToNext: false },
    ];
    const breaks = pathBreaks(segments, 10);
    expect(breaks).toEqual([3]);
    const x = Float64Array.from([0, 1, 2, 3, 3, 4, 5, 6, 6, 7]);
    const y = Float64Array.from({ length: 10 }, (_, i) => i);
    const out = decimate({ x, y, nq: 10, nb: 1, breaks }, { x0: 0, x1: 7, columns: 100 }, { withIndex: true });
    expect([...out.index!]).toEqual([0, 1, 2, 3, -1, 4, 5, 6, 7, 8, 9, -1]);
  });

  it('writes into a supplied array when it is large enough, with the same result', () => {
    fc.assert(
      fc.property(arbCase, arbWindow, (c, w) => {
        const xmax = c.x[c.nq - 1] || 1;
        const win = { x0: w.a * xmax, x1: (w.a + w.w) * xmax, columns: w.columns };
        const src = { x: c.x, y: c.y, nq: c.nq, nb: c.nb, breaks: c.breaks };
        const fresh = decimate(src, win);
        const big = new Float64Array(4 * c.nq * c.nb + 16).fill(7);
        const into = decimate(src, win, { out: big });
        expect(into.xy.buffer).toBe(big.buffer);
        expect([...into.xy]).toEqual([...fresh.xy]);
        // Too small: a new array, the supplied one untouched.
        const small = new Float64Array(1).fill(7);
        const other = decimate(src, win, { out: small });
        expect(other.xy.buffer).not.toBe(small.buffer);
        expect(small[0]).toBe(7);
      }),
    );
  });

  it('rejects an empty window', () => {
    const x = Float64Array.from([0, 1]);
    expect(() => decimate({ x, y: x, nq: 2, nb: 1, breaks: [] }, { x0: 1, x1: 1, columns: 10 })).toThrow(/x1 > x0/);
  });
});

describe('pathBreaks', () => {
  it('breaks between unconnected segments and around points no segment covers', () => {
    expect(pathBreaks([{ start: 0, end: 4, connectedToNext: true }, { start: 4, end: 9, connectedToNext: false }], 10)).toEqual([]);
    expect(pathBreaks([{ start: 0, end: 4, connectedToNext: true }, { start: 5, end: 9, connectedToNext: true }], 10)).toEqual([]);
    expect(pathBreaks([{ start: 0, end: 4, connectedToNext: false }, { start: 5, end: 9, connectedToNext: true }], 10)).toEqual([4]);
    expect(pathBreaks([{ start: 0, end: 3, connectedToNext: true }, { start: 6, end: 9, connectedToNext: true }], 10)).toEqual([3, 4, 5]);
    expect(pathBreaks([{ start: 2, end: 7, connectedToNext: true }], 10)).toEqual([0, 1, 7, 8]);
  });
});
