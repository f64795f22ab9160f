/** The screening result shape shared by the checks, the command line and the API (screening.md). */

export type Severity = 'info' | 'warn' | 'fail';

export type CheckId =
  | 'imaginary-modes'
  | 'acoustic-gamma'
  | 'continuity'
  | 'zone-folding'
  | 'branch-count'
  | 'path-labels'
  | 'units-suspect';

export const CHECK_IDS: readonly CheckId[] = [
  'imaginary-modes',
  'acoustic-gamma',
  'continuity',
  'zone-folding',
  'branch-count',
  'path-labels',
  'units-suspect',
];

export interface Finding {
  check: CheckId;
  severity: Severity;
  /** 0-based segment, where it applies. */
  segment: number | null;
  /** 0-based q-point index in file order, where it applies. */
  index: number | null;
  /** 0-based rank of the frequency at that q-point (k-th lowest), where it applies. */
  branch: number | null;
  /** Folded q (fractional when known, else as given), where known. */
  q: number[] | null;
  /** THz, where it applies. */
  value: number | null;
  /** The threshold that was used. */
  limit: number | null;
  message: string;
}

export type Verdict = 'pass' | 'warn' | 'fail';

export interface FoldedPoint {
  index: number;
  q: number[];
  folded: number[];
}

export interface ScreeningResult {
  format: 'columns' | 'yaml';
  qpoints: number;
  branches: number;
  segments: number;
  verdict: Verdict;
  findings: Finding[];
  folded: FoldedPoint[];
}
