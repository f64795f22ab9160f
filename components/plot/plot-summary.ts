import type { FrequencyUnit } from '@/lib/dispersion/types';
import { unitFactor } from '@/lib/physics/units';
import type { AxisMark } from '@/lib/plot/path-axis';
import type { PlotData } from '@/lib/plot/wire';
import { UNIT_TEXT } from './plot-option';
import type { Severity } from './plot-style';

/** One sentence that says what the plot shows, for the caption and screen readers. */
export function plotSummary(d: PlotData, marks: readonly AxisMark[], counts: Record<Severity, number>, unit: FrequencyUnit): string {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < d.frequencies.length; i++) {
    const v = d.frequencies[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  const k = unitFactor(unit);
  const digits = unit === 'cm-1' ? 0 : 2;
  const path = marks.length ? ` along ${marks.map((m) => m.text).join('–')}` : '';
  const range = Number.isFinite(lo) ? `, ${(lo * k).toFixed(digits)} to ${(hi * k).toFixed(digits)} ${UNIT_TEXT[unit]}` : '';
  const total = counts.fail + counts.warn + counts.info;
  const flagged = total
    ? ` ${total} finding${total === 1 ? '' : 's'} marked: ${counts.fail} fail, ${counts.warn} warning, ${counts.info} info.`
    : ' No findings marked.';
  const title = d.title ? `${d.title}: ` : '';
  return `${title}${d.nb} branch${d.nb === 1 ? '' : 'es'} at ${d.nq} q-points${path}${range}.${flagged}`;
}
