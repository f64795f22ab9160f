/**
 * Synthetic band structures from a smooth analytic model, for the plot's development page and
 * its benchmark only (invented data: no material, no calculation behind it).
 */
import type { Dispersion, Segment } from '../dispersion/types';
import type { PlotGeometry } from './wire';

interface Corner {
  label: string;
  q: [number, number, number];
  /** 0 at Γ, ~1 at the zone boundary: drives the model's shape. */
  r: number;
}

const C: Record<string, Corner> = {
  G: { label: 'Γ', q: [0, 0, 0], r: 0 },
  X: { label: 'X', q: [0.5, 0, 0.5], r: 1 },
  W: { label: 'W', q: [0.5, 0.25, 0.75], r: 1.12 },
  K: { label: 'K', q: [0.375, 0.375, 0.75], r: 0.96 },
  L: { label: 'L', q: [0.5, 0.5, 0.5], r: 0.86 },
  U: { label: 'U', q: [0.625, 0.25, 0.625], r: 0.98 },
};

/** Legs of the path with their relative lengths; `null` is a jump (path break). */
const LEGS: Array<[string, string, number] | null> = [
  ['G', 'X', 1.0],
  ['X', 'W', 0.5],
  ['W', 'K', 0.354],
  ['K', 'G', 1.061],
  ['G', 'L', 0.866],
  ['L', 'U', 0.612],
  ['U', 'W', 0.354],
  ['W', 'L', 0.707],
  ['L', 'K', 0.612],
  null,
  ['U', 'X', 0.354],
];

export interface SyntheticOptions {
  branches: number;
  points: number;
  /** Let the lowest branch dip below zero in the W–L leg (an imaginary-mode look-alike). */
  softMode?: boolean;
  /** Highest frequency of the model, THz. */
  top?: number;
}

const hash = (n: number) => {
  const s = Math.sin(n * 12.9898 + 78.233) * 43758.5453;
  return s - Math.floor(s);
};

export function syntheticBands(opts: SyntheticOptions): { dispersion: Dispersion; geometry: PlotGeometry & { qFolded: Float64Array } } {
  const nb = Math.max(1, Math.floor(opts.branches));
  const legs = LEGS.filter((l): l is [string, string, number] => l !== null);
  const total = legs.reduce((s, l) => s + l[2], 0);
  const nq = Math.max(legs.length * 2, Math.floor(opts.points));
  const top = opts.top ?? 48;

  // Points per leg, proportional to length. Each leg has its own points: where two legs meet the
  // corner is written twice (a connected join), as band files often do.
  const counts = legs.map((l) => Math.max(2, Math.round((l[2] / total) * nq)));
  let diff = nq - counts.reduce((s, c) => s + c, 0);
  for (let i = 0; diff !== 0; i = (i + 1) % counts.length) {
    if (diff > 0) {
      counts[i]++;
      diff--;
    } else if (counts[i] > 2) {
      counts[i]--;
      diff++;
    }
  }

  const distance = new Float64Array(nq);
  const q = new Float64Array(3 * nq);
  const r = new Float64Array(nq);
  const soft = new Float64Array(nq);
  const segments: Segment[] = [];
  const labels = new Map<number, string>();
  let iq = 0;
  let x = 0;
  let legIndex = 0;
  for (let li = 0; li < LEGS.length; li++) {
    const leg = LEGS[li];
    if (leg === null) continue;
    const [a, b, len] = leg;
    const n = counts[legIndex++];
    const start = iq;
    for (let j = 0; j < n; j++) {
      const t = j / (n - 1);
      distance[iq] = x + t * len;
      for (let c = 0; c < 3; c++) q[3 * iq + c] = C[a].q[c] + t * (C[b].q[c] - C[a].q[c]);
      r[iq] = C[a].r + t * (C[b].r - C[a].r);
      if (opts.softMode && a === 'W' && b === 'L') soft[iq] = Math.exp(-(((t - 0.5) / 0.08) ** 2));
      iq++;
    }
    x += len;
    const connected = li + 1 < LEGS.length && LEGS[li + 1] !== null;
    segments.push({ start, end: iq - 1, from: C[a].label, to: C[b].label, connectedToNext: connected });
    labels.set(start, C[a].label);
    labels.set(iq - 1, C[b].label);
  }

  const frequencies = new Float64Array(nq * nb);
  const row = new Float64Array(nb);
  const nAc = Math.min(3, nb);
  const acAmp = [0.085, 0.1, 0.16].map((f) => f * top);
  const nOpt = nb - nAc;
  const params = new Float64Array(4 * Math.max(0, nOpt));
  for (let k = 0; k < nOpt; k++) {
    params[4 * k] = top * (0.22 + 0.72 * (nOpt > 1 ? k / (nOpt - 1) : 0.5)); // centre
    params[4 * k + 1] = top * (0.01 + 0.05 * hash(k + 1)); // amplitude
    params[4 * k + 2] = 2 * Math.PI * hash(k + 101); // phase
    params[4 * k + 3] = 1 + Math.floor(3 * hash(k + 211)); // harmonic
  }
  for (let i = 0; i < nq; i++) {
    const ri = r[i];
    for (let k = 0; k < nAc; k++) row[k] = acAmp[k] * Math.sin((Math.PI / 2) * Math.min(1, ri)) - (k === 0 ? 0.09 * top * soft[i] : 0);
    for (let k = 0; k < nOpt; k++) {
      const c = params[4 * k];
      const a = params[4 * k + 1];
      row[nAc + k] = c + a * Math.cos(Math.PI * ri * params[4 * k + 3] + params[4 * k + 2]) - 0.5 * a * ri;
    }
    row.sort();
    frequencies.set(row, i * nb);
  }

  const dispersion: Dispersion = {
    format: 'columns',
    kind: 'path',
    title: `Invented crystal, synthetic bands (${nb} × ${nq})`,
    nq,
    nb,
    frequencies,
    q,
    coordinates: 'fractional',
    distance,
    weights: null,
    lattice: null,
    units: 'THz',
    labels,
    segments,
    atoms: null,
    polar: false,
    acoustic: nAc,
    metadata: { synthetic: true },
  };
  return { dispersion, geometry: { distance, qFolded: q } };
}
