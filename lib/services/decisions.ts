/**
 * Decisions (approve / return / reject), withdraw and reopen: the status machine of product.md
 * enforced on the server, under optimistic locking on the spectrum's version.
 */
import { AuditEvent, Decision, newId, Revision, User, type DecisionVerdictValue } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { can, type Action } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import type { ApprovalState } from '@/lib/review/approval';
import { checkTransition, type ReviewEvent } from '@/lib/review/status-machine';
import type { DecisionOutcome, StatusReason } from '@/lib/review/events';
import { recordAudit } from './audit';
import { notify } from './outbox';
import { approvalFor, inReviewTransaction, settleApproval, touch } from './review';
import { personDto, spectrumAccess, type PersonDto, type SpectrumAccess } from './spectra';

export interface DecisionDto {
  id: string;
  verdict: DecisionVerdictValue;
  note: string;
  revision: { id: string; number: number };
  reviewer: PersonDto | null;
  /** Whether it still counts toward approval (approvals of the current revision only). */
  counts: boolean;
  createdAt: string;
}

export interface ReviewStateDto {
  id: string;
  status: SpectrumAccess['spectrum']['status'];
  version: number;
  currentRevisionId: string | null;
  approval: ApprovalState;
}

function assertTransition(access: SpectrumAccess, caller: Caller, event: ReviewEvent) {
  const { spectrum, role } = access;
  const check = checkTransition({
    from: spectrum.status,
    event,
    actor: { allowed: (a: Action) => can(role, a), isSubmitter: spectrum.submitter?.id === caller.userId },
  });
  if (!check.ok) throw new AppError(check.code, check.message);
  return check.to;
}

function assertVersion(access: SpectrumAccess, version: number | undefined) {
  if (version !== undefined && version !== access.spectrum.version) {
    throw new AppError('conflict', 'This spectrum changed since you loaded it; reload it and try again.', { version: access.spectrum.version });
  }
}

async function stateOf(em: Em, access: SpectrumAccess): Promise<ReviewStateDto> {
  const s = access.spectrum;
  return { id: s.id, status: s.status, version: s.version, currentRevisionId: s.currentRevisionId ?? null, approval: await approvalFor(em, s) };
}

export function decisionDto(d: Decision, currentRevisionId: string | null | undefined): DecisionDto {
  return {
    id: d.id,
    verdict: d.verdict,
    note: d.note,
    revision: { id: d.revision.id, number: d.revision.number },
    reviewer: d.reviewer ? personDto(d.reviewer) : null,
    counts: d.verdict === 'approve' && !d.supersededAt && d.revision.id === currentRevisionId,
    createdAt: d.createdAt.toISOString(),
  };
}

/** An admin reopened the rejected spectrum: read back from the audit trail, which records it. */
export interface ReopenDto {
  id: string;
  by: PersonDto | null;
  note: string | null;
  createdAt: string;
}

async function listReopens(em: Em, spectrumId: string): Promise<ReopenDto[]> {
  const rows = await em.find(
    AuditEvent,
    { action: 'spectrum.reopened', target: `spectrum:${spectrumId}` },
    { populate: ['actor'], orderBy: { createdAt: 'desc', id: 'asc' } },
  );
  return rows.map((e) => ({
    id: e.id,
    by: personDto(e.actor),
    note: typeof e.data.note === 'string' && e.data.note.trim() ? e.data.note : null,
    createdAt: e.createdAt.toISOString(),
  }));
}

/**
 * Every decision on the spectrum, newest first; the reopenings, newest first (a rejection
 * followed by "in review" needs them to make sense); and where the approval rule stands.
 */
export async function listDecisions(
  em: Em,
  caller: Caller,
  spectrumId: string,
): Promise<{ items: DecisionDto[]; reopens: ReopenDto[]; state: ReviewStateDto }> {
  const access = await spectrumAccess(em, caller, spectrumId);
  const rows = await em.find(Decision, { spectrum: spectrumId }, { populate: ['reviewer', 'revision'], orderBy: { createdAt: 'desc', id: 'asc' } });
  return {
    items: rows.map((d) => decisionDto(d, access.spectrum.currentRevisionId)),
    reopens: await listReopens(em, spectrumId),
    state: await stateOf(em, access),
  };
}

export interface DecideInput {
  verdict: DecisionVerdictValue;
  note: string;
  /** The revision the reviewer looked at: a decision on an older one is refused (409). */
  revision: string;
  /** Optional: the spectrum version the page loaded (409 when it moved). */
  version?: number;
}

const reasonOf: Record<'return' | 'reject', StatusReason> = { return: 'returned', reject: 'rejected' };

