/** The audit trail as admins read it: one spectrum's, or the group's with filters. */
import { AuditEvent, Thread, Finding, Spectrum } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { assertCan } from '@/lib/auth/permissions';
import type { Em } from '@/lib/db/orm';
import { groupAccess } from './access';
import type { AuditEventDto } from './audit';
import { spectrumAccess } from './spectra';

function dto(e: AuditEvent): AuditEventDto {
  return {
    id: e.id,
    action: e.action,
    target: e.target ?? null,
    actor: e.actor ? { id: e.actor.id, name: e.actor.name ?? null, email: e.actor.email } : null,
    data: e.data,
    createdAt: e.createdAt.toISOString(),
  };
}

/**
 * Everything recorded about one spectrum, oldest first: events on the spectrum itself and on its
 * threads and findings (which carry the spectrum's id in their data).
 */
export async function spectrumAudit(em: Em, caller: Caller, spectrumId: string): Promise<{ items: AuditEventDto[] }> {
  const { spectrum, group, role } = await spectrumAccess(em, caller, spectrumId);
  assertCan(role, 'audit.read');
  const [threads, findings] = await Promise.all([
    em.find(Thread, { spectrum: spectrum.id }, { fields: ['id'] }),
    em.find(Finding, { revision: { spectrum: spectrum.id } }, { fields: ['id'] }),
  ]);
  const targets = [`spectrum:${spectrum.id}`, ...threads.map((t) => `thread:${t.id}`), ...findings.map((f) => `finding:${f.id}`)];
  const rows = await em.find(
    AuditEvent,
    { group: group.id, target: { $in: targets } },
    { populate: ['actor'], orderBy: { createdAt: 'asc', id: 'asc' }, limit: 5000 },
  );
  return { items: rows.map(dto) };
}

export interface GroupAuditFilter {
  /** An action, or a prefix ending in '.' ("decision." for every decision). */
  action?: string;
  /** The actor's user id. */
  actor?: string;
  /** Exact target, e.g. "spectrum:<id>". */
  target?: string;
  from?: Date;
  to?: Date;
  page: number;
  pageSize: number;
}

/** The group's trail, newest first, filtered and paginated in the database. */
export async function groupAudit(em: Em, caller: Caller, slug: string, f: GroupAuditFilter): Promise<{ items: AuditEventDto[]; total: number }> {
  const { group } = await groupAccess(em, caller, { slug }, 'audit.read');
  const where: Record<string, unknown> = { group: group.id };
  if (f.action) where.action = f.action.endsWith('.') ? { $like: `${f.action.replace(/[\\%_]/g, (c) => `\\${c}`)}%` } : f.action;
  if (f.actor) where.actor = f.actor;
  if (f.target) where.target = f.target;
  if (f.from || f.to) where.createdAt = { ...(f.from ? { $gte: f.from } : {}), ...(f.to ? { $lte: f.to } : {}) };
  const [rows, total] = await em.findAndCount(AuditEvent, where, {
    populate: ['actor'],
    orderBy: { createdAt: 'desc', id: 'asc' },
    limit: f.pageSize,
    offset: (f.page - 1) * f.pageSize,
  });
  return { items: await withSpectrumTitles(em, group.id, rows.map(dto)), total };
}

/** The spectrum an event is about: its target, or the spectrum its data names (threads, findings). */
function spectrumIdOf(e: AuditEventDto): string | null {
  if (e.target?.startsWith('spectrum:')) return e.target.slice('spectrum:'.length);
  return typeof e.data?.spectrum === 'string' ? e.data.spectrum : null;
}

/** Names each event's spectrum by its title, so the log reads without opening every id. */
async function withSpectrumTitles(em: Em, groupId: string, items: AuditEventDto[]): Promise<AuditEventDto[]> {
  const ids = [...new Set(items.map(spectrumIdOf).filter((id): id is string => !!id && /^[0-9a-f-]{36}$/i.test(id)))];
  const spectra = ids.length ? await em.find(Spectrum, { id: { $in: ids }, group: groupId }, { fields: ['id', 'title'] }) : [];
  const titles = new Map(spectra.map((s) => [s.id, s.title]));
  return items.map((e) => {
    const id = spectrumIdOf(e);
    return { ...e, spectrum: id && titles.has(id) ? { id, title: titles.get(id)! } : null };
  });
}
