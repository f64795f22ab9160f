/**
 * imaginary-modes: runs of consecutive points on one branch with ω below −threshold.
 * One finding per run, at its most negative point. A shallow run wholly near Γ is likely
 * numerical noise (warn); anything else is an instability or a badly converged calculation (fail).
 * On a mesh every point is its own run, and "near Γ" is measured towards the zone boundary.
 */
import type { Dispersion } from '../dispersion/types';
import { brillouinZone, cubeZoneFraction, zoneFraction } from '../physics/fold';
import type { PathGeometry } from '../physics/path';
import type { Policy } from './policy';
import type { Finding } from './types';
import { finding, fmt, fmtQ, linkNext, pointName, qAt, segmentLength, segmentOfPoint, segmentsOf } from './common';

interface Path {
  link: Uint8Array;
  segOf: Int32Array;
}

const REVIEWER = 'A soft mode can be real physics (a structural instability); a reviewer decides.';

// A point exactly at the fraction counts as near, as on a path; this absorbs round-off.
const NEAR_TOLERANCE = 1e-9;

/**
 * near[i] = 1 when point i lies within `fraction` of its segment's length from a Γ end of that
 * segment; on a mesh, when its folded q lies within `fraction` of the way from Γ to the zone
 * boundary in q's direction (nearMeshMask).
 */
export function nearGammaMask(d: Dispersion, g: PathGeometry, fraction: number): Uint8Array {
  if (d.kind === 'mesh') return nearMeshMask(d, g, fraction);
  const near = new Uint8Array(d.nq);
  for (const s of segmentsOf(d)) {
    const L = segmentLength(g, s);
    if (!(L > 0)) continue;
    const reach = fraction * L;
    if (g.gamma[s.start])
      for (let i = s.start; i <= s.end && Math.abs(g.distance[i] - g.distance[s.start]) <= reach; i++) near[i] = 1;
    if (g.gamma[s.end])
      for (let i = s.end; i >= s.start && Math.abs(g.distance[s.end] - g.distance[i]) <= reach; i--) near[i] = 1;
  }
  return near;
}

/**
 * The mesh form of "near Γ". A path segment from Γ usually ends on the zone boundary, so "within
 * 10 % of the segment" means a tenth of the way out; on a mesh that is q inside the first zone
 * shrunk about Γ by `fraction`, measured with the reciprocal-lattice metric (the lattice's
 * Wigner–Seitz cell), or without a lattice in fractional coordinates against the cube
 * [−½, ½]³ of the component-wise fold. Cartesian q without a lattice cannot be placed in the
 * zone: only Γ itself is near then.
 */
function nearMeshMask(d: Dispersion, g: PathGeometry, fraction: number): Uint8Array {
  const near = new Uint8Array(d.nq);
  const q = g.foldMode === 'none' ? null : g.qFolded;
  const z = q && d.lattice ? brillouinZone(d.lattice) : null;
  const limit = fraction + NEAR_TOLERANCE;
  for (let i = 0; i < d.nq; i++) {
    if (g.gamma[i]) near[i] = 1;
    else if (q) near[i] = (z ? zoneFraction(z, q, i * 3) : cubeZoneFraction(q, i * 3)) <= limit ? 1 : 0;
  }
  return near;
}

export function imaginaryModes(d: Dispersion, g: PathGeometry, policy: Policy): Finding[] {
  const p = policy.imaginaryModes;
  if (!p.enabled || d.nq === 0 || d.nb === 0) return [];
  const { nq, nb, frequencies: w } = d;
  const thr = -p.threshold;
  const link = linkNext(d);
  const near = nearGammaMask(d, g, p.nearGammaFraction);
  const segOf = segmentOfPoint(d);
  const out: Finding[] = [];

  // Frequencies are sorted ascending, so the imaginary branches at a point are a prefix 0..m-1.
  // Open runs are tracked per branch in typed arrays: no per-point allocation.
  const start = new Int32Array(nb);
  const minAt = new Int32Array(nb);
  const minVal = new Float64Array(nb);
  const allNear = new Uint8Array(nb);
  let open = 0; // branches 0..open-1 have an open run

  const close = (k: number, last: number) =>
    out.push(report(d, g, p, k, start[k], last, minAt[k], minVal[k], allNear[k] === 1, { link, segOf }));

  for (let i = 0; i < nq; i++) {
    const row = i * nb;
    let m = 0;
    while (m < nb && w[row + m] < thr) m++;
    const continues = i > 0 && link[i - 1] === 1;
    if (!continues) {
      for (let k = 0; k < open; k++) close(k, i - 1);
      open = 0;
    } else {
      for (let k = m; k < open; k++) close(k, i - 1);
    }
    for (let k = 0; k < m; k++) {
      const v = w[row + k];
      if (k >= open) {
        start[k] = i;
        minAt[k] = i;
        minVal[k] = v;
        allNear[k] = near[i];
      } else {
        if (v < minVal[k]) {
          minVal[k] = v;
          minAt[k] = i;
        }
        if (!near[i]) allNear[k] = 0;
      }
    }
    open = m;
  }
  for (let k = 0; k < open; k++) close(k, nq - 1);
  return out;
}

