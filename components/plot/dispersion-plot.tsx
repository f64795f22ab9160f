'use client';

/**
 * The dispersion plot. ECharts draws the axes, rules and markers; the branch lines are our own
 * min/max decimation per pixel column, rasterized into one image per redraw (line-painter.ts);
 * zoom and pan are ours (re-decimating the visible range), and so is the readout, by binary
 * search. The chart instance is held directly and fed with `setOption` merges, so React
 * renders never hand ECharts millions of values to compare.
 */
import { LineChart, ScatterChart } from 'echarts/charts';
import { GraphicComponent, GridComponent, MarkAreaComponent, MarkLineComponent } from 'echarts/components';
import * as echarts from 'echarts/core';
import { CanvasRenderer } from 'echarts/renderers';
import { useCallback, useEffect, useImperativeHandle, useLayoutEffect, useMemo, useRef, useState, type Ref } from 'react';
import { cx } from '@/components/ui/cx';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { unitFactor } from '@/lib/physics/units';
import { visibleRange } from '@/lib/plot/decimate';
import { axisMarks } from '@/lib/plot/path-axis';
import { frequencyAt, nearestPoint, qAt } from '@/lib/plot/readout';
import { clampView, paddedRange, panView, sameView, zoomView, type View, type ViewLimits } from '@/lib/plot/view';
import type { PlotData } from '@/lib/plot/wire';
import { createLinePainter } from './line-painter';
import { PlotControls } from './plot-controls';
import { fullOption, GRID, sameFinding, zoomOption, type DecimationBuffers, type LinePainter, type MeasuredPoint, type PlotFinding, type Scene, type ViewOption } from './plot-option';
import { PlotCursor, PlotReadout, type ReadoutPoint } from './plot-readout';
import { PLOT_COLORS } from './plot-style';
import { plotSummary } from './plot-summary';

echarts.use([LineChart, ScatterChart, GridComponent, GraphicComponent, MarkLineComponent, MarkAreaComponent, CanvasRenderer]);

export type { MeasuredPoint, PlotFinding } from './plot-option';

export interface PlotPoint {
  index: number;
  branch: number;
  frequencyTHz: number;
  /** Path distance of the point. */
  distance: number;
  q: ReturnType<typeof qAt>;
}

export interface PlotRenderInfo {
  /** 'first': the first drawing after mount or new data; 'view': zoom, pan, unit or markers. */
  kind: 'first' | 'view';
  /** From the start of decimation to the chart's `finished` event. */
  ms: number;
  /** Points handed to the chart (decimated). */
  points: number;
  /** Where the time went, ms: our decimation and option building; the chart's setOption through its paint. */
  phases?: { build: number; chart: number };
}

export interface DispersionPlotHandle {
  /** Zoom by `factor` (< 1 zooms in) about x (default: the centre of the view), along x. */
  zoom(factor: number, x?: number): void;
  reset(): void;
  getView(): View;
  setView(v: Partial<View>): void;
}

export interface DispersionPlotProps {
  data: PlotData;
  findings?: readonly PlotFinding[];
  /** One finding to emphasise: its branch is drawn strong, a halo marks the point, and the view pans to it. */
  highlight?: PlotFinding | null;
  /** A second dispersion drawn dashed (revision compare). */
  overlay?: PlotData | null;
  overlayLabel?: string;
  measured?: readonly MeasuredPoint[];
  /** Controlled unit; leave undefined to let the plot keep its own. */
  unit?: FrequencyUnit;
  defaultUnit?: FrequencyUnit;
  onUnitChange?: (u: FrequencyUnit) => void;
  onPointClick?: (p: PlotPoint) => void;
  onRendered?: (info: PlotRenderInfo) => void;
  /** Caption above the plot; default: a summary of the data. */
  caption?: string;
  height?: number;
  /** Most points drawn for the branches before the decimation columns widen (default 600,000). */
  pointBudget?: number;
  className?: string;
  ref?: Ref<DispersionPlotHandle>;
}

