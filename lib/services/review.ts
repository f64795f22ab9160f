/**
 * What the review services share: a transaction that turns a lost optimistic-lock race into a
 * 409, the approval rule applied to a spectrum (policy, approvals of the current revision,
 * blocking threads, unwaived findings), and the automatic approval it may trigger.
 */
import { OptimisticLockError } from '@mikro-orm/core';
import { Decision, Finding, Spectrum, Thread, Waiver } from '@/entities';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { approvalState, type ApprovalState } from '@/lib/review/approval';
import { verdictOf } from '@/lib/checks';
import { checkTransition } from '@/lib/review/status-machine';
import { recordAudit } from './audit';
import { notify } from './outbox';
import { getGroupPolicy } from './policy';

export const staleMessage = 'Someone changed this spectrum at the same time; reload it and try again.';

/**
 * Runs `fn` in one transaction. A spectrum whose version moved since it was read (another
 * decision, waiver or upload won the race) rolls everything back and answers 409.
 */
export async function inReviewTransaction<T>(em: Em, fn: (tx: Em) => Promise<T>): Promise<T> {
  try {
    return await em.transactional(fn);
  } catch (e) {
    if (e instanceof OptimisticLockError) throw new AppError('conflict', staleMessage);
    throw e;
  }
}

/**
 * Marks the spectrum changed so that the flush updates its row with the version check: two
 * requests that read the same version cannot both commit.
 */
export function touch(spectrum: Spectrum): void {
  spectrum.updatedAt = new Date();
}

/** Ids of people whose approvals of the current revision still count. */
export async function currentApprovers(em: Em, spectrum: Spectrum): Promise<string[]> {
  if (!spectrum.currentRevisionId) return [];
  const rows = await em.find(Decision, {
    spectrum: spectrum.id,
    revision: spectrum.currentRevisionId,
    verdict: 'approve',
    supersededAt: null,
  });
  return [...new Set(rows.map((d) => d.reviewer?.id).filter((x): x is string => !!x))];
}

/** The approval rule for the spectrum as it stands in `em` (flushed rows). */
export async function approvalFor(em: Em, spectrum: Spectrum): Promise<ApprovalState> {
  const policy = await getGroupPolicy(em, spectrum.group.id);
  const findings = spectrum.currentRevisionId ? await em.find(Finding, { revision: spectrum.currentRevisionId }) : [];
  const waived = new Set(
    findings.length ? (await em.find(Waiver, { finding: { $in: findings.map((f) => f.id) } })).map((w) => w.finding.id) : [],
  );
  const openBlockingThreads = await em.count(Thread, { spectrum: spectrum.id, blocking: true, resolved: false });
  return approvalState({
    status: spectrum.status,
    approvals: (await currentApprovers(em, spectrum)).length,
    requiredApprovals: policy.requiredApprovals,
    openBlockingThreads,
    findings: findings.map((f) => ({ severity: f.severity, waived: waived.has(f.id) })),
    blockingSeverities: policy.blockingSeverities,
  });
}

/** The current revision's verdict with its waivers (waived findings do not count). */
export async function effectiveVerdict(em: Em, revisionId: string) {
  const findings = await em.find(Finding, { revision: revisionId });
  const waived = new Set(
    findings.length ? (await em.find(Waiver, { finding: { $in: findings.map((f) => f.id) } })).map((w) => w.finding.id) : [],
  );
  return verdictOf(findings.map((f) => ({ severity: f.severity, waived: waived.has(f.id) })));
}

/**
 * After a change that can complete the rule (an approval, a waiver, a thread resolved or no
 * longer blocking): flushes, evaluates, and approves the spectrum when nothing stands in the
 * way. Call inside `inReviewTransaction` with the spectrum already touched. `cause.decisionId`
 * names the approval that completed the rule (its decision mail then tells its audience).
 */
export async function settleApproval(tx: Em, spectrum: Spectrum, actorId: string | null, cause: { decisionId?: string } = {}): Promise<ApprovalState> {
  await tx.flush();
  const state = await approvalFor(tx, spectrum);
  if (!state.approve) return state;
  const check = checkTransition({ from: spectrum.status, event: 'auto-approve', actor: null });
  if (!check.ok) return state;
  const from = spectrum.status;
  spectrum.status = check.to;
  const groupId = spectrum.group.id;
  recordAudit(tx, {
    groupId,
    actorId,
    action: 'spectrum.approved',
    target: `spectrum:${spectrum.id}`,
    data: { spectrum: spectrum.id, revision: spectrum.currentRevisionId, automatic: true, approvals: state.approvals },
  });
  notify(tx, { type: 'spectrum.status', groupId, spectrumId: spectrum.id, actorId, from, to: check.to, reason: 'auto-approved', ...cause });
  await tx.flush();
  return { ...state, approve: true };
}
