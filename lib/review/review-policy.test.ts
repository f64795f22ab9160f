import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { defaultPolicy } from '../checks/policy';
import { applyPolicyChange, defaultReviewPolicy, resolveReviewPolicy, reviewPolicyInput } from './review-policy';

describe('review policy', () => {
  it('defaults: one approval, fails block, the engine\'s thresholds', () => {
    expect(resolveReviewPolicy(null)).toEqual({ requiredApprovals: 1, blockingSeverities: ['fail'], checks: defaultPolicy });
  });

  it('a change overlays the current policy, keeping what it does not name', () => {
    const p = applyPolicyChange(defaultReviewPolicy, { requiredApprovals: 2, checks: { acousticGamma: { warn: 0.02 } } });
    expect(p.requiredApprovals).toBe(2);
    expect(p.checks.acousticGamma).toEqual({ enabled: true, warn: 0.02, fail: 0.1 });
    expect(p.checks.continuity).toEqual(defaultPolicy.continuity);
  });

  it('bad thresholds are refused with their path', () => {
    try {
      applyPolicyChange(defaultReviewPolicy, { checks: { acousticGamma: { warn: 0.5 } } });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ZodError);
      expect((e as ZodError).issues[0]!.path).toEqual(['acousticGamma', 'warn']);
    }
  });

  it("'fail' always blocks", () => {
    expect(reviewPolicyInput.safeParse({ blockingSeverities: ['warn'] }).success).toBe(false);
    expect(resolveReviewPolicy({ blockingSeverities: ['warn'] }).blockingSeverities).toEqual(['warn', 'fail']);
  });

  it('approvals between 1 and 10', () => {
    expect(reviewPolicyInput.safeParse({ requiredApprovals: 0 }).success).toBe(false);
    expect(reviewPolicyInput.safeParse({ requiredApprovals: 11 }).success).toBe(false);
    expect(reviewPolicyInput.safeParse({ requiredApprovals: 3 }).success).toBe(true);
  });
});
