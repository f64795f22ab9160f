/**
 * ECharts options for the dispersion plot, built from our own decimated arrays. One joined
 * series carries every branch (NaN gaps between branches and at path breaks); a few small
 * series on top carry the overlay, the highlighted branch, findings and measured points.
 * Series keep fixed ids so a zoom only replaces axis limits and three data arrays.
 */
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { decimate, type Decimated } from '@/lib/plot/decimate';
import type { RasterWindow } from '@/lib/plot/raster';
import type { AxisMark } from '@/lib/plot/path-axis';
import type { View } from '@/lib/plot/view';
import type { PlotData } from '@/lib/plot/wire';
import { MEASURED_SYMBOL, PLOT_COLORS as C, SEVERITIES, SEVERITY_LOOK, type Severity } from './plot-style';

export interface PlotFinding {
  /** Stable id (the finding's id), used to match `highlight`. */
  id?: string | number;
  severity: Severity;
  /** q-point index. */
  index: number;
  /** Branch (k-th lowest at that point); null when the finding is about the whole point. */
  branch: number | null;
  /** THz: where to draw it when there is no branch; without it, on the lowest branch at that point. */
  value?: number | null;
  /** Short text for the readout and the caption. */
  label?: string;
}

export interface MeasuredPoint {
  /** Path distance; or give `index`. */
  distance?: number;
  index?: number;
  frequencyTHz: number;
  uncertaintyTHz?: number;
}

export interface Scene {
  data: PlotData;
  overlay: PlotData | null;
  findings: readonly PlotFinding[];
  highlight: PlotFinding | null;
  measured: readonly MeasuredPoint[];
  unit: FrequencyUnit;
  /** Display value = THz × factor. */
  factor: number;
  /** y in THz. */
  view: View;
  /** Pixel columns for the decimation. */
  columns: number;
  marks: readonly AxisMark[];
  /**
   * Arrays the decimation may write into, kept between redraws (updated in place with the
   * larger ones it had to allocate): a zoom then allocates nothing big.
   */
  buffers?: DecimationBuffers;
  /**
   * When given, the branches and the overlay are drawn by this painter into one image under
   * the chart's markers, instead of as chart series: a chart library strokes a path of every
   * point, which at a thousand branches costs most of a second per zoom (see DEVELOPERS.md).
   */
  painter?: LinePainter | null;
  /** The chart's size in CSS pixels: where the painted image goes. Needed with `painter`. */
  size?: { width: number; height: number };
}

/** One polyline set for the painter, in display units, NaN points between runs. */
export interface PaintLayer {
  xy: Float64Array;
  points: number;
  color: string;
  /** `[on, off]` in CSS pixels. */
  dash?: readonly [number, number];
  opacity?: number;
}

/** Paints layers (in order, later ones on top) over `win` into an image of `width` × `height` CSS px. */
export type LinePainter = (layers: readonly PaintLayer[], win: RasterWindow, width: number, height: number) => unknown;

/** The plot area inside the chart, CSS px. */
export const GRID = { left: 64, right: 20, top: 16, bottom: 36 } as const;

export interface DecimationBuffers {
  bands?: Float64Array;
  overlay?: Float64Array;
  highlight?: Float64Array;
}

export const UNIT_TEXT: Record<FrequencyUnit, string> = { THz: 'THz', 'cm-1': 'cm⁻¹', meV: 'meV' };

export function sameFinding(a: PlotFinding | null | undefined, b: PlotFinding | null | undefined): boolean {
  if (!a || !b) return false;
  if (a.id !== undefined || b.id !== undefined) return a.id === b.id;
  return a.severity === b.severity && a.index === b.index && a.branch === b.branch;
}

/** Where a finding is drawn, in THz; null when it cannot be placed. */
export function findingY(d: PlotData, f: PlotFinding): number | null {
  if (f.index < 0 || f.index >= d.nq) return null;
  if (f.branch !== null && f.branch >= 0 && f.branch < d.nb) return d.frequencies[f.branch * d.nq + f.index];
  // A finding about the whole q-point (zone folding, say) has no frequency of its own: mark the
  // point on its lowest branch rather than leave it counted in the legend and drawn nowhere.
  if (f.value != null) return f.value;
  return d.nb > 0 ? d.frequencies[f.index] : null;
}

