/**
 * A group's review policy: how many approvals a revision needs, which finding severities block
 * approval, and the screening thresholds (lib/checks policy). Stored per group as JSON; the
 * defaults apply to a group that never set one.
 */
import { z } from 'zod';
import { defaultPolicy, resolvePolicy, type Policy } from '../checks/policy';
import type { Severity } from './approval';

export interface ReviewPolicy {
  requiredApprovals: number;
  /** Always contains 'fail' (product.md: an unwaived fail prevents approval). */
  blockingSeverities: Severity[];
  checks: Policy;
}

export const defaultReviewPolicy: ReviewPolicy = Object.freeze({
  requiredApprovals: 1,
  blockingSeverities: ['fail'],
  checks: defaultPolicy,
}) as ReviewPolicy;

export const MAX_REQUIRED_APPROVALS = 10;

/** The body of PUT …/policy: every key optional; `checks` may name only what changes. */
export const reviewPolicyInput = z
  .object({
    requiredApprovals: z.number().int().min(1).max(MAX_REQUIRED_APPROVALS).optional(),
    blockingSeverities: z
      .array(z.enum(['info', 'warn', 'fail']))
      .refine((s) => s.includes('fail'), { message: "must include 'fail': an unwaived failure always blocks approval" })
      .optional(),
    checks: z.record(z.string(), z.record(z.string(), z.unknown())).optional(),
  })
  .strict();
export type ReviewPolicyInput = z.infer<typeof reviewPolicyInput>;

/**
 * A stored (possibly partial or outdated) policy over the defaults, validated. Throws a ZodError
 * naming the path of a bad threshold.
 */
export function resolveReviewPolicy(stored?: Partial<{ requiredApprovals: number; blockingSeverities: Severity[]; checks: unknown }> | null): ReviewPolicy {
  if (!stored) return defaultReviewPolicy;
  const severities = [...new Set<Severity>(['fail', ...(stored.blockingSeverities ?? [])])];
  return {
    requiredApprovals: stored.requiredApprovals ?? defaultReviewPolicy.requiredApprovals,
    blockingSeverities: severities.sort((a, b) => rank[a] - rank[b]),
    checks: resolvePolicy((stored.checks ?? undefined) as Parameters<typeof resolvePolicy>[0]),
  };
}

const rank: Record<Severity, number> = { info: 0, warn: 1, fail: 2 };

/** The current policy with a change applied (PUT); throws a ZodError on bad thresholds. */
export function applyPolicyChange(current: ReviewPolicy, change: ReviewPolicyInput): ReviewPolicy {
  const checks: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(current.checks)) checks[k] = { ...v };
  for (const [k, v] of Object.entries(change.checks ?? {})) checks[k] = { ...((checks[k] as object) ?? {}), ...v };
  return resolveReviewPolicy({
    requiredApprovals: change.requiredApprovals ?? current.requiredApprovals,
    blockingSeverities: change.blockingSeverities ?? current.blockingSeverities,
    checks,
  });
}
