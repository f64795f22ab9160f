/**
 * The plot wire format: the body of `GET /api/v1/revisions/{id}/data`
 * (`Content-Type: application/vnd.branchwise.plot`, an octet stream).
 *
 * Layout (all little-endian):
 *
 *   bytes 0..3   magic "BWPD"
 *   bytes 4..7   uint32: length H of the JSON header in bytes
 *   bytes 8..    the header, UTF-8 JSON, padded with spaces so the first array starts at a
 *                multiple of 8
 *   then         the arrays, each starting at a multiple of 8, at the offsets the header gives
 *
 * Arrays: `distance` (Float64, nq), `frequencies` (Float32 by default, or Float64; nb × nq,
 * BRANCH-MAJOR `[k * nq + iq]`, THz), `qFolded` (Float64, 3 × nq, fractional, folded into the
 * first Brillouin zone; absent when unknown), `q` (Float64, 3 × nq, as written in the file).
 *
 * Why branch-major: everything the plot does walks one branch along the path (decimation per
 * pixel column, the extra series for a highlighted or flagged branch, the overlay), so each
 * branch is one contiguous run that a `subarray` hands out without copying, and the decimation
 * loop reads memory in order. The one column-wise need (the readout's binary search over the
 * branches at one q-point) touches only log₂(nb) values. The server transposes once from the
 * parser's point-major layout.
 *
 * Why Float32 frequencies by default: 3 M values are 12 MB instead of 24 MB on the wire and in
 * the browser's heap, and 7 significant digits (≈ 4 µTHz at 60 THz) are far below a pixel.
 * Anything that needs the exact stored value (a thread's anchor) looks it up by index and
 * branch on the server.
 *
 * Why binary at all: a JSON number costs ~18 bytes and a parse; a typed array over the fetched
 * ArrayBuffer costs nothing to decode.
 */
import type { Coordinates, Dispersion, FrequencyUnit, Segment } from '../dispersion/types';
import { pathBreaks } from './path-breaks';

export const PLOT_CONTENT_TYPE = 'application/vnd.branchwise.plot';
export const PLOT_WIRE_VERSION = 1;
const MAGIC = [0x42, 0x57, 0x50, 0x44]; // "BWPD"
const PRELUDE = 8;

export type FloatArray = Float32Array | Float64Array;
type DType = 'f32' | 'f64';
type ArrayName = 'distance' | 'frequencies' | 'qFolded' | 'q';

/** What the plot needs of the path geometry (a subset of `pathGeometry(d)` in lib/physics/path). */
export interface PlotGeometry {
  /** Path distance per q-point (x of the plot), non-decreasing. */
  distance: ArrayLike<number>;
  /** Fractional q folded into the first Brillouin zone, 3 per point; null when unknown. */
  qFolded?: ArrayLike<number> | null;
}

export interface PlotLabel {
  index: number;
  label: string;
}

/** The decoded body: what the dispersion plot draws. */
export interface PlotData {
  title: string | null;
  kind: 'path' | 'mesh';
  nq: number;
  nb: number;
  /** x of each q-point. */
  distance: Float64Array;
  /** THz, branch-major `[k * nq + iq]`; at each q-point branch k is the k-th lowest. */
  frequencies: FloatArray;
  /** Fractional, folded into the first Brillouin zone, 3 per point; null when unknown. */
  qFolded: Float64Array | null;
  /** As written in the file (in `coordinates`), 3 per point; null when the file gave none. */
  q: Float64Array | null;
  coordinates: Coordinates;
  labels: PlotLabel[];
  segments: Segment[];
  /** Indices i with no line from point i to i + 1 (see pathBreaks). */
  breaks: number[];
  /** The unit the file declared; the frequencies are always THz. */
  declaredUnit: FrequencyUnit;
  acoustic: number;
  polar: boolean;
}

interface ArrayEntry {
  dtype: DType;
  offset: number;
  length: number;
}

interface Header {
  format: 'branchwise-plot';
  version: number;
  layout: 'branch-major';
  title: string | null;
  kind: 'path' | 'mesh';
  nq: number;
  nb: number;
  unit: 'THz';
  declaredUnit: FrequencyUnit;
  coordinates: Coordinates;
  labels: Array<[number, string]>;
  segments: Segment[];
  breaks: number[];
  acoustic: number;
  polar: boolean;
  arrays: Partial<Record<ArrayName, ArrayEntry>>;
}

export class PlotWireError extends Error {
  constructor(message: string) {
    super(`plot data: ${message}`);
    this.name = 'PlotWireError';
  }
}

export interface EncodeOptions {
  /** Element type of the frequencies; default 'f32' (see the file comment). */
  frequencies?: DType;
}

const BYTES: Record<DType, number> = { f32: 4, f64: 8 };
const align8 = (n: number) => (n + 7) & ~7;

