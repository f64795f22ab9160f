/**
 * acoustic-gamma: at Γ the `acoustic` lowest frequencies must be zero (acoustic sum rule).
 * One finding per Γ point; a Γ written twice at a connected join is one point.
 */
import type { Dispersion } from '../dispersion/types';
import type { PathGeometry } from '../physics/path';
import type { Policy } from './policy';
import type { Finding } from './types';
import { finding, fmt, linkNext, pointName, qAt, segmentOfPoint } from './common';

export function acousticGamma(d: Dispersion, g: PathGeometry, policy: Policy): Finding[] {
  const p = policy.acousticGamma;
  if (!p.enabled || d.nb === 0) return [];
  const { nq, nb, frequencies: w } = d;
  const nA = Math.max(1, Math.min(d.acoustic, nb));
  const link = linkNext(d);
  const segOf = segmentOfPoint(d);
  const out: Finding[] = [];

  let i = 0;
  while (i < nq) {
    if (!g.gamma[i]) {
      i++;
      continue;
    }
    // A group of consecutive, connected Γ points is one Γ: report its worst copy.
    let worst = -1;
    let worstAt = i;
    let worstBranch = 0;
    let j = i;
    for (;;) {
      for (let k = 0; k < nA; k++) {
        const a = Math.abs(w[j * nb + k]);
        if (a > worst) {
          worst = a;
          worstAt = j;
          worstBranch = k;
        }
      }
      if (j + 1 < nq && link[j] && g.gamma[j + 1]) j++;
      else break;
    }
    i = j + 1;
    if (worst <= p.warn) continue;
    const severity = worst > p.fail ? 'fail' : 'warn';
    out.push(
      finding('acoustic-gamma', severity, {
        segment: segOf[worstAt] >= 0 ? segOf[worstAt] : null,
        index: worstAt,
        branch: worstBranch,
        q: qAt(d, g, worstAt),
        value: worst,
        limit: severity === 'fail' ? p.fail : p.warn,
        message:
          `At Γ (${pointName(d, g, worstAt)}) the ${nA} acoustic branch${nA > 1 ? 'es' : ''} should be zero, but branch ` +
          `${worstBranch} is ${fmt(w[worstAt * nb + worstBranch])} THz (allowed ${fmt(severity === 'fail' ? p.fail : p.warn)} THz` +
          `${severity === 'warn' ? ` for a pass, ${fmt(p.fail)} THz before it fails` : ''}). The acoustic sum rule is not satisfied: ` +
          `impose it on the force constants (not only on the frequencies at Γ) and recompute the dispersion.`,
      }),
    );
  }
  return out;
}
