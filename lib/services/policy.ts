/**
 * A group's review policy: required approvals, blocking severities, screening thresholds.
 * `getGroupPolicy` is what the screening worker and the approval rule read.
 */
import { Group, GroupPolicy, User } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import type { Em } from '@/lib/db/orm';
import { applyPolicyChange, defaultReviewPolicy, resolveReviewPolicy, type ReviewPolicy, type ReviewPolicyInput } from '@/lib/review/review-policy';
import { groupAccess } from './access';
import { recordAudit } from './audit';
import { personDto, type PersonDto } from './spectra';

/** The group's policy over the defaults (the defaults when it never set one). */
export async function getGroupPolicy(em: Em, groupId: string): Promise<ReviewPolicy> {
  const row = await em.findOne(GroupPolicy, { group: groupId });
  if (!row) return defaultReviewPolicy;
  try {
    return resolveReviewPolicy({ requiredApprovals: row.requiredApprovals, blockingSeverities: row.blockingSeverities, checks: row.checks });
  } catch (e) {
    // A stored policy the current engine refuses (a threshold renamed since) must not stop
    // screening: fall back to the defaults and say so in the log.
    console.error(`[branchwise] group ${groupId}: stored policy no longer valid, using defaults:`, e);
    return defaultReviewPolicy;
  }
}

export interface PolicyDto extends ReviewPolicy {
  defaults: ReviewPolicy;
  updatedAt: string | null;
  updatedBy: PersonDto | null;
}

async function policyDto(em: Em, groupId: string): Promise<PolicyDto> {
  const row = await em.findOne(GroupPolicy, { group: groupId }, { populate: ['updatedBy'] });
  return {
    ...(await getGroupPolicy(em, groupId)),
    defaults: defaultReviewPolicy,
    updatedAt: row?.updatedAt.toISOString() ?? null,
    updatedBy: row?.updatedBy ? personDto(row.updatedBy) : null,
  };
}

/** Any member reads the policy. */
export async function readPolicy(em: Em, caller: Caller, slug: string): Promise<PolicyDto> {
  const { group } = await groupAccess(em, caller, { slug }, 'group.read');
  return policyDto(em, group.id);
}

/** An admin changes it; the change applies to screenings that start afterwards. Audited. */
export async function updatePolicy(em: Em, caller: Caller, slug: string, change: ReviewPolicyInput): Promise<PolicyDto> {
  const { group } = await groupAccess(em, caller, { slug }, 'policy.edit');
  const before = await getGroupPolicy(em, group.id);
  const after = applyPolicyChange(before, change);
  let row = await em.findOne(GroupPolicy, { group: group.id });
  const values = {
    requiredApprovals: after.requiredApprovals,
    blockingSeverities: after.blockingSeverities,
    checks: after.checks as unknown as Record<string, unknown>,
    updatedBy: em.getReference(User, caller.userId),
  };
  if (row) em.assign(row, values);
  else row = em.create(GroupPolicy, { group: em.getReference(Group, group.id), ...values });
  recordAudit(em, {
    groupId: group.id,
    actorId: caller.userId,
    action: 'policy.updated',
    target: `group:${group.id}`,
    data: { change, before: { requiredApprovals: before.requiredApprovals, blockingSeverities: before.blockingSeverities } },
  });
  await em.flush();
  return policyDto(em, group.id);
}