export function encodePlotData(d: Dispersion, geometry: PlotGeometry, options: EncodeOptions = {}): Uint8Array {
  const { nq, nb } = d;
  if (!Number.isInteger(nq) || nq < 0 || !Number.isInteger(nb) || nb < 0) {
    throw new PlotWireError(`nq (${nq}) and nb (${nb}) must be non-negative integers`);
  }
  if (d.frequencies.length !== nq * nb) {
    throw new PlotWireError(`frequencies has ${d.frequencies.length} values, expected nq × nb = ${nq * nb}`);
  }
  if (geometry.distance.length !== nq) {
    throw new PlotWireError(`distance has ${geometry.distance.length} values, expected one per q-point (${nq})`);
  }
  for (let i = 0; i < nq; i++) {
    const x = geometry.distance[i];
    if (!Number.isFinite(x)) throw new PlotWireError(`distance at point ${i} is ${x}, expected a finite number`);
    if (i > 0 && x < geometry.distance[i - 1]) {
      throw new PlotWireError(`distance decreases at point ${i} (${x} after ${geometry.distance[i - 1]}); the plot needs a non-decreasing path distance`);
    }
  }
  const qFolded = geometry.qFolded ?? null;
  if (qFolded && qFolded.length !== 3 * nq) {
    throw new PlotWireError(`qFolded has ${qFolded.length} values, expected 3 per q-point (${3 * nq})`);
  }
  if (d.q && d.q.length !== 3 * nq) {
    throw new PlotWireError(`q has ${d.q.length} values, expected 3 per q-point (${3 * nq})`);
  }
  const fType: DType = options.frequencies ?? 'f32';

  const plan: Array<{ name: ArrayName; dtype: DType; length: number }> = [
    { name: 'distance', dtype: 'f64', length: nq },
    { name: 'frequencies', dtype: fType, length: nq * nb },
  ];
  if (qFolded) plan.push({ name: 'qFolded', dtype: 'f64', length: 3 * nq });
  if (d.q) plan.push({ name: 'q', dtype: 'f64', length: 3 * nq });

  // Offsets are relative to the start of the array block, so the header does not depend on its own length.
  const arrays: Header['arrays'] = {};
  let rel = 0;
  for (const p of plan) {
    arrays[p.name] = { dtype: p.dtype, offset: rel, length: p.length };
    rel = align8(rel + p.length * BYTES[p.dtype]);
  }
  const header: Header = {
    format: 'branchwise-plot',
    version: PLOT_WIRE_VERSION,
    layout: 'branch-major',
    title: d.title ?? null,
    kind: d.kind,
    nq,
    nb,
    unit: 'THz',
    declaredUnit: d.units,
    coordinates: d.coordinates,
    labels: [...d.labels.entries()].sort((a, b) => a[0] - b[0]),
    segments: d.segments.map((s) => ({ ...s })),
    breaks: pathBreaks(d.segments, nq),
    acoustic: d.acoustic,
    polar: d.polar,
    arrays,
  };
  const json = new TextEncoder().encode(JSON.stringify(header));
  const dataStart = align8(PRELUDE + json.length);
  const buf = new ArrayBuffer(dataStart + rel);
  const bytes = new Uint8Array(buf);
  bytes.set(MAGIC, 0);
  const view = new DataView(buf);
  view.setUint32(4, dataStart - PRELUDE, true);
  bytes.set(json, PRELUDE);
  bytes.fill(0x20, PRELUDE + json.length, dataStart);

  const le = littleEndianHost();
  const put = (entry: ArrayEntry, src: ArrayLike<number>) => {
    const at = dataStart + entry.offset;
    if (le) {
      const dst = entry.dtype === 'f32' ? new Float32Array(buf, at, entry.length) : new Float64Array(buf, at, entry.length);
      for (let i = 0; i < entry.length; i++) dst[i] = src[i];
    } else {
      for (let i = 0; i < entry.length; i++) {
        if (entry.dtype === 'f32') view.setFloat32(at + 4 * i, src[i], true);
        else view.setFloat64(at + 8 * i, src[i], true);
      }
    }
  };
  put(arrays.distance!, geometry.distance);
  // Point-major [iq * nb + k] in, branch-major [k * nq + iq] out.
  const f = d.frequencies;
  const fm = fType === 'f32' ? new Float32Array(nq * nb) : new Float64Array(nq * nb);
  for (let iq = 0; iq < nq; iq++) {
    const row = iq * nb;
    for (let k = 0; k < nb; k++) fm[k * nq + iq] = f[row + k];
  }
  put(arrays.frequencies!, fm);
  if (qFolded) put(arrays.qFolded!, qFolded);
  if (d.q) put(arrays.q!, d.q);
  return bytes;
}