function points(pairs: Array<[number, number]>): Float64Array {
  const a = new Float64Array(2 * pairs.length);
  pairs.forEach(([x, y], i) => {
    a[2 * i] = x;
    a[2 * i + 1] = y;
  });
  return a;
}

const EMPTY = new Float64Array(0);

function decimated(d: PlotData | null, s: Scene, key: keyof DecimationBuffers, branches?: number[]): Decimated | null {
  if (!d || d.nq === 0) return null;
  const out = decimate(
    { x: d.distance, y: d.frequencies, nq: d.nq, nb: d.nb, breaks: d.breaks },
    { x0: s.view.x0, x1: s.view.x1, columns: s.columns },
    { scale: s.factor, branches, out: s.buffers?.[key] },
  );
  if (s.buffers && s.buffers[key]?.buffer !== out.xy.buffer) s.buffers[key] = new Float64Array(out.xy.buffer);
  return out;
}

function decimalsFor(span: number): number {
  if (span >= 50) return 0;
  if (span >= 5) return 1;
  if (span >= 0.5) return 2;
  return 3;
}

function xAxis(s: Scene) {
  const text = new Map(s.marks.map((m) => [m.x, m.text]));
  const breaks = new Set(s.marks.filter((m) => m.isBreak).map((m) => m.x));
  const values = s.marks.map((m) => m.x);
  return {
    id: 'q',
    min: s.view.x0,
    max: s.view.x1,
    axisLabel: {
      customValues: values,
      formatter: (v: number) => (breaks.has(v) ? `{brk|${text.get(v) ?? ''}}` : text.get(v) ?? ''),
    },
    axisTick: { customValues: values },
  };
}

function yAxis(s: Scene) {
  const y0 = s.view.y0 * s.factor;
  const y1 = s.view.y1 * s.factor;
  const digits = decimalsFor(y1 - y0);
  return {
    id: 'f',
    min: y0,
    max: y1,
    name: `Frequency (${UNIT_TEXT[s.unit]})`,
    // Limits of a zoomed view are rarely round numbers: label only the nice ticks (and a zero floor).
    axisLabel: { formatter: (v: number) => v.toFixed(digits), showMinLabel: y0 === 0, showMaxLabel: false },
  };
}

/**
 * The zero line and the faint band below it (imaginary modes), only where they are in view:
 * markers are not clipped to the grid.
 */
function zeroMarkers(s: Scene) {
  const y0 = s.view.y0 * s.factor;
  const y1 = s.view.y1 * s.factor;
  // Where the path jumps, a dashed rule says so (the lines on both sides end at the same x).
  const jumps = s.marks
    .filter((m) => m.isBreak && m.x > s.view.x0 && m.x < s.view.x1)
    .map((m) => ({ xAxis: m.x, lineStyle: { color: C.breakRule, width: 1.25, type: [4, 3] } }));
  return {
    markLine: { data: [...(y0 < 0 && y1 > 0 ? [{ yAxis: 0 }] : []), ...jumps] },
    markArea: { data: y0 < 0 ? [[{ yAxis: y0 }, { yAxis: Math.min(0, y1) }]] : [] },
  };
}

/** The parts that change on zoom and pan: axis limits and the re-decimated lines. */
export function viewOption(s: Scene) {
  const bands = decimated(s.data, s, 'bands');
  const overlay = decimated(s.overlay, s, 'overlay');
  const hb = s.highlight?.branch;
  const hl = hb !== null && hb !== undefined && hb >= 0 && hb < s.data.nb ? decimated(s.data, s, 'highlight', [hb]) : null;
  const painted = s.painter && s.size ? paintedLines(s, bands, overlay) : null;
  const parts = {
    overlay: { id: 'overlay', data: overlay && !painted ? overlay.xy : EMPTY },
    bands: { id: 'bands', data: bands && !painted ? bands.xy : EMPTY, ...zeroMarkers(s) },
    highlight: { id: 'highlight-branch', data: hl ? hl.xy : EMPTY },
  };
  return {
    option: {
      xAxis: [xAxis(s)],
      yAxis: [yAxis(s)],
      series: [parts.overlay, parts.bands, parts.highlight],
      ...(painted ? { graphic: { elements: [painted] } } : {}),
    },
    parts,
    points: (bands?.points ?? 0) + (overlay?.points ?? 0),
  };
}

