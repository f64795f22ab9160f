/**
 * Screening: path geometry once, then every check, sorted findings and the verdict.
 * The same result goes to the command line, the API and the app (screening.md).
 */
import type { Dispersion } from '../dispersion/types';
import { parseBandFile } from '../parsers';
import { pathGeometry, type PathGeometry } from '../physics/path';
import { acousticGamma } from './acoustic-gamma';
import { branchCount } from './branch-count';
import { round, withScanMemo } from './common';
import { continuity } from './continuity';
import { imaginaryModes } from './imaginary-modes';
import { pathLabels } from './path-labels';
import { resolvePolicy, type DeepPartial, type Policy } from './policy';
import type { CheckId, Finding, ScreeningResult, Severity, Verdict } from './types';
import { unitsSuspect } from './units-suspect';
import { zoneFolding } from './zone-folding';

export type Check = (d: Dispersion, g: PathGeometry, policy: Policy) => Finding[];

/** Every check, in the order of screening.md. */
export const checks: Record<CheckId, Check> = {
  'imaginary-modes': imaginaryModes,
  'acoustic-gamma': acousticGamma,
  continuity,
  'zone-folding': zoneFolding,
  'branch-count': branchCount,
  'path-labels': pathLabels,
  'units-suspect': unitsSuspect,
};

const CHECK_ORDER = Object.keys(checks) as CheckId[];

/** Deterministic order: by q-point index (findings about the whole file first), then branch, then check. */
export function compareFindings(a: Finding, b: Finding): number {
  return (
    (a.index ?? -1) - (b.index ?? -1) ||
    (a.branch ?? -1) - (b.branch ?? -1) ||
    CHECK_ORDER.indexOf(a.check) - CHECK_ORDER.indexOf(b.check) ||
    (a.segment ?? -1) - (b.segment ?? -1) ||
    (a.message < b.message ? -1 : a.message > b.message ? 1 : 0)
  );
}

/** `fail` if any counted fail, else `warn` if any counted warn, else `pass`. Waived findings do not count. */
export function verdictOf(findings: readonly { severity: Severity; waived?: boolean }[]): Verdict {
  let warn = false;
  for (const f of findings) {
    if (f.waived) continue;
    if (f.severity === 'fail') return 'fail';
    if (f.severity === 'warn') warn = true;
  }
  return warn ? 'warn' : 'pass';
}

export function screen(d: Dispersion, policy?: DeepPartial<Policy>): ScreeningResult {
  const p = resolvePolicy(policy);
  const g = pathGeometry(d);
  const findings: Finding[] = [];
  withScanMemo(() => {
    for (const id of CHECK_ORDER) for (const f of checks[id](d, g, p)) findings.push(f);
  });
  findings.sort(compareFindings);
  return {
    format: d.format,
    qpoints: d.nq,
    branches: d.nb,
    segments: d.segments.length,
    verdict: verdictOf(findings),
    findings,
    folded: g.folded.map((f) => ({
      index: f.index,
      q: Array.from(f.q, (x) => round(x)),
      folded: Array.from(f.folded, (x) => round(x)),
    })),
  };
}

export type ScreenFileOptions = NonNullable<Parameters<typeof parseBandFile>[1]> & { policy?: DeepPartial<Policy> };

/** Parse and screen; a file that does not parse throws the parser's ParseError (line and column). */
export function screenFile(input: string | Uint8Array, opts: ScreenFileOptions = {}): ScreeningResult {
  const { policy, ...parseOpts } = opts;
  return screen(parseBandFile(input, parseOpts), policy);
}

export type { CheckId, Finding, ScreeningResult, Severity, Verdict } from './types';
export { defaultPolicy, policySchema, resolvePolicy, type DeepPartial, type Policy } from './policy';
