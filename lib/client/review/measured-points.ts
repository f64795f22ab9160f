/**
 * Measured points a reviewer lays over the plot: a small CSV of path distance (or q-point
 * index), frequency and an optional uncertainty, and the RMS deviation from the nearest branch.
 * Parsed in the browser; a bad line is named with its number and what was wrong.
 */
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { toTHz } from '@/lib/physics/units';
import type { PlotData } from '@/lib/plot/wire';

export interface MeasuredRow {
  /** 1-based line of the file. */
  line: number;
  distance?: number;
  index?: number;
  frequencyTHz: number;
  uncertaintyTHz?: number;
}

export class MeasuredCsvError extends Error {
  constructor(
    readonly line: number,
    message: string,
  ) {
    super(`Line ${line}: ${message}`);
    this.name = 'MeasuredCsvError';
  }
}

export const MAX_MEASURED_POINTS = 10_000;

/**
 * Columns: x, frequency[, uncertainty]. x is a path distance (the plot's horizontal axis) unless
 * the header's first name is `index` (then a 0-based q-point index). A header line is optional;
 * `#` starts a comment; commas, semicolons, tabs or spaces separate.
 */
export function parseMeasuredCsv(text: string, unit: FrequencyUnit = 'THz'): MeasuredRow[] {
  const rows: MeasuredRow[] = [];
  let byIndex = false;
  let seenData = false;
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const n = i + 1;
    const raw = lines[i].replace(/#.*$/, '').trim();
    if (!raw) continue;
    const cells = raw.split(/\s*[,;\t]\s*|\s+/).filter((c) => c !== '');
    const nums = cells.map(Number);
    if (!seenData && nums.some((x) => Number.isNaN(x))) {
      if (cells.every((c) => /^[A-Za-z_(][\w ()/.\-⁻¹]*$/.test(c))) {
        byIndex = cells[0].toLowerCase() === 'index';
        seenData = true;
        continue;
      }
    }
    seenData = true;
    if (cells.length < 2 || cells.length > 3) throw new MeasuredCsvError(n, `expected 2 or 3 values (x, frequency, uncertainty), found ${cells.length}.`);
    const bad = nums.findIndex((x) => !Number.isFinite(x));
    if (bad >= 0) throw new MeasuredCsvError(n, `"${cells[bad]}" in column ${bad + 1} is not a number.`);
    const [x, f, u] = nums;
    if (byIndex && (!Number.isInteger(x) || x < 0)) throw new MeasuredCsvError(n, `the q-point index must be a whole number ≥ 0, found ${cells[0]}.`);
    if (u !== undefined && u < 0) throw new MeasuredCsvError(n, `the uncertainty must not be negative, found ${cells[2]}.`);
    rows.push({
      line: n,
      ...(byIndex ? { index: x } : { distance: x }),
      frequencyTHz: toTHz(f, unit),
      ...(u !== undefined ? { uncertaintyTHz: toTHz(u, unit) } : {}),
    });
    if (rows.length > MAX_MEASURED_POINTS) throw new MeasuredCsvError(n, `more than ${MAX_MEASURED_POINTS} points; this overlay is meant for a few measured values.`);
  }
  if (rows.length === 0) throw new MeasuredCsvError(lines.length, 'no data lines found.');
  return rows;
}

/** Branch k's frequency at path distance x (linear between neighbouring points, never across a break). */
function branchesAt(d: PlotData, x: number): number[] | null {
  const dist = d.distance;
  if (d.nq === 0 || x < dist[0] || x > dist[d.nq - 1]) return null;
  let lo = 0;
  let hi = d.nq - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (dist[mid] <= x) lo = mid;
    else hi = mid;
  }
  const span = dist[hi] - dist[lo];
  const broken = d.breaks.includes(lo);
  const t = span > 0 && !broken ? (x - dist[lo]) / span : 0;
  const at = broken && x - dist[lo] > dist[hi] - x ? hi : lo;
  const out: number[] = [];
  for (let k = 0; k < d.nb; k++) {
    const a = d.frequencies[k * d.nq + (broken ? at : lo)];
    const b = d.frequencies[k * d.nq + hi];
    out.push(broken ? a : a + t * (b - a));
  }
  return out;
}

export interface MeasuredDeviation {
  /** √(mean of (measured − nearest branch)²), THz, over the points inside the path. */
  rms: number;
  used: number;
  /** Points outside the path's range (or index), not counted. */
  outside: number;
}

export function measuredDeviation(d: PlotData, rows: readonly MeasuredRow[]): MeasuredDeviation {
  let sum = 0;
  let used = 0;
  let outside = 0;
  for (const r of rows) {
    let branches: number[] | null;
    if (r.index !== undefined) {
      branches = r.index < d.nq ? Array.from({ length: d.nb }, (_, k) => d.frequencies[k * d.nq + r.index!]) : null;
    } else branches = branchesAt(d, r.distance!);
    if (!branches || branches.length === 0) {
      outside++;
      continue;
    }
    let best = Infinity;
    for (const w of branches) best = Math.min(best, Math.abs(r.frequencyTHz - w));
    sum += best * best;
    used++;
  }
  return { rms: used ? Math.sqrt(sum / used) : NaN, used, outside };
}
