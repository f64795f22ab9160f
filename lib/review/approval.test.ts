import { describe, expect, it } from 'vitest';
import { approvalState, type ApprovalInput } from './approval';

const base: ApprovalInput = {
  status: 'in-review',
  approvals: 1,
  requiredApprovals: 1,
  openBlockingThreads: 0,
  findings: [{ severity: 'warn', waived: false }, { severity: 'info', waived: false }],
  blockingSeverities: ['fail'],
};

describe('approvalState', () => {
  it('approves with enough approvals, no blocking thread and no unwaived fail', () => {
    expect(approvalState(base)).toMatchObject({ approve: true, waitingFor: [] });
  });

  it('counts approvals against the policy', () => {
    const s = approvalState({ ...base, requiredApprovals: 2 });
    expect(s.approve).toBe(false);
    expect(s.waitingFor).toEqual(['1 more approval']);
    expect(approvalState({ ...base, approvals: 2, requiredApprovals: 2 }).approve).toBe(true);
  });

  it('a blocking thread holds it back', () => {
    expect(approvalState({ ...base, openBlockingThreads: 2 })).toMatchObject({ approve: false, waitingFor: ['2 blocking threads to be resolved'] });
  });

  it('an unwaived fail holds it back; a waived one does not', () => {
    expect(approvalState({ ...base, findings: [{ severity: 'fail', waived: false }] })).toMatchObject({ approve: false, blockingFindings: 1 });
    expect(approvalState({ ...base, findings: [{ severity: 'fail', waived: true }] }).approve).toBe(true);
  });

  it('fail always blocks; warn blocks when the policy says so', () => {
    expect(approvalState({ ...base, blockingSeverities: [] , findings: [{ severity: 'fail', waived: false }] }).approve).toBe(false);
    expect(approvalState({ ...base, blockingSeverities: ['warn', 'fail'] })).toMatchObject({ approve: false, blockingFindings: 1 });
  });

  it('only a spectrum in review can be approved', () => {
    expect(approvalState({ ...base, status: 'returned' }).approve).toBe(false);
  });
});
