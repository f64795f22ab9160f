/**
 * Revision compare: per branch, the largest deviation between two revisions over the q-points
 * present in both. Same sampling: point by point. Paths sampled differently: each point of A
 * against B interpolated at the same place along the path (lib/review/sampling). Meshes: the
 * q-points both contain.
 */
import { commonRanges, frequencyAt, matchByQ, positionOf, sameSampling, type Sampled } from './sampling';

export interface BranchDeviation {
  branch: number;
  /** max |ω_B − ω_A| over the compared points (THz). */
  maxDeviation: number;
  /** ω_B − ω_A where the maximum is (THz): the sign says which way it moved. */
  signed: number;
  /** Where, on revision A: q-point index and path distance. */
  at: { index: number; distance: number };
}

export interface Comparison {
  sampling: 'same' | 'interpolated' | 'matched-q';
  /** Points of A that were compared. */
  compared: number;
  branches: BranchDeviation[];
  /** Branches one revision has beyond the other's count (not compared). */
  branchesOnlyInA: number;
  branchesOnlyInB: number;
}

export function compareRevisions(a: Sampled, b: Sampled): Comparison {
  const nb = Math.min(a.nb, b.nb);
  const best = Array.from({ length: nb }, (_, branch) => ({ branch, maxDeviation: 0, signed: 0, at: { index: -1, distance: 0 } }));
  let compared = 0;
  const take = (i: number, k: number, wb: number) => {
    const diff = wb - a.frequencies[i * a.nb + k];
    if (best[k]!.at.index < 0 || Math.abs(diff) > best[k]!.maxDeviation) {
      best[k] = { branch: k, maxDeviation: Math.abs(diff), signed: diff, at: { index: i, distance: a.distance[i] } };
    }
  };

  let sampling: Comparison['sampling'];
  if (sameSampling(a, b)) {
    sampling = 'same';
    for (let i = 0; i < a.nq; i++) {
      for (let k = 0; k < nb; k++) take(i, k, b.frequencies[i * b.nb + k]);
      compared++;
    }
  } else if (a.kind === 'mesh' || b.kind === 'mesh') {
    sampling = 'matched-q';
    for (const [i, j] of matchByQ(a, b) ?? new Map<number, number>()) {
      for (let k = 0; k < nb; k++) take(i, k, b.frequencies[j * b.nb + k]);
      compared++;
    }
  } else {
    sampling = 'interpolated';
    const [ra, rb] = commonRanges(a, b);
    for (let i = 0; i < a.nq; i++) {
      const pos = positionOf(a, ra, i);
      if (!pos) continue;
      for (let k = 0; k < nb; k++) {
        const wb = frequencyAt(b, rb, pos, k);
        if (wb !== null) take(i, k, wb);
      }
      compared++;
    }
  }
  return {
    sampling,
    compared,
    branches: compared ? best : [],
    branchesOnlyInA: Math.max(0, a.nb - b.nb),
    branchesOnlyInB: Math.max(0, b.nb - a.nb),
  };
}
