/**
 * Spectra: the queue (list with server-side filter, search, sort and pagination), one
 * spectrum's details, and the access check every spectrum or revision route goes through.
 */
import { raw } from '@mikro-orm/core';
import { Revision, Spectrum, User, type SpectrumStatus, type VerdictValue, type ScreeningStatus, type ScreeningErrorInfo } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { allowedActions, assertCan, can, type Action, type Role } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { groupAccess, type GroupRef } from './access';
import { listDecisions, type DecisionDto } from './decisions';
import { noFindings, unwaivedCounts, type FindingCounts } from './finding-counts';
import { threadCounts } from './threads';

export type { FindingCounts } from './finding-counts';

export interface PersonDto {
  id: string;
  name: string | null;
  email: string;
}

export interface RevisionDto {
  id: string;
  spectrumId: string;
  number: number;
  originalName: string;
  size: number;
  format: string;
  note: string | null;
  uploader: PersonDto | null;
  screeningStatus: ScreeningStatus;
  /** Set when screeningStatus is 'error': where and why. */
  screeningError: ScreeningErrorInfo | null;
  verdict: VerdictValue | null;
  findings: FindingCounts;
  createdAt: string;
  screenedAt: string | null;
}

export interface SpectrumListItem {
  id: string;
  title: string;
  material: string;
  formula: string | null;
  status: SpectrumStatus;
  /** The current revision's verdict; null until it is screened (or when it failed to parse). */
  verdict: VerdictValue | null;
  submitter: PersonDto | null;
  reviewers: PersonDto[];
  currentRevision: { id: string; number: number; screeningStatus: ScreeningStatus } | null;
  /** The current revision's findings that still count: waived ones are left out. */
  findings: FindingCounts;
  /** Unresolved threads on the spectrum (any revision). */
  openThreads: number;
  createdAt: string;
  updatedAt: string;
}

export interface SpectrumDetail extends SpectrumListItem {
  group: GroupRef;
  method: string | null;
  code: string | null;
  supercell: string | null;
  qmesh: string | null;
  notes: string | null;
  /** For optimistic locking: send it back with changes. */
  version: number;
  /** Newest first. */
  revisions: RevisionDto[];
  threads: { total: number; open: number };
  /** Every decision, newest first (lib/services/decisions.ts). */
  decisions: DecisionDto[];
  /** The caller's role in the group and what it allows on this spectrum. */
  role: Role;
  can: { revise: boolean; withdraw: boolean; decide: boolean };
}

