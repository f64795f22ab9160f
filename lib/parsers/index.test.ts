import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Dispersion } from '../dispersion/types';
import { formatFromFilename, parseBandFile, ParseError, sniffFormat } from './index';

// The same invented data in both formats (invented material, invented numbers).
const COLUMNS = `# title: Invented crystal Ab (invented)
# units: cm-1
# columns: q
# lattice: 0 2 2 ; 2 0 2 ; 2 2 0
# atoms: 1
# polar: no
# labels: 0=Γ 2=X 3=X 5=W 6=K|U 9=X
# method: invented
0 0 0            0 0 0
0.25 0 0.25      100 120 210
0.5 0 0.5        150 150 300
0.5 0 0.5        150 300 150
0.5 0.125 0.625  160 170 290
0.5 0.25 0.75    180 190 280
0.375 0.375 0.75 200 210 260
0.625 0.25 0.625 200 210 260
0.5625 0.125 0.5625 190 200 270
0.5 0 0.5        150 150 300
`;

const YAML = `format: branchwise-dispersion/1
title: Invented crystal Ab (invented)
units: cm-1
lattice: [[0, 2, 2], [2, 0, 2], [2, 2, 0]]
atoms: 1
polar: false
metadata:
  method: invented
segments:
  - from: Γ
    to: X
    q: [[0, 0, 0], [0.25, 0, 0.25], [0.5, 0, 0.5]]
    frequencies: [[0, 0, 0], [100, 120, 210], [150, 150, 300]]
  - from: X
    to: W
    q: [[0.5, 0, 0.5], [0.5, 0.125, 0.625], [0.5, 0.25, 0.75]]
    frequencies: [[300, 150, 150], [160, 170, 290], [180, 190, 280]]
  - from: W
    to: K
    q: [[0.5, 0.25, 0.75], [0.375, 0.375, 0.75]]
    frequencies: [[180, 190, 280], [200, 210, 260]]
  - from: U
    to: X
    q: [[0.625, 0.25, 0.625], [0.5625, 0.125, 0.5625], [0.5, 0, 0.5]]
    frequencies: [[200, 210, 260], [190, 200, 270], [150, 150, 300]]
`;

describe('both formats', () => {
  it('parse to the same Dispersion for the same data', () => {
    const c = parseBandFile(COLUMNS, { filename: 'ab.dat' });
    const y = parseBandFile(YAML, { filename: 'ab.yaml' });
    expect(c.format).toBe('columns');
    expect(y.format).toBe('yaml');
    // The columns file shares W between W–K and X–W (an interior label); the YAML file
    // repeats it. Compare the YAML file against the columns file with W written twice.
    const c2 = parseBandFile(COLUMNS.replace('0.5 0.25 0.75    180 190 280\n', '0.5 0.25 0.75    180 190 280\n0.5 0.25 0.75    180 190 280\n').replace('6=K|U 9=X', '7=K|U 10=X').replace('5=W', '5=W 6=W'));
    const strip = (d: Dispersion) => ({ ...d, format: null });
    expect(strip(y)).toEqual(strip(c2));
    expect(c.nq).toBe(10);
    expect(c.segments.map((s) => [s.start, s.end, s.connectedToNext, s.from, s.to])).toEqual([
      [0, 2, true, 'Γ', 'X'],
      [3, 5, true, 'X', 'W'],
      [5, 6, false, 'W', 'K'],
      [7, 9, false, 'U', 'X'],
    ]);
  });
});

