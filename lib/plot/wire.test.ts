import { describe, expect, it } from 'vitest';
import type { Dispersion } from '../dispersion/types';
import { decodePlotData, encodePlotData, PlotWireError } from './wire';

function small(): Dispersion {
  // 5 q-points, 3 branches, point-major; a break after point 2.
  const frequencies = Float64Array.from([
    0, 1.25, 3.5, //
    0.5, 1.5, 3.25,
    1, 2, 3.0000001,
    1, 2, 3,
    -0.125, 2.5, 4,
  ]);
  return {
    format: 'columns',
    kind: 'path',
    title: 'Invented test path',
    nq: 5,
    nb: 3,
    frequencies,
    q: Float64Array.from([0, 0, 0, 0.25, 0, 0.25, 0.5, 0, 0.5, 0.5, 0.25, 0.75, 0.75, 0, 0.75]),
    coordinates: 'fractional',
    distance: null,
    weights: null,
    lattice: null,
    units: 'cm-1',
    labels: new Map([
      [0, 'Γ'],
      [2, 'X'],
      [3, 'W'],
    ]),
    segments: [
      { start: 0, end: 2, from: 'Γ', to: 'X', connectedToNext: false },
      { start: 3, end: 4, from: 'W', connectedToNext: false },
    ],
    atoms: 1,
    polar: true,
    acoustic: 3,
    metadata: {},
  };
}

const geometry = {
  distance: Float64Array.from([0, 0.1, 0.2, 0.2, 0.35]),
  qFolded: Float64Array.from([0, 0, 0, 0.25, 0, 0.25, 0.5, 0, 0.5, 0.5, 0.25, -0.25, -0.25, 0, -0.25]),
};

describe('plot wire format', () => {
  it('round-trips every field, frequencies transposed to branch-major', () => {
    const d = small();
    const buf = encodePlotData(d, geometry, { frequencies: 'f64' });
    const p = decodePlotData(buf.buffer as ArrayBuffer);
    expect(p.nq).toBe(5);
    expect(p.nb).toBe(3);
    expect(p.title).toBe('Invented test path');
    expect(p.declaredUnit).toBe('cm-1');
    expect(p.polar).toBe(true);
    expect(p.coordinates).toBe('fractional');
    expect([...p.distance]).toEqual([...geometry.distance]);
    expect([...p.qFolded!]).toEqual([...geometry.qFolded]);
    expect([...p.q!]).toEqual([...d.q!]);
    expect(p.frequencies).toBeInstanceOf(Float64Array);
    for (let iq = 0; iq < 5; iq++) for (let k = 0; k < 3; k++) expect(p.frequencies[k * 5 + iq]).toBe(d.frequencies[iq * 3 + k]);
    expect(p.labels).toEqual([
      { index: 0, label: 'Γ' },
      { index: 2, label: 'X' },
      { index: 3, label: 'W' },
    ]);
    expect(p.segments).toEqual(d.segments);
    expect(p.breaks).toEqual([2]);
  });

  it('stores frequencies as Float32 by default, within single precision', () => {
    const d = small();
    const f64 = encodePlotData(d, geometry, { frequencies: 'f64' });
    const f32 = encodePlotData(d, geometry);
    expect(f32.byteLength).toBeLessThan(f64.byteLength);
    const p = decodePlotData(f32);
    expect(p.frequencies).toBeInstanceOf(Float32Array);
    for (let iq = 0; iq < 5; iq++)
      for (let k = 0; k < 3; k++) expect(p.frequencies[k * 5 + iq]).toBeCloseTo(d.frequencies[iq * 3 + k], 6);
  });

  it('starts every array on an 8-byte boundary so the views need no copy', () => {
    const p = decodePlotData(encodePlotData(small(), geometry));
    for (const a of [p.distance, p.frequencies, p.qFolded!, p.q!]) expect(a.byteOffset % 8).toBe(0);
  });

  it('reads a body that sits at an odd offset inside a larger buffer', () => {
    const body = encodePlotData(small(), geometry, { frequencies: 'f64' });
    const big = new Uint8Array(body.byteLength + 3);
    big.set(body, 3);
    const p = decodePlotData(big.subarray(3));
    expect(p.frequencies[2 * 5 + 4]).toBe(4);
  });

  it('omits qFolded and q when unknown', () => {
    const d = { ...small(), q: null };
    const p = decodePlotData(encodePlotData(d, { distance: geometry.distance }));
    expect(p.q).toBeNull();
    expect(p.qFolded).toBeNull();
  });

  it('refuses inconsistent input with what and where', () => {
    const d = small();
    expect(() => encodePlotData(d, { distance: new Float64Array(4) })).toThrow(/distance has 4 values, expected one per q-point \(5\)/);
    expect(() => encodePlotData(d, { distance: Float64Array.from([0, 0.2, 0.1, 0.3, 0.4]) })).toThrow(/distance decreases at point 2/);
    expect(() => encodePlotData(d, { distance: Float64Array.from([0, NaN, 0.1, 0.3, 0.4]) })).toThrow(/distance at point 1 is NaN/);
    expect(() => encodePlotData({ ...d, frequencies: new Float64Array(14) }, geometry)).toThrow(/frequencies has 14 values, expected nq × nb = 15/);
    expect(() => encodePlotData(d, { ...geometry, qFolded: new Float64Array(3) })).toThrow(/qFolded has 3 values/);
  });

  it('refuses a body that is not a plot body, or is cut short', () => {
    const body = encodePlotData(small(), geometry);
    expect(() => decodePlotData(new Uint8Array([1, 2, 3]))).toThrow(PlotWireError);
    const wrong = body.slice();
    wrong[0] = 0x58;
    expect(() => decodePlotData(wrong)).toThrow(/magic/);
    expect(() => decodePlotData(body.slice(0, body.byteLength - 8))).toThrow(/array "q" .* lies outside/);
    const badLen = body.slice();
    new DataView(badLen.buffer).setUint32(4, 1e6, true);
    expect(() => decodePlotData(badLen)).toThrow(/header length 1000000 runs past the end/);
    const badJson = body.slice();
    badJson[8] = 0x7b + 1;
    expect(() => decodePlotData(badJson)).toThrow(/not valid JSON/);
  });
});