export interface SpectrumAccess {
  spectrum: Spectrum;
  group: GroupRef;
  role: Role;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const noSpectrum = () => new AppError('not_found', 'No such spectrum.');

/** The spectrum and the caller's role in its group; a spectrum of another group is a 404. */
export async function spectrumAccess(em: Em, caller: Caller, id: string, action: Action = 'spectrum.read'): Promise<SpectrumAccess> {
  if (!UUID.test(id)) throw noSpectrum();
  const spectrum = await em.findOne(Spectrum, { id }, { populate: ['submitter'] });
  if (!spectrum) throw noSpectrum();
  let access;
  try {
    access = await groupAccess(em, caller, { id: spectrum.group.id });
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') throw noSpectrum();
    throw e;
  }
  assertCan(access.role, action);
  return { spectrum, group: access.group, role: access.role };
}

/** The revision, its spectrum and the caller's role; another group's revision is a 404. */
export async function revisionAccess(em: Em, caller: Caller, id: string): Promise<SpectrumAccess & { revision: Revision }> {
  const noRevision = () => new AppError('not_found', 'No such revision.');
  if (!UUID.test(id)) throw noRevision();
  const revision = await em.findOne(Revision, { id }, { populate: ['uploader'] });
  if (!revision) throw noRevision();
  try {
    return { ...(await spectrumAccess(em, caller, revision.spectrum.id)), revision };
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') throw noRevision();
    throw e;
  }
}

export function personDto(u: { id: string; name?: string | null; email: string } | null | undefined): PersonDto | null {
  return u ? { id: u.id, name: u.name ?? null, email: u.email } : null;
}

export function revisionDto(r: Revision): RevisionDto {
  return {
    id: r.id,
    spectrumId: r.spectrum.id,
    number: r.number,
    originalName: r.originalName,
    size: Number(r.size),
    format: r.format,
    note: r.note ?? null,
    uploader: r.uploader && 'email' in r.uploader && r.uploader.email !== undefined ? personDto(r.uploader) : null,
    screeningStatus: r.screeningStatus,
    screeningError: r.screeningError ?? null,
    verdict: r.verdict ?? null,
    findings: { fail: r.failCount, warn: r.warnCount, info: r.infoCount },
    createdAt: r.createdAt.toISOString(),
    screenedAt: r.screenedAt?.toISOString() ?? null,
  };
}

async function peopleById(em: Em, ids: string[]): Promise<Map<string, PersonDto>> {
  const unique = [...new Set(ids)].filter((id) => UUID.test(id));
  if (unique.length === 0) return new Map();
  const users = await em.find(User, { id: { $in: unique } });
  return new Map(users.map((u) => [u.id, personDto(u)!]));
}

async function listItems(em: Em, rows: Spectrum[]): Promise<SpectrumListItem[]> {
  const revIds = rows.map((s) => s.currentRevisionId).filter((x): x is string => !!x);
  const revisions = revIds.length ? await em.find(Revision, { id: { $in: revIds } }) : [];
  const byId = new Map(revisions.map((r) => [r.id, r]));
  const people = await peopleById(em, rows.flatMap((s) => s.reviewerIds ?? []));
  const findings = await unwaivedCounts(em, revisions.filter((r) => r.screeningStatus === 'done').map((r) => r.id));
  const threads = await threadCounts(em, rows.map((s) => s.id));
  return rows.map((s) => {
    const rev = s.currentRevisionId ? byId.get(s.currentRevisionId) : undefined;
    return {
      id: s.id,
      title: s.title,
      material: s.material,
      formula: s.formula ?? null,
      status: s.status,
      verdict: s.verdict ?? null,
      submitter: s.submitter && s.submitter.email !== undefined ? personDto(s.submitter) : null,
      reviewers: (s.reviewerIds ?? []).map((id) => people.get(id)).filter((p): p is PersonDto => !!p),
      currentRevision: rev ? { id: rev.id, number: rev.number, screeningStatus: rev.screeningStatus } : null,
      findings: (rev && findings.get(rev.id)) || noFindings(),
      openThreads: threads.get(s.id)?.open ?? 0,
      createdAt: s.createdAt.toISOString(),
      updatedAt: s.updatedAt.toISOString(),
    };
  });
}

export const sortKeys = ['updated', 'created', 'title', 'material', 'status', 'verdict'] as const;
export type SortKey = (typeof sortKeys)[number];
const sortColumn: Record<SortKey, keyof Spectrum> = {
  updated: 'updatedAt',
  created: 'createdAt',
  title: 'title',
  material: 'material',
  status: 'status',
  verdict: 'verdict',
};

export interface ListSpectraInput {
  /** Group slug; a token caller may leave it out (its own group). */
  group?: string;
  status?: SpectrumStatus[];
  /** 'none' matches spectra without a verdict yet. */
  verdict?: (VerdictValue | 'none')[];
  /** The current revision's screening status (`error`: its file did not parse). */
  screening?: ScreeningStatus[];
  q?: string;
  /** 'me': spectra the caller is an assigned reviewer of. */
  assigned?: 'me';
  /** 'me': in review, the caller may decide, is not the submitter and has not approved the current revision. */
  waiting?: 'me';
  sort: SortKey;
  direction: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** The queue: one page of a group's spectra, filtered, searched and sorted in the database. */
export async function listSpectra(em: Em, caller: Caller, input: ListSpectraInput): Promise<{ items: SpectrumListItem[]; total: number }> {
  let ref: { slug: string } | { id: string };
  if (input.group) ref = { slug: input.group };
  else if (caller.tokenGroupId) ref = { id: caller.tokenGroupId };
  else throw new AppError('invalid_input', 'Say which group: ?group=<slug>.', { fieldErrors: { group: ['A group is required.'] } });
  const { group, role } = await groupAccess(em, caller, ref, 'spectrum.read');

  const where: Record<string, unknown> = { group: group.id };
  const and: Record<string, unknown>[] = [];
  if (input.assigned === 'me') {
    and.push({ [raw((a) => `${a}.reviewer_ids @> ?::jsonb`, [JSON.stringify([caller.userId])])]: true });
  }
  if (input.waiting === 'me') {
    if (!can(role, 'spectrum.decide')) return { items: [], total: 0 };
    and.push({ status: 'in-review' }, { $or: [{ submitter: null }, { submitter: { $ne: caller.userId } }] });
    and.push({
      [raw(
        (a) =>
          `(not exists (select 1 from decision d where d.spectrum_id = ${a}.id and d.revision_id = ${a}.current_revision_id and d.reviewer_id = ? and d.verdict = 'approve' and d.superseded_at is null))`,
        [caller.userId],
      )]: true,
    });
  }
  if (input.status?.length) where.status = { $in: input.status };
  if (input.verdict?.length) {
    const named = input.verdict.filter((v) => v !== 'none');
    const none = input.verdict.includes('none');
    const or: Record<string, unknown>[] = [];
    if (named.length) or.push({ verdict: { $in: named } });
    if (none) or.push({ verdict: null });
    and.push({ $or: or });
  }
  if (input.screening?.length) {
    const marks = input.screening.map(() => '?').join(', ');
    and.push({
      [raw((a) => `exists (select 1 from revision r where r.id = ${a}.current_revision_id and r.screening_status in (${marks}))`, [...input.screening])]: true,
    });
  }
  const q = input.q?.trim();
  if (q) {
    const like = likePattern(q);
    const search = ['title', 'material', 'formula', 'code', 'method'].map((k) => ({ [k]: { $ilike: like } }));
    and.push({ $or: search });
  }
  if (and.length) where.$and = and;
  const [rows, total] = await em.findAndCount(Spectrum, where, {
    populate: ['submitter'],
    orderBy: [{ [sortColumn[input.sort]]: input.direction }, { id: 'asc' }],
    limit: input.pageSize,
    offset: (input.page - 1) * input.pageSize,
  });
  return { items: await listItems(em, rows), total };
}

/** One spectrum with its revisions (newest first) and what the caller may do with it. */
export async function getSpectrum(em: Em, caller: Caller, id: string): Promise<SpectrumDetail> {
  const { spectrum, group, role } = await spectrumAccess(em, caller, id);
  return spectrumDetail(em, caller, spectrum, group, role);
}

export async function spectrumDetail(em: Em, caller: Caller, spectrum: Spectrum, group: GroupRef, role: Role): Promise<SpectrumDetail> {
  const [item] = await listItems(em, [spectrum]);
  const revisions = await em.find(Revision, { spectrum: spectrum.id }, { populate: ['uploader'], orderBy: { number: 'desc' } });
  const threads = await threadCounts(em, [spectrum.id]);
  const decisions = await listDecisions(em, caller, spectrum.id);
  const actions = allowedActions(role);
  const own = spectrum.submitter?.id === caller.userId;
  return {
    ...item,
    group,
    method: spectrum.method ?? null,
    code: spectrum.code ?? null,
    supercell: spectrum.supercell ?? null,
    qmesh: spectrum.qmesh ?? null,
    notes: spectrum.notes ?? null,
    version: spectrum.version,
    revisions: revisions.map(revisionDto),
    threads: threads.get(spectrum.id) ?? { total: 0, open: 0 },
    decisions: decisions.items,
    role,
    can: {
      revise: own && actions.includes('spectrum.revise-own') && revisableState(spectrum, revisions.find((r) => r.id === spectrum.currentRevisionId)) === null,
      withdraw: own && actions.includes('spectrum.withdraw-own') && !['approved', 'rejected', 'withdrawn'].includes(spectrum.status),
      decide: !own && actions.includes('spectrum.decide') && spectrum.status === 'in-review',
    },
  };
}

/**
 * Why a new revision is not allowed now, or null. Allowed in `in-review` and `returned`, and
 * while `screening`: a newer file supersedes the one being screened (which is still screened and
 * kept, but no longer moves the spectrum), and a file that did not parse must be replaceable.
 */
export function revisableState(spectrum: Spectrum, _current?: Revision | null): string | null {
  if (spectrum.status === 'in-review' || spectrum.status === 'returned' || spectrum.status === 'screening') return null;
  return `A spectrum that is ${spectrum.status} takes no new revisions.`;
}

export interface QueueSummary {
  total: number;
  byStatus: Record<SpectrumStatus, number>;
  /** Of those in `screening`, how many wait for a new revision because their file did not parse. */
  fileNotRead: number;
  /** What the queue's "Waiting on me" filter lists; null when the caller may not decide. */
  waitingOnMe: number | null;
}

/** The group overview's counts: spectra per status and how many wait on the caller's decision. */
export async function queueSummary(em: Em, caller: Caller, slug: string): Promise<QueueSummary> {
  const { group, role } = await groupAccess(em, caller, { slug }, 'spectrum.read');
  const rows: { status: SpectrumStatus; n: string | number }[] = await em
    .createQueryBuilder(Spectrum, 's')
    .select(['s.status', raw('count(*) as n')])
    .where({ group: group.id })
    .groupBy('s.status')
    .execute();
  const byStatus = { screening: 0, 'in-review': 0, returned: 0, approved: 0, rejected: 0, withdrawn: 0 } as Record<SpectrumStatus, number>;
  for (const r of rows) byStatus[r.status] = Number(r.n);
  const total = Object.values(byStatus).reduce((a, b) => a + b, 0);
  // Counted with the queue's own filters, so the overview's links list exactly these.
  const count = async (filter: Partial<ListSpectraInput>) =>
    (await listSpectra(em, caller, { group: slug, sort: 'updated', direction: 'desc', page: 1, pageSize: 1, ...filter })).total;
  const fileNotRead = byStatus.screening > 0 ? await count({ status: ['screening'], screening: ['error'] }) : 0;
  const waitingOnMe = can(role, 'spectrum.decide') ? await count({ waiting: 'me' }) : null;
  return { total, byStatus, fileNotRead, waitingOnMe };
}