describe('both formats, random data (fast-check)', () => {
  // Random paths written both ways: YAML segments, and columns rows where a connected join is
  // the repeated point and a break is a blank line. Both must read back identically.
  const freq = fc.double({ min: -5, max: 60, noNaN: true, noDefaultInfinity: true });
  const segment = fc.record({ n: fc.integer({ min: 2, max: 5 }), connected: fc.boolean() });
  const file = fc.record({
    nb: fc.integer({ min: 1, max: 4 }),
    segments: fc.array(segment, { minLength: 1, maxLength: 5 }),
    unit: fc.constantFrom('THz', 'cm-1', 'meV'),
    seed: fc.array(freq, { minLength: 200, maxLength: 200 }),
  });
  it('read back to the same Dispersion', () => {
    fc.assert(
      fc.property(file, ({ nb, segments, unit, seed }) => {
        let label = 0;
        let point = 0;
        let fi = 0;
        const yamlSegs: string[] = [];
        const rowsOut: string[] = [];
        const labelPairs: string[] = [];
        let prevTo = '';
        let prevQ: number[] = [];
        segments.forEach((sg, s) => {
          const connected = s > 0 && sg.connected;
          const from = connected ? prevTo : `L${label++}`;
          const to = `L${label++}`;
          const qs: number[][] = [];
          const fs: number[][] = [];
          for (let i = 0; i < sg.n; i++) {
            const q = connected && i === 0 ? prevQ : [point * 0.01, -point * 0.02, 0.5 - point * 0.03];
            point++;
            qs.push(q);
            fs.push(Array.from({ length: nb }, () => seed[fi++ % seed.length]));
          }
          const start = rowsOut.filter((r) => r !== '').length;
          if (s > 0 && !connected) rowsOut.push('');
          qs.forEach((q, i) => rowsOut.push([...q, ...fs[i]].map(String).join(' ')));
          labelPairs.push(`${start}=${from}`, `${start + sg.n - 1}=${to}`);
          yamlSegs.push(
            `  - from: ${from}\n    to: ${to}\n    q: [${qs.map((q) => `[${q.join(', ')}]`).join(', ')}]\n` +
              `    frequencies: [${fs.map((f) => `[${f.join(', ')}]`).join(', ')}]`,
          );
          prevTo = to;
          prevQ = qs[qs.length - 1];
        });
        const yaml = `format: branchwise-dispersion/1\nunits: ${unit}\nsegments:\n${yamlSegs.join('\n')}\n`;
        const cols = `# units: ${unit}\n# columns: q\n# labels: ${labelPairs.join(' ')}\n${rowsOut.join('\n')}\n`;
        const y = parseBandFile(yaml, { format: 'yaml' });
        const c = parseBandFile(cols, { format: 'columns' });
        expect({ ...c, format: null }).toEqual({ ...y, format: null });
      }),
      { seed: 31337, numRuns: 100 },
    );
  });
});