export async function decide(em: Em, caller: Caller, spectrumId: string, input: DecideInput): Promise<{ decision: DecisionDto; state: ReviewStateDto }> {
  const access = await spectrumAccess(em, caller, spectrumId);
  const { spectrum, group } = access;
  const to = assertTransition(access, caller, input.verdict);
  if (input.revision !== spectrum.currentRevisionId) {
    throw new AppError('conflict', 'This decision is about an older revision; look at the current one and decide again.', {
      currentRevision: spectrum.currentRevisionId,
    });
  }
  assertVersion(access, input.version);
  const revision = await em.findOneOrFail(Revision, { id: input.revision });
  if (input.verdict === 'approve') {
    const mine = await em.count(Decision, { revision: revision.id, reviewer: caller.userId, verdict: 'approve', supersededAt: null });
    if (mine > 0) throw new AppError('conflict', 'You already approved this revision.');
  }

  const decision = await inReviewTransaction(em, async (tx) => {
    const d = tx.create(Decision, {
      id: newId(),
      spectrum,
      revision,
      reviewer: tx.getReference(User, caller.userId),
      verdict: input.verdict,
      note: input.note,
      supersededAt: null,
    });
    touch(spectrum);
    const from = spectrum.status;
    spectrum.status = to;
    recordAudit(tx, {
      groupId: group.id,
      actorId: caller.userId,
      action: `decision.${input.verdict}`,
      target: `spectrum:${spectrum.id}`,
      data: { spectrum: spectrum.id, revision: revision.id, number: revision.number, decision: d.id, note: input.note },
    });
    const event = { groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId };
    let outcome: DecisionOutcome;
    if (input.verdict === 'approve') {
      const state = await settleApproval(tx, spectrum, caller.userId, { decisionId: d.id });
      outcome = state.approve
        ? { status: spectrum.status }
        : {
            status: spectrum.status,
            waiting: { approvals: state.approvals, openBlockingThreads: state.openBlockingThreads, blockingFindings: state.blockingFindings },
          };
    } else {
      notify(tx, { ...event, type: 'spectrum.status', from, to, reason: reasonOf[input.verdict], decisionId: d.id });
      outcome = { status: to };
    }
    notify(tx, { ...event, type: 'decision.made', decisionId: d.id, revisionId: revision.id, verdict: input.verdict, outcome });
    await tx.flush();
    return d;
  });
  await em.populate(decision, ['reviewer']);
  return { decision: decisionDto(decision, spectrum.currentRevisionId), state: await stateOf(em, access) };
}

/** The submitter withdraws their spectrum from any open state. */
export async function withdraw(em: Em, caller: Caller, spectrumId: string, input: { note?: string; version?: number } = {}): Promise<ReviewStateDto> {
  return move(em, caller, spectrumId, 'withdraw', 'withdrawn', input);
}

/** An admin reopens a rejected spectrum: back in review, earlier approvals cleared. */
export async function reopen(em: Em, caller: Caller, spectrumId: string, input: { note?: string; version?: number } = {}): Promise<ReviewStateDto> {
  return move(em, caller, spectrumId, 'reopen', 'reopened', input);
}

async function move(
  em: Em,
  caller: Caller,
  spectrumId: string,
  event: 'withdraw' | 'reopen',
  reason: StatusReason,
  input: { note?: string; version?: number },
): Promise<ReviewStateDto> {
  const access = await spectrumAccess(em, caller, spectrumId);
  const { spectrum, group } = access;
  const to = assertTransition(access, caller, event);
  assertVersion(access, input.version);
  await inReviewTransaction(em, async (tx) => {
    const from = spectrum.status;
    touch(spectrum);
    spectrum.status = to;
    if (event === 'reopen') await clearApprovals(tx, spectrum.id);
    recordAudit(tx, {
      groupId: group.id,
      actorId: caller.userId,
      action: `spectrum.${reason}`,
      target: `spectrum:${spectrum.id}`,
      data: { spectrum: spectrum.id, from, to, ...(input.note ? { note: input.note } : {}) },
    });
    notify(tx, { type: 'spectrum.status', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, from, to, reason });
    await tx.flush();
  });
  return stateOf(em, access);
}

/**
 * Approvals given so far stop counting (a new revision, a reopen). Call inside the transaction
 * of that change. Decisions on older revisions never count anyway; this also marks them.
 */
export async function clearApprovals(tx: Em, spectrumId: string): Promise<number> {
  return tx.nativeUpdate(Decision, { spectrum: spectrumId, verdict: 'approve', supersededAt: null }, { supersededAt: new Date() });
}
