/**
 * The in-memory dispersion every parser produces and every check, model and page consumes.
 * Numbers live in typed arrays so a 3 M-value file costs 24 MB, not an object per point.
 */

export type Vec3 = [number, number, number];
/** Real-space primitive vectors a1, a2, a3 (rows), in Å. */
export type Lattice = [Vec3, Vec3, Vec3];

export type FrequencyUnit = 'THz' | 'cm-1' | 'meV';
export type Coordinates = 'fractional' | 'cartesian';
export type SourceFormat = 'columns' | 'yaml';

/**
 * A run of q-points drawn as one connected line. `start` and `end` are inclusive q-point
 * indices in file order. Consecutive segments either
 *  - share a point (`end === next.start`, split at an interior label),
 *  - repeat it (`end + 1 === next.start`, the same q written twice: a connected join), or
 *  - are broken (`connectedToNext === false`: the path jumps, nothing to compare).
 */
export interface Segment {
  start: number;
  end: number;
  /** Label at the start / end point, when known. */
  from?: string;
  to?: string;
  /** Whether the last point of this segment is joined to the first point of the next one. */
  connectedToNext: boolean;
}

export interface Dispersion {
  format: SourceFormat;
  /** 'path' for a band path, 'mesh' for a weighted q-point mesh (DOS, thermodynamics). */
  kind: 'path' | 'mesh';
  title?: string;
  /** Number of q-points. */
  nq: number;
  /** Number of branches (frequencies per q-point). */
  nb: number;
  /** THz, row-major `[iq * nb + k]`, sorted ascending at each q-point (branch k = k-th lowest). */
  frequencies: Float64Array;
  /** q as given in the file, 3 per point (`[iq * 3 + c]`), in `coordinates`; null when only distances are given. */
  q: Float64Array | null;
  coordinates: Coordinates;
  /** Path distance as given in the file, one per point; null when the file gives none. */
  distance: Float64Array | null;
  /** Mesh weights, one per point (kind === 'mesh'); null for paths. */
  weights: Float64Array | null;
  lattice: Lattice | null;
  /** Unit the file declared (values above are already converted to THz). */
  units: FrequencyUnit;
  /** q-point index -> label, e.g. 0 -> 'Γ'. */
  labels: Map<number, string>;
  /** Path segments in file order, covering every point; empty for a mesh (kind === 'mesh'). */
  segments: Segment[];
  atoms: number | null;
  polar: boolean;
  /** Number of acoustic branches: the file's value, else min(3, nb). */
  acoustic: number;
  /** Unknown header keys and the YAML `metadata` map, kept and shown, never an error. */
  metadata: Record<string, unknown>;
}
