/** branch-count: with `atoms` known, a cell of N atoms has 3N branches. */
import type { Dispersion } from '../dispersion/types';
import type { PathGeometry } from '../physics/path';
import type { Policy } from './policy';
import type { Finding } from './types';
import { finding } from './common';

export function branchCount(d: Dispersion, _g: PathGeometry, policy: Policy): Finding[] {
  if (!policy.branchCount.enabled || d.atoms == null) return [];
  const expected = 3 * d.atoms;
  if (d.nb === expected) return [];
  return [
    finding('branch-count', 'fail', {
      // value and limit are THz in every finding; the counts are in the message.
      message:
        `The file has ${d.nb} branches, but a cell of ${d.atoms} atom${d.atoms === 1 ? '' : 's'} has 3 × ${d.atoms} = ${expected}. ` +
        `Check the number of atoms given, and that every branch was written (none dropped or duplicated).`,
    }),
  ];
}
