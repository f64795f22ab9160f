'use client';

import type { FrequencyUnit } from '@/lib/dispersion/types';
import { degenerateRange, qAt, type NearestPoint } from '@/lib/plot/readout';
import type { PlotData } from '@/lib/plot/wire';
import { UNIT_TEXT, type PlotFinding } from './plot-option';
import { PLOT_COLORS, SEVERITY_LOOK } from './plot-style';

export interface ReadoutPoint extends NearestPoint {
  distance: number;
  /** Pixel position in the chart. */
  px: number;
  py: number;
  /** Pixel distance from the pointer. */
  dist: number;
}

const fmtQ = (q: [number, number, number] | null) => (q ? `(${q.map((c) => c.toFixed(4)).join(', ')})` : '—');

function fmtF(v: number, unit: FrequencyUnit): string {
  return `${v.toFixed(unit === 'cm-1' ? 2 : 4)} ${UNIT_TEXT[unit]}`;
}

/** The marker on the point being read: a faint vertical rule and a ring. */
export function PlotCursor({ point, height }: { point: ReadoutPoint; height: number }) {
  return (
    <>
      <div
        aria-hidden="true"
        className="pointer-events-none absolute top-4 w-px"
        style={{ left: point.px, height: height - 52, background: PLOT_COLORS.cursor, opacity: 0.35 }}
      />
      <div
        aria-hidden="true"
        className="pointer-events-none absolute h-2.5 w-2.5 -translate-x-1/2 -translate-y-1/2 rounded-full border-2 bg-paper-0"
        style={{ left: point.px, top: point.py, borderColor: PLOT_COLORS.cursor }}
      />
    </>
  );
}

/** The strip under the plot that names the point: frequency, branch, q as written and folded, findings there. */
export function PlotReadout({
  point,
  data,
  unit,
  factor,
  findings,
}: {
  point: ReadoutPoint | null;
  data: PlotData;
  unit: FrequencyUnit;
  factor: number;
  findings: readonly PlotFinding[];
}) {
  if (!point) {
    return (
      <div role="status" aria-live="polite" data-testid="plot-readout" className="min-h-9 border-t border-paper-200 px-3 py-2 text-xs text-paper-600">
        Point at a line to read its q, branch and frequency.
      </div>
    );
  }
  const q = qAt(data, point.index);
  const deg = degenerateRange(data, point.index, point.branch);
  const others = deg.last > deg.first ? Array.from({ length: deg.last - deg.first + 1 }, (_, i) => deg.first + i).filter((k) => k !== point.branch) : [];
  const here = findings.filter((f) => f.index === point.index && (f.branch === null || (f.branch >= deg.first && f.branch <= deg.last)));
  const label = data.labels.find((l) => l.index === point.index)?.label;
  return (
    <div
      role="status"
      aria-live="polite"
      data-testid="plot-readout"
      className="flex min-h-9 flex-wrap items-baseline gap-x-5 gap-y-0.5 border-t border-paper-200 px-3 py-2 text-xs text-paper-800"
    >
      <span className="font-semibold text-paper-900 tabular">{fmtF(point.frequency * factor, unit)}</span>
      <span>
        branch {point.branch} <span className="text-paper-600">(0–{data.nb - 1}, lowest first)</span>
        {others.length > 0 && (
          <span className="text-paper-700" data-testid="plot-readout-degenerate">
            {' '}
            · degenerate with {others.length === 1 ? 'branch' : 'branches'} {others.join(', ')}
          </span>
        )}
      </span>
      <span className="font-mono text-2xs">
        point {point.index}
        {label ? ` (${label})` : ''}
      </span>
      {q.given && (
        <span className="font-mono text-2xs">
          q {q.coordinates === 'fractional' ? 'fractional' : 'Cartesian'} {fmtQ(q.given)}
        </span>
      )}
      <span className="font-mono text-2xs">q folded {fmtQ(q.folded)}</span>
      {here.map((f, i) => (
        <span key={i} className="font-medium" style={{ color: SEVERITY_LOOK[f.severity].color }}>
          {SEVERITY_LOOK[f.severity].word}
          {f.label ? `: ${f.label}` : ''}
        </span>
      ))}
    </div>
  );
}
