'use client';

import { LineChart } from 'echarts/charts';
import { GridComponent } from 'echarts/components';
import * as echarts from 'echarts/core';
import { CanvasRenderer } from 'echarts/renderers';
import { useEffect, useImperativeHandle, useLayoutEffect, useRef, type Ref } from 'react';
import type { PlotRenderInfo } from '@/components/plot/dispersion-plot';
import { connectedRuns } from '@/lib/plot/path-breaks';
import type { PlotData } from '@/lib/plot/wire';

echarts.use([LineChart, GridComponent, CanvasRenderer]);

/**
 * The comparison for the benchmark: the same data drawn by ECharts alone, one line series per
 * branch (typed arrays, NaN at path breaks), zoom by axis limits. No decimation of ours.
 */
export function NaivePlot({
  data,
  onRendered,
  height,
  ref,
}: {
  data: PlotData;
  height: number;
  onRendered: (i: PlotRenderInfo) => void;
  ref?: Ref<{ zoom(f: number): void; reset(): void }>;
}) {
  const host = useRef<HTMLDivElement>(null);
  const chart = useRef<echarts.ECharts | null>(null);
  const pending = useRef<{ t0: number; kind: PlotRenderInfo['kind'] } | null>(null);
  const view = useRef({ x0: 0, x1: 1 });
  const cb = useRef(onRendered);
  useLayoutEffect(() => {
    cb.current = onRendered;
  });
  const points = data.nq * data.nb;

  useEffect(() => {
    const c = echarts.init(host.current!, null, { renderer: 'canvas' });
    chart.current = c;
    c.on('finished', () => {
      const p = pending.current;
      if (!p) return;
      pending.current = null;
      cb.current({ kind: p.kind, ms: performance.now() - p.t0, points });
    });
    const runs = connectedRuns(data.breaks, data.nq);
    const series = [];
    const t0 = performance.now();
    for (let k = 0; k < data.nb; k++) {
      const xy = new Float64Array(2 * (data.nq + runs.length));
      let p = 0;
      for (const [a, b] of runs) {
        for (let i = a; i <= b; i++) {
          xy[p++] = data.distance[i];
          xy[p++] = data.frequencies[k * data.nq + i];
        }
        xy[p++] = NaN;
        xy[p++] = NaN;
      }
      series.push({ type: 'line', dimensions: ['x', 'y'], data: xy, showSymbol: false, silent: true, animation: false, lineStyle: { width: 1, color: '#0e3434' } });
    }
    view.current = { x0: data.distance[0], x1: data.distance[data.nq - 1] };
    pending.current = { t0, kind: 'first' };
    c.setOption({
      animation: false,
      grid: { left: 64, right: 20, top: 16, bottom: 36 },
      xAxis: { type: 'value', min: view.current.x0, max: view.current.x1 },
      yAxis: { type: 'value' },
      series,
    });
    return () => {
      c.dispose();
      chart.current = null;
    };
  }, [data, points]);

  useImperativeHandle(ref, () => {
    const apply = () => {
      pending.current = { t0: performance.now(), kind: 'view' };
      chart.current?.setOption({ xAxis: { min: view.current.x0, max: view.current.x1 } });
    };
    return {
      zoom(f) {
        const { x0, x1 } = view.current;
        const c = (x0 + x1) / 2;
        const h = ((x1 - x0) * f) / 2;
        view.current = { x0: c - h, x1: c + h };
        apply();
      },
      reset() {
        view.current = { x0: data.distance[0], x1: data.distance[data.nq - 1] };
        apply();
      },
    };
  }, [data]);

  return <div ref={host} className="w-full rounded-md border border-paper-300 bg-paper-0" style={{ height }} />;
}
