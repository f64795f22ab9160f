import { describe, expect, it } from 'vitest';
import { ParseError } from './parse-error';
import fc from 'fast-check';
import { parseYaml, parseYamlNodeByNode } from './yaml';

function error(fn: () => unknown): ParseError {
  try {
    fn();
  } catch (e) {
    if (e instanceof ParseError) return e;
    throw new Error(`threw something else: ${String(e)}`);
  }
  throw new Error('did not throw');
}

// Invented material, invented numbers.
const GOOD = `format: branchwise-dispersion/1
title: Invented crystal Ab (invented)
units: THz
coordinates: fractional
lattice:
  - [0.0, 2.0, 2.0]
  - [2.0, 0.0, 2.0]
  - [2.0, 2.0, 0.0]
atoms: 2
polar: true
acoustic: 3
metadata:
  method: invented
  supercell: [4, 4, 4]
segments:
  - from: Γ
    to: X
    q:
      - [0.0, 0.0, 0.0]
      - [0.5, 0.0, 0.5]
    frequencies:
      - [0.0, 0.0, 0.0, 15.3, 15.3, 15.3]
      - [4.5, 4.5, 12.3, 13.9, 13.9, 12.3]
  - from: X
    to: W
    q:
      - [0.5, 0.0, 0.5]
      - [0.5, 0.25, 0.75]
    frequencies:
      - [4.5, 4.5, 12.3, 13.9, 13.9, 12.3]
      - [5.0, 6.0, 11.0, 12.0, 13.0, 14.0]
  - from: K
    to: Γ
    q:
      - [0.375, 0.375, 0.75]
      - [0.0, 0.0, 0.0]
    frequencies:
      - [5.0, 6.0, 11.0, 12.0, 13.0, 14.0]
      - [0.0, 0.0, 0.0, 15.3, 15.3, 15.3]
`;

describe('yaml: the branchwise-dispersion/1 schema', () => {
  it('reads every field', () => {
    const d = parseYaml(GOOD);
    expect(d.format).toBe('yaml');
    expect(d.title).toBe('Invented crystal Ab (invented)');
    expect([d.nq, d.nb]).toEqual([6, 6]);
    expect(d.lattice![1]).toEqual([2, 0, 2]);
    expect([d.atoms, d.polar, d.acoustic]).toEqual([2, true, 3]);
    expect(d.metadata).toEqual({ method: 'invented', supercell: [4, 4, 4] });
    expect(Array.from(d.frequencies.subarray(6, 12))).toEqual([4.5, 4.5, 12.3, 12.3, 13.9, 13.9]); // sorted
    expect(d.segments).toEqual([
      { start: 0, end: 1, from: 'Γ', to: 'X', connectedToNext: true },
      { start: 2, end: 3, from: 'X', to: 'W', connectedToNext: false },
      { start: 4, end: 5, from: 'K', to: 'Γ', connectedToNext: false },
    ]);
    expect([...d.labels.entries()]).toEqual([
      [0, 'Γ'],
      [1, 'X'],
      [2, 'X'],
      [3, 'W'],
      [4, 'K'],
      [5, 'Γ'],
    ]);
  });

  it('connects Γ spellings to each other', () => {
    const d = parseYaml(`format: branchwise-dispersion/1
segments:
  - {from: X, to: G, distance: [0, 1], frequencies: [[1], [0]]}
  - {from: Gamma, to: L, distance: [1, 2], frequencies: [[0], [1]]}
`);
    expect(d.segments[0].connectedToNext).toBe(true);
    expect(d.q).toBeNull();
    expect(Array.from(d.distance!)).toEqual([0, 1, 1, 2]);
  });

  it('converts units, keeps Cartesian coordinates, and takes overrides', () => {
    const d = parseYaml(
      `format: branchwise-dispersion/1
units: cm-1
coordinates: cartesian
polar: no
segments:
  - q: [[0, 0, 0]]
    frequencies: [[33.3564095198152]]
`,
      { overrides: { polar: true } },
    );
    expect(d.frequencies[0]).toBeCloseTo(1, 12);
    expect(d.coordinates).toBe('cartesian');
    expect(d.polar).toBe(true);
    expect(d.acoustic).toBe(1);
  });

  it('reads the mesh form', () => {
    const d = parseYaml(`format: branchwise-dispersion/1
mesh:
  q: [[0, 0, 0], [0.5, 0, 0]]
  weights: [1, 6]
  frequencies: [[0, 0, 0], [3, 2, 1]]
`);
    expect(d.kind).toBe('mesh');
    expect(Array.from(d.weights!)).toEqual([1, 6]);
    expect(Array.from(d.frequencies.subarray(3))).toEqual([1, 2, 3]);
    expect(d.segments).toEqual([]);
  });

  it('keeps unknown top-level keys as metadata', () => {
    const d = parseYaml('format: branchwise-dispersion/1\ncode: invented-code\nsegments:\n  - {distance: [0], frequencies: [[1]]}\n');
    expect(d.metadata).toEqual({ code: 'invented-code' });
  });
});

