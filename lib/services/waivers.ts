/**
 * Waivers: a reviewer or admin waives a finding of the current revision with a written reason.
 * The finding stays visible; it stops counting toward the verdict and the approval rule.
 */
import { Finding, newId, Spectrum, User, Waiver } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { assertCan } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import type { ApprovalState } from '@/lib/review/approval';
import { recordAudit } from './audit';
import { notify } from './outbox';
import { effectiveVerdict, inReviewTransaction, settleApproval, touch } from './review';
import { personDto, revisionAccess, spectrumAccess, type PersonDto, type SpectrumAccess } from './spectra';

export interface WaiverDto {
  id: string;
  findingId: string;
  reason: string;
  author: PersonDto | null;
  createdAt: string;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function waiverDto(w: Waiver): WaiverDto {
  return { id: w.id, findingId: w.finding.id, reason: w.reason, author: w.author ? personDto(w.author) : null, createdAt: w.createdAt.toISOString() };
}

/** The finding and the caller's access to its spectrum; another group's finding is a 404. */
async function findingAccess(em: Em, caller: Caller, id: string): Promise<SpectrumAccess & { finding: Finding }> {
  const noFinding = () => new AppError('not_found', 'No such finding.');
  if (!UUID.test(id)) throw noFinding();
  const finding = await em.findOne(Finding, { id }, { populate: ['revision'] });
  if (!finding) throw noFinding();
  try {
    return { ...(await spectrumAccess(em, caller, finding.revision.spectrum.id)), finding };
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') throw noFinding();
    throw e;
  }
}

/** Waivers of these findings, by finding id (for screening and export pages). */
export async function waiversByFinding(em: Em, findingIds: string[]): Promise<Map<string, WaiverDto>> {
  if (!findingIds.length) return new Map();
  const rows = await em.find(Waiver, { finding: { $in: findingIds } }, { populate: ['author'] });
  return new Map(rows.map((w) => [w.finding.id, waiverDto(w)]));
}

export async function getWaiver(em: Em, caller: Caller, findingId: string): Promise<WaiverDto> {
  const { finding } = await findingAccess(em, caller, findingId);
  const w = await em.findOne(Waiver, { finding: finding.id }, { populate: ['author'] });
  if (!w) throw new AppError('not_found', 'This finding is not waived.');
  return waiverDto(w);
}

/** Waivers are given while the spectrum is under review, and only then. */
function assertTakesWaivers(spectrum: Spectrum): void {
  if (spectrum.status !== 'in-review' && spectrum.status !== 'returned') {
    throw new AppError('conflict', `A spectrum that is ${spectrum.status} takes no waivers.`);
  }
}

/**
 * One waiver with its audit event and outbox event, the same whether it is waived alone or
 * with others (`batch`: how many were waived together).
 */
function writeWaiver(
  tx: Em,
  w: { caller: Caller; group: { id: string }; spectrum: Spectrum; finding: Finding; reason: string; batch?: number },
): Waiver {
  const { caller, group, spectrum, finding, reason } = w;
  const waiver = tx.create(Waiver, { id: newId(), finding, author: tx.getReference(User, caller.userId), reason });
  recordAudit(tx, {
    groupId: group.id,
    actorId: caller.userId,
    action: 'finding.waived',
    target: `finding:${finding.id}`,
    data: {
      spectrum: spectrum.id,
      revision: finding.revision.id,
      check: finding.check,
      severity: finding.severity,
      reason,
      ...(w.batch !== undefined ? { batch: w.batch } : {}),
    },
  });
  notify(tx, { type: 'finding.waived', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, findingId: finding.id, waiverId: waiver.id });
  return waiver;
}

export async function waiveFinding(
  em: Em,
  caller: Caller,
  findingId: string,
  input: { reason: string },
): Promise<{ waiver: WaiverDto; verdict: string; approval: ApprovalState }> {
  const access = await findingAccess(em, caller, findingId);
  const { finding, spectrum, group } = access;
  assertCan(access.role, 'finding.waive');
  if (finding.revision.id !== spectrum.currentRevisionId) {
    throw new AppError('conflict', 'This finding belongs to an older revision; waive findings of the current one.');
  }
  assertTakesWaivers(spectrum);
  if (await em.count(Waiver, { finding: finding.id })) throw new AppError('conflict', 'This finding is already waived.');

  return inReviewTransaction(em, async (tx) => {
    const waiver = writeWaiver(tx, { caller, group, spectrum, finding, reason: input.reason });
    touch(spectrum);
    await tx.flush();
    // The spectrum's verdict is the current revision's with its waivers (the queue shows it).
    spectrum.verdict = await effectiveVerdict(tx, finding.revision.id);
    const approval = await settleApproval(tx, spectrum, caller.userId);
    await tx.populate(waiver, ['author']);
    return { waiver: waiverDto(waiver), verdict: spectrum.verdict, approval };
  });
}

export interface WaiveManyResult {
  waivers: WaiverDto[];
  verdict: string;
  approval: ApprovalState;
}

const listIds = (ids: string[]) => ids.join(', ');

/**
 * Waives several findings of one revision with one reason: all or none. Ids that name no
 * finding the caller can see are a 404; findings of another revision and findings already
 * waived are a 409; each answer names the ids (`details`) and nothing is written. Every
 * finding gets its own waiver, audit event and outbox event, as one at a time would; the
 * verdict and the approval rule are settled once, after all of them.
 */
export async function waiveFindings(
  em: Em,
  caller: Caller,
  revisionId: string,
  input: { findingIds: string[]; reason: string },
): Promise<WaiveManyResult> {
  const access = await revisionAccess(em, caller, revisionId);
  const { revision, spectrum, group } = access;
  assertCan(access.role, 'finding.waive');
  if (revision.id !== spectrum.currentRevisionId) {
    throw new AppError('conflict', `Revision ${revision.number} is not the current one; waive findings of the current revision.`);
  }
  assertTakesWaivers(spectrum);

  return inReviewTransaction(em, async (tx) => {
    const wellFormed = input.findingIds.filter((id) => UUID.test(id));
    const found = wellFormed.length ? await tx.find(Finding, { id: { $in: wellFormed } }, { populate: ['revision.spectrum'] }) : [];
    // A finding of another group is unknown to the caller, as on the single route.
    const byId = new Map(found.filter((f) => f.revision.spectrum.group.id === group.id).map((f) => [f.id, f]));
    const unknown = input.findingIds.filter((id) => !byId.has(id));
    if (unknown.length) {
      throw new AppError('not_found', `No such finding: ${listIds(unknown)}. Nothing was waived.`, { unknown });
    }
    const otherRevision = input.findingIds.filter((id) => byId.get(id)!.revision.id !== revision.id);
    const waivedAlready = (await tx.find(Waiver, { finding: { $in: input.findingIds } })).map((w) => w.finding.id);
    if (otherRevision.length || waivedAlready.length) {
      const parts = [
        otherRevision.length ? `of another revision (waive findings of revision ${revision.number}): ${listIds(otherRevision)}` : '',
        waivedAlready.length ? `already waived: ${listIds(waivedAlready)}` : '',
      ].filter(Boolean);
      throw new AppError('conflict', `Some findings cannot be waived, ${parts.join('; ')}. Nothing was waived.`, {
        ...(otherRevision.length ? { otherRevision } : {}),
        ...(waivedAlready.length ? { alreadyWaived: waivedAlready } : {}),
      });
    }

    const batch = input.findingIds.length;
    const waivers = input.findingIds.map((id) => writeWaiver(tx, { caller, group, spectrum, finding: byId.get(id)!, reason: input.reason, batch }));
    touch(spectrum);
    await tx.flush();
    spectrum.verdict = await effectiveVerdict(tx, revision.id);
    const approval = await settleApproval(tx, spectrum, caller.userId);
    await tx.populate(waivers, ['author']);
    return { waivers: waivers.map(waiverDto), verdict: spectrum.verdict, approval };
  });
}
