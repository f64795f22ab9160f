/**
 * continuity: (a) connected joins, (b) points that are the same point of the zone
 * (ω(q) = ω(q + G)), (c) jumps inside a segment. In a polar file a mismatch at Γ is LO–TO
 * splitting (the optical frequencies at Γ depend on the direction of approach) and only info.
 */
import type { Dispersion } from '../dispersion/types';
import type { PathGeometry } from '../physics/path';
import type { Policy } from './policy';
import type { Finding, Severity } from './types';
import { finding, fmt, maxAbs, pointName, qAt, rememberLargest, segmentOfPoint, segmentsOf } from './common';
import { medianInPlace } from './select';

const LOTO =
  'The file is marked polar and this is at Γ, where LO–TO splitting makes the optical frequencies depend on the direction of approach: expected, shown for information.';

export function continuity(d: Dispersion, g: PathGeometry, policy: Policy): Finding[] {
  const p = policy.continuity;
  if (!p.enabled || d.nq === 0 || d.nb === 0) return [];
  // Steps first: their pass reads every value and notes the largest |ω| that δ needs.
  const stepFindings: Finding[] = [];
  if (d.kind !== 'mesh') steps(d, g, p, stepFindings);
  const delta = Math.max(p.minDelta, p.relativeDelta * maxAbs(d.frequencies));
  const out: Finding[] = [];
  const joinPair = joins(d, g, p, delta, out);
  coincident(d, g, p, delta, joinPair, out);
  for (const f of stepFindings) out.push(f);
  return out;
}

/** Largest |ω_i,k − ω_j,k| over branches, and where. */
function rowDiff(w: Float64Array, nb: number, i: number, j: number): { diff: number; branch: number } {
  let diff = 0;
  let branch = 0;
  const a = i * nb;
  const b = j * nb;
  for (let k = 0; k < nb; k++) {
    const x = Math.abs(w[a + k] - w[b + k]);
    if (x > diff) {
      diff = x;
      branch = k;
    }
  }
  return { diff, branch };
}

const gammaSeverity = (d: Dispersion, g: PathGeometry, i: number, j: number): Severity =>
  d.polar && (g.gamma[i] || g.gamma[j]) ? 'info' : 'fail';

/** (a) Connected joins that repeat a point: both sides must agree within δ. Returns join[i] = 1 for the first point of each pair. */
function joins(
  d: Dispersion,
  g: PathGeometry,
  p: Policy['continuity'],
  delta: number,
  out: Finding[],
): Uint8Array {
  const pair = new Uint8Array(d.nq);
  if (d.kind === 'mesh') return pair;
  const segs = segmentsOf(d);
  for (let s = 0; s + 1 < segs.length; s++) {
    const a = segs[s];
    const b = segs[s + 1];
    if (!a.connectedToNext || b.start !== a.end + 1) continue;
    const i = a.end;
    const j = b.start;
    pair[i] = 1;
    const { diff, branch } = rowDiff(d.frequencies, d.nb, i, j);
    if (diff <= delta) continue;
    const severity = gammaSeverity(d, g, i, j);
    const la = a.to ?? d.labels.get(i) ?? `q-point ${i}`;
    const lb = b.from ?? d.labels.get(j) ?? `q-point ${j}`;
    out.push(
      finding('continuity', severity, {
        segment: s + 1,
        index: j,
        branch,
        q: qAt(d, g, j),
        value: diff,
        limit: delta,
        message:
          `The spectrum jumps at the join between ${la} (end of segment ${s}, q-point ${i}) and ${lb} (start of segment ${s + 1}, ` +
          `q-point ${j}): branch ${branch} differs by ${fmt(diff)} THz (allowed ${fmt(delta)} THz). ` +
          (severity === 'info'
            ? LOTO
            : 'Check that both segments come from the same calculation and the same units, and that the shared point is the same q.'),
      }),
    );
  }
  return pair;
}

