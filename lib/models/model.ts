/**
 * What every model offers, and how a model becomes a `Dispersion` along a path or on a mesh.
 */
import type { Dispersion, Lattice, Segment, Vec3 } from '../dispersion/types';
import { foldToFirstZone } from '../physics/fold';
import { fracToCart, norm, reciprocal } from '../physics/lattice';

export interface ModelPath {
  /** Fractional coordinates of the named points. */
  points: Record<string, Vec3>;
  /** Connected runs of point names; consecutive runs are separated by a path break. */
  runs: string[][];
}

export interface PhononModel {
  /** Short name used by the command line, e.g. 'fcc'. */
  name: string;
  title: string;
  lattice: Lattice;
  /** Atoms in the primitive cell, or null for a reduced 1-D form without 3 branches per atom. */
  atoms: number | null;
  branches: number;
  acoustic: number;
  polar: boolean;
  path: ModelPath;
  /**
   * THz, ascending, at fractional q. `approach` (Cartesian unit vector) is the direction along
   * which q = 0 is approached; only polar models use it.
   */
  frequencies(qFrac: Vec3, approach?: Vec3 | null): Float64Array;
  /** Model parameters, written into the file's metadata. */
  parameters: Record<string, unknown>;
}

export interface PathOptions {
  /** q-points per segment, both ends included (default 41, at least 2). */
  points?: number;
}

/**
 * The model along its standard path. Every label ends one segment and starts the next with the
 * same q written twice (a connected join, `end + 1 === next.start`), so both file formats can
 * carry the result unchanged.
 */
export function pathDispersion(model: PhononModel, options: PathOptions = {}): Dispersion {
  const perSegment = options.points ?? 41;
  if (!Number.isInteger(perSegment) || perSegment < 2) {
    throw new Error(`points per segment must be an integer ≥ 2, got ${perSegment}`);
  }
  const legs: { from: string; to: string; broken: boolean }[] = [];
  model.path.runs.forEach((run, r) => {
    if (run.length < 2) throw new Error(`path run ${r} of model ${model.name} needs at least two points`);
    for (let i = 0; i + 1 < run.length; i++) {
      legs.push({ from: run[i], to: run[i + 1], broken: i + 2 === run.length && r + 1 < model.path.runs.length });
    }
  });
  const nq = legs.length * perSegment;
  const nb = model.branches;
  const b = reciprocal(model.lattice);
  const frequencies = new Float64Array(nq * nb);
  const q = new Float64Array(nq * 3);
  const distance = new Float64Array(nq);
  const labels = new Map<number, string>();
  const segments: Segment[] = [];
  let s = 0;
  let iq = 0;
  for (let l = 0; l < legs.length; l++) {
    const { from, to, broken } = legs[l];
    const q0 = model.path.points[from];
    const q1 = model.path.points[to];
    if (!q0 || !q1) throw new Error(`model ${model.name}: unknown path point ${q0 ? to : from}`);
    const c0 = fracToCart(q0, b);
    const c1 = fracToCart(q1, b);
    const delta: Vec3 = [c1[0] - c0[0], c1[1] - c0[1], c1[2] - c0[2]];
    const length = norm(delta);
    const direction: Vec3 | null = length > 0 ? [delta[0] / length, delta[1] / length, delta[2] / length] : null;
    const start = iq;
    for (let k = 0; k < perSegment; k++, iq++) {
      const t = k / (perSegment - 1);
      const qf: Vec3 = [q0[0] + t * (q1[0] - q0[0]), q0[1] + t * (q1[1] - q0[1]), q0[2] + t * (q1[2] - q0[2])];
      q.set(qf, iq * 3);
      distance[iq] = s + t * length;
      frequencies.set(model.frequencies(qf, direction), iq * nb);
    }
    s += length;
    labels.set(start, from);
    labels.set(iq - 1, to);
    segments.push({ start, end: iq - 1, from, to, connectedToNext: l + 1 < legs.length && !broken });
  }
  return {
    format: 'columns',
    kind: 'path',
    title: model.title,
    nq,
    nb,
    frequencies,
    q,
    coordinates: 'fractional',
    distance,
    weights: null,
    lattice: model.lattice,
    units: 'THz',
    labels,
    segments,
    atoms: model.atoms,
    polar: model.polar,
    acoustic: model.acoustic,
    metadata: { model: model.name, ...model.parameters },
  };
}

export interface MeshOptions {
  /** Points along b1, b2, b3 (a Γ-centred grid; default 8 × 8 × 8). */
  mesh?: [number, number, number];
  /** Offset of the grid in steps along each axis (default 0: Γ-centred; ½ gives a grid without Γ). */
  shift?: [number, number, number];
}

/**
 * The model on a uniform q-mesh (Γ-centred unless shifted) over the whole zone, every point with weight 1
 * (no symmetry reduction), for the DOS and thermodynamics, each point folded into the first zone.
 */
export function meshDispersion(model: PhononModel, options: MeshOptions = {}): Dispersion {
  const mesh = options.mesh ?? [8, 8, 8];
  for (const m of mesh) {
    if (!Number.isInteger(m) || m < 1) throw new Error(`mesh sizes must be positive integers, got ${mesh.join('×')}`);
  }
  const [n1, n2, n3] = mesh;
  const nq = n1 * n2 * n3;
  const nb = model.branches;
  const frequencies = new Float64Array(nq * nb);
  const q = new Float64Array(nq * 3);
  const weights = new Float64Array(nq).fill(1);
  const shift = options.shift ?? [0, 0, 0];
  const centre = (i: number, n: number, c: number) => {
    const f = (i + shift[c]) / n;
    return f > 0.5 ? f - 1 : f;
  };
  let iq = 0;
  for (let i = 0; i < n1; i++) for (let j = 0; j < n2; j++) for (let k = 0; k < n3; k++, iq++) {
    // Folded into the Wigner–Seitz cell, so a mesh file holds no point outside the first zone.
    const qf = foldToFirstZone([centre(i, n1, 0), centre(j, n2, 1), centre(k, n3, 2)], model.lattice);
    q.set(qf, iq * 3);
    frequencies.set(model.frequencies(qf, null), iq * nb);
  }
  return {
    format: 'columns',
    kind: 'mesh',
    title: `${model.title}, ${n1}×${n2}×${n3} mesh`,
    nq,
    nb,
    frequencies,
    q,
    coordinates: 'fractional',
    distance: null,
    weights,
    lattice: model.lattice,
    units: 'THz',
    labels: new Map(),
    segments: [{ start: 0, end: nq - 1, connectedToNext: false }],
    atoms: model.atoms,
    polar: model.polar,
    acoustic: model.acoustic,
    metadata: { model: model.name, mesh: [n1, n2, n3], ...model.parameters },
  };
}