describe('parseBandFile', () => {
  it('picks the format from the option, the extension, then the content', () => {
    expect(formatFromFilename('a.TSV')).toBe('columns');
    expect(formatFromFilename('a.yml')).toBe('yaml');
    expect(formatFromFilename('a.json')).toBeNull();
    expect(sniffFormat('# units: THz\n\n-0.5 1 2\n')).toBe('columns');
    expect(sniffFormat('# comment\nformat: branchwise-dispersion/1\n')).toBe('yaml');
    expect(sniffFormat('---\nformat: x\n')).toBe('yaml');
    expect(parseBandFile(YAML).format).toBe('yaml');
    expect(parseBandFile(COLUMNS).format).toBe('columns');
    expect(() => parseBandFile(COLUMNS, { format: 'yaml' })).toThrow(ParseError);
  });

  it('reads bytes, with a BOM', () => {
    const bytes = new TextEncoder().encode('\uFEFF0 1 2\n');
    const d = parseBandFile(bytes);
    expect(Array.from(d.frequencies)).toEqual([1, 2]);
  });

  it('refuses invalid UTF-8 at its line', () => {
    const e = parseError(() => parseBandFile(new Uint8Array([48, 32, 49, 10, 48, 32, 0xff, 10])));
    expect([e.line, e.column, e.expected]).toEqual([2, 3, 'UTF-8 text']);
  });

  it('counts error columns in characters, not bytes, on lines with multi-byte text', () => {
    const enc = (t: string) => new TextEncoder().encode(t);
    const cases: [string, number, number, string][] = [
      // A header error after Γ (2 bytes each in UTF-8).
      ['# labels: 0=Γ 1=ΓΓ 9=X\n0 1\n1 2\n', 1, 20, 'a q-point index from 0 to 1'],
      ['# title: ΓΓΓ\n# units: Γ-Hz\n0 1\n', 2, 10, 'a unit: THz, cm-1 or meV'],
      // A data token holding Γ, and a token after a comment-free line start.
      ['0 1\n1 ΓX\n', 2, 3, 'a number'],
      ['# ΓΓ\n0 1 2\n1 2\n', 3, 4, '3 numbers per line, like line 2'],
      // A 4-byte character (two UTF-16 units, as string offsets count it) before the error.
      ['# units: 😀\n0 1\n', 1, 10, 'a unit: THz, cm-1 or meV'],
    ];
    for (const [text, line, column, expected] of cases) {
      for (const input of [text, enc(text)]) {
        const e = parseError(() => parseBandFile(input, { format: 'columns' }));
        expect([e.line, e.column, e.expected]).toEqual([line, column, expected]);
      }
    }
    // Invalid UTF-8 after multi-byte text: the column of the bad byte in characters.
    const bad = new Uint8Array([...enc('0 1\n# ΓΓ '), 0xff, 10]);
    const e = parseError(() => parseBandFile(bad));
    expect([e.line, e.column, e.expected]).toEqual([2, 6, 'UTF-8 text']);
    const inToken = new Uint8Array([...enc('0 1\n1 Γ'), 0xe2, 0x82, 10]);
    const t = parseError(() => parseBandFile(inToken));
    expect([t.line, t.column, t.expected]).toEqual([2, 4, 'UTF-8 text']);
  });

  it('reads a file without a final newline, from bytes and from text', () => {
    for (const input of ['# units: meV\n0 1 2\n1 3 4', new TextEncoder().encode('0 1 2\n1 3 4')]) {
      const d = parseBandFile(input);
      expect([d.nq, d.nb, d.distance![1]]).toEqual([2, 2, 1]);
    }
  });

  it('refuses a file over the size limit (default 64 MiB)', () => {
    const e = parseError(() => parseBandFile('0 1\n'.repeat(100), { maxBytes: 100 }));
    expect([e.line, e.expected]).toEqual([1, 'a file of at most 100 bytes']);
    expect(parseError(() => parseBandFile(new Uint8Array(101), { maxBytes: 100 })).line).toBe(1);
    // Multi-byte characters count as bytes, not characters.
    expect(() => parseBandFile('# ' + 'Γ'.repeat(60) + '\n0 1\n', { maxBytes: 100 })).toThrow(/at most 100 bytes/);
  });
});

function parseError(fn: () => unknown): ParseError {
  try {
    fn();
  } catch (e) {
    if (e instanceof ParseError) return e;
    throw e;
  }
  throw new Error('did not throw');
}

function outcome(fn: () => Dispersion): { dispersion: Dispersion } | { error: unknown } {
  try {
    return { dispersion: fn() };
  } catch (e) {
    return { error: e };
  }
}

/** Invariants every Dispersion a parser returns must keep. */
function checkDispersion(d: Dispersion): boolean {
  if (d.frequencies.length !== d.nq * d.nb || d.nq < 1 || d.nb < 1) return false;
  for (let i = 0; i < d.frequencies.length; i++) if (!Number.isFinite(d.frequencies[i])) return false;
  for (let i = 0; i < d.nq; i++) for (let k = 1; k < d.nb; k++) if (d.frequencies[i * d.nb + k] < d.frequencies[i * d.nb + k - 1]) return false;
  if (d.q && d.q.length !== d.nq * 3) return false;
  if (d.distance && d.distance.length !== d.nq) return false;
  if (d.kind === 'path') {
    if (d.segments.length === 0 || d.segments[0].start !== 0 || d.segments[d.segments.length - 1].end !== d.nq - 1) return false;
    for (let s = 0; s < d.segments.length; s++) {
      const seg = d.segments[s];
      if (seg.start > seg.end) return false;
      const next = d.segments[s + 1];
      if (next && next.start !== seg.end && next.start !== seg.end + 1) return false;
    }
  }
  for (const i of d.labels.keys()) if (i < 0 || i >= d.nq) return false;
  return d.acoustic >= 0 && d.acoustic <= d.nb;
}

