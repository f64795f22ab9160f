import { describe, expect, it } from 'vitest';
import type { Dispersion } from '../dispersion/types';
import { parseBandFile } from '../parsers';
import { fccModel } from '../models/fcc';
import { meshDispersion, pathDispersion } from '../models/model';
import { rocksaltModel } from '../models/rocksalt';
import { monatomicChain } from '../models/chain';
import { pushBeyondZone } from '../models/defects';
import { writeColumns } from './columns';
import { writeYaml } from './yaml';

function expectSame(a: Dispersion, b: Dispersion, tol = 0, labels = true) {
  expect(b.kind).toBe(a.kind);
  expect(b.nq).toBe(a.nq);
  expect(b.nb).toBe(a.nb);
  const close = (x: ArrayLike<number> | null, y: ArrayLike<number> | null) => {
    expect(y === null).toBe(x === null);
    if (!x || !y) return;
    for (let i = 0; i < x.length; i++) {
      if (tol === 0) expect(y[i]).toBe(x[i]);
      else expect(Math.abs(y[i] - x[i])).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(x[i])));
    }
  };
  close(a.frequencies, b.frequencies);
  close(a.q, b.q);
  close(a.weights, b.weights);
  expect(b.lattice).toEqual(a.lattice);
  expect(b.atoms).toBe(a.atoms);
  expect(b.polar).toBe(a.polar);
  expect(b.acoustic).toBe(a.acoustic);
  expect(b.title).toBe(a.title);
  if (a.kind === 'path') {
    expect(b.segments.map((s) => [s.start, s.end, s.connectedToNext])).toEqual(a.segments.map((s) => [s.start, s.end, s.connectedToNext]));
    if (labels) expect([...b.labels].sort((x, y) => x[0] - y[0])).toEqual([...a.labels].sort((x, y) => x[0] - y[0]));
  }
}

const fcc = pathDispersion(fccModel(), { points: 11 });

describe('writeColumns → parseBandFile', () => {
  it('gives back the same fcc path bit for bit in THz', () => {
    const back = parseBandFile(writeColumns(fcc), { format: 'columns' });
    expectSame(fcc, back);
    for (let i = 0; i < fcc.nq; i++) expect(back.distance![i]).toBe(fcc.distance![i]);
  });

  it('gives back the same values through cm-1 and meV (to round-off of the conversion)', () => {
    for (const units of ['cm-1', 'meV'] as const) {
      const text = writeColumns(fcc, { units });
      expect(text).toContain(`# units: ${units}`);
      const back = parseBandFile(text, { format: 'columns' });
      expect(back.units).toBe(units);
      expectSame(fcc, back, 1e-14);
    }
  });

  it('keeps path breaks (blank lines) and polar flags', () => {
    const d = { ...pathDispersion(rocksaltModel({ polar: true }), { points: 6 }) };
    d.segments = d.segments.map((s, i) => (i === 1 ? { ...s, connectedToNext: false } : s));
    const text = writeColumns(d);
    expect(text).toMatch(/\n\n/);
    expectSame(d, parseBandFile(text, { format: 'columns' }));
  });

  it('writes the blocks layout with distances only', () => {
    const d = pathDispersion(monatomicChain(), { points: 9 });
    const back = parseBandFile(writeColumns(d, { layout: 'blocks', columns: 'distance' }), { format: 'columns' });
    expectSame({ ...d, q: null }, back);
  });

  it('writes a mesh with weights', () => {
    const m = meshDispersion(fccModel(), { mesh: [3, 3, 3] });
    expectSame(m, parseBandFile(writeColumns(m), { format: 'columns' }));
  });

  it('keeps q outside the first zone as written', () => {
    const d = pushBeyondZone(fcc, { indices: [3], g: [1, 0, 0] });
    expect(parseBandFile(writeColumns(d), { format: 'columns' }).q![9]).toBe(d.q![9]);
  });

  it('refuses what the format cannot carry', () => {
    expect(() => writeColumns({ ...fcc, q: null }, { columns: 'q' })).toThrow(/no q coordinates/);
    const broken = { ...fcc, segments: fcc.segments.map((s, i) => (i === 0 ? { ...s, connectedToNext: false } : s)) };
    expect(() => writeColumns(broken, { layout: 'blocks', columns: 'distance' })).toThrow(/path breaks/);
  });
});

describe('writeYaml → parseBandFile', () => {
  it('gives back the same fcc path', () => {
    expectSame(fcc, parseBandFile(writeYaml(fcc), { format: 'yaml' }));
  });

  it('keeps breaks, units and metadata', () => {
    const d = { ...pathDispersion(rocksaltModel({ polar: true }), { points: 6 }) };
    d.segments = d.segments.map((s, i) => (i === 1 ? { ...s, connectedToNext: false } : s));
    const back = parseBandFile(writeYaml(d, { units: 'meV' }), { format: 'yaml' });
    expectSame(d, back, 1e-14, false);
    // A break between two equally named points is written with a primed name, so it reads as a break.
    const start = d.segments[2].start;
    expect(back.labels.get(start)).toBe('W′');
    expect(back.labels.get(start - 1)).toBe('W');
    expect(back.metadata.model).toBe('cubic2');
  });

  it('writes a mesh', () => {
    const m = meshDispersion(fccModel(), { mesh: [2, 2, 2] });
    expectSame(m, parseBandFile(writeYaml(m), { format: 'yaml' }));
  });
});
