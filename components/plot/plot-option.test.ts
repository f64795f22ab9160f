import { describe, expect, it } from 'vitest';
import { THZ_TO_CM1 } from '@/lib/physics/units';
import { axisMarks } from '@/lib/plot/path-axis';
import { syntheticBands } from '@/lib/plot/synthetic-bands';
import { decodePlotData, encodePlotData } from '@/lib/plot/wire';
import { findingY, fullOption, GRID, sameFinding, viewOption, zoomOption, type LinePainter, type PaintLayer, type Scene } from './plot-option';
import { SEVERITY_LOOK } from './plot-style';

function scene(over: Partial<Scene> = {}): Scene {
  const { dispersion, geometry } = syntheticBands({ branches: 6, points: 240, softMode: true });
  const data = decodePlotData(encodePlotData(dispersion, geometry, { frequencies: 'f64' }));
  return {
    data,
    overlay: null,
    findings: [],
    highlight: null,
    measured: [],
    unit: 'THz',
    factor: 1,
    view: { x0: data.distance[0], x1: data.distance[data.nq - 1], y0: -1, y1: 50 },
    columns: 100,
    marks: axisMarks(data),
    ...over,
  };
}

type Series = { id: string; data: Float64Array; symbol?: string; markLine?: { data: Array<{ xAxis?: number; yAxis?: number }> } };

describe('plot options', () => {
  it('puts each finding on its branch, in the series of its severity with that severity’s shape', () => {
    const s = scene();
    const f = { severity: 'fail' as const, index: 100, branch: 0, value: -3 };
    const w = { severity: 'warn' as const, index: 10, branch: null, value: 2.5 };
    const { option } = fullOption({ ...s, findings: [f, w] });
    const series = option.series as Series[];
    const fail = series.find((x) => x.id === 'finding-fail')!;
    const warn = series.find((x) => x.id === 'finding-warn')!;
    expect(fail.symbol).toBe(SEVERITY_LOOK.fail.symbol);
    expect(warn.symbol).toBe(SEVERITY_LOOK.warn.symbol);
    expect([...fail.data]).toEqual([s.data.distance[100], s.data.frequencies[100]]);
    // No branch: drawn at the finding's value.
    expect([...warn.data]).toEqual([s.data.distance[10], 2.5]);
    expect(findingY(s.data, { severity: 'info', index: 9999, branch: 0 })).toBeNull();
    // About the whole point, with no value: on the lowest branch there, not left out.
    expect(findingY(s.data, { severity: 'info', index: 45, branch: null, value: null })).toBe(s.data.frequencies[45]);
    // Three different shapes: meaning never rests on colour alone.
    expect(new Set(Object.values(SEVERITY_LOOK).map((l) => l.symbol)).size).toBe(3);
  });

  it('scales the lines, markers and axis limits to the chosen unit', () => {
    const s = scene();
    const thz = viewOption(s).option;
    const cm = viewOption({ ...s, unit: 'cm-1', factor: THZ_TO_CM1 }).option;
    const a = (thz.series as Series[])[1].data;
    const b = (cm.series as Series[])[1].data;
    expect(b.length).toBe(a.length);
    expect(b[1]).toBeCloseTo(a[1] * THZ_TO_CM1, 9);
    expect(cm.yAxis[0].max).toBeCloseTo(50 * THZ_TO_CM1, 9);
    expect(cm.yAxis[0].name).toBe('Frequency (cm⁻¹)');
  });

  it('labels the axis at the high-symmetry points and rules the path break', () => {
    const s = scene();
    const { option } = viewOption(s);
    const values = option.xAxis[0].axisLabel.customValues;
    expect(values.length).toBe(s.marks.length);
    expect(option.xAxis[0].axisLabel.formatter(s.marks[0].x)).toBe('Γ');
    const brk = s.marks.find((m) => m.isBreak)!;
    expect(brk.text).toBe('K|U');
    const lines = (option.series as Series[])[1].markLine!.data;
    expect(lines).toContainEqual(expect.objectContaining({ xAxis: brk.x }));
    expect(lines).toContainEqual({ yAxis: 0 });
  });

  it('draws the highlighted finding’s branch as its own series, matched by id', () => {
    const s = scene();
    const h = { id: 7, severity: 'warn' as const, index: 5, branch: 2 };
    expect(sameFinding(h, { id: 7, severity: 'fail', index: 0, branch: 0 })).toBe(true);
    const hl = (viewOption({ ...s, highlight: h }).option.series as Series[])[2].data;
    expect(hl.length).toBeGreaterThan(0);
    expect(hl[1]).toBe(s.data.frequencies[2 * s.data.nq]);
  });
});

