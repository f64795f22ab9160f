/**
 * Has the spectrum moved at a thread's anchor since the revision the thread was opened on? The
 * frequency at the anchor's q-point and branch on that revision is compared with the current
 * revision's frequency at the same place on the path (interpolated when the samplings differ),
 * against the continuity tolerance δ = max(minDelta, relativeDelta × largest |ω|) of
 * screening.md, taking the larger |ω| of the two revisions.
 */
import { commonRanges, frequencyAt, matchByQ, maxAbs, positionOf, sameSampling, type Sampled } from './sampling';

export interface Tolerance {
  minDelta: number;
  relativeDelta: number;
}

/** screening.md's defaults (lib/checks defaultPolicy.continuity). */
export const defaultTolerance: Tolerance = { minDelta: 0.05, relativeDelta: 0.01 };

export interface AnchorMove {
  /** null when the current revision has no such place (branch or q-point missing). */
  moved: boolean | null;
  /** ω at the anchor on the thread's revision and on the current one (THz). */
  then: number;
  now: number | null;
  /** now − then (THz). */
  delta: number | null;
  tolerance: number;
}

export function toleranceFor(a: Sampled, b: Sampled, t: Tolerance = defaultTolerance): number {
  return Math.max(t.minDelta, t.relativeDelta * Math.max(maxAbs(a), maxAbs(b)));
}

export function anchorMoved(
  then: Sampled,
  current: Sampled,
  anchor: { index: number; branch: number },
  t: Tolerance = defaultTolerance,
): AnchorMove {
  const tolerance = toleranceFor(then, current, t);
  if (anchor.index < 0 || anchor.index >= then.nq || anchor.branch < 0 || anchor.branch >= then.nb) {
    return { moved: null, then: NaN, now: null, delta: null, tolerance };
  }
  const w0 = then.frequencies[anchor.index * then.nb + anchor.branch];
  let now: number | null = null;
  if (anchor.branch < current.nb) {
    if (sameSampling(then, current)) {
      now = current.frequencies[anchor.index * current.nb + anchor.branch];
    } else if (then.kind === 'mesh' || current.kind === 'mesh') {
      const j = matchByQ(then, current)?.get(anchor.index);
      now = j === undefined ? null : current.frequencies[j * current.nb + anchor.branch];
    } else {
      const [ra, rb] = commonRanges(then, current);
      const pos = positionOf(then, ra, anchor.index);
      now = pos ? frequencyAt(current, rb, pos, anchor.branch) : null;
    }
  }
  if (now === null) return { moved: null, then: w0, now: null, delta: null, tolerance };
  const delta = now - w0;
  return { moved: Math.abs(delta) > tolerance, then: w0, now, delta, tolerance };
}
