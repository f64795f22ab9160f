/**
 * Defect injectors: pure functions that return a damaged copy of a spectrum, so tests and the
 * demo can show each screening check firing for a known reason. The input is never modified.
 * Every injector keeps the frequencies sorted ascending at each point.
 */
import type { Dispersion, Vec3 } from '../dispersion/types';
import { fracToCart, reciprocal } from '../physics/lattice';
import { pathGeometry } from '../physics/path';
import { segmentArcLength } from '../physics/velocity';

export function cloneDispersion(d: Dispersion): Dispersion {
  return {
    ...d,
    frequencies: d.frequencies.slice(),
    q: d.q ? d.q.slice() : null,
    distance: d.distance ? d.distance.slice() : null,
    weights: d.weights ? d.weights.slice() : null,
    lattice: d.lattice ? (d.lattice.map((r) => [...r]) as Dispersion['lattice']) : null,
    labels: new Map(d.labels),
    segments: d.segments.map((s) => ({ ...s })),
    metadata: structuredClone(d.metadata),
  };
}

function sortRow(f: Float64Array, nb: number, iq: number): void {
  f.subarray(iq * nb, iq * nb + nb).sort();
}

function checkIndex(d: Dispersion, index: number, what: string): void {
  if (!Number.isInteger(index) || index < 0 || index >= d.nq) {
    throw new Error(`${what}: q-point index ${index} is out of range 0…${d.nq - 1}`);
  }
}

/** Points written twice at connected joins move together, so a defect does not open a join. */
function twinOf(d: Dispersion, i: number): number | null {
  for (let s = 0; s + 1 < d.segments.length; s++) {
    const a = d.segments[s];
    const b = d.segments[s + 1];
    if (!a.connectedToNext || b.start !== a.end + 1) continue;
    if (i === a.end) return b.start;
    if (i === b.start) return a.end;
  }
  return null;
}

export interface SoftModeOptions {
  /** Centre of the pocket (q-point index); must not be a Γ point. */
  index: number;
  /** Branch rank pulled down (default 0, the lowest). */
  branch?: number;
  /** Depth at the centre, THz (the branch reaches −depthTHz there). */
  depthTHz: number;
  /** Half-width of the pocket in q-points (default 3). */
  widthPoints?: number;
}

/**
 * An imaginary pocket: a smooth cos² dip that takes branch `branch` to −depthTHz at `index`
 * and back to its own value `widthPoints + 1` points away, within the point's segment.
 */
export function injectSoftMode(d: Dispersion, options: SoftModeOptions): Dispersion {
  const { index, depthTHz } = options;
  const branch = options.branch ?? 0;
  const width = options.widthPoints ?? 3;
  checkIndex(d, index, 'injectSoftMode');
  if (!(depthTHz > 0)) throw new Error(`injectSoftMode: depthTHz must be positive, got ${depthTHz}`);
  if (!Number.isInteger(branch) || branch < 0 || branch >= d.nb) throw new Error(`injectSoftMode: branch ${branch} is out of range 0…${d.nb - 1}`);
  if (!Number.isInteger(width) || width < 0) throw new Error(`injectSoftMode: widthPoints must be a non-negative integer, got ${width}`);
  if (pathGeometry(d).gamma[index]) throw new Error(`injectSoftMode: point ${index} is Γ; put the pocket away from Γ`);
  const out = cloneDispersion(d);
  const seg = d.segments.find((s) => index >= s.start && index <= s.end) ?? { start: 0, end: d.nq - 1 };
  const f = out.frequencies;
  const nb = d.nb;
  const touched = new Set<number>();
  for (let i = Math.max(seg.start, index - width); i <= Math.min(seg.end, index + width); i++) {
    const w = Math.cos(((Math.PI / 2) * Math.abs(i - index)) / (width + 1)) ** 2;
    for (const j of [i, twinOf(d, i)]) {
      if (j === null || touched.has(j)) continue;
      touched.add(j);
      const v = d.frequencies[j * nb + branch];
      f[j * nb + branch] = v * (1 - w) - depthTHz * w;
      sortRow(f, nb, j);
    }
  }
  return out;
}

export interface SumRuleOptions {
  /** Lift of the acoustic branches at Γ, THz. */
  offsetTHz: number;
  /** Fraction of the segment length over which the lift fades (default 0.1). */
  fade?: number;
}

/**
 * The acoustic branches no longer reach zero at Γ: each is lifted by offsetTHz at every Γ point,
 * fading as a Gaussian over `fade` of the segment's length, like a residual that the acoustic
 * sum rule would remove.
 */
