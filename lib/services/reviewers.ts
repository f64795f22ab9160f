/** Reviewers assigned to a spectrum: read by members, set by admins (who may review it). */
import { Membership, User } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { assertCan, can } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { recordAudit } from './audit';
import { notify } from './outbox';
import { inReviewTransaction, touch } from './review';
import { personDto, spectrumAccess, type PersonDto } from './spectra';

export interface ReviewersDto {
  reviewers: PersonDto[];
  /** Members who may be assigned (reviewers and admins other than the submitter); admins only. */
  candidates: PersonDto[] | null;
  version: number;
}

async function eligible(em: Em, groupId: string, submitterId: string | undefined): Promise<PersonDto[]> {
  const rows = await em.find(Membership, { group: groupId, role: { $in: ['admin', 'reviewer'] } }, { populate: ['user'], orderBy: { user: { email: 'asc' } } });
  return rows.filter((m) => m.user.id !== submitterId).map((m) => personDto(m.user)!);
}

async function people(em: Em, ids: string[]): Promise<PersonDto[]> {
  if (!ids.length) return [];
  const users = await em.find(User, { id: { $in: ids } });
  const byId = new Map(users.map((u) => [u.id, personDto(u)!]));
  return ids.map((id) => byId.get(id)).filter((p): p is PersonDto => !!p);
}

export async function getReviewers(em: Em, caller: Caller, spectrumId: string): Promise<ReviewersDto> {
  const { spectrum, group, role } = await spectrumAccess(em, caller, spectrumId);
  return {
    reviewers: await people(em, spectrum.reviewerIds ?? []),
    candidates: can(role, 'reviewers.assign') ? await eligible(em, group.id, spectrum.submitter?.id) : null,
    version: spectrum.version,
  };
}

export async function setReviewers(em: Em, caller: Caller, spectrumId: string, input: { reviewers: string[]; version?: number }): Promise<ReviewersDto> {
  const access = await spectrumAccess(em, caller, spectrumId);
  const { spectrum, group } = access;
  assertCan(access.role, 'reviewers.assign');
  if (input.version !== undefined && input.version !== spectrum.version) {
    throw new AppError('conflict', 'This spectrum changed since you loaded it; reload it and try again.');
  }
  const wanted = [...new Set(input.reviewers)];
  const allowed = new Set((await eligible(em, group.id, spectrum.submitter?.id)).map((p) => p.id));
  const bad = wanted.filter((id) => !allowed.has(id));
  if (bad.length) {
    throw new AppError('invalid_input', 'Reviewers must be reviewers or admins of this group, and not the submitter.', {
      fieldErrors: { reviewers: bad.map((id) => `${id} cannot review this spectrum`) },
    });
  }
  const before = spectrum.reviewerIds ?? [];
  const added = wanted.filter((id) => !before.includes(id));
  const removed = before.filter((id) => !wanted.includes(id));
  if (added.length || removed.length) {
    await inReviewTransaction(em, async (tx) => {
      touch(spectrum);
      spectrum.reviewerIds = wanted;
      recordAudit(tx, {
        groupId: group.id,
        actorId: caller.userId,
        action: 'reviewers.assigned',
        target: `spectrum:${spectrum.id}`,
        data: { spectrum: spectrum.id, added, removed },
      });
      if (added.length) notify(tx, { type: 'reviewer.assigned', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, reviewerIds: added });
      await tx.flush();
    });
  }
  return getReviewers(em, caller, spectrumId);
}