/** The painted image of the branches (overlay underneath), as a chart graphic element over the grid. */
function paintedLines(s: Scene, bands: Decimated | null, overlay: Decimated | null) {
  const width = Math.max(1, s.size!.width - GRID.left - GRID.right);
  const height = Math.max(1, s.size!.height - GRID.top - GRID.bottom);
  const layers: PaintLayer[] = [];
  if (overlay) layers.push({ xy: overlay.xy, points: overlay.points, color: C.overlay, dash: [5, 3], opacity: 0.9 });
  if (bands) layers.push({ xy: bands.xy, points: bands.points, color: C.bands });
  const win = { x0: s.view.x0, x1: s.view.x1, y0: s.view.y0 * s.factor, y1: s.view.y1 * s.factor };
  const image = s.painter!(layers, win, width, height);
  // Over the grid rules (axis z 0), under every series (z 1 and up, drawn later at equal z).
  // The z goes on the element: the component-level z only fills an unset one, and zrender sets 0.
  return { id: 'painted-lines', type: 'image', silent: true, z: 1, style: { image, x: GRID.left, y: GRID.top, width, height } };
}

/**
 * What a zoom or pan must hand the chart, given the option drawn before it: the axis limits,
 * the re-decimated lines that exist, and markers or label formats only when they changed.
 * Everything else (styles, axis labels at the high-symmetry points, the small series) stays
 * as merged before, so ECharts rebuilds nothing else.
 */
export function zoomOption(s: Scene, before: ViewOption) {
  const now = viewOption(s);
  const b = before.option;
  const n = now.option;
  const y = n.yAxis[0];
  const yLabelSame = b.yAxis[0].axisLabel.showMinLabel === y.axisLabel.showMinLabel && sameFormat(b.yAxis[0].min, b.yAxis[0].max, y.min, y.max);
  const { overlay: bo, bands: bb, highlight: bh } = before.parts;
  const { overlay: no, bands: nb, highlight: nh } = now.parts;
  const series: object[] = [];
  // An empty series stays empty: nothing to send.
  if (no.data.length || bo.data.length) series.push({ id: no.id, data: no.data });
  const markersSame = JSON.stringify([bb.markLine, bb.markArea]) === JSON.stringify([nb.markLine, nb.markArea]);
  if (!markersSame) series.push(nb);
  else if (nb.data.length || bb.data.length) series.push({ id: nb.id, data: nb.data });
  if (nh.data.length || bh.data.length) series.push({ id: nh.id, data: nh.data });
  return {
    option: {
      xAxis: [{ id: 'q', min: n.xAxis[0].min, max: n.xAxis[0].max }],
      yAxis: [yLabelSame ? { id: 'f', min: y.min, max: y.max } : y],
      series,
      ...('graphic' in n ? { graphic: n.graphic } : {}),
    },
    view: now,
    points: now.points,
  };
}

export type ViewOption = ReturnType<typeof viewOption>;

/** Whether two y ranges label their ticks with the same number of decimals. */
function sameFormat(a0: number, a1: number, b0: number, b1: number): boolean {
  return decimalsFor(a1 - a0) === decimalsFor(b1 - b0);
}