export function breakSumRule(d: Dispersion, options: SumRuleOptions): Dispersion {
  const { offsetTHz } = options;
  const fade = options.fade ?? 0.1;
  if (!Number.isFinite(offsetTHz) || offsetTHz === 0) throw new Error(`breakSumRule: offsetTHz must be a non-zero number, got ${offsetTHz}`);
  const geometry = pathGeometry(d);
  const arc = segmentArcLength(d, geometry);
  if (!arc) throw new Error('breakSumRule: the spectrum has no q or distances to measure how far a point is from Γ');
  const out = cloneDispersion(d);
  const nAc = Math.min(d.acoustic, d.nb);
  const lift = new Float64Array(d.nq);
  for (const seg of d.segments) {
    const length = arc.s[seg.end];
    for (const end of [seg.start, seg.end]) {
      if (!geometry.gamma[end]) continue;
      for (let i = seg.start; i <= seg.end; i++) {
        const x = length > 0 ? Math.abs(arc.s[i] - arc.s[end]) / (fade * length) : 0;
        lift[i] = Math.max(lift[i], Math.exp(-x * x));
      }
    }
  }
  for (let i = 0; i < d.nq; i++) {
    if (lift[i] === 0) continue;
    for (let k = 0; k < nAc; k++) out.frequencies[i * d.nb + k] += offsetTHz * lift[i];
    sortRow(out.frequencies, d.nb, i);
  }
  return out;
}

/** Every frequency of one segment shifted by deltaTHz: a jump at its joins. */
export function shiftSegment(d: Dispersion, options: { segment: number; deltaTHz: number }): Dispersion {
  const seg = d.segments[options.segment];
  if (!seg) throw new Error(`shiftSegment: segment ${options.segment} is out of range 0…${d.segments.length - 1}`);
  if (!Number.isFinite(options.deltaTHz)) throw new Error('shiftSegment: deltaTHz must be a finite number');
  const out = cloneDispersion(d);
  for (let i = seg.start * d.nb; i < (seg.end + 1) * d.nb; i++) out.frequencies[i] += options.deltaTHz;
  return out;
}

/**
 * q + G for the listed points (G in fractions of the reciprocal vectors, integers): the
 * frequencies stay (ω(q + G) = ω(q)) but the points now lie outside the first zone.
 */
export function pushBeyondZone(d: Dispersion, options: { indices: number[]; g: Vec3 }): Dispersion {
  if (!d.q) throw new Error('pushBeyondZone: the spectrum has no q coordinates');
  if (!options.g.every(Number.isInteger) || options.g.every((x) => x === 0)) {
    throw new Error(`pushBeyondZone: g must be a non-zero integer vector, got (${options.g.join(', ')})`);
  }
  const out = cloneDispersion(d);
  let shift: number[] = options.g;
  if (d.coordinates === 'cartesian') {
    if (!d.lattice) throw new Error('pushBeyondZone: Cartesian q needs a lattice to turn G into Å⁻¹');
    shift = fracToCart(options.g, reciprocal(d.lattice));
  }
  for (const i of options.indices) {
    checkIndex(d, i, 'pushBeyondZone');
    for (let c = 0; c < 3; c++) out.q![i * 3 + c] += shift[c];
  }
  return out;
}

/**
 * A small negative dip on the lowest branch next to every Γ end of every segment, within 5 % of
 * the segment's length: the kind of numerical noise a coarse calculation leaves near Γ.
 */
export function noisePocketNearGamma(d: Dispersion, options: { depthTHz: number; fraction?: number }): Dispersion {
  const { depthTHz } = options;
  const fraction = options.fraction ?? 0.05;
  if (!(depthTHz > 0)) throw new Error(`noisePocketNearGamma: depthTHz must be positive, got ${depthTHz}`);
  const geometry = pathGeometry(d);
  const arc = segmentArcLength(d, geometry);
  if (!arc) throw new Error('noisePocketNearGamma: the spectrum has no q or distances to measure how far a point is from Γ');
  const out = cloneDispersion(d);
  const nb = d.nb;
  for (const seg of d.segments) {
    const length = arc.s[seg.end];
    if (!(length > 0)) continue;
    for (const end of [seg.start, seg.end]) {
      if (!geometry.gamma[end]) continue;
      for (let i = seg.start; i <= seg.end; i++) {
        const x = Math.abs(arc.s[i] - arc.s[end]) / (fraction * length);
        if (x <= 0 || x >= 1) continue;
        const dip = -depthTHz * Math.sin(Math.PI * x);
        if (dip < out.frequencies[i * nb]) out.frequencies[i * nb] = dip;
        sortRow(out.frequencies, nb, i);
      }
    }
  }
  return out;
}

/** Every frequency multiplied by `factor` (a unit mis-declaration, e.g. THz read as cm-1). */
export function scaleFrequencies(d: Dispersion, factor: number): Dispersion {
  if (!Number.isFinite(factor) || factor === 0) throw new Error(`scaleFrequencies: factor must be a non-zero number, got ${factor}`);
  const out = cloneDispersion(d);
  for (let i = 0; i < out.frequencies.length; i++) out.frequencies[i] *= factor;
  if (factor < 0) for (let i = 0; i < d.nq; i++) sortRow(out.frequencies, d.nb, i);
  return out;
}

/** ω² written where ω belongs: ν → sign(ν)·ν² (THz² read as THz). */
export function squareFrequencies(d: Dispersion): Dispersion {
  const out = cloneDispersion(d);
  for (let i = 0; i < out.frequencies.length; i++) out.frequencies[i] *= Math.abs(out.frequencies[i]);
  return out;
}