/** Narrowest decimation column, px: 2 keeps every extreme visible at half the points. */
const COLUMN_PX = 2;
/**
 * Most points handed to the chart for the branches; past it the columns widen. The envelope
 * still keeps every extreme; only the path between extremes inside a wider column is
 * straightened, invisible under a thousand overlapping branches. Drawing cost grows with points.
 */
const DEFAULT_POINT_BUDGET = 600_000;
/** A click farther than this from the nearest line selects nothing. */
const CLICK_RADIUS_PX = 12;

export function DispersionPlot({
  data,
  findings = [],
  highlight = null,
  overlay = null,
  overlayLabel = 'Compared revision',
  measured = [],
  unit: unitProp,
  defaultUnit = 'THz',
  onUnitChange,
  onPointClick,
  onRendered,
  caption,
  height = 480,
  pointBudget = DEFAULT_POINT_BUDGET,
  className,
  ref,
}: DispersionPlotProps) {
  const hostRef = useRef<HTMLDivElement>(null);
  const chartRef = useRef<echarts.ECharts | null>(null);
  const [ownUnit, setOwnUnit] = useState<FrequencyUnit>(defaultUnit);
  const unit = unitProp ?? ownUnit;
  const factor = unitFactor(unit);

  const marks = useMemo(() => axisMarks(data), [data]);
  const limits = useMemo<ViewLimits>(() => fullLimits(data, overlay), [data, overlay]);
  const viewRef = useRef<View>(limits.full);
  const [zoomed, setZoomed] = useState(false);
  const [cursor, setCursor] = useState<ReadoutPoint | null>(null);
  // The keyboard cursor: which point (ref, for handlers) and where it is drawn (state).
  const keyCursor = useRef<{ index: number; branch: number } | null>(null);
  const [keyPoint, setKeyPoint] = useState<ReadoutPoint | null>(null);

  // New data: back to the full view, nothing under the cursor (state adjusted while rendering).
  const [stateFor, setStateFor] = useState(data);
  if (stateFor !== data) {
    setStateFor(data);
    setZoomed(false);
    setCursor(null);
    setKeyPoint(null);
  }

  // Latest inputs for event handlers and the render loop, without re-binding them. Layout
  // effects run before the effects below that draw.
  const sceneRef = useRef<Omit<Scene, 'view' | 'columns'>>({ data, overlay, findings, highlight, measured, unit, factor, marks });
  const pointBudgetRef = useRef(pointBudget);
  const cbRef = useRef({ onPointClick, onRendered });
  useLayoutEffect(() => {
    sceneRef.current = { data, overlay, findings, highlight, measured, unit, factor, marks };
    pointBudgetRef.current = pointBudget;
    cbRef.current = { onPointClick, onRendered };
  });

  // Timing: set before a setOption, read in the `finished` handler.
  const pending = useRef<{ t0: number; kind: PlotRenderInfo['kind']; points: number; build: number } | null>(null);
  const frame = useRef(0);
  const drawnData = useRef<PlotData | null>(null);
  const drawnInputs = useRef<unknown[]>([]);
  // Decimation arrays reused from one redraw to the next, and what the chart was last given.
  const buffers = useRef<DecimationBuffers>({});
  const drawnView = useRef<ViewOption | null>(null);
  const painter = useRef<LinePainter | null>(null);

  const columns = () => {
    const chart = chartRef.current;
    const w = chart ? chart.getWidth() - GRID.left - GRID.right : 1000;
    const { data: d, overlay: o } = sceneRef.current;
    const lines = d.nb + (o?.nb ?? 0);
    // Two points per branch per column, plus the run ends.
    const byBudget = Math.floor(pointBudgetRef.current / Math.max(1, 2 * lines));
    return Math.max(50, Math.min(Math.floor(w / COLUMN_PX), byBudget));
  };

  const draw = useCallback((mode: 'full' | 'view') => {
    const chart = chartRef.current;
    if (!chart) return;
    const t0 = performance.now();
    const scene: Scene = {
      ...sceneRef.current,
      view: viewRef.current,
      columns: columns(),
      buffers: buffers.current,
      painter: painter.current,
      size: { width: chart.getWidth(), height: chart.getHeight() },
    };
    const first = drawnData.current !== scene.data;
    const before = drawnView.current;
    // A zoom or pan hands the chart only the new limits and lines; anything else redraws it all.
    const built = mode === 'full' || first || !before ? fullOption(scene) : zoomOption(scene, before);
    drawnView.current = built.view;
    const t1 = performance.now();
    // Drawings that land in one paint are timed from the earliest.
    const prev = pending.current;
    const p = prev
      ? { ...prev, points: built.points, build: prev.build + (t1 - t0) }
      : { t0, kind: first ? ('first' as const) : ('view' as const), points: built.points, build: t1 - t0 };
    pending.current = p;
    drawnData.current = scene.data;
    // Paints before returning: `finished` usually fires inside this call.
    chart.setOption(built.option as echarts.EChartsCoreOption, { lazyUpdate: false, silent: true });
  }, []);

  // Coalesce wheel and drag bursts into one redraw per animation frame.
  const schedule = useCallback(() => {
    if (frame.current) return;
    frame.current = requestAnimationFrame(() => {
      frame.current = 0;
      draw('view');
    });
  }, [draw]);

  const setView = useCallback(
    (v: View) => {
      viewRef.current = clampView(v, limits);
      setZoomed(!sameView(viewRef.current, limits.full));
      setCursor(null);
      schedule();
    },
    [limits, schedule],
  );

  // Mount: one chart for the component's life.
  useEffect(() => {
    const host = hostRef.current!;
    const chart = echarts.init(host, null, { renderer: 'canvas' });
    chartRef.current = chart;
    painter.current = createLinePainter();
    chart.on('finished', () => {
      const p = pending.current;
      if (!p) return;
      pending.current = null;
      // The keyboard cursor follows the drawing (view or unit may have moved it).
      const k = keyCursor.current;
      if (k) placeKey(k.index, k.branch);
      const ms = performance.now() - p.t0;
      cbRef.current.onRendered?.({
        kind: p.kind,
        ms,
        points: p.points,
        phases: { build: p.build, chart: ms - p.build },
      });
    });
    // The observer also reports the first size on observe: redraw only on a real change.
    let size = `${host.clientWidth}x${host.clientHeight}`;
    const ro = new ResizeObserver(() => {
      const now = `${host.clientWidth}x${host.clientHeight}`;
      if (now === size) return;
      size = now;
      chart.resize();
      schedule();
    });
    ro.observe(host);
    return () => {
      ro.disconnect();
      cancelAnimationFrame(frame.current);
      frame.current = 0;
      chart.dispose();
      chartRef.current = null;
      painter.current = null;
      drawnData.current = null;
      drawnView.current = null;
      buffers.current = {};
    };
    // placeKey reads refs and a state setter only: the first render's copy is as good as any.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [schedule]);

  // New data: back to the full view, draw everything.
  useEffect(() => {
    const sc = sceneRef.current;
    drawnInputs.current = [data, overlay, sc.unit, sc.findings, sc.measured, sc.highlight];
    viewRef.current = limits.full;
    keyCursor.current = null;
    draw('full');
  }, [data, overlay, limits, draw]);

  // Unit, markers or highlight: redraw everything but keep the view (skipped when the data
  // effect above has just drawn these very inputs).
  useEffect(() => {
    const inputs = [data, overlay, unit, findings, measured, highlight];
    const same = inputs.length === drawnInputs.current.length && inputs.every((v, i) => v === drawnInputs.current[i]);
    drawnInputs.current = inputs;
    if (!same && drawnData.current === data) draw('full');
  }, [data, overlay, unit, findings, measured, highlight, draw]);

  // A newly highlighted finding outside the view: pan to it, keeping the zoom.
  useEffect(() => {
    if (!highlight || highlight.index < 0 || highlight.index >= data.nq) return;
    const x = data.distance[highlight.index];
    const v = viewRef.current;
    if (x < v.x0 || x > v.x1) {
      const half = (v.x1 - v.x0) / 2;
      setView({ ...v, x0: x - half, x1: x + half });
    }
  }, [highlight, data, setView]);

  useImperativeHandle(
    ref,
    () => ({
      zoom(f, x) {
        const v = viewRef.current;
        setView(zoomView(v, f, { x: x ?? (v.x0 + v.x1) / 2, y: (v.y0 + v.y1) / 2 }, 'x', limits));
      },
      reset() {
        setView(limits.full);
      },
      getView() {
        return { ...viewRef.current };
      },
      setView(p) {
        setView({ ...viewRef.current, ...p });
      },
    }),
    [limits, setView],
  );

  // --- pointer: wheel zoom, drag pan, hover readout, click ---------------------------------

  const toData = (px: number, py: number): [number, number] | null => {
    const chart = chartRef.current;
    if (!chart || !chart.containPixel({ gridIndex: 0 }, [px, py])) return null;
    const [x, y] = chart.convertFromPixel({ gridIndex: 0 }, [px, py]) as number[];
    return [x, y / sceneRef.current.factor];
  };

  const toPixel = (x: number, fTHz: number): [number, number] | null => {
    const chart = chartRef.current;
    if (!chart) return null;
    return chart.convertToPixel({ gridIndex: 0 }, [x, fTHz * sceneRef.current.factor]) as [number, number];
  };

  const pointAt = (px: number, py: number): ReadoutPoint | null => {
    const at = toData(px, py);
    if (!at) return null;
    const d = sceneRef.current.data;
    const v = viewRef.current;
    const [i0, i1] = visibleRange(d.distance, v.x0, v.x1);
    const hit = nearestPoint(d, at[0], at[1], i0, i1 + 1);
    if (!hit) return null;
    const pix = toPixel(d.distance[hit.index], hit.frequency);
    if (!pix) return null;
    return { ...hit, distance: d.distance[hit.index], px: pix[0], py: pix[1], dist: Math.hypot(pix[0] - px, pix[1] - py) };
  };

  const drag = useRef<{ x: number; y: number; view: View; sx: number; sy: number; moved: boolean; id: number } | null>(null);
  const [dragging, setDragging] = useState(false);
  const hoverFrame = useRef(0);

  const local = (e: { clientX: number; clientY: number }) => {
    const r = hostRef.current!.getBoundingClientRect();
    return [e.clientX - r.left, e.clientY - r.top] as const;
  };

  // Wheel must be a non-passive native listener to keep the page from scrolling under the plot.
  useEffect(() => {
    const host = hostRef.current!;
    const onWheel = (e: WheelEvent) => {
      const [px, py] = local(e);
      const at = toData(px, py);
      if (!at) return;
      e.preventDefault();
      const f = Math.exp(Math.max(-1, Math.min(1, e.deltaY / 300)));
      const axes = e.shiftKey ? 'y' : e.altKey ? 'xy' : 'x';
      setView(zoomView(viewRef.current, f, { x: at[0], y: at[1] }, axes, limits));
    };
    host.addEventListener('wheel', onWheel, { passive: false });
    return () => host.removeEventListener('wheel', onWheel);
  }, [limits, setView]);

  const onPointerDown = (e: React.PointerEvent<HTMLDivElement>) => {
    if (e.button !== 0) return;
    const [px, py] = local(e);
    if (!toData(px, py)) return;
    // Data units per pixel, fixed for the whole drag so the spectrum follows the pointer.
    const v = viewRef.current;
    const p0 = toPixel(v.x0, v.y0);
    const p1 = toPixel(v.x1, v.y1);
    if (!p0 || !p1) return;
    const sx = (v.x1 - v.x0) / Math.max(1, p1[0] - p0[0]);
    const sy = (v.y1 - v.y0) / Math.max(1, p0[1] - p1[1]);
    drag.current = { x: px, y: py, view: v, sx, sy, moved: false, id: e.pointerId };
    e.currentTarget.setPointerCapture(e.pointerId);
  };

  const onPointerMove = (e: React.PointerEvent<HTMLDivElement>) => {
    const [px, py] = local(e);
    const g = drag.current;
    if (g) {
      if (!g.moved && Math.hypot(px - g.x, py - g.y) < 4) return;
      if (!g.moved) setDragging(true);
      g.moved = true;
      setView(panView(g.view, -(px - g.x) * g.sx, (py - g.y) * g.sy, limits));
      return;
    }
    if (hoverFrame.current) return;
    hoverFrame.current = requestAnimationFrame(() => {
      hoverFrame.current = 0;
      setCursor(pointAt(px, py));
    });
  };

  const onPointerUp = (e: React.PointerEvent<HTMLDivElement>) => {
    const g = drag.current;
    drag.current = null;
    setDragging(false);
    if (!g || g.id !== e.pointerId) return;
    e.currentTarget.releasePointerCapture(e.pointerId);
    if (g.moved) return;
    const [px, py] = local(e);
    const p = pointAt(px, py);
    if (p && p.dist <= CLICK_RADIUS_PX) {
      placeKey(p.index, p.branch);
      emitClick(p.index, p.branch);
    }
  };

  const emitClick = (index: number, branch: number) => {
    const d = sceneRef.current.data;
    cbRef.current.onPointClick?.({
      index,
      branch,
      frequencyTHz: frequencyAt(d, index, branch),
      distance: d.distance[index],
      q: qAt(d, index),
    });
  };

  // --- keyboard: a cursor that walks the points, zoom keys, Enter to select -----------------

  function placeKey(index: number, branch: number) {
    const d = sceneRef.current.data;
    keyCursor.current = { index, branch };
    const f = frequencyAt(d, index, branch);
    const pix = toPixel(d.distance[index], f);
    setKeyPoint({ index, branch, frequency: f, distance: d.distance[index], px: pix?.[0] ?? 0, py: pix?.[1] ?? 0, dist: 0 });
  }

  const onKeyDown = (e: React.KeyboardEvent<HTMLDivElement>) => {
    const v = viewRef.current;
    const d = data;
    const step = e.shiftKey ? 10 : 1;
    const start = () => {
      const [i0] = visibleRange(d.distance, v.x0, v.x1);
      const index = Math.min(d.nq - 1, i0 + 1);
      return { index, branch: Math.min(d.nb - 1, 0) };
    };
    const moveTo = (index: number, branch: number) => {
      const c = { index: Math.max(0, Math.min(d.nq - 1, index)), branch: Math.max(0, Math.min(d.nb - 1, branch)) };
      placeKey(c.index, c.branch);
      const x = d.distance[c.index];
      if (x < v.x0 || x > v.x1) {
        const half = (v.x1 - v.x0) / 2;
        setView({ ...v, x0: x - half, x1: x + half });
      }
    };
    const kc = keyCursor.current;
    switch (e.key) {
      case 'ArrowRight':
        if (kc) moveTo(kc.index + step, kc.branch);
        else moveTo(start().index, 0);
        break;
      case 'ArrowLeft':
        if (kc) moveTo(kc.index - step, kc.branch);
        else moveTo(start().index, 0);
        break;
      case 'ArrowUp':
        if (kc) moveTo(kc.index, kc.branch + step);
        else moveTo(start().index, 0);
        break;
      case 'ArrowDown':
        if (kc) moveTo(kc.index, kc.branch - step);
        else moveTo(start().index, 0);
        break;
      case 'Enter':
      case ' ':
        if (kc) emitClick(kc.index, kc.branch);
        else return;
        break;
      case '+':
      case '=':
        setView(zoomView(v, 0.7, { x: kc ? d.distance[kc.index] : (v.x0 + v.x1) / 2, y: (v.y0 + v.y1) / 2 }, 'x', limits));
        break;
      case '-':
      case '_':
        setView(zoomView(v, 1 / 0.7, { x: kc ? d.distance[kc.index] : (v.x0 + v.x1) / 2, y: (v.y0 + v.y1) / 2 }, 'x', limits));
        break;
      case '0':
        setView(limits.full);
        break;
      case 'Escape':
        keyCursor.current = null;
        setKeyPoint(null);
        break;
      default:
        return;
    }
    e.preventDefault();
  };

  const changeUnit = (u: FrequencyUnit) => {
    if (unitProp === undefined) setOwnUnit(u);
    onUnitChange?.(u);
  };

  const counts = useMemo(() => {
    const c = { info: 0, warn: 0, fail: 0 };
    for (const f of findings) c[f.severity]++;
    return c;
  }, [findings]);
  const summary = useMemo(() => caption ?? plotSummary(data, marks, counts, unit), [caption, data, marks, counts, unit]);
  const shown = cursor ?? keyPoint;
  const highlightedHere = highlight && findings.some((f) => sameFinding(f, highlight));

  return (
    <figure className={cx('flex flex-col gap-2', className)} data-testid="dispersion-plot">
      <figcaption className="text-sm text-paper-700">{summary}</figcaption>
      <PlotControls
        unit={unit}
        onUnit={changeUnit}
        zoomed={zoomed}
        onZoomIn={() => {
          const v = viewRef.current;
          setView(zoomView(v, 0.5, { x: (v.x0 + v.x1) / 2, y: (v.y0 + v.y1) / 2 }, 'x', limits));
        }}
        onZoomOut={() => {
          const v = viewRef.current;
          setView(zoomView(v, 2, { x: (v.x0 + v.x1) / 2, y: (v.y0 + v.y1) / 2 }, 'x', limits));
        }}
        onReset={() => setView(limits.full)}
        counts={counts}
        hasOverlay={overlay !== null}
        overlayLabel={overlayLabel}
        hasMeasured={measured.length > 0}
        highlight={highlightedHere ? highlight : null}
      />
      <div className="relative overflow-hidden rounded-md border border-paper-300 bg-paper-0 shadow-panel">
        <div
          ref={hostRef}
          role="application"
          aria-roledescription="dispersion plot"
          aria-label={`${summary} Arrow keys move a cursor along q and across branches,${onPointClick ? ' Enter opens the point,' : ''} plus and minus zoom, 0 resets.`}
          tabIndex={0}
          onKeyDown={onKeyDown}
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerUp}
          onPointerLeave={() => {
            if (!drag.current) setCursor(null);
          }}
          className={cx('w-full touch-none select-none outline-none focus-visible:ring-2 focus-visible:ring-ember-500', dragging ? 'cursor-grabbing' : 'cursor-crosshair')}
          style={{ height, background: PLOT_COLORS.background }}
          data-testid="dispersion-plot-canvas"
        />
        {shown && <PlotCursor point={shown} height={height} />}
        <PlotReadout point={shown} data={data} unit={unit} factor={factor} findings={findings} />
      </div>
      <p className="text-2xs text-paper-600">
        {/* Only offer clicking where a click does something (an observer cannot open threads). */}
        Wheel zooms along q (Shift: frequency, Alt: both) · drag pans{onPointClick ? ' · click a line to open that point' : ''} · keys: ← → ↑ ↓,
        {onPointClick ? ' Enter,' : ''} + − 0
      </p>
    </figure>
  );
}

function fullLimits(d: PlotData, overlay: PlotData | null): ViewLimits {
  let lo = Infinity;
  let hi = -Infinity;
  for (const src of overlay ? [d, overlay] : [d]) {
    const f = src.frequencies;
    for (let i = 0; i < f.length; i++) {
      const v = f[i];
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  if (!Number.isFinite(lo)) {
    lo = 0;
    hi = 1;
  }
  const x0 = d.nq ? d.distance[0] : 0;
  let x1 = d.nq ? d.distance[d.nq - 1] : 1;
  if (!(x1 > x0)) x1 = x0 + 1;
  const { y0, y1 } = paddedRange(lo, hi);
  const spacing = d.nq > 1 ? (x1 - x0) / (d.nq - 1) : 1;
  return { full: { x0, x1, y0, y1 }, minSpanX: 4 * spacing, minSpanY: Math.max(1e-3, (y1 - y0) * 1e-4) };
}
