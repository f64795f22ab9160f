/**
 * Threads on a spectrum: anchored to a point of a revision, to a finding, or to the spectrum;
 * replies, mentions, blocking, resolve and reopen. Threads stay across revisions and say
 * whether the spectrum moved at their anchor since the revision they were opened on.
 */
import { Finding, Membership, newId, Reply, Revision, Thread, User, type Spectrum } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { assertCan, can } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { anchorMoved } from '@/lib/review/anchor-moved';
import type { ApprovalState } from '@/lib/review/approval';
import { parseMentions, resolveMentions } from '@/lib/review/mentions';
import { recordAudit } from './audit';
import { sampledCache } from './compare';
import { notify } from './outbox';
import { getGroupPolicy } from './policy';
import { inReviewTransaction, settleApproval, touch } from './review';
import { personDto, spectrumAccess, type PersonDto, type SpectrumAccess } from './spectra';

export type ThreadAnchorDto =
  | { kind: 'point'; revision: string; index: number; branch: number; frequency: number }
  | { kind: 'finding'; revision: string; finding: string | null; check: string | null; severity: string | null; index: number | null; branch: number | null }
  | { kind: 'spectrum' };

export interface ReplyDto {
  id: string;
  body: string;
  author: PersonDto | null;
  createdAt: string;
}

export interface MovedDto {
  /** Whether the current revision differs at the anchor by more than the continuity tolerance; null when it cannot tell. */
  moved: boolean | null;
  /** The revision compared against (the current one). */
  current: { id: string; number: number };
  then: number | null;
  now: number | null;
  delta: number | null;
  tolerance: number | null;
}

export interface ThreadDto {
  id: string;
  spectrumId: string;
  /** The revision it was opened on. */
  revision: { id: string; number: number };
  anchor: ThreadAnchorDto;
  body: string;
  author: PersonDto | null;
  blocking: boolean;
  resolved: boolean;
  resolvedAt: string | null;
  resolvedBy: PersonDto | null;
  replies: ReplyDto[];
  /** Null for threads on the spectrum as a whole. */
  moved: MovedDto | null;
  createdAt: string;
  updatedAt: string;
}

export type AnchorInput = { revision: string; index: number; branch: number } | { finding: string } | null;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function replyDto(r: Reply): ReplyDto {
  return { id: r.id, body: r.body, author: r.author ? personDto(r.author) : null, createdAt: r.createdAt.toISOString() };
}

function anchorDto(t: Thread): ThreadAnchorDto {
  if (t.anchorKind === 'point') {
    return { kind: 'point', revision: t.revision.id, index: t.anchorIndex!, branch: t.anchorBranch!, frequency: Number(t.anchorFrequency) };
  }
  if (t.anchorKind === 'finding') {
    const f = t.finding;
    return {
      kind: 'finding',
      revision: t.revision.id,
      finding: f?.id ?? null,
      check: f?.check ?? null,
      severity: f?.severity ?? null,
      index: f?.index ?? null,
      branch: f?.branch ?? null,
    };
  }
  return { kind: 'spectrum' };
}

/** The point a thread is about, when it has one. */
function anchorPoint(t: Thread): { index: number; branch: number } | null {
  if (t.anchorKind === 'point') return { index: t.anchorIndex!, branch: t.anchorBranch! };
  if (t.anchorKind === 'finding' && t.finding && t.finding.index != null && t.finding.branch != null) {
    return { index: t.finding.index, branch: t.finding.branch };
  }
  return null;
}

async function threadDtos(em: Em, spectrum: Spectrum, groupId: string, threads: Thread[]): Promise<ThreadDto[]> {
  if (!threads.length) return [];
  const replies = await em.find(Reply, { thread: { $in: threads.map((t) => t.id) } }, { populate: ['author'], orderBy: { createdAt: 'asc', id: 'asc' } });
  const current = spectrum.currentRevisionId ? await em.findOne(Revision, { id: spectrum.currentRevisionId }) : null;
  const load = sampledCache(em);
  const tolerance = (await getGroupPolicy(em, groupId)).checks.continuity;
  const out: ThreadDto[] = [];
  for (const t of threads) {
    const point = anchorPoint(t);
    let moved: MovedDto | null = null;
    if (point && current) {
      moved = { moved: null, current: { id: current.id, number: current.number }, then: null, now: null, delta: null, tolerance: null };
      const [then, now] = await Promise.all([load(t.revision.id), current.screeningStatus === 'done' ? load(current.id) : null]);
      if (then && now) {
        const m = anchorMoved(then, now, point, tolerance);
        moved = { ...moved, moved: m.moved, then: Number.isNaN(m.then) ? null : m.then, now: m.now, delta: m.delta, tolerance: m.tolerance };
      }
    }
    out.push({
      id: t.id,
      spectrumId: spectrum.id,
      revision: { id: t.revision.id, number: t.revision.number },
      anchor: anchorDto(t),
      body: t.body,
      author: t.author ? personDto(t.author) : null,
      blocking: t.blocking,
      resolved: t.resolved,
      resolvedAt: t.resolvedAt?.toISOString() ?? null,
      resolvedBy: t.resolvedBy ? personDto(t.resolvedBy) : null,
      replies: replies.filter((r) => r.thread.id === t.id).map(replyDto),
      moved,
      createdAt: t.createdAt.toISOString(),
      updatedAt: t.updatedAt.toISOString(),
    });
  }
  return out;
}