describe('yaml: bad input (band-files.md "Bad input")', () => {
  it('a YAML syntax error: line and column', () => {
    const e = error(() => parseYaml('format: branchwise-dispersion/1\nsegments:\n  - q: [[0, 0, 0]\n    frequencies: [[1]]\n'));
    expect(e.expected).toBe('valid YAML');
    expect(e.line).toBeGreaterThanOrEqual(3);
    expect(e.column).not.toBeNull();
  });
  it('a duplicate key', () => {
    const e = error(() => parseYaml('format: branchwise-dispersion/1\nunits: THz\nunits: meV\n'));
    expect(e.line).toBe(3);
  });
  it('a missing or wrong format', () => {
    const missing = error(() => parseYaml('segments:\n  - {distance: [0], frequencies: [[1]]}\n'));
    expect([missing.line, missing.expected]).toEqual([1, 'a `format: branchwise-dispersion/1` line']);
    const wrong = error(() => parseYaml('title: x\nformat: branchwise-dispersion/2\nsegments: []\n'));
    expect([wrong.line, wrong.column]).toEqual([2, 9]);
  });
  it('missing segments, an empty list, a document that is not a mapping', () => {
    expect(error(() => parseYaml('format: branchwise-dispersion/1\n')).expected).toMatch(/segments/);
    expect(error(() => parseYaml('format: branchwise-dispersion/1\nsegments: []\n')).line).toBe(2);
    expect(error(() => parseYaml('- 1\n- 2\n')).line).toBe(1);
    expect(error(() => parseYaml('')).line).toBe(1);
  });
  it('mismatched q and frequencies lengths: at the q list', () => {
    const e = error(() =>
      parseYaml('format: branchwise-dispersion/1\nsegments:\n  - q: [[0, 0, 0], [0.1, 0, 0]]\n    frequencies: [[1]]\n'),
    );
    expect([e.line, e.column]).toEqual([3, 8]);
    expect(e.expected).toBe('as many q-points as frequency rows (1)');
  });
  it('a non-numeric, NaN or infinite value: at the value', () => {
    const bad = (v: string) => error(() => parseYaml(`format: branchwise-dispersion/1\nsegments:\n  - q: [[0, 0, 0]]\n    frequencies: [[1, ${v}]]\n`));
    const a = bad('abc');
    expect([a.line, a.column, a.found]).toEqual([4, 23, '"abc"']);
    expect(bad('.nan').expected).toMatch(/finite/);
    expect(bad('.inf').expected).toMatch(/finite/);
  });
  it('a row of a different width', () => {
    const e = error(() => parseYaml('format: branchwise-dispersion/1\nsegments:\n  - distance: [0, 1]\n    frequencies:\n      - [1, 2]\n      - [1, 2, 3]\n'));
    expect([e.line, e.column]).toEqual([6, 9]);
    expect(e.expected).toBe('2 frequencies per row, like line 5');
  });
  it('an unknown unit', () => {
    const e = error(() => parseYaml('format: branchwise-dispersion/1\nunits: rad/s\nsegments: []\n'));
    expect([e.line, e.column]).toEqual([2, 8]);
  });
  it('a segment with neither q nor distance; q in some segments only', () => {
    expect(error(() => parseYaml('format: branchwise-dispersion/1\nsegments:\n  - frequencies: [[1]]\n')).line).toBe(3);
    const mixed = error(() =>
      parseYaml('format: branchwise-dispersion/1\nsegments:\n  - {q: [[0,0,0]], frequencies: [[1]]}\n  - {distance: [1], frequencies: [[1]]}\n'),
    );
    expect(mixed.line).toBe(4);
  });
  it('a self-referencing alias', () => {
    expect(error(() => parseYaml('format: branchwise-dispersion/1\na: &a [1, *a]\nsegments: []\n')).line).toBe(2);
  });
  it('aliases that expand beyond the limit', () => {
    const bomb = [
      'format: branchwise-dispersion/1',
      'a: &a [1, 1, 1, 1, 1, 1, 1, 1, 1]',
      'b: &b [*a, *a, *a, *a, *a, *a, *a, *a, *a]',
      'c: &c [*b, *b, *b, *b, *b, *b, *b, *b, *b]',
      'd: &d [*c, *c, *c, *c, *c, *c, *c, *c, *c]',
      'e: &e [*d, *d, *d, *d, *d, *d, *d, *d, *d]',
      'segments:',
      '  - {distance: [0], frequencies: [[1]]}',
    ].join('\n');
    const e = error(() => parseYaml(bomb));
    expect(e.line).toBe(6);
    expect(e.expected).toMatch(/aliases/);
  });
  it('a small alias is fine', () => {
    const d = parseYaml('format: branchwise-dispersion/1\nsegments:\n  - {from: A, to: B, distance: [0, 1], frequencies: [&r [1, 2], *r]}\n');
    expect(Array.from(d.frequencies)).toEqual([1, 2, 1, 2]);
  });
  it('a bad lattice, atoms, acoustic', () => {
    expect(error(() => parseYaml('format: branchwise-dispersion/1\nlattice: [[1, 0, 0], [0, 1, 0]]\nsegments: []\n')).line).toBe(2);
    expect(error(() => parseYaml('format: branchwise-dispersion/1\natoms: 1.5\nsegments: []\n')).line).toBe(2);
    const ac = error(() => parseYaml('format: branchwise-dispersion/1\nacoustic: 3\nsegments:\n  - {distance: [0], frequencies: [[1, 2]]}\n'));
    expect([ac.line, ac.column]).toEqual([2, 11]);
  });
});