/** Everything: on mount, on new data and on a unit switch (merged by series id). */
export function fullOption(s: Scene) {
  const { option, parts, points: n } = viewOption(s);
  const d = s.data;
  const line = (id: string, color: string, width: number, z: number, extra: object = {}) => ({
    id,
    type: 'line',
    dimensions: ['x', 'y'],
    showSymbol: false,
    symbol: 'none',
    silent: true,
    animation: false,
    connectNulls: false,
    clip: true,
    z,
    emphasis: { disabled: true },
    lineStyle: { color, width, ...extra },
  });
  const scatter = (id: string, data: Float64Array, symbol: string, size: number, color: string, z: number, extra: object = {}) => ({
    id,
    type: 'scatter',
    dimensions: ['x', 'y'],
    data,
    symbol,
    symbolSize: size,
    silent: true,
    animation: false,
    clip: true,
    z,
    itemStyle: { color, borderColor: '#ffffff', borderWidth: 1, opacity: 1 },
    emphasis: { disabled: true },
    ...extra,
  });

  const bySeverity: Record<Severity, Array<[number, number]>> = { info: [], warn: [], fail: [] };
  for (const f of s.findings) {
    const y = findingY(d, f);
    if (y === null) continue;
    bySeverity[f.severity].push([d.distance[f.index], y * s.factor]);
  }
  const measured: Array<[number, number]> = [];
  for (const m of s.measured) {
    const x = m.distance ?? (m.index !== undefined && m.index >= 0 && m.index < d.nq ? d.distance[m.index] : undefined);
    if (x !== undefined && Number.isFinite(m.frequencyTHz)) measured.push([x, m.frequencyTHz * s.factor]);
  }
  const hy = s.highlight ? findingY(d, s.highlight) : null;
  const halo = s.highlight && hy !== null ? points([[d.distance[s.highlight.index], hy * s.factor]]) : EMPTY;
  const { overlay: overlaySeries, bands: bandSeries, highlight: hlSeries } = parts;

  return {
    option: {
      animation: false,
      backgroundColor: C.background,
      textStyle: { fontFamily: 'var(--font-plex-sans), ui-sans-serif, system-ui, sans-serif', color: C.axisLabel },
      grid: { ...GRID, containLabel: false },
      ...(option.graphic ? { graphic: option.graphic } : {}),
      xAxis: [
        {
          ...option.xAxis[0],
          type: 'value',
          scale: false,
          axisLine: { show: true, onZero: false, lineStyle: { color: C.axis } },
          axisTick: { ...option.xAxis[0].axisTick, show: true, length: 5, lineStyle: { color: C.axis } },
          axisLabel: {
            ...option.xAxis[0].axisLabel,
            color: C.axisLabel,
            fontSize: 13,
            margin: 9,
            hideOverlap: true,
            rich: { brk: { color: C.axisLabel, fontSize: 13, fontWeight: 600 } },
          },
          splitLine: { show: true, lineStyle: { color: C.rule, width: 1 } },
        },
      ],
      yAxis: [
        {
          ...option.yAxis[0],
          type: 'value',
          scale: false,
          nameLocation: 'middle',
          nameGap: 46,
          nameTextStyle: { color: C.axisLabel, fontSize: 12 },
          axisLine: { show: true, lineStyle: { color: C.axis } },
          axisTick: { show: true, length: 4, lineStyle: { color: C.axis } },
          axisLabel: { ...option.yAxis[0].axisLabel, color: C.axisLabel, fontSize: 11 },
          splitLine: { show: true, lineStyle: { color: C.grid, width: 1, type: [3, 3] } },
        },
      ],
      series: [
        { ...line('overlay', C.overlay, 1, 1, { type: [5, 3], opacity: 0.9 }), ...overlaySeries },
        {
          ...line('bands', C.bands, 1, 2),
          ...bandSeries,
          markLine: {
            ...bandSeries.markLine,
            silent: true,
            symbol: 'none',
            label: { show: false },
            lineStyle: { color: C.zero, width: 1, type: 'solid' },
            animation: false,
          },
          markArea: { ...bandSeries.markArea, silent: true, itemStyle: { color: C.belowZero }, animation: false },
        },
        { ...line('highlight-branch', C.highlight, 2.25, 3), ...hlSeries },
        scatter('measured', points(measured), MEASURED_SYMBOL, 7, C.measured, 4, {
          itemStyle: { color: 'rgba(255,255,255,0.9)', borderColor: C.measured, borderWidth: 1.5 },
        }),
        ...SEVERITIES.slice()
          .reverse()
          .map((sev, i) => {
            const look = SEVERITY_LOOK[sev];
            const extra =
              look.glyph === 'ring'
                ? { itemStyle: { color: '#ffffff', borderColor: look.color, borderWidth: 2.25 } }
                : {};
            return scatter(`finding-${sev}`, points(bySeverity[sev]), look.symbol, look.size, look.color, 5 + i, extra);
          }),
        scatter('highlight-point', halo, 'circle', 22, 'rgba(192, 97, 44, 0.12)', 9, {
          itemStyle: { color: 'rgba(192, 97, 44, 0.12)', borderColor: C.highlight, borderWidth: 2 },
        }),
      ],
    },
    points: n,
    view: { option, parts, points: n } as ViewOption,
  };
}