const threadPopulate = ['author', 'revision', 'finding', 'resolvedBy'] as const;

export async function listThreads(em: Em, caller: Caller, spectrumId: string): Promise<{ items: ThreadDto[] }> {
  const { spectrum, group } = await spectrumAccess(em, caller, spectrumId);
  const threads = await em.find(Thread, { spectrum: spectrum.id }, { populate: threadPopulate, orderBy: { createdAt: 'asc', id: 'asc' } });
  return { items: await threadDtos(em, spectrum, group.id, threads) };
}

/** Thread counts for the queue and the spectrum page. */
export async function threadCounts(em: Em, spectrumIds: string[]): Promise<Map<string, { total: number; open: number }>> {
  const out = new Map<string, { total: number; open: number }>();
  if (!spectrumIds.length) return out;
  const rows = await em.getConnection().execute<{ spectrum_id: string; total: string; open: string }[]>(
    `select spectrum_id, count(*) as total, count(*) filter (where not resolved) as open from thread where spectrum_id in (${spectrumIds.map(() => '?').join(',')}) group by spectrum_id`,
    spectrumIds,
  );
  for (const r of rows) out.set(r.spectrum_id, { total: Number(r.total), open: Number(r.open) });
  return out;
}

async function mentionedMembers(em: Em, groupId: string, body: string, authorId: string): Promise<string[]> {
  const handles = parseMentions(body);
  if (!handles.length) return [];
  const members = await em.find(Membership, { group: groupId }, { populate: ['user'] });
  return resolveMentions(handles, members.map((m) => ({ id: m.user.id, email: m.user.email }))).filter((id) => id !== authorId);
}

export async function openThread(
  em: Em,
  caller: Caller,
  spectrumId: string,
  input: { anchor: AnchorInput; body: string; blocking?: boolean },
): Promise<ThreadDto> {
  const access = await spectrumAccess(em, caller, spectrumId);
  const { spectrum, group, role } = access;
  assertCan(role, 'thread.open');
  if (input.blocking) assertCan(role, 'thread.mark-blocking');

  let revision: Revision;
  const anchor: Partial<Pick<Thread, 'anchorKind' | 'anchorIndex' | 'anchorBranch' | 'anchorFrequency' | 'finding'>> = {};
  if (input.anchor && 'finding' in input.anchor) {
    const f = UUID.test(input.anchor.finding) ? await em.findOne(Finding, { id: input.anchor.finding }, { populate: ['revision'] }) : null;
    if (!f || f.revision.spectrum.id !== spectrum.id) throw new AppError('not_found', 'No such finding on this spectrum.');
    revision = f.revision;
    Object.assign(anchor, { anchorKind: 'finding', finding: f });
  } else if (input.anchor) {
    const a = input.anchor;
    const r = UUID.test(a.revision) ? await em.findOne(Revision, { id: a.revision, spectrum: spectrum.id }) : null;
    if (!r) throw new AppError('not_found', 'No such revision of this spectrum.');
    const data = r.screeningStatus === 'done' ? await sampledCache(em)(r.id) : null;
    if (!data) throw new AppError('conflict', `Revision ${r.number} has no data yet to anchor a thread to.`);
    const where: Record<string, string[]> = {};
    if (a.index >= data.nq) where['anchor.index'] = [`must be below ${data.nq} (the revision's number of q-points)`];
    if (a.branch >= data.nb) where['anchor.branch'] = [`must be below ${data.nb} (the revision's number of branches)`];
    if (Object.keys(where).length) throw new AppError('invalid_input', 'The anchor is outside the revision.', { fieldErrors: where });
    revision = r;
    Object.assign(anchor, { anchorKind: 'point', anchorIndex: a.index, anchorBranch: a.branch, anchorFrequency: data.frequencies[a.index * data.nb + a.branch] });
  } else {
    if (!spectrum.currentRevisionId) throw new AppError('conflict', 'This spectrum has no revision yet.');
    revision = await em.findOneOrFail(Revision, { id: spectrum.currentRevisionId });
    anchor.anchorKind = 'spectrum';
  }

  const mentioned = await mentionedMembers(em, group.id, input.body, caller.userId);
  const id = newId();
  await inReviewTransaction(em, async (tx) => {
    tx.create(Thread, {
      id,
      spectrum,
      revision,
      author: tx.getReference(User, caller.userId),
      anchorKind: anchor.anchorKind!,
      anchorIndex: anchor.anchorIndex ?? null,
      anchorBranch: anchor.anchorBranch ?? null,
      anchorFrequency: anchor.anchorFrequency ?? null,
      finding: anchor.finding ?? null,
      body: input.body,
      blocking: input.blocking ?? false,
      resolved: false,
    });
    // A blocking thread changes what approval needs: serialise it with decisions.
    if (input.blocking) touch(spectrum);
    recordAudit(tx, {
      groupId: group.id,
      actorId: caller.userId,
      action: 'thread.opened',
      target: `thread:${id}`,
      data: { spectrum: spectrum.id, revision: revision.id, anchor: anchor.anchorKind, blocking: input.blocking ?? false },
    });
    notify(tx, { type: 'thread.opened', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, threadId: id, blocking: input.blocking ?? false });
    if (mentioned.length) notify(tx, { type: 'mention', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, threadId: id, replyId: null, mentionedIds: mentioned });
    await tx.flush();
  });
  return oneThread(em, access, id);
}

