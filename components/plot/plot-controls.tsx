'use client';

import { Button } from '@/components/ui/button';
import { cx } from '@/components/ui/cx';
import { Glyph } from '@/components/ui/glyph';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { FREQUENCY_UNITS } from '@/lib/physics/units';
import { UNIT_TEXT, type PlotFinding } from './plot-option';
import { PLOT_COLORS, SEVERITIES, SEVERITY_LOOK, type Severity } from './plot-style';

export interface PlotControlsProps {
  unit: FrequencyUnit;
  onUnit: (u: FrequencyUnit) => void;
  zoomed: boolean;
  onZoomIn: () => void;
  onZoomOut: () => void;
  onReset: () => void;
  counts: Record<Severity, number>;
  hasOverlay: boolean;
  overlayLabel: string;
  hasMeasured: boolean;
  highlight: PlotFinding | null;
}

/** Unit switch, zoom buttons and the legend: every mark is named in words beside its shape. */
export function PlotControls(p: PlotControlsProps) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-x-6 gap-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <fieldset className="flex items-center gap-2">
          <legend className="sr-only">Frequency unit</legend>
          <span className="text-xs font-medium text-paper-700" aria-hidden="true">
            Unit
          </span>
          <div className="inline-flex overflow-hidden rounded-md border border-paper-300 bg-paper-0">
            {FREQUENCY_UNITS.map((u) => (
              <label
                key={u}
                className={cx(
                  'cursor-pointer px-2.5 py-1 text-xs font-medium has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-ember-500',
                  u === p.unit ? 'bg-ink-800 text-paper-50' : 'text-ink-800 hover:bg-ink-50',
                )}
              >
                <input
                  type="radio"
                  name="plot-unit"
                  value={u}
                  checked={u === p.unit}
                  onChange={() => p.onUnit(u)}
                  className="sr-only"
                  data-testid={`plot-unit-${u}`}
                />
                {UNIT_TEXT[u]}
              </label>
            ))}
          </div>
        </fieldset>
        <div className="flex items-center gap-1" role="group" aria-label="Zoom">
          <Button variant="secondary" size="sm" onClick={p.onZoomIn} aria-label="Zoom in along q" data-testid="plot-zoom-in">
            <Sign plus />
          </Button>
          <Button variant="secondary" size="sm" onClick={p.onZoomOut} disabled={!p.zoomed} aria-label="Zoom out along q">
            <Sign />
          </Button>
          <Button variant="quiet" size="sm" onClick={p.onReset} disabled={!p.zoomed} data-testid="plot-reset">
            Reset view
          </Button>
        </div>
      </div>
      <ul className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-paper-700" aria-label="Legend">
        <li className="flex items-center gap-1.5">
          <svg width="18" height="6" aria-hidden="true">
            <line x1="0" y1="3" x2="18" y2="3" stroke={PLOT_COLORS.bands} strokeWidth="1.5" />
          </svg>
          Branches
        </li>
        {p.hasOverlay && (
          <li className="flex items-center gap-1.5">
            <svg width="18" height="6" aria-hidden="true">
              <line x1="0" y1="3" x2="18" y2="3" stroke={PLOT_COLORS.overlay} strokeWidth="1.5" strokeDasharray="5 3" />
            </svg>
            {p.overlayLabel}
          </li>
        )}
        {p.hasMeasured && (
          <li className="flex items-center gap-1.5">
            <svg width="10" height="10" aria-hidden="true">
              <rect x="1.5" y="1.5" width="7" height="7" fill="#fff" stroke={PLOT_COLORS.measured} strokeWidth="1.5" />
            </svg>
            Measured
          </li>
        )}
        {SEVERITIES.map((s) => (
          <li key={s} className="flex items-center gap-1.5" data-testid={`plot-legend-${s}`}>
            <span style={{ color: SEVERITY_LOOK[s].color }}>
              <Glyph shape={SEVERITY_LOOK[s].glyph} />
            </span>
            {SEVERITY_LOOK[s].word} <span className="tabular text-paper-600">{p.counts[s]}</span>
          </li>
        ))}
        {p.highlight && (
          <li className="flex items-center gap-1.5">
            <svg width="12" height="12" aria-hidden="true">
              <circle cx="6" cy="6" r="4.5" fill="rgba(192,97,44,0.12)" stroke={PLOT_COLORS.highlight} strokeWidth="1.5" />
            </svg>
            Selected finding
          </li>
        )}
      </ul>
    </div>
  );
}

function Sign({ plus = false }: { plus?: boolean }) {
  return (
    <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true">
      <path d={plus ? 'M2 6 H10 M6 2 V10' : 'M2 6 H10'} stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
    </svg>
  );
}
