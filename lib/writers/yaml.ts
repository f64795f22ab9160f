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
import { checkFinite, chunkLines, joinChunks, pointPlace } from './chunks';
import { formatNumber } from './format-number';

export interface YamlOptions {
  units?: FrequencyUnit;
  digits?: number;
}

const scalar = (s: string) => JSON.stringify(s); // a JSON string is a valid YAML double-quoted scalar

export function writeYaml(d: Dispersion, options: YamlOptions = {}): string {
  return joinChunks(yamlChunks(d, options));
}

/** The same text as writeYaml, in chunks; throws before the first chunk if it cannot be written. */
export function yamlChunks(d: Dispersion, options: YamlOptions = {}): Iterable<string> {
  const units = options.units ?? 'THz';
  if (d.kind === 'mesh') {
    if (!d.q || !d.weights) throw new Error('cannot write a mesh without q and weights');
    checkFinite(d.weights, pointPlace('weights'));
  } else if (!d.q) {
    if (!d.distance) throw new Error('cannot write a YAML path without q or distances');
    checkFinite(d.distance, pointPlace('distances'));
  }
  if (d.q) checkFinite(d.q, pointPlace('q', 3));
  checkFinite(d.frequencies, pointPlace(`frequencies in ${units}`, d.nb, 'branch'), (v) => fromTHz(v, units));
  if (d.lattice) checkFinite(d.lattice.flat(), (i) => `lattice, vector ${Math.floor(i / 3) + 1}, component ${(i % 3) + 1}`);
  return chunkLines(yamlLines(d, units, options.digits));
}

function* yamlLines(d: Dispersion, units: FrequencyUnit, digits: number | undefined): Generator<string, void, undefined> {
  const num = (v: number) => formatNumber(v, digits);
  const freqRow = (i: number) => {
    const parts: string[] = [];
    for (let k = 0; k < d.nb; k++) parts.push(formatNumber(fromTHz(d.frequencies[i * d.nb + k], units), digits));
    return `[${parts.join(', ')}]`;
  };
  const qRow = (i: number) => `[${num(d.q![i * 3])}, ${num(d.q![i * 3 + 1])}, ${num(d.q![i * 3 + 2])}]`;

  yield 'format: branchwise-dispersion/1';
  if (d.title) yield `title: ${scalar(d.title)}`;
  yield `units: ${units}`;
  if (d.q) yield `coordinates: ${d.coordinates}`;
  if (d.lattice) {
    yield 'lattice:';
    for (const r of d.lattice) yield `  - [${r.map(num).join(', ')}]`;
  }
  if (d.atoms !== null) yield `atoms: ${d.atoms}`;
  yield `polar: ${d.polar}`;
  yield `acoustic: ${d.acoustic}`;
  if (Object.keys(d.metadata).length > 0) {
    yield stringify({ metadata: d.metadata }).trimEnd();
  }

  if (d.kind === 'mesh') {
    yield 'mesh:';
    yield '  q:';
    for (let i = 0; i < d.nq; i++) yield `    - ${qRow(i)}`;
    yield `  weights: [${Array.from(d.weights!, num).join(', ')}]`;
    yield '  frequencies:';
    for (let i = 0; i < d.nq; i++) yield `    - ${freqRow(i)}`;
    return;
  }

  yield 'segments:';
  let previousTo: string | null = null;
  for (let s = 0; s < d.segments.length; s++) {
    const seg = d.segments[s];
    const connectedFromPrevious = s > 0 && d.segments[s - 1].connectedToNext;
    let from = seg.from ?? d.labels.get(seg.start) ?? `q${seg.start}`;
    if (connectedFromPrevious) from = previousTo!;
    else if (s > 0 && from === previousTo) from = `${from}′`; // a break between equal labels must not read as a join
    const to = seg.to ?? d.labels.get(seg.end) ?? `q${seg.end}`;
    yield `  - from: ${scalar(from)}`;
    yield `    to: ${scalar(to)}`;
    if (d.q) {
      yield '    q:';
      for (let i = seg.start; i <= seg.end; i++) yield `      - ${qRow(i)}`;
    } else {
      const ds: string[] = [];
      for (let i = seg.start; i <= seg.end; i++) ds.push(num(d.distance![i]));
      yield `    distance: [${ds.join(', ')}]`;
    }
    yield '    frequencies:';
    for (let i = seg.start; i <= seg.end; i++) yield `      - ${freqRow(i)}`;
    previousTo = to;
  }
}