async function oneThread(em: Em, access: SpectrumAccess, id: string): Promise<ThreadDto> {
  const t = await em.findOneOrFail(Thread, { id }, { populate: threadPopulate, refresh: true });
  return (await threadDtos(em, access.spectrum, access.group.id, [t]))[0]!;
}

async function threadAccess(em: Em, caller: Caller, id: string): Promise<SpectrumAccess & { thread: Thread }> {
  const noThread = () => new AppError('not_found', 'No such thread.');
  if (!UUID.test(id)) throw noThread();
  const thread = await em.findOne(Thread, { id }, { populate: threadPopulate });
  if (!thread) throw noThread();
  try {
    return { ...(await spectrumAccess(em, caller, thread.spectrum.id)), thread };
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') throw noThread();
    throw e;
  }
}

/** Reviewers and admins reply anywhere; the submitter on their own spectrum; observers never. */
export async function replyToThread(em: Em, caller: Caller, threadId: string, input: { body: string }): Promise<ReplyDto> {
  const access = await threadAccess(em, caller, threadId);
  const { thread, spectrum, group, role } = access;
  if (!can(role, 'thread.reply')) {
    assertCan(role, 'thread.reply-own');
    if (spectrum.submitter?.id !== caller.userId) {
      throw new AppError('forbidden', 'Submitters reply in threads on their own spectra only.');
    }
  }
  const mentioned = await mentionedMembers(em, group.id, input.body, caller.userId);
  const id = newId();
  await inReviewTransaction(em, async (tx) => {
    tx.create(Reply, { id, thread, author: tx.getReference(User, caller.userId), body: input.body });
    thread.updatedAt = new Date();
    recordAudit(tx, { groupId: group.id, actorId: caller.userId, action: 'thread.replied', target: `thread:${thread.id}`, data: { spectrum: spectrum.id, reply: id } });
    notify(tx, { type: 'thread.replied', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, threadId: thread.id, replyId: id });
    if (mentioned.length) notify(tx, { type: 'mention', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, threadId: thread.id, replyId: id, mentionedIds: mentioned });
    await tx.flush();
  });
  const reply = await em.findOneOrFail(Reply, { id }, { populate: ['author'] });
  return replyDto(reply);
}

/** Resolve or reopen, mark or unmark blocking (reviewers and admins). */
export async function updateThread(
  em: Em,
  caller: Caller,
  threadId: string,
  input: { resolved?: boolean; blocking?: boolean },
): Promise<{ thread: ThreadDto; approval: ApprovalState | null }> {
  const access = await threadAccess(em, caller, threadId);
  const { thread, spectrum, group, role } = access;
  if (input.resolved !== undefined) assertCan(role, 'thread.resolve');
  if (input.blocking !== undefined) assertCan(role, 'thread.mark-blocking');
  const change: { resolved?: boolean; blocking?: boolean } = {};
  if (input.resolved !== undefined && input.resolved !== thread.resolved) change.resolved = input.resolved;
  if (input.blocking !== undefined && input.blocking !== thread.blocking) change.blocking = input.blocking;
  let approval: ApprovalState | null = null;
  if (Object.keys(change).length) {
    approval = await inReviewTransaction(em, async (tx) => {
      if (change.resolved !== undefined) {
        thread.resolved = change.resolved;
        thread.resolvedAt = change.resolved ? new Date() : null;
        thread.resolvedBy = change.resolved ? tx.getReference(User, caller.userId) : null;
      }
      if (change.blocking !== undefined) thread.blocking = change.blocking;
      // Whether a blocking thread is open decides approval: serialise with decisions.
      touch(spectrum);
      const action = change.resolved === true ? 'thread.resolved' : change.resolved === false ? 'thread.reopened' : change.blocking ? 'thread.blocking' : 'thread.not-blocking';
      recordAudit(tx, { groupId: group.id, actorId: caller.userId, action, target: `thread:${thread.id}`, data: { spectrum: spectrum.id, ...change } });
      notify(tx, { type: 'thread.updated', groupId: group.id, spectrumId: spectrum.id, actorId: caller.userId, threadId: thread.id, change });
      const unblocked = change.resolved === true || change.blocking === false;
      if (unblocked) return settleApproval(tx, spectrum, caller.userId);
      await tx.flush();
      return null;
    });
  }
  return { thread: await oneThread(em, access, thread.id), approval };
}