function report(
  d: Dispersion,
  g: PathGeometry,
  p: Policy['imaginaryModes'],
  k: number,
  first: number,
  last: number,
  at: number,
  value: number,
  wholeNearGamma: boolean,
  path: Path,
): Finding {
  const segment = path.segOf[at] >= 0 ? path.segOf[at] : null;
  const span = first === last ? `at ${pointName(d, g, at)}` : `over q-points ${first}–${last}, deepest at ${pointName(d, g, at)}`;
  const base = { segment, index: at, branch: k, q: qAt(d, g, at), value, limit: -p.threshold };
  const pct = Math.round(p.nearGammaFraction * 100);
  const reach = d.kind === 'mesh' ? `within ${pct} % of the way from Γ to the zone boundary` : `within ${pct} % of the segment`;

  if (wholeNearGamma && value >= -p.nearGammaDepth) {
    return finding('imaginary-modes', 'warn', {
      ...base,
      message:
        `Branch ${k} is imaginary ${span}, down to ${fmt(value)} THz, only near Γ (${reach}) and no deeper than ` +
        `${fmt(p.nearGammaDepth)} THz: most likely numerical noise. Tighten convergence (supercell size, k-point mesh, cut-off) ` +
        `and impose the acoustic sum rule; the dip should shrink or vanish. ${REVIEWER}`,
    });
  }
  const where = wholeNearGamma
    ? `near Γ but deeper than ${fmt(p.nearGammaDepth)} THz`
    : 'away from Γ';
  return finding('imaginary-modes', 'fail', {
    ...base,
    message:
      `Branch ${k} is imaginary ${span}, down to ${fmt(value)} THz (${where}). ` +
      `${rangeAdvice(d, g, segment, path.link, k, first, last)}${REVIEWER}`,
  });
}

/**
 * Where the mode is imaginary, and the supercell length 2π/Δq that would sample a feature of
 * that q-extent if it were an artefact of a too-small supercell.
 */
function rangeAdvice(
  d: Dispersion,
  g: PathGeometry,
  segment: number | null,
  link: Uint8Array,
  k: number,
  first: number,
  last: number,
): string {
  const r = imaginaryRange(d, g, k, first, last, link);
  const qa = qBetween(d, g, r.lo);
  const qb = qBetween(d, g, r.hi);
  const range = qa && qb ? `It is imaginary from about q = ${fmtQ(qa)} to q = ${fmtQ(qb)}. ` : '';
  const dq = Math.abs(r.hi.x - r.lo.x);
  const seg = segment != null ? segmentsOf(d)[segment] : null;
  const dir = seg?.from && seg?.to ? ` along ${seg.from}–${seg.to}` : ' along that direction of the path';
  // Å only when the path distance is Cartesian (path-geometry rule): q with a lattice, or Cartesian q.
  const cartesian = d.q !== null && (d.lattice !== null || d.coordinates === 'cartesian');
  if (cartesian && dq > 0) {
    const L = (2 * Math.PI) / dq;
    return (
      `${range}It spans Δq ≈ ${fmt(dq)} 1/Å; if it is an artefact, a supercell about 2π/Δq ≈ ${fmt(L, 1)} Å long${dir} ` +
      `would be needed to sample it: increase the supercell and tighten convergence, then see whether the mode stays. `
    );
  }
  return `${range}If it is an artefact, increase the supercell and tighten convergence, then see whether the mode stays. `;
}

/** A place on the path: between point i and point j (= i or a neighbour), fraction t of the way, at distance x. */
interface PathPlace {
  i: number;
  j: number;
  t: number;
  x: number;
}

/**
 * Where branch k is below zero around the run: widened through neighbouring points that are
 * still negative, then to the zero crossings interpolated linearly between the last negative
 * and the first non-negative point.
 */
function imaginaryRange(
  d: Dispersion,
  g: PathGeometry,
  k: number,
  first: number,
  last: number,
  link: Uint8Array,
): { lo: PathPlace; hi: PathPlace } {
  const { nb, frequencies: w } = d;
  const x = g.distance;
  const cross = (i: number, j: number): PathPlace => {
    const a = w[i * nb + k];
    const b = w[j * nb + k];
    const t = a / (a - b);
    return { i, j, t, x: x[i] + (x[j] - x[i]) * t };
  };
  let i = first;
  while (i > 0 && link[i - 1] && w[(i - 1) * nb + k] < 0) i--;
  const lo = i > 0 && link[i - 1] ? cross(i - 1, i) : { i, j: i, t: 0, x: x[i] };
  let j = last;
  while (j < d.nq - 1 && link[j] && w[(j + 1) * nb + k] < 0) j++;
  const hi = j < d.nq - 1 && link[j] ? cross(j, j + 1) : { i: j, j, t: 0, x: x[j] };
  return { lo, hi };
}

/** q at a path place, interpolated in fractional coordinates as given (not folded: a fold would jump). */
function qBetween(d: Dispersion, g: PathGeometry, p: PathPlace): number[] | null {
  const src = g.qFrac ?? d.q;
  if (!src) return null;
  const out = [0, 1, 2].map((c) => src[3 * p.i + c] + p.t * (src[3 * p.j + c] - src[3 * p.i + c]));
  return out.map((v) => Math.round(v * 1e6) / 1e6 || 0);
}
