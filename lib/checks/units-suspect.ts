/**
 * units-suspect: values that look like the wrong unit or like ω².
 * (a) The largest |ω| outside the range any solid shows: name the usual factor and unit that
 *     would bring it back (physics-ref §1.4 factors; §7 plausible range).
 * (b) Acoustic branches leaving Γ grow linearly in a 3-D crystal; if every one grows as a
 *     power above squaredExponent, the file probably holds ω².
 */
import type { Dispersion, FrequencyUnit } from '../dispersion/types';
import type { PathGeometry } from '../physics/path';
import { unitFactor } from '../physics/units';
import type { Policy } from './policy';
import type { Finding } from './types';
import { finding, fmt, largest, qAt, segmentLength, segmentOfPoint, segmentsOf } from './common';

type Candidate = FrequencyUnit | 'rad/ps';

const TYPICAL_MAX_THZ = 15;

/** value in unit = THz × factor; angular frequency ω = 2πν, so rad/ps = 2π × THz. */
const factorOf = (u: Candidate) => (u === 'rad/ps' ? 2 * Math.PI : unitFactor(u));

const UNIT_NAME: Record<Candidate, string> = {
  THz: 'THz',
  'cm-1': 'cm-1',
  meV: 'meV',
  'rad/ps': 'angular frequency in rad/ps (2π × THz)',
};

/** Pairs related by one of the usual factors: 33.356 (THz–cm-1), 4.1357 (THz–meV), 8.0655 (meV–cm-1), 2π (THz–rad/ps). */
const RELATED: Record<FrequencyUnit, Candidate[]> = {
  THz: ['cm-1', 'meV', 'rad/ps'],
  'cm-1': ['THz', 'meV'],
  meV: ['THz', 'cm-1'],
};

export function unitsSuspect(d: Dispersion, g: PathGeometry, policy: Policy): Finding[] {
  const p = policy.unitsSuspect;
  if (!p.enabled || d.nq === 0 || d.nb === 0) return [];
  const out: Finding[] = [];
  const squared = squaredFinding(d, g, p);
  const range = rangeFinding(d, g, p, squared !== null);
  if (range) out.push(range);
  if (squared) out.push(squared);
  return out;
}

function rangeFinding(d: Dispersion, g: PathGeometry, p: Policy['unitsSuspect'], squared: boolean): Finding | null {
  const { max, at } = largest(d.frequencies);
  const high = max > p.maxTHz;
  if (!high && !(max < p.minTHz)) return null;
  const raw = max * factorOf(d.units); // the number as written in the file
  // Several factors can fit; the first named is the one whose result is nearest a typical largest
  // phonon frequency (common practice: most solids top out between about 5 and 40 THz).
  const centre = TYPICAL_MAX_THZ;
  const fits = RELATED[d.units]
    .map((u) => ({ u, thz: raw / factorOf(u), ratio: factorOf(u) / factorOf(d.units) }))
    .filter((c) => c.thz >= p.plausibleLow && c.thz <= p.plausibleHigh)
    .sort((a, b) => Math.abs(Math.log(a.thz / centre)) - Math.abs(Math.log(b.thz / centre)));
  const index = Math.floor(at / d.nb);
  const seg = segmentOfPoint(d)[index];
  const rootFits = squared && high && Math.sqrt(raw) >= p.plausibleLow && Math.sqrt(raw) <= p.plausibleHigh;
  const fix = fits.length
    ? fits
        .map(
          (c, n) =>
            `${n === 0 ? '' : 'or, less likely, '}${c.ratio > 1 ? 'dividing' : 'multiplying'} by ${factorName(d.units, c.u)} ` +
            `brings it to ${fmt(c.thz)} THz: the values look like ${UNIT_NAME[c.u]}`,
        )
        .join('; ')
    : `no usual factor (33.356, 4.1357, 8.0655, 2π) brings it into ${fmt(p.plausibleLow)}–${fmt(p.plausibleHigh)} THz`;
  return finding('units-suspect', 'warn', {
    segment: seg >= 0 ? seg : null,
    index,
    branch: at % d.nb,
    q: qAt(d, g, index),
    value: max,
    limit: high ? p.maxTHz : p.minTHz,
    message:
      `The largest |ω| is ${fmt(max)} THz (the file's ${fmt(raw)} read as ${d.units}), ` +
      `${high ? `above ${fmt(p.maxTHz)} THz, more than any solid shows` : `below ${fmt(p.minTHz)} THz, less than any solid shows`}. ` +
      `${cap(fix)}.${rootFits ? ` Its square root, ${fmt(Math.sqrt(raw))}, is also plausible: the values may be ω².` : ''} ` +
      `Check the units the file declares (header "units:" or the YAML "units") and upload it again with the right one.`,
  });
}

