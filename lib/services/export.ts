/**
 * Export of an approved spectrum: the current revision's dispersion as YAML or CSV, the plot as
 * SVG, or the printable review record. Only `approved` spectra export (409 otherwise); a spectrum
 * of another group is a 404; the audit trail goes into the record for roles that may read it.
 */
import { AuditEvent, Finding, Reply, Revision, Thread, User, Waiver, Decision } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { can } from '@/lib/auth/permissions';
import { env } from '@/lib/config/env';
import type { Em } from '@/lib/db/orm';
import type { Dispersion, FrequencyUnit } from '@/lib/dispersion/types';
import { AppError } from '@/lib/errors';
import {
  contentDisposition,
  dispersionCsvChunks,
  dispersionSvg,
  dispersionYamlChunks,
  exportFilename,
  reviewRecordHtml,
  textStream,
  type RecordPerson,
  type ReviewRecordData,
} from '@/lib/export';
import { spectrumLink } from '@/lib/notifications/render';
import { recordAudit } from './audit';
import { loadStoredDispersion } from './dispersion-store';
import { spectrumAccess, type SpectrumAccess } from './spectra';

export const exportFormats = ['yaml', 'csv', 'svg', 'record'] as const;
export type ExportFormat = (typeof exportFormats)[number];

export interface ExportOptions {
  units?: FrequencyUnit;
  width?: number;
  height?: number;
}

export interface ExportFile {
  /** YAML and CSV are streamed as they are written (a large spectrum is tens of megabytes of text). */
  body: string | ReadableStream<Uint8Array>;
  contentType: string;
  filename: string;
  disposition: string;
}

const contentTypes: Record<ExportFormat, string> = {
  yaml: 'application/yaml; charset=utf-8',
  csv: 'text/csv; charset=utf-8; header=present',
  svg: 'image/svg+xml; charset=utf-8',
  record: 'text/html; charset=utf-8',
};

const person = (u: { name?: string | null; email: string } | null | undefined): RecordPerson | null =>
  u && u.email !== undefined ? { name: u.name ?? null, email: u.email } : null;

async function loadDispersion(em: Em, revisionId: string): Promise<Dispersion> {
  const d = await loadStoredDispersion(em, revisionId);
  if (!d) throw new AppError('conflict', 'The approved revision has no stored data to export.');
  return d;
}

function anchorText(t: Thread): string {
  if (t.anchorKind === 'point') {
    // The same 0-based words as the workspace shows, so the record and the screen name one place alike.
    return `q-point ${t.anchorIndex}, branch ${t.anchorBranch ?? 0} (${Number(t.anchorFrequency).toPrecision(5)} THz)`;
  }
  if (t.anchorKind === 'finding') return t.finding ? `Finding: ${t.finding.check}${t.finding.index != null ? ` at q-point ${t.finding.index}` : ''}` : 'A finding of an earlier screening';
  return 'The spectrum as a whole';
}

