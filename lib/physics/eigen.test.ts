import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import fc from 'fast-check';
import { hermitianEigenvalues, symmetricEigenvalues } from './eigen';

/** Independent oracle: ml-matrix's JAMA port, symmetric path (signed ascending order). */
function mlEigenvalues(rows: number[][]): number[] {
  const e = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
  return [...e.realEigenvalues].sort((a, b) => a - b);
}

function randomSymmetric(n: number, values: number[]): number[][] {
  const rows = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  let k = 0;
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) {
    rows[i][j] = values[k];
    rows[j][i] = values[k];
    k++;
  }
  return rows;
}

describe('symmetricEigenvalues', () => {
  it('keeps the sign and sorts ascending (ml-matrix order; mathjs eigs would sort by absolute value)', () => {
    expect([...symmetricEigenvalues([-4, 0, 0, 0, 1, 0, 0, 0, 0.5], 3)]).toEqual([-4, 0.5, 1]);
  });

  it('agrees with ml-matrix EigenvalueDecomposition on random symmetric matrices', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 8 }).chain((n) =>
          fc.tuple(fc.constant(n), fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: (n * (n + 1)) / 2, maxLength: (n * (n + 1)) / 2 })),
        ),
        ([n, values]) => {
          const rows = randomSymmetric(n, values);
          const ours = symmetricEigenvalues(rows.flat(), n);
          const oracle = mlEigenvalues(rows);
          const scale = Math.max(1, ...oracle.map(Math.abs));
          oracle.forEach((v, i) => expect(Math.abs(ours[i] - v)).toBeLessThan(1e-12 * scale));
        },
      ),
      { seed: 20240611, numRuns: 200 },
    );
  });

  it('resolves a triple degeneracy exactly', () => {
    const v = symmetricEigenvalues([2, 0, 0, 0, 2, 0, 0, 0, 2], 3);
    expect([...v]).toEqual([2, 2, 2]);
  });

  it('rejects a matrix of the wrong size', () => {
    expect(() => symmetricEigenvalues([1, 2, 3], 2)).toThrow(/expected 4 entries/);
  });
});

describe('hermitianEigenvalues', () => {
  it('gives [1, 4] for [[2, 1−i], [1+i, 3]] (value checked with mathjs eigs in physics-ref §8)', () => {
    const v = hermitianEigenvalues([2, 1, 1, 3], [0, -1, 1, 0], 2);
    expect(v[0]).toBeCloseTo(1, 13);
    expect(v[1]).toBeCloseTo(4, 13);
  });

  it('agrees with ml-matrix on the real embedding of random Hermitian matrices', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: 32, maxLength: 32 }), (xs) => {
        const n = 4;
        const re = new Float64Array(16);
        const im = new Float64Array(16);
        for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
          const a = xs[i * n + j];
          if (i === j) { re[i * n + i] = a; continue; }
          const [lo, hi] = i < j ? [i, j] : [j, i];
          re[i * n + j] = xs[lo * n + hi];
          im[i * n + j] = (i < j ? 1 : -1) * xs[16 + lo * n + hi];
        }
        const rows: number[][] = [];
        for (let i = 0; i < 2 * n; i++) {
          const row: number[] = [];
          for (let j = 0; j < 2 * n; j++) {
            const ii = i % n, jj = j % n;
            const r = re[ii * n + jj], c = im[ii * n + jj];
            row.push(i < n ? (j < n ? r : -c) : (j < n ? c : r));
          }
          rows.push(row);
        }
        const oracle = mlEigenvalues(rows).filter((_, k) => k % 2 === 0);
        const ours = hermitianEigenvalues(re, im, n);
        oracle.forEach((v, i) => expect(Math.abs(ours[i] - v)).toBeLessThan(1e-11));
      }),
      { seed: 7, numRuns: 100 },
    );
  });
});