describe('fuzzing: mutated valid files give a Dispersion or a ParseError, nothing else', () => {
  const alphabet = [...'0123456789-+.eE ,;\t\n\r#:|=[]{}&*!x"\'Γ\uFEFF', '\n\n', '# units: meV\n', '- ', ': '];
  const mutation = fc.oneof(
    fc.record({ op: fc.constant('delete' as const), at: fc.nat(), len: fc.integer({ min: 1, max: 4 }) }),
    fc.record({ op: fc.constant('insert' as const), at: fc.nat(), s: fc.constantFrom(...alphabet) }),
    fc.record({ op: fc.constant('replace' as const), at: fc.nat(), s: fc.constantFrom(...alphabet) }),
    fc.record({ op: fc.constant('dropLine' as const), at: fc.nat() }),
    fc.record({ op: fc.constant('dupLine' as const), at: fc.nat() }),
    fc.record({ op: fc.constant('swapLines' as const), at: fc.nat(), to: fc.nat() }),
  );
  type Mutation = typeof mutation extends fc.Arbitrary<infer T> ? T : never;

  function mutate(text: string, ms: Mutation[]): string {
    let t = text;
    for (const m of ms) {
      const at = t.length ? m.at % (t.length + 1) : 0;
      if (m.op === 'delete') t = t.slice(0, at) + t.slice(at + m.len);
      else if (m.op === 'insert') t = t.slice(0, at) + m.s + t.slice(at);
      else if (m.op === 'replace') t = t.slice(0, at) + m.s + t.slice(at + 1);
      else {
        const lines = t.split('\n');
        const i = m.at % lines.length;
        if (m.op === 'dropLine') lines.splice(i, 1);
        else if (m.op === 'dupLine') lines.splice(i, 0, lines[i]);
        else {
          const j = m.to % lines.length;
          [lines[i], lines[j]] = [lines[j], lines[i]];
        }
        t = lines.join('\n');
      }
    }
    return t;
  }

  // The YAML base is small: the yaml package takes a few ms per document, and the suite must stay fast.
  const smallYaml = [
    'format: branchwise-dispersion/1',
    'units: meV',
    'lattice: [[0, 2, 2], [2, 0, 2], [2, 2, 0]]',
    'metadata: {method: invented}',
    'segments:',
    '  - from: Γ',
    '    to: X',
    '    q: [[0, 0, 0], [0.5, 0, 0.5]]',
    '    frequencies: [[0, 0.1], [2, 3]]',
    '  - {from: X, to: W, q: [[0.5, 0, 0.5], [0.5, 0.25, 0.75]], frequencies: [[3, 2], [4, 5]]}',
    '',
  ].join('\n');
  for (const [name, base, runs] of [
    ['columns', COLUMNS, 3000],
    ['yaml', smallYaml, 1200],
    ['blocks', '# units: meV\n# labels: 0=Γ 2=X\n0 0\n0.5 1\n1 2\n\n0 3\n0.5 4\n1 5\n', 3000],
  ] as const) {
    it(`${name}: ${runs} mutated files`, () => {
      const maxLine = (t: string) => t.split('\n').length + 1;
      fc.assert(
        fc.property(fc.array(mutation, { minLength: 1, maxLength: 6 }), fc.boolean(), (ms, named) => {
          const text = mutate(base, ms);
          const opts = named ? { filename: name === 'yaml' ? 'f.yaml' : 'f.dat' } : {};
          // Uploads arrive as bytes: the byte path must give the same result or the same error.
          const fromText = outcome(() => parseBandFile(text, opts));
          const fromBytes = outcome(() => parseBandFile(new TextEncoder().encode(text), opts));
          expect(fromBytes).toEqual(fromText);
          if ('dispersion' in fromText) return checkDispersion(fromText.dispersion);
          const e = fromText.error;
          if (!(e instanceof ParseError)) return false;
          return (
            Number.isInteger(e.line) &&
            e.line >= 1 &&
            e.line <= maxLine(text) &&
            (e.column === null || (Number.isInteger(e.column) && e.column >= 1)) &&
            e.expected.length > 0 &&
            e.message.startsWith(`line ${e.line}`)
          );
        }),
        { seed: 424242, numRuns: runs },
      );
    });
  }
});
