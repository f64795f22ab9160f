/** zone-folding: q-points given outside the first Brillouin zone (one info finding with the count). */
import type { Dispersion } from '../dispersion/types';
import type { PathGeometry } from '../physics/path';
import type { Policy } from './policy';
import type { Finding } from './types';
import { finding, fmtQ, round, segmentOfPoint } from './common';

export function zoneFolding(d: Dispersion, g: PathGeometry, policy: Policy): Finding[] {
  if (!policy.zoneFolding.enabled || g.folded.length === 0) return [];
  const n = g.folded.length;
  const first = g.folded[0];
  const seg = segmentOfPoint(d)[first.index];
  const how =
    g.foldMode === 'componentwise'
      ? ' The file gives no lattice, so each fractional coordinate was folded into [−1/2, 1/2] on its own: exact only for ' +
        'orthogonal lattices. Add the lattice for an exact fold.'
      : '';
  return [
    finding('zone-folding', 'info', {
      segment: seg >= 0 ? seg : null,
      index: first.index,
      q: Array.from(first.folded, (x) => round(x)),
      value: null,
      limit: null,
      message:
        `${n} q-point${n > 1 ? 's lie' : ' lies'} outside the first Brillouin zone and ${n > 1 ? 'were' : 'was'} folded back ` +
        `(q → q − G, the shortest image); the first is q-point ${first.index}, ${fmtQ(first.q)} → ${fmtQ(first.folded)}. ` +
        `The checks use the folded points. If the path was meant to stay in the first zone, check the q-path and the lattice.${how}`,
    }),
  ];
}
