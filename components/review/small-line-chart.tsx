'use client';

import ReactEChartsCore from 'echarts-for-react/lib/core';
import { LineChart } from 'echarts/charts';
import { GridComponent, LegendComponent, TooltipComponent } from 'echarts/components';
import * as echarts from 'echarts/core';
import { CanvasRenderer } from 'echarts/renderers';
import { useMemo } from 'react';
import { PLOT_COLORS } from '@/components/plot/plot-style';

echarts.use([LineChart, GridComponent, LegendComponent, TooltipComponent, CanvasRenderer]);

export interface SmallSeries {
  name: string;
  /** [x, y] pairs; a few hundred at most. */
  data: [number, number][];
  dashed?: boolean;
}

const PALETTE = [PLOT_COLORS.bands, PLOT_COLORS.overlay, '#5b6b2e', '#6a4c93'];

/** A small line chart for derived quantities: DOS, heat capacity, entropy, free energy. */
export function SmallLineChart({ series, xName, yName, label, height = 220 }: { series: SmallSeries[]; xName: string; yName: string; label: string; height?: number }) {
  const option = useMemo(
    () => ({
      animation: false,
      grid: { left: 56, right: 16, top: series.length > 1 ? 30 : 12, bottom: 40 },
      legend: series.length > 1 ? { top: 0, textStyle: { color: PLOT_COLORS.axisLabel, fontSize: 11 } } : undefined,
      tooltip: { trigger: 'axis', valueFormatter: (v: number) => (typeof v === 'number' ? v.toPrecision(4) : String(v)) },
      xAxis: { type: 'value', name: xName, nameLocation: 'middle', nameGap: 26, axisLine: { lineStyle: { color: PLOT_COLORS.axis } }, splitLine: { lineStyle: { color: PLOT_COLORS.grid } } },
      yAxis: { type: 'value', name: yName, nameLocation: 'middle', nameGap: 44, axisLine: { lineStyle: { color: PLOT_COLORS.axis } }, splitLine: { lineStyle: { color: PLOT_COLORS.grid } } },
      series: series.map((s, i) => ({
        type: 'line',
        name: s.name,
        data: s.data,
        showSymbol: false,
        lineStyle: { width: 1.5, color: PALETTE[i % PALETTE.length], type: s.dashed ? 'dashed' : 'solid' },
        itemStyle: { color: PALETTE[i % PALETTE.length] },
      })),
    }),
    [series, xName, yName],
  );
  return (
    <div role="img" aria-label={label}>
      <ReactEChartsCore echarts={echarts} option={option} style={{ height }} notMerge />
    </div>
  );
}
