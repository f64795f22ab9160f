/**
 * New spectra and new revisions from an uploaded file, whichever way the file came (the upload
 * route's callback or the multipart API). Idempotent on the upload's file key; revision numbers
 * are sequential per spectrum under concurrent uploads (the spectrum row is locked).
 */
import { randomUUID } from 'node:crypto';
import { LockMode, UniqueConstraintViolationException } from '@mikro-orm/core';
import { Group, Revision, Spectrum, User } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { assertCan } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { enqueueScreening } from '@/lib/jobs/screening-queue';
import { formatFromFilename } from '@/lib/parsers';
import { bandFileProblem } from '@/lib/storage/limits';
import { groupAccess } from './access';
import { recordAudit } from './audit';
import { clearApprovals as supersedeApprovals } from './decisions';
import { notify } from './outbox';
import { revisableState, revisionDto, spectrumAccess, type RevisionDto } from './spectra';

/** A file the upload service holds. */
export interface UploadedFileRef {
  key: string;
  ufsUrl: string;
  name: string;
  size: number;
}

export interface SpectrumMeta {
  title: string;
  material: string;
  formula?: string | null;
  method?: string | null;
  code?: string | null;
  supercell?: string | null;
  qmesh?: string | null;
  notes?: string | null;
}

export interface CreatedSpectrum {
  id: string;
  status: Spectrum['status'];
  revision: { id: string; number: number };
}

function assertBandFile(file: { name: string; size: number }): void {
  const problem = bandFileProblem(file);
  if (!problem) return;
  throw new AppError(problem.code === 'too_large' ? 'too_large' : 'invalid_input', problem.message);
}

/** May the caller create a spectrum in this group? (404 outside it, 403 for an observer.) */
export async function assertCanCreateSpectrum(em: Em, caller: Caller, group: { slug: string } | { id: string }) {
  return groupAccess(em, caller, group, 'spectrum.create');
}

/** May the caller add a revision to this spectrum now? Returns the spectrum's group id. */
export async function assertCanAddRevision(em: Em, caller: Caller, spectrumId: string): Promise<{ groupId: string }> {
  const { spectrum, group } = await spectrumAccess(em, caller, spectrumId, 'spectrum.revise-own');
  if (spectrum.submitter?.id !== caller.userId) {
    throw new AppError('forbidden', 'Only the person who submitted this spectrum can upload its revisions.');
  }
  const current = spectrum.currentRevisionId ? await em.findOne(Revision, { id: spectrum.currentRevisionId }) : null;
  const why = revisableState(spectrum, current);
  if (why) throw new AppError('conflict', why);
  return { groupId: group.id };
}

async function byFileKey(em: Em, key: string): Promise<Revision | null> {
  return em.fork().findOne(Revision, { fileKey: key }, { populate: ['spectrum', 'uploader'] });
}

function isFileKeyClash(e: unknown): boolean {
  return e instanceof UniqueConstraintViolationException && /file_key/.test(String((e as Error).message));
}

async function enqueue(revisionId: string): Promise<void> {
  try {
    await enqueueScreening(revisionId);
  } catch (e) {
    // The rows are committed: the sweep sets the revision to `error` if it never gets screened.
    console.error(`[branchwise] could not enqueue screening of revision ${revisionId}:`, e);
  }
}

