/**
 * The approval rule (product.md): a spectrum in review is approved automatically when its
 * current revision has the policy's number of approvals, no unresolved blocking thread, and no
 * unwaived finding of a severity the policy says blocks (`fail` always blocks).
 */
export type Severity = 'info' | 'warn' | 'fail';

export interface ApprovalInput {
  status: string;
  /** Distinct people who approved the current revision (and whose approval still counts). */
  approvals: number;
  requiredApprovals: number;
  /** Unresolved threads marked blocking. */
  openBlockingThreads: number;
  /** Findings of the current revision. */
  findings: readonly { severity: Severity; waived: boolean }[];
  blockingSeverities: readonly Severity[];
}

export interface ApprovalState {
  /** True when the spectrum is in review and nothing stands in the way. */
  approve: boolean;
  approvals: { count: number; required: number };
  openBlockingThreads: number;
  /** Unwaived findings whose severity blocks. */
  blockingFindings: number;
  /** Why not yet, in words for the page; empty when approved. */
  waitingFor: string[];
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export function approvalState(input: ApprovalInput): ApprovalState {
  const blocking = new Set<Severity>(['fail', ...input.blockingSeverities]);
  const blockingFindings = input.findings.filter((f) => !f.waived && blocking.has(f.severity)).length;
  const waitingFor: string[] = [];
  const missing = input.requiredApprovals - input.approvals;
  if (missing > 0) waitingFor.push(`${plural(missing, 'more approval', 'more approvals')}`);
  if (input.openBlockingThreads > 0) waitingFor.push(`${plural(input.openBlockingThreads, 'blocking thread', 'blocking threads')} to be resolved`);
  if (blockingFindings > 0) waitingFor.push(`${plural(blockingFindings, 'blocking finding', 'blocking findings')} to be fixed or waived`);
  return {
    approve: input.status === 'in-review' && waitingFor.length === 0,
    approvals: { count: input.approvals, required: input.requiredApprovals },
    openBlockingThreads: input.openBlockingThreads,
    blockingFindings,
    waitingFor,
  };
}