/** The usual factors as physics-ref §1.4 writes them. */
function factorName(a: Candidate, b: Candidate): string {
  const pair = [a, b].sort().join(' ');
  switch (pair) {
    case 'THz cm-1':
      return '33.356';
    case 'THz meV':
      return '4.1357';
    case 'cm-1 meV':
      return '8.0655';
    default:
      return '2π';
  }
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Exponent of ω ∝ r^p for each acoustic branch on each segment with a Γ end, by least squares
 * on log ω against log r over fitFrom–fitTo of the segment's length (r = distance from Γ).
 */
function squaredFinding(d: Dispersion, g: PathGeometry, p: Policy['unitsSuspect']): Finding | null {
  if (d.kind === 'mesh') return null;
  const { nb, frequencies: w } = d;
  const nA = Math.max(1, Math.min(d.acoustic, nb));
  let fitted = 0;
  let lo = Infinity;
  let hi = -Infinity;
  let firstSeg = -1;
  let firstGamma = -1;
  const segs = segmentsOf(d);
  for (let s = 0; s < segs.length; s++) {
    const seg = segs[s];
    const L = segmentLength(g, seg);
    if (!(L > 0)) continue;
    for (const end of [seg.start, seg.end]) {
      if (!g.gamma[end] || (end === seg.end && seg.end === seg.start)) continue;
      const x0 = g.distance[end];
      for (let k = 0; k < nA; k++) {
        let n = 0;
        let sx = 0;
        let sy = 0;
        let sxx = 0;
        let sxy = 0;
        for (let i = seg.start; i <= seg.end; i++) {
          const r = Math.abs(g.distance[i] - x0);
          if (r < p.fitFrom * L || r > p.fitTo * L) continue;
          const v = w[i * nb + k];
          if (!(v > 0)) continue;
          const x = Math.log(r);
          const y = Math.log(v);
          n++;
          sx += x;
          sy += y;
          sxx += x * x;
          sxy += x * y;
        }
        if (n < p.minFitPoints) continue;
        const den = n * sxx - sx * sx;
        if (!(den > 0)) continue;
        const slope = (n * sxy - sx * sy) / den;
        fitted++;
        lo = Math.min(lo, slope);
        hi = Math.max(hi, slope);
        if (firstSeg < 0) {
          firstSeg = s;
          firstGamma = end;
        }
      }
    }
  }
  if (fitted === 0 || !(lo > p.squaredExponent)) return null;
  return finding('units-suspect', 'warn', {
    segment: firstSeg,
    index: firstGamma,
    q: qAt(d, g, firstGamma),
    limit: p.squaredExponent,
    message:
      `Leaving Γ, every acoustic branch grows as distance^p with p between ${fmt(lo, 2)} and ${fmt(hi, 2)} ` +
      `(${fitted} fit${fitted > 1 ? 's' : ''} over ${Math.round(p.fitFrom * 100)}–${Math.round(p.fitTo * 100)} % of each segment), where frequencies grow ` +
      `linearly (p ≈ 1). The values look like ω² (eigenvalues) rather than frequencies: check what the file holds and take ` +
      `the square root (keeping the sign for imaginary modes). One quadratic branch alone is normal (the flexural mode of a 2-D material); all of them is not.`,
  });
}
