/**
 * A `Dispersion` written in the YAML schema `branchwise-dispersion/1` (band-files.md §2), or its
 * `mesh:` form (docs/formats.md). Number arrays are written as flow sequences, one point a line.
 * Each segment lists its own points, so a point shared by two segments is written in both
 * (it reads back as a repeated, connected point). Connected segments share a label
 * (`to` = next `from`); broken ones get different labels.
 */
import { stringify } from 'yaml';
import type { Dispersion, FrequencyUnit } from '../dispersion/types';
import { fromTHz } from '../physics/units';
import { formatNumber } from './format-number';

export interface YamlOptions {
  units?: FrequencyUnit;
  digits?: number;
}

const scalar = (s: string) => JSON.stringify(s); // a JSON string is a valid YAML double-quoted scalar

export function writeYaml(d: Dispersion, options: YamlOptions = {}): string {
  const units = options.units ?? 'THz';
  const num = (v: number) => formatNumber(v, options.digits);
  const freqRow = (i: number) => {
    const parts: string[] = [];
    for (let k = 0; k < d.nb; k++) parts.push(formatNumber(fromTHz(d.frequencies[i * d.nb + k], units), options.digits));
    return `[${parts.join(', ')}]`;
  };
  const qRow = (i: number) => `[${num(d.q![i * 3])}, ${num(d.q![i * 3 + 1])}, ${num(d.q![i * 3 + 2])}]`;

  const out: string[] = ['format: branchwise-dispersion/1'];
  if (d.title) out.push(`title: ${scalar(d.title)}`);
  out.push(`units: ${units}`);
  if (d.q) out.push(`coordinates: ${d.coordinates}`);
  if (d.lattice) {
    out.push('lattice:');
    for (const r of d.lattice) out.push(`  - [${r.map(num).join(', ')}]`);
  }
  if (d.atoms !== null) out.push(`atoms: ${d.atoms}`);
  out.push(`polar: ${d.polar}`);
  out.push(`acoustic: ${d.acoustic}`);
  if (Object.keys(d.metadata).length > 0) {
    out.push(stringify({ metadata: d.metadata }).trimEnd());
  }

  if (d.kind === 'mesh') {
    if (!d.q || !d.weights) throw new Error('cannot write a mesh without q and weights');
    out.push('mesh:', '  q:');
    for (let i = 0; i < d.nq; i++) out.push(`    - ${qRow(i)}`);
    out.push(`  weights: [${Array.from(d.weights, num).join(', ')}]`);
    out.push('  frequencies:');
    for (let i = 0; i < d.nq; i++) out.push(`    - ${freqRow(i)}`);
    return out.join('\n') + '\n';
  }

  if (!d.q && !d.distance) throw new Error('cannot write a YAML path without q or distances');
  out.push('segments:');
  let previousTo: string | null = null;
  d.segments.forEach((seg, s) => {
    const connectedFromPrevious = s > 0 && d.segments[s - 1].connectedToNext;
    let from = seg.from ?? d.labels.get(seg.start) ?? `q${seg.start}`;
    if (connectedFromPrevious) from = previousTo!;
    else if (s > 0 && from === previousTo) from = `${from}′`; // a break between equal labels must not read as a join
    const to = seg.to ?? d.labels.get(seg.end) ?? `q${seg.end}`;
    out.push(`  - from: ${scalar(from)}`, `    to: ${scalar(to)}`);
    if (d.q) {
      out.push('    q:');
      for (let i = seg.start; i <= seg.end; i++) out.push(`      - ${qRow(i)}`);
    } else {
      const ds: string[] = [];
      for (let i = seg.start; i <= seg.end; i++) ds.push(num(d.distance![i]));
      out.push(`    distance: [${ds.join(', ')}]`);
    }
    out.push('    frequencies:');
    for (let i = seg.start; i <= seg.end; i++) out.push(`      - ${freqRow(i)}`);
    previousTo = to;
  });
  return out.join('\n') + '\n';
}
