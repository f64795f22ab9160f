import type { Segment } from '../dispersion/types';

/**
 * Indices i where the line must NOT be drawn from point i to point i + 1: a segment that is
 * not connected to the next one, or q-points that no segment covers. Sorted ascending.
 * A shared point (`end === next.start`) can never be a break: there is nothing between.
 */
export function pathBreaks(segments: readonly Segment[], nq: number): number[] {
  const out = new Set<number>();
  for (let s = 0; s + 1 < segments.length; s++) {
    const a = segments[s];
    const b = segments[s + 1];
    if (b.start > a.end && (!a.connectedToNext || b.start > a.end + 1)) {
      // Every step from a.end up to b.start is a gap (points between belong to no segment).
      for (let i = a.end; i < b.start && i < nq - 1; i++) out.add(i);
    }
  }
  // Points before the first or after the last segment are not part of the path.
  if (segments.length > 0) {
    for (let i = 0; i < segments[0].start && i < nq - 1; i++) out.add(i);
    const last = segments[segments.length - 1].end;
    for (let i = Math.max(0, last); i < nq - 1; i++) out.add(i);
  }
  return [...out].sort((x, y) => x - y);
}

/**
 * Connected runs `[start, end]` (inclusive) of a path of `nq` points with the given breaks:
 * the pieces that are each drawn as one polyline.
 */
export function connectedRuns(breaks: readonly number[], nq: number): Array<[number, number]> {
  const runs: Array<[number, number]> = [];
  let start = 0;
  for (const b of breaks) {
    if (b < start || b >= nq - 1) continue;
    runs.push([start, b]);
    start = b + 1;
  }
  if (nq > 0) runs.push([start, nq - 1]);
  return runs;
}
