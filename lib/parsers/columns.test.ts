import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CM1_TO_THZ, MEV_TO_THZ } from '../physics/units';
import { parseColumns } from './columns';
import { ParseError } from './parse-error';

function error(fn: () => unknown): ParseError {
  try {
    fn();
  } catch (e) {
    if (e instanceof ParseError) return e;
    throw new Error(`threw something else: ${String(e)}`);
  }
  throw new Error('did not throw');
}

const rows = (r: number[][]) => r.map((x) => x.join(' ')).join('\n') + '\n';

describe('columns: rows layout', () => {
  it('reads distance + frequencies with the defaults', () => {
    const d = parseColumns(rows([[0, 0, 0, 1], [0.1, 1, 2, 3], [0.2, 2, 3, 4]]));
    expect(d.format).toBe('columns');
    expect(d.kind).toBe('path');
    expect([d.nq, d.nb]).toEqual([3, 3]);
    expect(Array.from(d.distance!)).toEqual([0, 0.1, 0.2]);
    expect(Array.from(d.frequencies)).toEqual([0, 0, 1, 1, 2, 3, 2, 3, 4]);
    expect(d.q).toBeNull();
    expect(d.units).toBe('THz');
    expect(d.acoustic).toBe(3);
    expect(d.segments).toEqual([{ start: 0, end: 2, connectedToNext: false }]);
  });

  it('ignores a BOM, takes CRLF, commas, semicolons and tabs', () => {
    const text = '\uFEFF# units: THz\r\n0.0,\t1.5 ; 2\r\n0.1;2.5,3\r\n';
    const d = parseColumns(text);
    expect(Array.from(d.frequencies)).toEqual([1.5, 2, 2.5, 3]);
  });

  it('takes a comment after the numbers', () => {
    const d = parseColumns('0 1 2   # Γ\n1 2 3# X\n');
    expect(Array.from(d.frequencies)).toEqual([1, 2, 2, 3]);
  });

  it('sorts the frequencies ascending at each q-point', () => {
    const d = parseColumns(rows([[0, 3, -1, 2], [1, 9, 8, 7]]));
    expect(Array.from(d.frequencies)).toEqual([-1, 2, 3, 7, 8, 9]);
  });

  it('converts cm-1 and meV to THz with the CODATA factors', () => {
    const c = parseColumns('# units: cm-1\n0 520.2\n');
    expect(c.frequencies[0]).toBeCloseTo(520.2 * CM1_TO_THZ, 14);
    expect(c.units).toBe('cm-1');
    const m = parseColumns('# Units: MEV\n0 64.5\n');
    expect(m.frequencies[0]).toBeCloseTo(64.5 * MEV_TO_THZ, 14);
    // Si Raman line 520.2 cm-1 = 15.595 THz (physics-ref §3.1, computed).
    expect(c.frequencies[0]).toBeCloseTo(15.595, 3);
  });

  it('keeps unknown directives as metadata; later "#" lines are comments', () => {
    const d = parseColumns('# Method: DFPT (invented)\n# cutoff: 80 Ry\n# just a comment\n0 1\n# units: meV\n1 2\n');
    expect(d.metadata).toEqual({ Method: 'DFPT (invented)', cutoff: '80 Ry' });
    expect(d.units).toBe('THz');
  });

  it('reads every directive', () => {
    const text = [
      '# title: Invented compound Qx2 (invented)',
      '# columns: distance q',
      '# coords: cartesian',
      '# lattice: 0 2 2 ; 2 0 2 ; 2 2 0',
      '# atoms: 2',
      '# polar: yes',
      '# acoustic: 2',
      '# layout: rows',
      '0 0 0 0 1 2 3 4 5 6',
      '1 0.1 0 0 1 2 3 4 5 6',
    ].join('\n');
    const d = parseColumns(text);
    expect(d.title).toBe('Invented compound Qx2 (invented)');
    expect(d.coordinates).toBe('cartesian');
    expect(d.lattice).toEqual([
      [0, 2, 2],
      [2, 0, 2],
      [2, 2, 0],
    ]);
    expect(d.atoms).toBe(2);
    expect(d.polar).toBe(true);
    expect(d.acoustic).toBe(2);
    expect(Array.from(d.q!)).toEqual([0, 0, 0, 0.1, 0, 0]);
    expect(Array.from(d.distance!)).toEqual([0, 1]);
    expect(d.nb).toBe(6);
  });

  it('reads q-only columns', () => {
    const d = parseColumns('# columns: q\n0 0 0 1 2\n0.5 0 0.5 3 4\n');
    expect(d.distance).toBeNull();
    expect(Array.from(d.q!)).toEqual([0, 0, 0, 0.5, 0, 0.5]);
    expect(d.nb).toBe(2);
  });

  it('overrides replace the file values', () => {
    const d = parseColumns('# units: THz\n# polar: no\n# atoms: 5\n0 33.3564095198152\n', {
      overrides: { units: 'cm-1', polar: true, atoms: 1, lattice: [[1, 0, 0], [0, 1, 0], [0, 0, 1]] },
    });
    expect(d.units).toBe('cm-1');
    expect(d.frequencies[0]).toBeCloseTo(1, 12);
    expect(d.polar).toBe(true);
    expect(d.atoms).toBe(1);
    expect(d.lattice![2]).toEqual([0, 0, 1]);
  });

  it('acoustic defaults to min(3, branches)', () => {
    expect(parseColumns('0 1 2\n').acoustic).toBe(2);
    expect(parseColumns('0 1 2 3 4\n').acoustic).toBe(3);
  });
});

