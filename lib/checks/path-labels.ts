/**
 * path-labels: a high-symmetry label at the wrong place. The lattice is recognised (sc, fcc,
 * bcc, hexagonal) and the Cartesian length of each labelled point's folded q is compared with
 * the length of the standard point of that name (Setyawan & Curtarolo 2010). Lengths do not
 * change under the lattice's symmetry, so any image of the point passes.
 */
import type { Dispersion } from '../dispersion/types';
import { latticeName, standardName, standardPoints, type StandardPoint } from '../physics/high-symmetry';
import { latticeType, type LatticeType } from '../physics/lattice-type';
import type { PathGeometry } from '../physics/path';
import type { Policy } from './policy';
import type { Finding } from './types';
import { finding, fmt, fmtQ, qAt, segmentOfPoint, segmentsOf } from './common';

export function pathLabels(d: Dispersion, g: PathGeometry, policy: Policy): Finding[] {
  const p = policy.pathLabels;
  if (!p.enabled || !d.lattice || !g.qCart || d.kind === 'mesh') return [];
  const t = latticeType(d.lattice, p.latticeTolerance);
  if (!t) return [];
  const table = standardPoints(t);
  const smallest = Math.min(...table.filter((s) => s.length > 0).map((s) => s.length));

  // Labels from the label map and from the segments' ends, one entry per (point, name).
  const labelled = new Map<string, { index: number; label: string; names: string[] }>();
  const add = (index: number, label: string | undefined) => {
    if (label == null || index < 0 || index >= d.nq) return;
    const names = label.split('|').map(standardName).filter(Boolean);
    const key = `${index}\u0000${names.join('|')}`;
    if (!labelled.has(key)) labelled.set(key, { index, label, names });
  };
  for (const [i, l] of d.labels) add(i, l);
  for (const s of segmentsOf(d)) {
    add(s.start, s.from);
    add(s.end, s.to);
  }

  const segOf = segmentOfPoint(d);
  const out: Finding[] = [];
  const entries = [...labelled.values()].sort((a, b) => a.index - b.index);
  for (const { index: i, label, names } of entries) {
    const known = names.map((n) => table.find((s) => s.name === n)).filter((s): s is StandardPoint => !!s);
    if (known.length === 0) continue;
    const len = Math.hypot(g.qCart[3 * i], g.qCart[3 * i + 1], g.qCart[3 * i + 2]);
    // A break label "X|K" names both sides: the point passes if it is either of them.
    const fits = (s: StandardPoint) =>
      s.length === 0 ? len <= p.tolerance * smallest : Math.abs(len - s.length) <= p.tolerance * s.length;
    if (known.some(fits)) continue;
    const want = known[0];
    const matches = table.filter(fits).map((s) => s.name);
    out.push(
      finding('path-labels', 'warn', {
        segment: segOf[i] >= 0 ? segOf[i] : null,
        index: i,
        q: qAt(d, g, i),
        limit: p.tolerance,
        message:
          `Label ${label} at q-point ${i}${qAt(d, g, i) ? ` (q = ${fmtQ(qAt(d, g, i))})` : ''} sits at |q| = ${lengthText(len, t)}` +
          `${matches.length ? `, which is where ${matches.join(' or ')} belong${matches.length > 1 ? '' : 's'}` : ''}; ` +
          `in this ${latticeName(t)} lattice ${want.name} belongs at |q| = ${lengthText(want.length, t)}` +
          `${want.length > 0 ? `, e.g. ${fmtQ(want.frac)} in the standard primitive cell` : ''}. ` +
          `Check the labels and the q-path (and that the lattice is the one the path was made for).`,
      }),
    );
  }
  return out;
}

function lengthText(len: number, t: LatticeType): string {
  const inv = `${fmt(len, 4)} 1/Å`;
  return t.kind === 'hex' ? inv : `${fmt(len / ((2 * Math.PI) / t.a), 4)} × 2π/a (${inv})`;
}