/**
 * (b) Points whose q differ by a reciprocal-lattice vector: fractional coordinates reduced
 * modulo 1 and rounded to the tolerance, found through an open-addressing hash (O(n), no
 * per-point allocation). Each point is compared with the first point of its class.
 */
function coincident(
  d: Dispersion,
  g: PathGeometry,
  p: Policy['continuity'],
  delta: number,
  joinPair: Uint8Array,
  out: Finding[],
) {
  const fractional = g.qFrac ?? (d.q && d.coordinates === 'fractional' ? d.q : null);
  const src = fractional ?? d.q;
  if (!src) return;
  const modular = fractional !== null;
  const tol = p.coincidence;
  const period = Math.round(1 / tol);
  const key = (i: number, c: number) => {
    const r = Math.round(src[3 * i + c] / tol);
    return modular ? ((r % period) + period) % period : r;
  };
  let size = 1;
  while (size < 2 * d.nq) size <<= 1;
  const table = new Int32Array(size).fill(-1);
  const mask = size - 1;
  const segOf = segmentOfPoint(d);

  for (let i = 0; i < d.nq; i++) {
    const k0 = key(i, 0);
    const k1 = key(i, 1);
    const k2 = key(i, 2);
    let h = (Math.imul(k0 | 0, 73856093) ^ Math.imul(k1 | 0, 19349663) ^ Math.imul(k2 | 0, 83492791)) & mask;
    let rep = -1;
    while (table[h] !== -1) {
      const j = table[h];
      if (key(j, 0) === k0 && key(j, 1) === k1 && key(j, 2) === k2) {
        rep = j;
        break;
      }
      h = (h + 1) & mask;
    }
    if (rep === -1) {
      table[h] = i;
      continue;
    }
    // A connected join's repeated point was compared in (a).
    if (rep === i - 1 && joinPair[rep]) continue;
    const { diff, branch } = rowDiff(d.frequencies, d.nb, rep, i);
    if (diff <= delta) continue;
    const severity = gammaSeverity(d, g, rep, i);
    out.push(
      finding('continuity', severity, {
        segment: segOf[i] >= 0 ? segOf[i] : null,
        index: i,
        branch,
        q: qAt(d, g, i),
        value: diff,
        limit: delta,
        message:
          `${cap(pointName(d, g, i))} and ${pointName(d, g, rep)} are the same point of the zone ` +
          `(their q ${modular ? 'differ by a reciprocal-lattice vector' : 'coincide'}), so their frequencies must agree, ` +
          `but branch ${branch} differs by ${fmt(diff)} THz (allowed ${fmt(delta)} THz). ` +
          (severity === 'info'
            ? LOTO
            : 'Check the q-path and the lattice, and that both parts of the path come from the same calculation and units.'),
      }),
    );
  }
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Why a step limit is what it is. On a nearly flat branch the median-step term is tiny and the
 * floor decides; saying "the larger of 0.5 and 8 × 0 THz" there reads as a riddle.
 */
function limitReason(p: Policy['continuity'], median: number): string {
  if (p.medianFactor * median <= p.minStep) {
    const shape = median === 0 ? 'flat' : 'nearly flat';
    return `the floor; the branch is ${shape} here, median step ${fmtSmall(median)} THz`;
  }
  return `${fmt(p.medianFactor)} × the branch's median step of ${fmt(median)} THz, above the ${fmt(p.minStep)} THz floor`;
}

/** Small steps in plain decimals (0.0003, not 3.00e-4): one significant digit says enough. */
const fmtSmall = (x: number) => (x !== 0 && Math.abs(x) < 1e-3 ? String(Number(x.toPrecision(1))) : fmt(x));

/**
 * (c) Steps between neighbouring points of a segment above both minStep and
 * medianFactor × that branch's median step in that segment. One finding per step position,
 * at the branch that exceeds its limit the most.
 *
 * A step must exceed minStep to count, so a first row-wise pass (contiguous memory) finds the
 * branches with any such step; only those need their median, gathered into one scratch buffer.
 * A clean, densely sampled file costs one pass over the frequencies.
 */
function steps(d: Dispersion, g: PathGeometry, p: Policy['continuity'], out: Finding[]) {
  const { nb, frequencies: w } = d;
  const segs = segmentsOf(d);
  let longest = 0;
  for (const s of segs) longest = Math.max(longest, s.end - s.start);
  if (longest < 2) return;
  const scratch = new Float64Array(longest);
  const candidate = new Uint8Array(nb);
  const rowHas = new Uint8Array(longest);
  const limit = new Float64Array(nb);
  const median = new Float64Array(nb);
  // Largest |ω| over the rows this pass reads (every row but each segment's last, added below).
  let big = 0;
  let bigAt = 0;
  let covered = segs.length > 0 && segs[0].start === 0 && segs[segs.length - 1].end === d.nq - 1;
  segs.forEach((s, si) => {
    if (si > 0 && s.start > segs[si - 1].end + 1) covered = false;
    const m = s.end - s.start;
    // The first index wins ties, as in largest(), so the result does not depend on who scanned.
    const note = (from: number, to: number) => {
      for (let a = from; a < to; a++) {
        const av = Math.abs(w[a]);
        if (av >= big && (av > big || a < bigAt)) {
          big = av;
          bigAt = a;
        }
      }
    };
    note(s.end * nb, (s.end + 1) * nb);
    if (m < 2) {
      note(s.start * nb, s.end * nb);
      return;
    }
    candidate.fill(0);
    rowHas.fill(0);
    let any = false;
    const minStep = p.minStep;
    for (let t = 0; t < m; t++) {
      const a = (s.start + t) * nb;
      for (let k = 0; k < nb; k++) {
        const v = w[a + k];
        const av = v < 0 ? -v : v;
        if (av >= big && (av > big || a + k < bigAt)) {
          big = av;
          bigAt = a + k;
        }
        if (Math.abs(w[a + nb + k] - v) > minStep) {
          candidate[k] = 1;
          rowHas[t] = 1;
          any = true;
        }
      }
    }
    if (!any) return;
    for (let k = 0; k < nb; k++) {
      if (!candidate[k]) continue;
      for (let t = 0; t < m; t++) {
        const a = (s.start + t) * nb + k;
        scratch[t] = Math.abs(w[a + nb] - w[a]);
      }
      median[k] = medianInPlace(scratch, 0, m);
      limit[k] = Math.max(p.minStep, p.medianFactor * median[k]);
    }

    for (let t = 0; t < m; t++) {
      if (!rowHas[t]) continue;
      const i = s.start + t;
      const a = i * nb;
      let count = 0;
      let worst = 0;
      let worstK = 0;
      let worstStep = 0;
      for (let k = 0; k < nb; k++) {
        if (!candidate[k]) continue;
        const step = Math.abs(w[a + nb + k] - w[a + k]);
        if (step > limit[k]) {
          count++;
          const r = step / limit[k];
          if (r > worst) {
            worst = r;
            worstK = k;
            worstStep = step;
          }
        }
      }
      if (count === 0) continue;
      const severity = gammaSeverity(d, g, i, i + 1);
      const seg = s.from && s.to ? ` (${s.from}–${s.to})` : '';
      out.push(
        finding('continuity', severity, {
          segment: si,
          index: i + 1,
          branch: worstK,
          q: qAt(d, g, i + 1),
          value: worstStep,
          limit: limit[worstK],
          message:
            `Inside segment ${si}${seg} the spectrum jumps between q-points ${i} and ${i + 1}: branch ${worstK} changes by ` +
            `${fmt(worstStep)} THz, above ${fmt(limit[worstK])} THz (${limitReason(p, median[worstK])})` +
            `${count > 1 ? `; ${count} branches jump there` : ''}. ` +
            (severity === 'info'
              ? LOTO
              : 'Look for a missing or repeated stretch of the path, parts from different calculations or units, or too coarse a q-sampling.'),
        }),
      );
    }
  });
  if (covered) rememberLargest(w, big, bigAt);
}
