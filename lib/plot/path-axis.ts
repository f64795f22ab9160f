/**
 * The x axis of a band path: one tick per labelled position (high-symmetry points), with the
 * labels of points that share a distance joined, e.g. "X|K" where the path jumps.
 */
import type { PlotData } from './wire';

export interface AxisMark {
  /** Path distance. */
  x: number;
  /** Text under the axis, e.g. "Γ" or "X|K". */
  text: string;
  /** True where the path is broken at this position. */
  isBreak: boolean;
}

/** Labels as written in files ("G", "Gamma", "\\Gamma") shown as Γ; others kept. */
export function displayLabel(label: string): string {
  const t = label.trim();
  if (/^(g|gamma|\\gamma|γ|Γ)$/i.test(t)) return 'Γ';
  return t;
}

export function axisMarks(d: Pick<PlotData, 'distance' | 'labels' | 'segments' | 'breaks' | 'nq'>): AxisMark[] {
  const { distance } = d;
  const at = new Map<number, string[]>();
  const add = (index: number, label: string | undefined) => {
    if (label === undefined || label === '' || index < 0 || index >= d.nq) return;
    const parts = label.split('|').map(displayLabel).filter(Boolean);
    const list = at.get(index) ?? [];
    for (const p of parts) if (list[list.length - 1] !== p) list.push(p);
    at.set(index, list);
  };
  for (const l of d.labels) add(l.index, l.label);
  for (const s of d.segments) {
    add(s.start, s.from);
    add(s.end, s.to);
  }
  const breakAfter = new Set(d.breaks);
  // Group by distance: the two sides of a break (or a repeated point) share one tick.
  const indices = [...at.keys()].sort((a, b) => a - b);
  const marks: AxisMark[] = [];
  const tol = 1e-9 * Math.max(1, Math.abs(distance[d.nq - 1] ?? 1));
  for (const i of indices) {
    const x = distance[i];
    const last = marks[marks.length - 1];
    const texts = at.get(i)!;
    const isBreak = breakAfter.has(i) || breakAfter.has(i - 1);
    if (last && Math.abs(last.x - x) <= tol) {
      const have = last.text.split('|');
      for (const t of texts) if (!have.includes(t)) have.push(t);
      last.text = have.join('|');
      last.isBreak ||= isBreak;
    } else {
      marks.push({ x, text: texts.join('|'), isBreak });
    }
  }
  return marks;
}
