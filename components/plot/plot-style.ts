/**
 * The plot's own look: colours from the app's palette (tailwind.config.ts), and one marker
 * shape per severity so no meaning rests on colour alone.
 */
import type { GlyphShape } from '@/components/ui/glyph';

export type Severity = 'info' | 'warn' | 'fail';

export const PLOT_COLORS = {
  background: '#ffffff',
  bands: '#0e3434', // ink-900
  axis: '#5a5246', // paper-700
  axisLabel: '#3f3a32', // paper-800
  rule: '#bdb3a2', // paper-400: vertical rules at labelled points
  breakRule: '#736a5b', // paper-600: rules where the path jumps
  grid: '#ebe5da', // paper-200
  zero: '#948a79', // paper-500
  belowZero: 'rgba(185, 60, 51, 0.05)', // brick-600, faint: the imaginary side
  overlay: '#c0612c', // ember-500
  highlight: '#c0612c', // ember-500
  measured: '#2a2621', // paper-900
  cursor: '#a14e22', // ember-600
} as const;

export interface SeverityLook {
  color: string;
  /** ECharts symbol. */
  symbol: string;
  size: number;
  /** The same shape for HTML legends and lists. */
  glyph: GlyphShape;
  word: string;
}

// A bold saltire drawn as one filled outline (ECharts fills path symbols).
const CROSS = 'path://M2,0 L5,3 L8,0 L10,2 L7,5 L10,8 L8,10 L5,7 L2,10 L0,8 L3,5 L0,2 Z';

export const SEVERITY_LOOK: Record<Severity, SeverityLook> = {
  info: { color: '#226a69', symbol: 'circle', size: 10, glyph: 'ring', word: 'Info' }, // ink-600
  warn: { color: '#96700a', symbol: 'triangle', size: 11, glyph: 'triangle', word: 'Warning' }, // ochre-600
  fail: { color: '#b93c33', symbol: CROSS, size: 11, glyph: 'cross', word: 'Fail' }, // brick-600
};

export const SEVERITIES: readonly Severity[] = ['fail', 'warn', 'info'];

export const MEASURED_SYMBOL = 'rect';