describe('columns: segments, joins and breaks', () => {
  it('a blank line is a path break', () => {
    const d = parseColumns('0 1 1\n1 2 2\n\n\n1 5 5\n2 6 6\n');
    expect(d.segments).toEqual([
      { start: 0, end: 1, connectedToNext: false },
      { start: 2, end: 3, connectedToNext: false },
    ]);
  });

  it('a repeated distance is a connected join (the same point written twice)', () => {
    const d = parseColumns('# labels: 0=Γ 1=X 3=W\n0 1\n1 2\n1 2\n2 3\n');
    expect(d.segments).toEqual([
      { start: 0, end: 1, connectedToNext: true, from: 'Γ', to: 'X' },
      { start: 2, end: 3, connectedToNext: false, from: 'X', to: 'W' },
    ]);
    // The label of one copy applies to both.
    expect(d.labels.get(2)).toBe('X');
  });

  it('a repeated q is a join; the same distance with another q is a jump', () => {
    const d = parseColumns(
      '# columns: distance q\n0 0 0 0 1\n1 0.5 0 0.5 2\n1 0.5 0 0.5 2\n2 0.5 0.25 0.75 3\n2 0.375 0.375 0.75 4\n3 0 0 0 5\n',
    );
    expect(d.segments.map((s) => [s.start, s.end, s.connectedToNext])).toEqual([
      [0, 1, true],
      [2, 3, false],
      [4, 5, false],
    ]);
  });

  it('an interior labelled point splits a segment (shared point)', () => {
    const d = parseColumns('# labels: 0=Γ 2=X 4=W\n0 1\n1 2\n2 3\n3 4\n4 5\n');
    expect(d.segments).toEqual([
      { start: 0, end: 2, connectedToNext: true, from: 'Γ', to: 'X' },
      { start: 2, end: 4, connectedToNext: false, from: 'X', to: 'W' },
    ]);
  });

  it('X|K at index i: i is X and ends a segment, i + 1 is K and starts the next, not connected', () => {
    const d = parseColumns('# labels: 0=Γ 2=K|U 4=X\n0 1\n1 2\n2 3\n2 3\n3 4\n');
    expect(d.labels.get(2)).toBe('K');
    expect(d.labels.get(3)).toBe('U');
    expect(d.segments).toEqual([
      { start: 0, end: 2, connectedToNext: false, from: 'Γ', to: 'K' },
      { start: 3, end: 4, connectedToNext: false, from: 'U', to: 'X' },
    ]);
  });
});

describe('columns: blocks layout', () => {
  const blocks = '# labels: 0=Γ 2=X\n0 0\n0.5 1\n1 2\n\n0 3\n0.5 4\n1 5\n';
  it('is detected and reads one branch per block', () => {
    const d = parseColumns(blocks);
    expect([d.nq, d.nb]).toEqual([3, 2]);
    expect(Array.from(d.distance!)).toEqual([0, 0.5, 1]);
    expect(Array.from(d.frequencies)).toEqual([0, 3, 1, 4, 2, 5]);
    expect(d.segments).toEqual([{ start: 0, end: 2, connectedToNext: false, from: 'Γ', to: 'X' }]);
  });
  it('equals the same data in rows', () => {
    const r = parseColumns('# labels: 0=Γ 2=X\n0 0 3\n0.5 1 4\n1 2 5\n');
    expect(parseColumns(blocks)).toEqual(r);
  });
  it('`# layout: rows` keeps a one-branch file with a break as rows', () => {
    const d = parseColumns('# layout: rows\n0 0\n1 1\n\n1 2\n2 3\n');
    expect([d.nq, d.nb, d.segments.length]).toEqual([4, 1, 2]);
  });
});

describe('columns: mesh', () => {
  it('reads q, a weight, then frequencies', () => {
    const d = parseColumns('# columns: q\n# weights: yes\n0 0 0 1 0 0 0\n0.5 0 0 3 4 5 6\n0 0.5 0 3 4 5 6\n');
    expect(d.kind).toBe('mesh');
    expect(Array.from(d.weights!)).toEqual([1, 3, 3]);
    expect(d.nb).toBe(3);
    expect(d.segments).toEqual([]);
  });
});