describe('yaml: number lists read apart from the yaml package', () => {
  const outcome = (fn: () => unknown) => {
    try {
      return { value: fn() };
    } catch (e) {
      if (!(e instanceof ParseError)) throw e;
      return { error: [e.line, e.column, e.expected, e.found] };
    }
  };
  const same = (text: string) => expect(outcome(() => parseYaml(text))).toEqual(outcome(() => parseYamlNodeByNode(text)));

  it('give the same Dispersion as reading every number through the yaml package', () => {
    same(GOOD);
    same(GOOD.replace(/\n/g, '\r\n'));
    same('format: branchwise-dispersion/1\nsegments:\n- distance:\n  - 0\n  - 0.5e1\n\n  - -.25\n  frequencies: [[1, 2], [3,4],\n     [5 , 6]]\n');
    same('format: branchwise-dispersion/1\nmesh:\n  q: [[0, 0, 0], [0.5, 0, 0]]\n  weights: [1, 3]\n  frequencies:\n    - [1, 2]\n    - [3, 4]\n');
  });

  it('put errors inside a list at the row or number', () => {
    const width = error(() => parseYaml('format: branchwise-dispersion/1\nsegments:\n  - distance: [0, 1]\n    frequencies:\n      - [1, 2]\n      - [1, 2, 3]\n'));
    expect([width.line, width.column, width.expected]).toEqual([6, 9, '2 frequencies per row, like line 5']);
    const q = error(() => parseYaml('format: branchwise-dispersion/1\nsegments:\n  - frequencies: [[1], [2]]\n    q: [[0, 0, 0], [Γ, 0, 0]]\n'));
    expect([q.line, q.column, q.expected]).toEqual([4, 21, 'a number (a q coordinate)']);
    const q2 = error(() => parseYaml('format: branchwise-dispersion/1\nsegments:\n  - frequencies: [[1], [2]]\n    q: [[0, 0, 0], [0.5, 0]]\n'));
    expect([q2.line, q2.column, q2.expected, q2.found]).toEqual([4, 20, 'three coordinates [x, y, z]', '2']);
    const flat = error(() => parseYaml('format: branchwise-dispersion/1\nsegments:\n  - distance: [0]\n    frequencies: [1.5, 2]\n'));
    expect([flat.line, flat.column, flat.found]).toEqual([4, 19, '1.5']);
  });

  it('leave look-alikes in strings, block scalars and YAML 1.1 documents alone', () => {
    const inScalar = 'format: branchwise-dispersion/1\nnote: |\n  q: [[1, 2]]\n  frequencies:\n    - [1]\nsegments:\n  - distance: [0]\n    frequencies: [[1]]\n';
    expect(parseYaml(inScalar).metadata.note).toBe('q: [[1, 2]]\nfrequencies:\n  - [1]\n');
    same(inScalar);
    const v11 = '%YAML 1.1\n---\nformat: branchwise-dispersion/1\nsegments:\n  - distance: [0]\n    frequencies: [[1_000]]\n';
    same(v11);
    // A block list inside a flow mapping is an error, cut out or not.
    same('format: branchwise-dispersion/1\nsegments: [{distance: [0],\nfrequencies:\n  - [1]\n}]\n');
  });

  it('count their nodes toward the alias limit', () => {
    const row = `[${Array.from({ length: 200 }, (_, i) => i).join(', ')}]`;
    const seg = `  - &s\n    distance: [${Array.from({ length: 30 }, (_, i) => i).join(', ')}]\n    frequencies:\n${Array.from({ length: 30 }, () => `      - ${row}`).join('\n')}\n`;
    const text = `format: branchwise-dispersion/1\nsegments:\n${seg}  - *s\n  - *s\n`;
    const e = error(() => parseYaml(text));
    expect(e.expected).toMatch(/aliases/);
    same(text);
  });

  it('agree with the yaml package on thousands of mutated files (fast-check)', () => {
    const base = [
      'format: branchwise-dispersion/1',
      'units: meV',
      'metadata: {q: [1, 2]}',
      'segments:',
      '  - from: Γ',
      '    to: X',
      '    q:',
      '      - [0, 0, 0]',
      '      - [0.5, 0, 0.5]',
      '    frequencies:',
      '    - [0, 0.1]',
      '    - [2, 3e-1]',
      '  - from: X',
      '    q: [[0.5, 0, 0.5], [0.5, 0.25,',
      '      0.75]]',
      '    frequencies: [[3, 2], [4, 5]]',
      '',
    ].join('\n');
    const alphabet = [...'0123456789-+.eE ,\t\n\r#:[]{}&*!"|', '- ', ': ', '\n  ', '\n    - ', '&a ', '*a', '  '];
    const edit = fc.record({ at: fc.nat(), del: fc.integer({ min: 0, max: 3 }), s: fc.constantFrom('', ...alphabet) });
    fc.assert(
      fc.property(fc.array(edit, { minLength: 1, maxLength: 5 }), (edits) => {
        let t = base;
        for (const m of edits) {
          const at = m.at % (t.length + 1);
          t = t.slice(0, at) + m.s + t.slice(at + m.del);
        }
        same(t);
      }),
      { seed: 20240611, numRuns: 500 },
    );
  });
});