export function decodePlotData(input: ArrayBuffer | Uint8Array): PlotData {
  // Typed-array views need their element alignment: copy a misaligned slice once (Node's pooled Buffers).
  let buf: ArrayBuffer;
  let base = 0;
  if (input instanceof Uint8Array) {
    if (input.byteOffset % 8 === 0 && input.buffer instanceof ArrayBuffer) {
      buf = input.buffer;
      base = input.byteOffset;
    } else {
      buf = input.slice().buffer as ArrayBuffer;
    }
  } else {
    buf = input;
  }
  const size = input.byteLength;
  if (size < PRELUDE) throw new PlotWireError(`body is ${size} bytes, shorter than the 8-byte prelude`);
  const bytes = new Uint8Array(buf, base, size);
  for (let i = 0; i < 4; i++) {
    if (bytes[i] !== MAGIC[i]) throw new PlotWireError('bytes 0..3 are not the magic "BWPD": not a plot body');
  }
  const view = new DataView(buf, base, size);
  const hlen = view.getUint32(4, true);
  if (PRELUDE + hlen > size) throw new PlotWireError(`header length ${hlen} runs past the end of the ${size}-byte body`);
  let header: Header;
  try {
    header = JSON.parse(new TextDecoder().decode(bytes.subarray(PRELUDE, PRELUDE + hlen))) as Header;
  } catch (e) {
    throw new PlotWireError(`header (bytes 8..${PRELUDE + hlen - 1}) is not valid JSON: ${(e as Error).message}`);
  }
  if (header?.format !== 'branchwise-plot') throw new PlotWireError(`header.format is ${JSON.stringify(header?.format)}, expected "branchwise-plot"`);
  if (header.version !== PLOT_WIRE_VERSION) throw new PlotWireError(`header.version is ${header.version}; this client reads version ${PLOT_WIRE_VERSION}`);
  if (header.layout !== 'branch-major') throw new PlotWireError(`header.layout is ${JSON.stringify(header.layout)}, expected "branch-major"`);
  const { nq, nb } = header;
  if (!Number.isInteger(nq) || nq < 0 || !Number.isInteger(nb) || nb < 0) {
    throw new PlotWireError(`header nq (${nq}) and nb (${nb}) must be non-negative integers`);
  }
  const dataStart = PRELUDE + hlen;
  if (dataStart % 8 !== 0) throw new PlotWireError(`arrays start at byte ${dataStart}, not a multiple of 8`);
  const le = littleEndianHost();

  const read = (name: ArrayName, expected: number, required: boolean): FloatArray | null => {
    const e = header.arrays?.[name];
    if (!e) {
      if (required) throw new PlotWireError(`header.arrays has no "${name}"`);
      return null;
    }
    if (e.dtype !== 'f32' && e.dtype !== 'f64') throw new PlotWireError(`array "${name}" has dtype ${JSON.stringify(e.dtype)}, expected "f32" or "f64"`);
    if (e.length !== expected) throw new PlotWireError(`array "${name}" has ${e.length} values, expected ${expected}`);
    const width = BYTES[e.dtype];
    const at = dataStart + e.offset;
    if (!Number.isInteger(e.offset) || e.offset < 0 || e.offset % width !== 0 || at + e.length * width > size) {
      throw new PlotWireError(`array "${name}" (offset ${e.offset}, ${e.length} × ${width} bytes) lies outside the ${size}-byte body`);
    }
    if (le) return e.dtype === 'f32' ? new Float32Array(buf, base + at, e.length) : new Float64Array(buf, base + at, e.length);
    const out = e.dtype === 'f32' ? new Float32Array(e.length) : new Float64Array(e.length);
    for (let i = 0; i < e.length; i++) out[i] = e.dtype === 'f32' ? view.getFloat32(at + 4 * i, true) : view.getFloat64(at + 8 * i, true);
    return out;
  };
  const asF64 = (a: FloatArray | null): Float64Array | null => (a === null || a instanceof Float64Array ? a : Float64Array.from(a));

  const distance = asF64(read('distance', nq, true))!;
  const frequencies = read('frequencies', nq * nb, true)!;
  const qFolded = asF64(read('qFolded', 3 * nq, false));
  const q = asF64(read('q', 3 * nq, false));
  const labels: PlotLabel[] = (header.labels ?? []).map(([index, label]) => ({ index, label }));
  for (const l of labels) {
    if (!Number.isInteger(l.index) || l.index < 0 || l.index >= nq) throw new PlotWireError(`label ${JSON.stringify(l.label)} has index ${l.index}, outside 0..${nq - 1}`);
  }
  return {
    title: header.title ?? null,
    kind: header.kind,
    nq,
    nb,
    distance,
    frequencies,
    qFolded,
    q,
    coordinates: header.coordinates,
    labels,
    segments: header.segments ?? [],
    breaks: header.breaks ?? pathBreaks(header.segments ?? [], nq),
    declaredUnit: header.declaredUnit,
    acoustic: header.acoustic,
    polar: header.polar,
  };
}

function littleEndianHost(): boolean {
  return new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;
}