describe('columns: numbers', () => {
  it('reads every decimal form exactly as Number() does', () => {
    const toks = ['1.5E+02', '+3', '.5', '-0', '5.', '-.25e-3', '12345678901234567890', '1e-300', '0.1', '9007199254740993', '00012.5000'];
    const d = parseColumns(`0 ${toks.join(' ')}\n`);
    const want = toks.map(Number).sort((a, b) => a - b);
    expect(Array.from(d.frequencies)).toEqual(want);
  });

  it('agrees with Number() on random doubles in several notations (fast-check)', () => {
    const dbl = fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true });
    fc.assert(
      fc.property(fc.array(dbl, { minLength: 1, maxLength: 20 }), fc.integer({ min: 0, max: 3 }), (xs, style) => {
        const toks = xs.map((x) =>
          style === 0 ? String(x) : style === 1 ? x.toExponential(12) : style === 2 ? x.toFixed(8) : x.toPrecision(17),
        );
        const d = parseColumns(`0 ${toks.join(' ')}\n`);
        const want = toks.map(Number).sort((a, b) => a - b);
        return want.every((w, i) => Object.is(w, d.frequencies[i]) || (w === 0 && d.frequencies[i] === 0));
      }),
      { seed: 7, numRuns: 2000 },
    );
  });
});

describe('columns: bad input (band-files.md "Bad input")', () => {
  it('a non-numeric token: line and column', () => {
    const e = error(() => parseColumns('# units: THz\n0 1 2\n1 2 abc\n'));
    expect([e.line, e.column, e.expected]).toEqual([3, 5, 'a number']);
    expect(e.message).toBe('line 3, column 5: expected a number, found "abc"');
  });
  it('an empty field between commas', () => {
    const e = error(() => parseColumns('0,1,,2\n'));
    expect([e.line, e.column]).toEqual([1, 5]);
  });
  it('a line of a different width: too few and too many', () => {
    const few = error(() => parseColumns('0 1 2\n1 2\n'));
    expect([few.line, few.column]).toEqual([2, 4]);
    expect(few.expected).toBe('3 numbers per line, like line 1');
    const many = error(() => parseColumns('0 1 2\r\n1 2 3 4\r\n'));
    expect([many.line, many.column]).toEqual([2, 7]);
  });
  it('blocks of different lengths', () => {
    const e = error(() => parseColumns('0 0\n1 1\n2 2\n\n0 3\n1 4\n'));
    expect(e.line).toBe(5);
    expect(e.expected).toMatch(/3 lines in every block/);
  });
  it('blocks with different distances', () => {
    const e = error(() => parseColumns('0 0\n1 1\n\n0 3\n1.5 4\n'));
    expect(e.line).toBe(5);
    expect(e.expected).toMatch(/the distance 1/);
  });
  it('no data', () => {
    expect(error(() => parseColumns('')).line).toBe(1);
    const e = error(() => parseColumns('# units: THz\n# only a header\n\n'));
    expect(e.expected).toMatch(/at least one data line/);
    expect(e.line).toBe(3);
  });
  it('NaN and infinite values', () => {
    for (const [tok, col] of [
      ['nan', 3],
      ['NaN', 3],
      ['inf', 3],
      ['-Infinity', 3],
      ['1e999', 3],
    ] as const) {
      const e = error(() => parseColumns(`0 1\n1 ${tok}\n`));
      expect([e.line, e.column, e.expected]).toEqual([2, col, 'a finite number']);
    }
  });
  it('an unknown unit', () => {
    const e = error(() => parseColumns('# units:  Hz\n0 1\n'));
    expect([e.line, e.column]).toEqual([1, 11]);
    expect(e.expected).toMatch(/THz, cm-1 or meV/);
  });
  it('a label index out of range', () => {
    const e = error(() => parseColumns('# labels: 0=Γ 7=X\n0 1\n1 2\n'));
    expect([e.line, e.column]).toEqual([1, 15]);
    expect(e.expected).toBe('a q-point index from 0 to 1');
  });
  it('a break label on the last point, a malformed label list', () => {
    expect(error(() => parseColumns('# labels: 1=X|K\n0 1\n1 2\n')).line).toBe(1);
    expect(error(() => parseColumns('# labels: 0=Γ X\n0 1\n')).column).toBe(15);
  });
  it('bad directive values', () => {
    expect(error(() => parseColumns('# columns: freq\n0 1\n')).expected).toMatch(/distance/);
    expect(error(() => parseColumns('# lattice: 1 0 0 0 1 0 0 0\n0 1\n')).expected).toMatch(/9 numbers/);
    const lat = error(() => parseColumns('# lattice: 1 0 0 0 x 0 0 0 1\n0 1\n'));
    expect([lat.line, lat.column]).toEqual([1, 20]);
    expect(error(() => parseColumns('# atoms: two\n0 1\n')).line).toBe(1);
    expect(error(() => parseColumns('# polar: maybe\n0 1\n')).expected).toBe('`yes` or `no`');
    expect(error(() => parseColumns('\n# acoustic: 4\n0 1 2\n')).line).toBe(2);
    expect(error(() => parseColumns('# coords: polar\n0 1\n')).expected).toMatch(/fractional/);
    expect(error(() => parseColumns('# columns: distance q\n0 0 0 0\n')).expected).toMatch(/at least 5 numbers/);
  });
});
