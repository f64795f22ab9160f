/**
 * Waivers: a reviewer or admin waives a finding of the current revision with a written reason.
 * The finding stays visible; it stops counting toward the verdict and the approval rule.
 */
import { Finding, newId, User, Waiver } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { assertCan } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import type { ApprovalState } from '@/lib/review/approval';
import { recordAudit } from './audit';
import { notify } from './outbox';
import { effectiveVerdict, inReviewTransaction, settleApproval, touch } from './review';
import { personDto, spectrumAccess, type PersonDto, type SpectrumAccess } from './spectra';

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
  if (spectrum.status !== 'in-review' && spectrum.status !== 'returned') {
    throw new AppError('conflict', `A spectrum that is ${spectrum.status} takes no waivers.`);
  }
  if (await em.count(Waiver, { finding: finding.id })) throw new AppError('conflict', 'This finding is already waived.');

  return inReviewTransaction(em, async (tx) => {
    const waiver = tx.create(Waiver, { id: newId(), finding, author: tx.getReference(User, caller.userId), reason: input.reason });
    touch(spectrum);
    recordAudit(tx, {
      groupId: group.id,
      actorId: caller.userId,
      action: 'finding.waived',
      target: `finding:${finding.id}`,
      data: { spectrum: spectrum.id, revision: finding.revision.id, check: finding.check, severity: finding.severity, reason: input.reason },
    });
    notify(tx, { type: 'finding.waived', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, findingId: finding.id, waiverId: waiver.id });
    await tx.flush();
    // The spectrum's verdict is the current revision's with its waivers (the queue shows it).
    spectrum.verdict = await effectiveVerdict(tx, finding.revision.id);
    const approval = await settleApproval(tx, spectrum, caller.userId);
    await tx.populate(waiver, ['author']);
    return { waiver: waiverDto(waiver), verdict: spectrum.verdict, approval };
  });
}
