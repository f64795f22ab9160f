/**
 * A `Dispersion` written as a columns file (band-files.md §1; the mesh form of docs/formats.md).
 * Frequencies are written in the requested unit (converted from THz) and declared in the header.
 */
import type { Dispersion, FrequencyUnit } from '../dispersion/types';
import { pathGeometry } from '../physics/path';
import { fromTHz } from '../physics/units';
import { formatNumber } from './format-number';

export type LeadingColumns = 'distance' | 'q' | 'distance q';

export interface ColumnsOptions {
  units?: FrequencyUnit;
  /** Leading columns of a path (default 'distance q' when q is known, else 'distance'). */
  columns?: LeadingColumns;
  layout?: 'rows' | 'blocks';
  /** Significant digits (default: as many as needed to read back the same double). */
  digits?: number;
}

function headerValue(v: unknown): string {
  const s = typeof v === 'string' ? v : JSON.stringify(v);
  return s.replace(/[\r\n]+/g, ' ');
}

function checkLabel(label: string, index: number): string {
  if (/[\s=|]/.test(label) || label === '') {
    throw new Error(`label "${label}" at q-point ${index} cannot be written in a columns header (no spaces, "=" or "|")`);
  }
  return label;
}

export function writeColumns(d: Dispersion, options: ColumnsOptions = {}): string {
  const units = options.units ?? 'THz';
  const layout = options.layout ?? 'rows';
  const mesh = d.kind === 'mesh';
  const columns: LeadingColumns = mesh ? 'q' : (options.columns ?? (d.q ? 'distance q' : 'distance'));
  const withQ = columns !== 'distance';
  const withDistance = columns !== 'q';
  if (withQ && !d.q) throw new Error(`cannot write q columns: the spectrum has no q coordinates (use columns: 'distance')`);
  if (mesh && !d.weights) throw new Error('cannot write a mesh without weights');
  if (layout === 'blocks') {
    if (mesh || withQ) throw new Error("the blocks layout holds distance and frequency only: use columns: 'distance' on a path");
    if (d.segments.some((s, i) => i + 1 < d.segments.length && !s.connectedToNext)) {
      throw new Error('the blocks layout cannot mark path breaks; write this spectrum with the rows layout');
    }
  }
  const distance = withDistance ? (d.distance ?? pathGeometry(d).distance) : null;
  const num = (v: number) => formatNumber(v, options.digits);
  const freq = (v: number) => formatNumber(fromTHz(v, units), options.digits);

  const out: string[] = [];
  if (d.title) out.push(`# title: ${headerValue(d.title)}`);
  out.push(`# units: ${units}`);
  out.push(`# columns: ${columns}`);
  if (mesh) out.push('# weights: yes');
  if (withQ) out.push(`# coords: ${d.coordinates}`);
  if (d.lattice) out.push(`# lattice: ${d.lattice.map((r) => r.map(num).join(' ')).join(' ; ')}`);
  if (d.labels.size > 0) {
    const pairs = [...d.labels].sort((a, b) => a[0] - b[0]).map(([i, l]) => `${i}=${checkLabel(l, i)}`);
    out.push(`# labels: ${pairs.join(' ')}`);
  }
  if (d.atoms !== null) out.push(`# atoms: ${d.atoms}`);
  out.push(`# polar: ${d.polar ? 'yes' : 'no'}`);
  out.push(`# acoustic: ${d.acoustic}`);
  out.push(`# layout: ${layout}`);
  const known = new Set(['title', 'units', 'columns', 'weights', 'coords', 'coordinates', 'lattice', 'labels', 'atoms', 'polar', 'acoustic', 'layout']);
  for (const [k, v] of Object.entries(d.metadata)) {
    if (known.has(k.toLowerCase()) || !/^[A-Za-z][\w.-]*$/.test(k)) continue;
    out.push(`# ${k}: ${headerValue(v)}`);
  }

  const { nq, nb, frequencies: f } = d;
  if (layout === 'blocks') {
    for (let k = 0; k < nb; k++) {
      if (k > 0) out.push('');
      for (let i = 0; i < nq; i++) out.push(`${num(distance![i])} ${freq(f[i * nb + k])}`);
    }
    return out.join('\n') + '\n';
  }
  const breakBefore = new Uint8Array(nq);
  if (!mesh) {
    for (let s = 0; s + 1 < d.segments.length; s++) {
      if (!d.segments[s].connectedToNext) breakBefore[d.segments[s + 1].start] = 1;
    }
  }
  const row: string[] = [];
  for (let i = 0; i < nq; i++) {
    if (breakBefore[i]) out.push('');
    row.length = 0;
    if (distance) row.push(num(distance[i]));
    if (withQ) row.push(num(d.q![i * 3]), num(d.q![i * 3 + 1]), num(d.q![i * 3 + 2]));
    if (mesh) row.push(num(d.weights![i]));
    for (let k = 0; k < nb; k++) row.push(freq(f[i * nb + k]));
    out.push(row.join(' '));
  }
  return out.join('\n') + '\n';
}
