/**
 * A dispersion as CSV for spreadsheets and scripts: comment-free, one header row naming each
 * column with its unit, one row per q-point: index, segment, label, path distance, q, then one
 * column per branch (branch 1 = lowest). Mesh files get a weight column instead of distance
 * and labels. Text cells are quoted per RFC 4180 and defused against spreadsheet formulas.
 */
import type { Dispersion, FrequencyUnit } from '@/lib/dispersion/types';
import { pathGeometry } from '@/lib/physics/path';
import { fromTHz } from '@/lib/physics/units';
import { checkFinite, chunkLines, formatNumber, joinChunks, pointPlace } from '@/lib/writers';

export interface CsvOptions {
  units?: FrequencyUnit;
}

/** RFC 4180 quoting, and a leading apostrophe where a spreadsheet would read a formula. */
export function csvText(value: string): string {
  const defused = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(defused) ? `"${defused.replace(/"/g, '""')}"` : defused;
}

/** What pathGeometry's distance measures for this file. */
function distanceUnit(d: Dispersion): string {
  if (d.q && d.lattice) return '1/Å';
  if (d.q && d.coordinates === 'cartesian') return 'as the q columns';
  if (d.distance) return 'as in the file';
  return 'point index';
}

const unitLabel: Record<FrequencyUnit, string> = { THz: 'THz', 'cm-1': 'cm-1', meV: 'meV' };

export function dispersionCsv(d: Dispersion, options: CsvOptions = {}): string {
  return joinChunks(dispersionCsvChunks(d, options));
}

/** The same text as dispersionCsv, in chunks; throws before the first chunk if it cannot be written. */
export function dispersionCsvChunks(d: Dispersion, options: CsvOptions = {}): Iterable<string> {
  const units = options.units ?? 'THz';
  const mesh = d.kind === 'mesh';
  const distance = mesh ? null : pathGeometry(d).distance;
  if (distance) checkFinite(distance, pointPlace('distances'));
  if (d.q) checkFinite(d.q, pointPlace('q', 3));
  if (mesh && d.weights) checkFinite(d.weights, pointPlace('weights'));
  checkFinite(d.frequencies, pointPlace(`frequencies in ${units}`, d.nb, 'branch'), (v) => fromTHz(v, units));
  return chunkLines(csvLines(d, units, distance), '\r\n');
}

function* csvLines(d: Dispersion, units: FrequencyUnit, distance: Float64Array | null): Generator<string, void, undefined> {
  const mesh = d.kind === 'mesh';
  const qUnit = d.coordinates === 'fractional' ? 'fractional' : '1/Å';
  const header = ['index'];
  if (!mesh) header.push('segment', 'label', `distance (${distanceUnit(d)})`);
  if (d.q) header.push(`qx (${qUnit})`, `qy (${qUnit})`, `qz (${qUnit})`);
  if (mesh) header.push('weight');
  for (let k = 0; k < d.nb; k++) header.push(`branch ${k + 1} (${unitLabel[units]})`);

  const segmentOf = new Int32Array(d.nq).fill(-1);
  d.segments.forEach((s, i) => {
    for (let j = s.start; j <= s.end && j < d.nq; j++) if (segmentOf[j] < 0) segmentOf[j] = i + 1;
  });
  yield header.map(csvText).join(',');
  const row: string[] = [];
  for (let i = 0; i < d.nq; i++) {
    row.length = 0;
    row.push(String(i));
    if (!mesh) {
      row.push(segmentOf[i] > 0 ? String(segmentOf[i]) : '', csvText(d.labels.get(i) ?? ''), formatNumber(distance![i]));
    }
    if (d.q) row.push(formatNumber(d.q[i * 3]), formatNumber(d.q[i * 3 + 1]), formatNumber(d.q[i * 3 + 2]));
    if (mesh) row.push(d.weights ? formatNumber(d.weights[i]) : '');
    for (let k = 0; k < d.nb; k++) row.push(formatNumber(fromTHz(d.frequencies[i * d.nb + k], units)));
    yield row.join(',');
  }
}