async function recordData(em: Em, access: SpectrumAccess, revision: Revision, d: Dispersion, link: string): Promise<ReviewRecordData> {
  const { spectrum, group, role } = access;
  const [findings, threads, decisions, revisions, reviewers] = await Promise.all([
    em.find(Finding, { revision: revision.id }, { orderBy: { ordinal: 'asc' } }),
    em.find(Thread, { spectrum: spectrum.id }, { populate: ['author', 'revision', 'finding'], orderBy: { createdAt: 'asc', id: 'asc' } }),
    em.find(Decision, { spectrum: spectrum.id }, { populate: ['reviewer', 'revision'], orderBy: { createdAt: 'asc', id: 'asc' } }),
    em.find(Revision, { spectrum: spectrum.id }, { populate: ['uploader'], orderBy: { number: 'asc' } }),
    spectrum.reviewerIds?.length ? em.find(User, { id: { $in: spectrum.reviewerIds } }) : Promise.resolve([]),
  ]);
  const [waivers, replies] = await Promise.all([
    findings.length ? em.find(Waiver, { finding: { $in: findings.map((f) => f.id) } }, { populate: ['author'] }) : Promise.resolve([]),
    threads.length ? em.find(Reply, { thread: { $in: threads.map((t) => t.id) } }, { populate: ['author'], orderBy: { createdAt: 'asc', id: 'asc' } }) : Promise.resolve([]),
  ]);
  const waiverOf = new Map(waivers.map((w) => [w.finding.id, w]));

  let audit: ReviewRecordData['audit'] = null;
  if (can(role, 'audit.read')) {
    // Events on the spectrum and on its threads and findings (of every revision).
    const allFindings = await em.find(Finding, { revision: { spectrum: spectrum.id } }, { fields: ['id'] });
    const targets = [`spectrum:${spectrum.id}`, ...threads.map((t) => `thread:${t.id}`), ...allFindings.map((f) => `finding:${f.id}`)];
    const rows = await em.find(AuditEvent, { group: group.id, target: { $in: targets } }, { populate: ['actor'], orderBy: { createdAt: 'asc', id: 'asc' }, limit: 5000 });
    audit = rows.map((a) => ({ at: a.createdAt, actor: person(a.actor), action: a.action, target: a.target ?? null, data: a.data }));
  }

  const currentId = spectrum.currentRevisionId;
  return {
    generatedAt: new Date(),
    link,
    group: { name: group.name, slug: group.slug },
    spectrum: {
      id: spectrum.id,
      title: spectrum.title,
      material: spectrum.material,
      formula: spectrum.formula ?? null,
      method: spectrum.method ?? null,
      code: spectrum.code ?? null,
      supercell: spectrum.supercell ?? null,
      qmesh: spectrum.qmesh ?? null,
      notes: spectrum.notes ?? null,
      status: spectrum.status,
      submitter: person(spectrum.submitter),
      reviewers: (spectrum.reviewerIds ?? []).map((id) => person(reviewers.find((u) => u.id === id))).filter((p): p is RecordPerson => !!p),
      createdAt: spectrum.createdAt,
    },
    revision: {
      number: revision.number,
      originalName: revision.originalName,
      verdict: revision.verdict ?? null,
      screenedAt: revision.screenedAt ?? null,
      qpoints: d.nq,
      branches: d.nb,
    },
    findings: findings.map((f) => {
      const w = waiverOf.get(f.id);
      return {
        check: f.check,
        severity: f.severity,
        message: f.message,
        index: f.index ?? null,
        branch: f.branch ?? null,
        waiver: w ? { reason: w.reason, author: person(w.author), at: w.createdAt } : null,
      };
    }),
    threads: threads.map((t) => ({
      anchor: anchorText(t),
      revisionNumber: t.revision.number,
      author: person(t.author),
      body: t.body,
      blocking: t.blocking,
      resolved: t.resolved,
      createdAt: t.createdAt,
      replies: replies.filter((r) => r.thread.id === t.id).map((r) => ({ author: person(r.author), body: r.body, at: r.createdAt })),
    })),
    decisions: decisions.map((x) => ({
      verdict: x.verdict,
      reviewer: person(x.reviewer),
      revisionNumber: x.revision.number,
      note: x.note,
      at: x.createdAt,
      counts: x.verdict === 'approve' && !x.supersededAt && x.revision.id === currentId,
    })),
    revisions: revisions.map((v) => ({
      number: v.number,
      originalName: v.originalName,
      uploader: person(v.uploader),
      at: v.createdAt,
      verdict: v.verdict ?? null,
      fail: v.failCount,
      warn: v.warnCount,
      info: v.infoCount,
      note: v.note ?? null,
    })),
    audit,
    plotSvg: dispersionSvg(d, { width: 900, height: 520, title: spectrum.title }),
  };
}

/** The file for one format; records the export in the audit trail. */
export async function exportSpectrum(em: Em, caller: Caller, spectrumId: string, format: ExportFormat, options: ExportOptions = {}): Promise<ExportFile> {
  const access = await spectrumAccess(em, caller, spectrumId, 'spectrum.export');
  const { spectrum, group } = access;
  if (spectrum.status !== 'approved') {
    throw new AppError('conflict', `Only approved spectra can be exported; this one is ${spectrum.status}.`, { status: spectrum.status });
  }
  if (!spectrum.currentRevisionId) throw new AppError('conflict', 'This spectrum has no revision to export.');
  const revision = await em.findOneOrFail(Revision, { id: spectrum.currentRevisionId });
  const d = await loadDispersion(em, revision.id);
  const link = spectrumLink(env().APP_URL, group.slug, spectrum.id);

  let body: string | ReadableStream<Uint8Array>;
  let filename: string;
  switch (format) {
    case 'yaml':
      body = textStream(dispersionYamlChunks(d, { spectrumId: spectrum.id, title: spectrum.title, group: group.slug, revision: revision.number, status: spectrum.status, exportedAt: new Date(), link }));
      filename = exportFilename(spectrum.title, revision.number, '', 'yaml');
      break;
    case 'csv':
      body = textStream(dispersionCsvChunks(d, { units: options.units }));
      filename = exportFilename(spectrum.title, revision.number, options.units && options.units !== 'THz' ? options.units : '', 'csv');
      break;
    case 'svg':
      body = dispersionSvg(d, { width: options.width, height: options.height, units: options.units, title: spectrum.title });
      filename = exportFilename(spectrum.title, revision.number, 'plot', 'svg');
      break;
    case 'record':
      body = reviewRecordHtml(await recordData(em, access, revision, d, link));
      filename = exportFilename(spectrum.title, revision.number, 'review-record', 'html');
      break;
  }
  recordAudit(em, {
    groupId: group.id,
    actorId: caller.userId,
    action: 'spectrum.exported',
    target: `spectrum:${spectrum.id}`,
    data: { spectrum: spectrum.id, revision: revision.id, format },
  });
  await em.flush();
  return {
    body,
    contentType: contentTypes[format],
    filename,
    // The record is meant to be opened and printed; data files are downloads.
    disposition: contentDisposition(filename, format === 'record' ? 'inline' : 'attachment'),
  };
}