/** A new spectrum (status `screening`) with the uploaded file as revision 1, queued for screening. */
export async function createSpectrumWithFile(
  em: Em,
  caller: Caller,
  input: { group: { slug: string } | { id: string }; meta: SpectrumMeta; file: UploadedFileRef },
): Promise<CreatedSpectrum> {
  const replay = await byFileKey(em, input.file.key);
  if (replay) return { id: replay.spectrum.id, status: replay.spectrum.status, revision: { id: replay.id, number: replay.number } };
  assertBandFile(input.file);
  const { group } = await assertCanCreateSpectrum(em, caller, input.group);
  let created: CreatedSpectrum;
  try {
    created = await em.transactional(async (tx) => {
      const m = input.meta;
      const spectrum = tx.create(Spectrum, {
        // Made here, not at flush: the audit target and the event name it before the flush.
        id: randomUUID(),
        group: tx.getReference(Group, group.id),
        submitter: tx.getReference(User, caller.userId),
        title: m.title,
        material: m.material,
        formula: m.formula ?? null,
        method: m.method ?? null,
        code: m.code ?? null,
        supercell: m.supercell ?? null,
        qmesh: m.qmesh ?? null,
        notes: m.notes ?? null,
        status: 'screening',
        reviewerIds: [],
        revisionCount: 1,
        verdict: null,
      });
      const revision = newRevision(tx, spectrum, 1, caller, input.file, null);
      spectrum.currentRevisionId = revision.id;
      recordAudit(tx, {
        groupId: group.id,
        actorId: caller.userId,
        action: 'spectrum.created',
        target: `spectrum:${spectrum.id}`,
        data: { title: spectrum.title, revision: 1, file: input.file.name, via: caller.via },
      });
      // Committed with the revision or not at all; the notification worker decides who hears of it.
      notify(tx, { type: 'revision.created', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, revisionId: revision.id, number: 1 });
      await tx.flush();
      return { id: spectrum.id, status: spectrum.status, revision: { id: revision.id, number: 1 } };
    });
  } catch (e) {
    if (!isFileKeyClash(e)) throw e;
    // The same callback ran concurrently and won: answer with its result.
    const won = await byFileKey(em, input.file.key);
    if (!won) throw e;
    return { id: won.spectrum.id, status: won.spectrum.status, revision: { id: won.id, number: won.number } };
  }
  await enqueue(created.revision.id);
  return created;
}

function newRevision(tx: Em, spectrum: Spectrum, number: number, caller: Caller, file: UploadedFileRef, note: string | null): Revision {
  return tx.create(Revision, {
    // Made here, not at flush: the spectrum points at it in the same unit of work.
    id: randomUUID(),
    spectrum,
    number,
    fileKey: file.key,
    ufsUrl: file.ufsUrl,
    originalName: file.name,
    size: file.size,
    format: formatFromFilename(file.name) ?? 'columns',
    note,
    uploader: tx.getReference(User, caller.userId),
    screeningStatus: 'pending',
    screeningError: null,
    verdict: null,
    summary: null,
  });
}

/**
 * Earlier approvals no longer hold for a new revision (product.md). Decisions arrive with the
 * review issue: clear them here, inside the same transaction as the new revision.
 */
async function clearApprovals(tx: Em, spectrumId: string): Promise<void> {
  await supersedeApprovals(tx, spectrumId);
}

/** A new revision of the caller's own spectrum, numbered after the last one, queued for screening. */
export async function addRevisionWithFile(
  em: Em,
  caller: Caller,
  input: { spectrumId: string; note?: string | null; file: UploadedFileRef },
): Promise<RevisionDto> {
  const replay = await byFileKey(em, input.file.key);
  if (replay) {
    if (replay.spectrum.id !== input.spectrumId) throw new AppError('conflict', 'This file already belongs to another spectrum.');
    return revisionDto(replay);
  }
  assertBandFile(input.file);
  const { groupId } = await assertCanAddRevision(em, caller, input.spectrumId);
  let revisionId: string;
  try {
    revisionId = await em.transactional(async (tx) => {
      // The row lock serialises concurrent uploads: each reads the count the previous one wrote.
      const spectrum = await tx.findOneOrFail(Spectrum, { id: input.spectrumId }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
      const current = spectrum.currentRevisionId ? await tx.findOne(Revision, { id: spectrum.currentRevisionId }) : null;
      const why = revisableState(spectrum, current);
      if (why) throw new AppError('conflict', why);
      const number = spectrum.revisionCount + 1;
      const revision = newRevision(tx, spectrum, number, caller, input.file, input.note?.trim() || null);
      spectrum.revisionCount = number;
      spectrum.currentRevisionId = revision.id;
      spectrum.status = 'screening';
      spectrum.verdict = null;
      await clearApprovals(tx, spectrum.id);
      recordAudit(tx, {
        groupId,
        actorId: caller.userId,
        action: 'revision.created',
        target: `spectrum:${spectrum.id}`,
        data: { revision: number, file: input.file.name, via: caller.via },
      });
      notify(tx, { type: 'revision.created', groupId, spectrumId: spectrum.id, actorId: caller.userId, revisionId: revision.id, number });
      await tx.flush();
      return revision.id;
    });
  } catch (e) {
    if (!isFileKeyClash(e)) throw e;
    const won = await byFileKey(em, input.file.key);
    if (!won) throw e;
    return revisionDto(won);
  }
  await enqueue(revisionId);
  const fresh = await em.fork().findOneOrFail(Revision, { id: revisionId }, { populate: ['uploader'] });
  return revisionDto(fresh);
}