describe('zoom option', () => {
  it('hands the chart only the new limits and lines when nothing else changed', () => {
    const s = scene();
    const full = fullOption(s);
    const span = s.view.x1 - s.view.x0;
    // The break stays in view, the zero line too.
    const z = zoomOption({ ...s, view: { ...s.view, x0: s.view.x0 + span / 4 } }, full.view);
    expect(z.option.xAxis).toEqual([{ id: 'q', min: s.view.x0 + span / 4, max: s.view.x1 }]);
    expect(z.option.yAxis).toEqual([{ id: 'f', min: -1, max: 50 }]);
    // No overlay, no highlighted branch: only the bands, and its markers did not change.
    const series = z.option.series as Series[];
    expect(series.map((x) => x.id)).toEqual(['bands']);
    expect(Object.keys(series[0]).sort()).toEqual(['data', 'id']);
    expect(series[0].data.length).toBeGreaterThan(0);
  });

  it('sends the markers and the label format again when the view changes them', () => {
    const s = scene();
    const full = fullOption(s);
    const brk = s.marks.find((m) => m.isBreak)!;
    // Away from the break and above zero: no zero line, no break rule, and finer labels.
    const v = { x0: s.view.x0, x1: brk.x - 0.01, y0: 1, y1: 3 };
    const z = zoomOption({ ...s, view: v }, full.view);
    const bands = (z.option.series as Series[]).find((x) => x.id === 'bands')!;
    expect(bands.markLine!.data).toEqual([]);
    expect((z.option.yAxis[0] as { axisLabel?: { formatter(v: number): string } }).axisLabel!.formatter(2)).toBe('2.00');
  });

  it('reuses the decimation arrays from one zoom to the next', () => {
    const buffers = {};
    const s = scene({ buffers });
    const full = fullOption(s);
    const first = (full.option.series as Series[])[1].data.buffer;
    const span = s.view.x1 - s.view.x0;
    const z = zoomOption({ ...s, view: { ...s.view, x1: s.view.x0 + span / 2 } }, full.view);
    expect((z.option.series as Series[])[0].data.buffer).toBe(first);
  });
});

describe('painted lines', () => {
  it('hands the branches and the overlay to the painter, and places its image over the grid', () => {
    const s = scene();
    const calls: Array<{ layers: readonly PaintLayer[]; w: number; h: number; win: object }> = [];
    const image = { painted: true };
    const painter: LinePainter = (layers, win, w, h) => {
      calls.push({ layers, win, w, h });
      return image;
    };
    const full = fullOption({ ...s, overlay: s.data, painter, size: { width: 900, height: 480 }, factor: 2 });
    expect(calls).toHaveLength(1);
    const [{ layers, win, w, h }] = calls;
    // Overlay first (underneath), dashed; then the bands; in display units.
    expect(layers.map((l) => Boolean(l.dash))).toEqual([true, false]);
    expect(layers[1].points).toBeGreaterThan(0);
    expect(layers[1].xy[1]).toBeCloseTo(2 * s.data.frequencies[0], 9);
    expect(win).toEqual({ x0: s.view.x0, x1: s.view.x1, y0: -2, y1: 100 });
    expect([w, h]).toEqual([900 - GRID.left - GRID.right, 480 - GRID.top - GRID.bottom]);
    const graphic = (full.option as { graphic: { elements: Array<{ z: number; style: { image: unknown; x: number; y: number } }> } }).graphic;
    expect(graphic.elements[0].style).toMatchObject({ image, x: GRID.left, y: GRID.top });
    // Under every series.
    expect(Math.min(...(full.option.series as Array<{ z: number }>).map((x) => x.z))).toBeGreaterThanOrEqual(graphic.elements[0].z);
    // The chart's own line series are left empty, but the band series keeps its markers.
    const series = full.option.series as Series[];
    expect(series.find((x) => x.id === 'bands')!.data.length).toBe(0);
    expect(series.find((x) => x.id === 'overlay')!.data.length).toBe(0);
    expect(series.find((x) => x.id === 'bands')!.markLine!.data).toContainEqual({ yAxis: 0 });

    // A zoom paints again and sends only the limits and the new image.
    const span = s.view.x1 - s.view.x0;
    const z = zoomOption({ ...s, overlay: s.data, painter, size: { width: 900, height: 480 }, factor: 2, view: { ...s.view, x0: s.view.x0 + span / 4 } }, full.view);
    expect(calls).toHaveLength(2);
    expect(calls[1].win).toMatchObject({ x0: s.view.x0 + span / 4 });
    expect((z.option.series as Series[]).map((x) => x.id)).toEqual([]);
    expect((z.option as { graphic?: unknown }).graphic).toBeDefined();
  });
});
