/** Small hand-made dispersions for the review tests (numbers chosen to be checked by hand). */
import type { Dispersion } from '../dispersion/types';

export function curve(opts: {
  distance: number[];
  /** One row per q-point, ascending. */
  rows: number[][];
  segments?: { start: number; end: number }[];
  q?: number[][];
  kind?: 'path' | 'mesh';
}): Dispersion {
  const nq = opts.rows.length;
  const nb = opts.rows[0]!.length;
  const kind = opts.kind ?? 'path';
  return {
    format: 'columns',
    kind,
    nq,
    nb,
    frequencies: Float64Array.from(opts.rows.flat()),
    q: opts.q ? Float64Array.from(opts.q.flat()) : null,
    coordinates: 'fractional',
    distance: kind === 'path' ? Float64Array.from(opts.distance) : null,
    weights: kind === 'mesh' ? new Float64Array(nq).fill(1 / nq) : null,
    lattice: null,
    units: 'THz',
    labels: new Map(),
    segments: kind === 'mesh' ? [] : (opts.segments ?? [{ start: 0, end: nq - 1 }]).map((s, i, all) => ({ ...s, connectedToNext: i < all.length - 1 })),
    atoms: null,
    polar: false,
    acoustic: Math.min(3, nb),
    metadata: {},
  };
}

/** Revision A of the compare case: 3 points at distances 0, 1, 2; two branches. */
export const revisionA = () => curve({ distance: [0, 1, 2], rows: [[0, 1], [1, 2], [2, 3]] });

/** Revision B: the same path in 4 unevenly spaced points (distances 0, 0.6, 1.2, 2.0). */
export const revisionB = () =>
  curve({ distance: [0, 0.6, 1.2, 2.0], rows: [[0.05, 1], [0.5, 1.3], [1.4, 2.3], [2.02, 2.7]] });
