/** Findings grouped for waiving together (the findings panel's "select all" shortcuts). */

export interface RunnableFinding {
  id: string;
  check: string;
  branch: number | null;
  /** Anything but null means waived. */
  waived: unknown;
}

export interface FindingRun {
  check: string;
  branch: number;
  /** In the order given (engine order). */
  ids: string[];
}

/**
 * Open findings of one check on one branch, two or more, largest run first (then lowest
 * branch): a soft pocket raises one imaginary-modes fail and a run of continuity fails on the
 * same branch, and a reviewer who judges it real wants them in one go.
 */
export function findingRuns(findings: readonly RunnableFinding[]): FindingRun[] {
  const runs = new Map<string, FindingRun>();
  for (const f of findings) {
    if (f.waived || f.branch === null) continue;
    const key = `${f.check}\u0000${f.branch}`;
    const run = runs.get(key) ?? { check: f.check, branch: f.branch, ids: [] };
    run.ids.push(f.id);
    runs.set(key, run);
  }
  return [...runs.values()].filter((r) => r.ids.length > 1).sort((a, b) => b.ids.length - a.ids.length || a.branch - b.branch || a.check.localeCompare(b.check));
}
