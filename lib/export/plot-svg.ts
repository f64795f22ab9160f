/**
 * The dispersion plot as a standalone SVG, drawn on the server with ECharts' SSR renderer (no
 * DOM): branches as lines, gaps at path breaks, high-symmetry labels on the x axis with
 * vertical rules. Big spectra are decimated first (lib/plot/decimate: per pixel column min/max
 * of each run) into one joined series, so the file stays small and the picture stays exact
 * to a column. PNG is made in the browser from the page's own chart instance, not here.
 */
import * as echarts from 'echarts';
import type { Dispersion, FrequencyUnit } from '@/lib/dispersion/types';
import { pathGeometry } from '@/lib/physics/path';
import { fromTHz } from '@/lib/physics/units';
import { decimate } from '@/lib/plot/decimate';
import { axisMarks } from '@/lib/plot/path-axis';
import { pathBreaks } from '@/lib/plot/path-breaks';

export interface SvgOptions {
  width?: number;
  height?: number;
  units?: FrequencyUnit;
  title?: string;
}

const unitName: Record<FrequencyUnit, string> = { THz: 'Frequency (THz)', 'cm-1': 'Frequency (cm⁻¹)', meV: 'Energy (meV)' };

export function dispersionSvg(d: Dispersion, options: SvgOptions = {}): string {
  const width = options.width ?? 1000;
  const height = options.height ?? 600;
  const units = options.units ?? 'THz';
  const mesh = d.kind === 'mesh';
  const x = mesh ? Float64Array.from({ length: d.nq }, (_, i) => i) : pathGeometry(d).distance;
  const breaks = mesh ? [] : pathBreaks(d.segments, d.nq);

  // decimate() reads branch-major values; the Dispersion is point-major.
  const y = new Float64Array(d.nq * d.nb);
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < d.nq; i++) {
    for (let k = 0; k < d.nb; k++) {
      const v = d.frequencies[i * d.nb + k];
      y[k * d.nq + i] = v;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  const x0 = x[0] ?? 0;
  const x1 = x[d.nq - 1] ?? 1;
  const scale = fromTHz(1, units);
  const { xy, points } = decimate({ x, y, nq: d.nq, nb: d.nb, breaks }, { x0, x1, columns: Math.max(50, Math.round(width / 2)) }, { scale });
  const data: [number, number][] = new Array(points);
  for (let p = 0; p < points; p++) data[p] = [xy[2 * p], xy[2 * p + 1]];

  const labels = [...d.labels].map(([index, label]) => ({ index, label }));
  const marks = mesh ? [] : axisMarks({ distance: x instanceof Float64Array ? x : Float64Array.from(x), labels, segments: d.segments, breaks, nq: d.nq });
  const markText = new Map(marks.map((m) => [m.x, m.text]));
  const pad = (hi - lo) * 0.04 || 1;

  const chart = echarts.init(null, null, { renderer: 'svg', ssr: true, width, height });
  try {
    chart.setOption({
      animation: false,
      title: options.title ? { text: options.title, left: 'center', top: 8, textStyle: { fontSize: 14, fontWeight: 'normal' } } : undefined,
      grid: { left: 70, right: 24, top: options.title ? 40 : 20, bottom: 48 },
      xAxis: {
        type: 'value',
        min: x0,
        max: x1,
        name: mesh ? 'Mesh point' : undefined,
        nameLocation: 'middle',
        nameGap: 28,
        splitLine: { show: false },
        axisLabel: marks.length
          ? { customValues: marks.map((m) => m.x), formatter: (v: number) => markText.get(v) ?? '', fontSize: 13 }
          : { show: mesh },
        axisTick: marks.length ? { customValues: marks.map((m) => m.x) } : { show: mesh },
      },
      yAxis: {
        type: 'value',
        name: unitName[units],
        nameLocation: 'middle',
        nameGap: 50,
        min: Number(((lo - pad) * scale).toPrecision(3)),
        max: Number(((hi + pad) * scale).toPrecision(3)),
        splitLine: { lineStyle: { color: '#e4e8e6' } },
      },
      series: [
        {
          type: 'line',
          data,
          showSymbol: false,
          connectNulls: false,
          silent: true,
          lineStyle: { width: 1.1, color: '#1f4d46' },
          markLine: marks.length
            ? { silent: true, symbol: 'none', label: { show: false }, lineStyle: { color: '#8a9a95', type: 'solid', width: 0.8 }, data: marks.map((m) => ({ xAxis: m.x })) }
            : undefined,
        },
        // The zero line: frequencies below it are imaginary modes.
        { type: 'line', data: [[x0, 0], [x1, 0]], showSymbol: false, silent: true, lineStyle: { width: 0.8, color: '#b0413e', type: 'dashed' } },
      ],
    });
    return chart.renderToSVGString();
  } finally {
    chart.dispose();
  }
}
