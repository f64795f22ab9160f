/** The steps both parsers share once the numbers are read: units, sorting, overrides, segments. */
import type { Coordinates, Dispersion, FrequencyUnit, Lattice, Segment, SourceFormat } from '../dispersion/types';
import { toTHzFactor } from '../physics/units';
import type { ParseOverrides } from './options';

export interface RawDispersion {
  format: SourceFormat;
  kind: 'path' | 'mesh';
  title?: string;
  nq: number;
  nb: number;
  /** In `units`, row-major, any branch order; converted and sorted in place by `finish`. */
  frequencies: Float64Array;
  q: Float64Array | null;
  coordinates: Coordinates;
  distance: Float64Array | null;
  weights: Float64Array | null;
  lattice: Lattice | null;
  units: FrequencyUnit;
  labels: Map<number, string>;
  segments: Segment[];
  atoms: number | null;
  polar: boolean;
  acoustic: number | null;
  metadata: Record<string, unknown>;
}

export function finish(raw: RawDispersion, overrides: ParseOverrides | undefined): Dispersion {
  const units = overrides?.units ?? raw.units;
  const f = raw.frequencies;
  if (units !== 'THz') {
    const factor = toTHzFactor(units);
    for (let i = 0; i < f.length; i++) f[i] *= factor;
  }
  sortRows(f, raw.nq, raw.nb);
  const d: Dispersion = {
    format: raw.format,
    kind: raw.kind,
    nq: raw.nq,
    nb: raw.nb,
    frequencies: f,
    q: raw.q,
    coordinates: raw.coordinates,
    distance: raw.distance,
    weights: raw.weights,
    lattice: overrides?.lattice ?? raw.lattice,
    units,
    labels: raw.labels,
    segments: raw.segments,
    atoms: overrides?.atoms ?? raw.atoms,
    polar: overrides?.polar ?? raw.polar,
    acoustic: raw.acoustic ?? Math.min(3, raw.nb),
    metadata: raw.metadata,
  };
  if (raw.title !== undefined) d.title = raw.title;
  return d;
}

/** Ascending at each q-point; most files are already sorted, so check before sorting. */
function sortRows(f: Float64Array, nq: number, nb: number): void {
  for (let i = 0; i < nq; i++) {
    const o = i * nb;
    for (let k = o + 1; k < o + nb; k++) {
      if (f[k] < f[k - 1]) {
        f.subarray(o, o + nb).sort();
        break;
      }
    }
  }
}

/** How point i relates to point i − 1. */
export const CONTINUE = 0;
export const JOIN = 1; // the same q-point written twice: connected
export const BREAK = 2; // the path jumps

/**
 * Segments from the relation of each point to the previous one, split also at interior
 * labelled points (shared point, end === next.start). A label on either copy of a repeated
 * point applies to both copies.
 */
export function buildSegments(nq: number, relation: Uint8Array, labels: Map<number, string>): Segment[] {
  for (let i = 1; i < nq; i++) {
    if (relation[i] !== JOIN) continue;
    const before = labels.get(i - 1);
    const after = labels.get(i);
    if (before !== undefined && after === undefined) labels.set(i, before);
    else if (after !== undefined && before === undefined) labels.set(i - 1, after);
  }
  const segs: Segment[] = [];
  let start = 0;
  for (let i = 1; i < nq; i++) {
    const r = relation[i];
    if (r === JOIN || r === BREAK) {
      segs.push({ start, end: i - 1, connectedToNext: r === JOIN });
      start = i;
    } else if (i - 1 > start && labels.has(i - 1)) {
      segs.push({ start, end: i - 1, connectedToNext: true });
      start = i - 1;
    }
  }
  if (nq > 0) segs.push({ start, end: nq - 1, connectedToNext: false });
  for (const s of segs) {
    const from = labels.get(s.start);
    const to = labels.get(s.end);
    if (from !== undefined) s.from = from;
    if (to !== undefined) s.to = to;
  }
  return segs;
}
